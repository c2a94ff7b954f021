// Runs the migrations in migrations/ with Kysely's Migrator. The provider imports each file itself,
// so the .ts sources load under tsx and vitest alike.
import { readdir } from "node:fs/promises";
import path from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import { type Kysely, type Migration, type MigrationProvider, Migrator } from "kysely";

const MIGRATIONS_DIR = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../migrations");

const provider: MigrationProvider = {
  async getMigrations() {
    const files = (await readdir(MIGRATIONS_DIR)).filter((f) => f.endsWith(".ts")).sort();
    const migrations: Record<string, Migration> = {};
    for (const file of files) {
      migrations[file.replace(/\.ts$/, "")] = (await import(
        pathToFileURL(path.join(MIGRATIONS_DIR, file)).href
      )) as Migration;
    }
    return migrations;
  },
};

export async function migrateToLatest<DB>(db: Kysely<DB>): Promise<string[]> {
  const { error, results = [] } = await new Migrator({ db, provider }).migrateToLatest();
  const failed = results.find((r) => r.status === "Error");
  if (error || failed) {
    throw new Error(`Migration ${failed?.migrationName ?? ""} failed: ${String(error)}`);
  }
  return results.map((r) => r.migrationName);
}
