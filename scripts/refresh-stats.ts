// `npm run stats:refresh`: recompute every stats cell from the accepted reports (DATABASE_URL).
import { createDb, DEFAULT_DATABASE_URL } from "../db/database";
import { refreshAll } from "../app/stats/refresh.server";

const db = createDb(process.env.DATABASE_URL ?? DEFAULT_DATABASE_URL, 2);
const t0 = Date.now();
const cells = await refreshAll(db);
console.log(`Refreshed ${cells} cells in ${((Date.now() - t0) / 1000).toFixed(2)} s`);
await db.destroy();
