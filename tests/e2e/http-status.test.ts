// Bad addresses get a clear 4xx page, never a 500.
import { describe, expect, inject, it } from "vitest";

const baseUrl = inject("baseUrl");

describe("HTTP status of public pages", () => {
  it.each([
    ["/", 200],
    ["/models", 200],
    ["/models/brackwater-bh-150", 200],
    ["/jobs", 200],
    ["/jobs/axle-nut-breakaway", 200],
    ["/models/no-such-model", 404],
    ["/models/Bad%20Slug!", 404],
    ["/jobs/no-such-job", 404],
    ["/jobs/axle-nut-breakaway?page=0", 400],
    ["/jobs/axle-nut-breakaway?page=abc", 400],
    ["/models/brackwater-bh-150?page=99999", 400],
    ["/nowhere/at/all", 404],
  ])("%s answers %i", async (path, status) => {
    const res = await fetch(`${baseUrl}${path}`);
    expect(res.status).toBe(status);
    expect(res.headers.get("content-type")).toMatch(/text\/html/);
  });

  it("serves the shipped font from its own origin", async () => {
    const html = await (await fetch(baseUrl)).text();
    const css = html.match(/href="(\/assets\/[^"]+\.css)"/)?.[1];
    expect(css).toBeTruthy();
    const sheet = await (await fetch(`${baseUrl}${css}`)).text();
    expect(sheet).toMatch(/font-family:\s*"?Noto Sans/);
    expect(sheet).not.toMatch(/https?:\/\/fonts\./);
    const font = sheet.match(/url\((\/assets\/noto-sans[^)]+\.woff2)\)/)?.[1];
    expect(font).toBeTruthy();
    expect((await fetch(`${baseUrl}${font}`)).status).toBe(200);
  });
});
