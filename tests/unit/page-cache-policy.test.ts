// The page cache's parts that need no server: which paths are public pages, the byte-bounded LRU, the CSP hash
// sources of a kept page's inline scripts (CSP Level 3 §8.3: base64 of SHA-256 over the script's text), the
// loader results shared between visitors, and a stored page's Content-Type.
import { createHash } from "node:crypto";
import { describe, expect, it } from "vitest";
import { ByteLru } from "../../app/http-cache/byte-lru";
import { inlineScriptSources, PageCache, withCharset } from "../../app/http-cache/page-cache.server";
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

describe("shared loader results (PageCache.remember)", () => {
  /** A cache that hears changes, as one whose listener is connected. */
  function listeningCache() {
    const cache = new PageCache(1024 * 1024);
    const events = cache.events(() => Promise.resolve());
    events.listening(true);
    return { cache, events };
  }

  it("computes once for all who ask, until a change empties it", async () => {
    const { cache, events } = listeningCache();
    let computed = 0;
    const compute = () => Promise.resolve({ rate: ++computed, rows: [{ n: 1 }] });
    const [a, b] = await Promise.all([cache.remember("k", compute), cache.remember("k", compute)]);
    expect(a).toBe(b);
    expect(computed).toBe(1);
    // Shared by many renders at once, so nothing may change it.
    expect(Object.isFrozen(a.rows[0])).toBe(true);
    expect(() => (a.rows as { n: number }[]).push({ n: 2 })).toThrow(TypeError);
    events.changed("reports");
    await Promise.resolve();
    expect((await cache.remember("k", compute)).rate).toBe(2);
  });

  it("keeps nothing while changes are not heard, and never keeps a failure", async () => {
    const deaf = new PageCache(1024 * 1024);
    let computed = 0;
    const compute = () => Promise.resolve(++computed);
    await deaf.remember("k", compute);
    expect(await deaf.remember("k", compute)).toBe(2);

    const { cache } = listeningCache();
    let fail = true;
    const flaky = () => (fail ? Promise.reject(new Error("database gone")) : Promise.resolve("fine"));
    await expect(cache.remember("k", flaky)).rejects.toThrow("database gone");
    fail = false;
    expect(await cache.remember("k", flaky)).toBe("fine");
  });
});

describe("a stored page's Content-Type", () => {
  it("adds the charset Express adds to text, JavaScript and JSON, and leaves the rest", () => {
    expect(withCharset("text/html")).toBe("text/html; charset=utf-8");
    expect(withCharset("text/x-script")).toBe("text/x-script; charset=utf-8");
    expect(withCharset("application/json")).toBe("application/json; charset=utf-8");
    expect(withCharset("text/html; charset=utf-8")).toBe("text/html; charset=utf-8");
    expect(withCharset("image/png")).toBe("image/png");
  });
});
