import { inject } from "vitest";
import { createDb } from "../../db/database";

/** A Kysely instance on the test run's own throwaway database. */
export const testDb = () => createDb(inject("databaseUrl"), 4);
