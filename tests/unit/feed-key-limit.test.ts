// BAYPROOF_FEED_KEY_LIMIT (issue 22): the feed's requests a minute per API key, read once by
// app/config.server.ts — 600 unless set, a whole number when set, and anything else stops the start.
import { afterEach, describe, expect, it, vi } from "vitest";

const NAME = "BAYPROOF_FEED_KEY_LIMIT";
const before = process.env[NAME];

async function configWith(value: string | undefined) {
  if (value === undefined) delete process.env[NAME];
  else process.env[NAME] = value;
  vi.resetModules();
  return (await import("../../app/config.server")).config;
}

afterEach(() => {
  if (before === undefined) delete process.env[NAME];
  else process.env[NAME] = before;
  vi.resetModules();
});

describe("the feed's per-key limit", () => {
  it("is 600 unless set, and the number given when set", async () => {
    expect((await configWith(undefined)).feed.keyLimit).toBe(600);
    expect((await configWith("")).feed.keyLimit).toBe(600);
    expect((await configWith("1000000")).feed.keyLimit).toBe(1_000_000);
    expect((await configWith(" 120 ")).feed.keyLimit).toBe(120);
  });

  it("refuses anything but a whole number from 1 to 10⁹, naming the variable", async () => {
    for (const bad of ["0", "-5", "12.5", "6e2", "lots", "10000000000"])
      await expect(configWith(bad), bad).rejects.toThrow(/BAYPROOF_FEED_KEY_LIMIT must be a whole number/);
  });

  it("is the limit the feed's access control counts against", async () => {
    await configWith("42");
    const { LIMITS } = await import("../../app/feed/access.server");
    expect(LIMITS.key).toEqual({ points: 42, duration: 60 });
    expect(LIMITS.anonymous.points).toBe(60);
  });
});
