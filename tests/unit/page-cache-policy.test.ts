// The page cache's pure parts: which paths are public pages, the byte-bounded LRU, and the CSP hash
// sources of a kept page's inline scripts (CSP Level 3 §8.3: base64 of SHA-256 over the script's text).
import { createHash } from "node:crypto";
import { describe, expect, it } from "vitest";
import { ByteLru } from "../../app/http-cache/byte-lru";
import { inlineScriptSources } from "../../app/http-cache/page-cache.server";
import { isPublicPage, pagePath } from "../../app/http-cache/policy";

describe("public pages", () => {
  it("lists the catalogue, job, compare, air, search and data pages, and their data requests", () => {
    for (const p of ["/", "/jobs", "/jobs/ball-joint-separation", "/models", "/models/x-1", "/compare", "/air"])
      expect(isPublicPage(p), p).toBe(true);
    expect(isPublicPage("/search")).toBe(true);
    expect(isPublicPage("/data")).toBe(true);
    expect(isPublicPage("/_root.data")).toBe(true);
    expect(isPublicPage("/jobs/ball-joint-separation.data")).toBe(true);
    expect(pagePath("/models.data")).toBe("/models");
  });

  it("leaves out everything with a session, a form or a token", () => {
    for (const p of ["/account", "/sign-in", "/reports/new", "/reports/1/edit", "/review", "/review/3", "/me/reports"])
      expect(isPublicPage(p), p).toBe(false);
    for (const p of ["/admin/users", "/units", "/api/v1/stats", "/api/search", "/jobs/a/b", "/dev/mail"])
      expect(isPublicPage(p), p).toBe(false);
  });
});

describe("ByteLru", () => {
  it("drops the least recently used entries once the bytes exceed the bound", () => {
    const lru = new ByteLru<string>(10, (v) => v.length);
    lru.set("a", "xxxx");
    lru.set("b", "xxxx");
    expect(lru.get("a")).toBe("xxxx"); // a is now the newest
    lru.set("c", "xxxx");
    expect(lru.get("b")).toBeUndefined();
    expect(lru.get("a")).toBe("xxxx");
    expect(lru.bytes).toBe(8);
    lru.set("huge", "x".repeat(11));
    expect(lru.get("huge")).toBeUndefined();
    lru.clear();
    expect(lru.size).toBe(0);
    expect(lru.bytes).toBe(0);
  });
});

describe("inline script sources", () => {
  it("hash each inline script's text and skip scripts with a src", () => {
    const html = '<script nonce="n">a()</script><script type="module" src="/x.js"></script><script>b()</script>';
    const sha = (s: string) => `'sha256-${createHash("sha256").update(s).digest("base64")}'`;
    expect(inlineScriptSources(html)).toEqual([sha("a()"), sha("b()")]);
  });
});
