import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { startPostgres } from "./postgres";
import { freePort } from "./free-port";
import { createDb } from "../db/database";
import { migrateToLatest } from "../db/migrate";

const dir = mkdtempSync(path.join(tmpdir(), "cache22-pg-"));
const server = await startPostgres({ dataDir: dir, port: await freePort(), fast: true });
const db = createDb(server.url, 2);
await migrateToLatest(db);
await db.destroy();
writeFileSync("/tmp/cache22-dbg/pg.json", JSON.stringify({ url: server.url, dir }));
console.log("ready", server.url);
process.on("SIGTERM", () => { server.stop(); process.exit(0); });
setInterval(() => {}, 1 << 30);
