// `npm run reindex`: rebuild the search index from PostgreSQL (DATABASE_URL, SEARCH_URL).
import { createDb, DEFAULT_DATABASE_URL } from "../db/database";
import { reindexAll } from "../app/search/search.server";

const db = createDb(process.env.DATABASE_URL ?? DEFAULT_DATABASE_URL, 2);
const t0 = Date.now();
console.log(`Indexed ${await reindexAll(db)} documents in ${((Date.now() - t0) / 1000).toFixed(1)} s`);
await db.destroy();
