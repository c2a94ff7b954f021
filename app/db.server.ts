import { createDb, createPool, DEFAULT_DATABASE_URL } from "../db/database";

// One pool per server process; the URL comes from the environment (see README, Configuration).
// The pool itself is shared with what needs a bare client (the feed's cursors and rate limits).
export const pool = createPool(process.env.DATABASE_URL ?? DEFAULT_DATABASE_URL);
export const db = createDb(pool);
