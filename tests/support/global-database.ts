import type { TestProject } from "vitest/node";
import { startTestDatabase } from "./system";

export default async function setup(project: TestProject) {
  const database = await startTestDatabase();
  project.provide("databaseUrl", database.url);
  return () => database.stop();
}
