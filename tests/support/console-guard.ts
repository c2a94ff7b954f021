// A test that prints a console error fails: the error is usually a real bug hiding in a log.
import { afterEach, beforeEach, vi } from "vitest";

let errors: unknown[][] = [];

beforeEach(() => {
  errors = [];
  vi.spyOn(console, "error").mockImplementation((...args: unknown[]) => {
    errors.push(args);
  });
});

afterEach(() => {
  vi.restoreAllMocks();
  if (errors.length) {
    const text = errors.map((a) => a.map(String).join(" ")).join("\n");
    throw new Error(`console.error was called during the test:\n${text}`);
  }
});
