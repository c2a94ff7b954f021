// db/schema.ts is written by hand (it narrows text columns to the values their CHECKs allow); this
// test keeps it honest against the migrated database. Two steps:
//   1. kysely-codegen reads the test database (migrated by the global setup) and must produce
//      exactly db/generated.ts — a migration without a regenerated file fails here;
//   2. db/schema-check.ts, compiled on its own, must hold: every table of the hand-written
//      `Database` has the generated table's columns, nullability and defaults.
// To regenerate after a migration: BAYPROOF_WRITE_SCHEMA=1 npx vitest run --project integration
// tests/integration/schema-matches-database.test.ts
import { execFile } from "node:child_process";
import { mkdtemp, readFile, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { promisify } from "node:util";
import ts from "typescript";
import { expect, inject, it } from "vitest";

const run = promisify(execFile);
const root = path.resolve(import.meta.dirname, "../..");
const committed = path.join(root, "db/generated.ts");

async function generate(outFile: string) {
  // Only the app's tables: not pg-boss's schema, not the migrator's bookkeeping.
  await run(
    process.execPath,
    [
      path.join(root, "node_modules/kysely-codegen/dist/cli/bin.js"),
      "--dialect",
      "postgres",
      "--url",
      inject("databaseUrl"),
      "--out-file",
      outFile,
      "--include-pattern",
      "public.*",
      "--exclude-pattern",
      "public.kysely_migration*",
      "--log-level",
      "error",
      // JSON columns as `object`: kysely-codegen's own Json type admits null, which would hide whether
      // the column does.
      "--type-mapping",
      JSON.stringify({ json: "object", jsonb: "object" }),
    ],
    { cwd: root, timeout: 120_000 },
  );
}

it("db/generated.ts is what kysely-codegen makes of the migrated database", { timeout: 180_000 }, async () => {
  if (process.env.BAYPROOF_WRITE_SCHEMA === "1") await generate(committed);
  const dir = await mkdtemp(path.join(tmpdir(), "bayproof-schema-"));
  try {
    const fresh = path.join(dir, "generated.ts");
    await generate(fresh);
    expect(await readFile(fresh, "utf8"), "db/generated.ts is stale: regenerate it (see the top of this test)").toBe(
      await readFile(committed, "utf8"),
    );
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
});

it("the hand-written Database agrees with the generated types, table by table", { timeout: 120_000 }, async () => {
  const file = path.join(root, "db/schema-check.ts");
  const program = ts.createProgram([file], {
    strict: true,
    noEmit: true,
    skipLibCheck: true,
    target: ts.ScriptTarget.ES2022,
    module: ts.ModuleKind.ES2022,
    moduleResolution: ts.ModuleResolutionKind.Bundler,
    types: [],
  });
  const problems = ts.getPreEmitDiagnostics(program).map((d) => ts.flattenDiagnosticMessageText(d.messageText, "\n"));
  expect(problems).toEqual([]);
});
