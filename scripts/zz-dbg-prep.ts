import { createDb } from "../db/database";
import { prepareDatabase } from "./prepare-db";
const db = createDb(process.argv[2]!, 4);
await prepareDatabase(db, () => {});
await db.destroy();
console.log("prepared");
