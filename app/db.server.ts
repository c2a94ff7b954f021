import { createDb, DEFAULT_DATABASE_URL } from "../db/database";

// One pool per server process; the URL comes from the environment (see README, Configuration).
export const db = createDb(process.env.DATABASE_URL ?? DEFAULT_DATABASE_URL);
