// How many processes server.js runs, and how long it waits before replacing a worker that died.
import { availableParallelism } from "node:os";
import { expect, it } from "vitest";
// @ts-expect-error server-cluster.js is plain JavaScript run by node, without type declarations.
import { restartDelay, workerCount } from "../../server-cluster.js";

const count = workerCount as (env: Record<string, string | undefined>) => number;
const delay = restartDelay as (quickDeaths: number) => number;

it("runs WEB_CONCURRENCY workers, one per core in production by default, one process elsewhere", () => {
  expect(count({ WEB_CONCURRENCY: "3", NODE_ENV: "production" })).toBe(3);
  expect(count({ WEB_CONCURRENCY: "1" })).toBe(1);
  expect(count({ NODE_ENV: "production" })).toBe(availableParallelism());
  expect(count({ WEB_CONCURRENCY: "", NODE_ENV: "production" })).toBe(availableParallelism());
  expect(count({})).toBe(1);
  for (const bad of ["0", "-2", "1.5", "two", "999"])
    expect(() => count({ WEB_CONCURRENCY: bad })).toThrow(/WEB_CONCURRENCY must be a whole number from 1 to 256/);
});

it("waits longer after each quick death of a worker, up to 30 s", () => {
  expect([1, 2, 3, 4].map(delay)).toEqual([250, 500, 1000, 2000]);
  expect(delay(20)).toBe(30_000);
});
