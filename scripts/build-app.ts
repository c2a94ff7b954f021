// The production build, skipped when the sources it is made from have not changed since the last
// one (a content hash kept beside it), so a second `npm start` is ready in seconds.
import { spawnSync } from "node:child_process";
import { createHash } from "node:crypto";
import { existsSync, readdirSync, readFileSync, statSync, writeFileSync } from "node:fs";
import path from "node:path";

/** What the bundle is made from: everything else (tests, scripts, docs) cannot change it. */
const SOURCE_DIRS = ["app", "db", "fonts", "public", "seeds"];
const SOURCE_FILES = ["package.json", "package-lock.json", "vite.config.ts", "react-router.config.ts", "tsconfig.json"];

function listFiles(dir: string): string[] {
  if (!existsSync(dir)) return [];
  return readdirSync(dir)
    .sort()
    .flatMap((name) => {
      const full = path.join(dir, name);
      return statSync(full).isDirectory() ? listFiles(full) : [full];
    });
}

export function sourceHash(root: string) {
  const hash = createHash("sha256");
  // Builds made before NODE_ENV was fixed to production (below) could hold React's development build.
  hash.update("NODE_ENV=production\0");
  const files = [
    ...SOURCE_DIRS.flatMap((d) => listFiles(path.join(root, d))),
    ...SOURCE_FILES.map((f) => path.join(root, f)).filter((f) => existsSync(f)),
  ];
  for (const file of files) hash.update(path.relative(root, file)).update("\0").update(readFileSync(file)).update("\0");
  return hash.digest("hex");
}

/** Builds the app in `root` unless its last build was made from the same sources; false if the build failed. */
export function buildApp(root: string, log: (s: string) => void, { inheritOutput = true } = {}) {
  const stamp = path.join(root, "build", ".source-hash");
  const hash = sourceHash(root);
  if (
    existsSync(path.join(root, "build/server/index.js")) &&
    existsSync(stamp) &&
    readFileSync(stamp, "utf8") === hash
  ) {
    log("The build is up to date with the sources; not building again");
    return { ok: true as const };
  }
  log("Building the app…");
  const r = spawnSync(path.join(root, "node_modules/.bin/react-router"), ["build"], {
    cwd: root,
    // Always the production bundle: under vitest NODE_ENV is "test", which would ship React's
    // development build (three times the size, and not what is served).
    env: { ...process.env, NODE_ENV: "production" },
    stdio: inheritOutput ? "inherit" : "pipe",
    encoding: "utf8",
  });
  if (r.status !== 0) return { ok: false as const, output: `${r.stdout ?? ""}\n${r.stderr ?? ""}` };
  writeFileSync(stamp, hash);
  return { ok: true as const };
}
