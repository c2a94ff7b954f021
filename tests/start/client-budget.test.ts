// The client budget (scripts/client-budget.ts) on the production build the start command serves:
// no page ships more than its allowance of JavaScript, and the job, model and compare pages ship
// none of the statistics libraries (the browser only predicts from stored fits there).
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { buildApp } from "../../scripts/build-app";
import { formatWeights, routeWeights } from "../../scripts/client-budget";

const root = path.resolve(import.meta.dirname, "../..");

describe("the client budget", () => {
  it("keeps every page within its allowance of gzipped JavaScript", () => {
    const build = buildApp(root, () => {}, { inheritOutput: false });
    if (!build.ok) throw new Error(`react-router build failed:\n${build.output}`);
    const rows = routeWeights(path.join(root, "build/client"));
    expect(rows.map((r) => r.route)).toEqual(expect.arrayContaining(["jobs.$slug", "models.$slug", "compare"]));
    expect(
      rows.filter((r) => r.over),
      formatWeights(rows),
    ).toEqual([]);

    // jStat's and seedrandom's own names (jStat.studentt, seedrandom.xor4096), in whatever chunk they would land.
    const manifest = JSON.parse(readFileSync(path.join(root, "build/client/.vite/manifest.json"), "utf8")) as Record<
      string,
      { file: string }
    >;
    const shipped = Object.values(manifest)
      .filter((c) => c.file.endsWith(".js"))
      .map((c) => readFileSync(path.join(root, "build/client", c.file), "utf8"));
    expect(shipped.some((js) => js.includes("studentt"))).toBe(false);
    expect(shipped.some((js) => js.includes("xor4096"))).toBe(false);
  });
});
