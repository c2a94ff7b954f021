// The served app's log (stderr), as the global setup writes it to a file.
import { readFileSync, statSync } from "node:fs";
import { inject } from "vitest";

/**
 * What the server logged while `work` ran. The server writes its log to the file synchronously,
 * so whatever it logged while answering is there once the answers are in. Other test files run
 * at the same time: look for what only this work could log.
 */
export async function serverLogDuring(work: () => Promise<unknown>): Promise<string> {
  const file = inject("serverLog");
  const start = statSync(file).size;
  await work();
  return readFileSync(file).subarray(start).toString();
}
