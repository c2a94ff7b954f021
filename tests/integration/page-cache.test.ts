// Issue 22 item 2: public pages for anonymous visitors come from each app process's page cache with
// a strong ETag (304 on If-None-Match), say how a CDN may keep them, and change on every process
// within a second of an accept (NOTIFY bayproof_pages). Signed-in visitors are never cached.
// HTTP semantics: RFC 9110 §8.8.3 (ETag), §13.1.2 (If-None-Match), §12.5.5 (Vary); RFC 9111 §5.2
// (Cache-Control, s-maxage); RFC 5861 §3 (stale-while-revalidate); CSP Level 3 §8.3 (hash sources).
import { type ChildProcess, spawn } from "node:child_process";
import { createHash } from "node:crypto";
import { request as httpRequest } from "node:http";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { freePort } from "../../scripts/free-port";
import { waitForHttp } from "../../scripts/wait-http";
import { testDb } from "../support/db";
import { fileFirstReport } from "../support/first-report";
import { Browserish, signedInAs } from "../support/http";

const root = path.resolve(import.meta.dirname, "../..");
const db = testDb();
const JOB_PAGE = "/jobs/ball-joint-separation";
let second: ChildProcess;
let secondUrl: string;

beforeAll(async () => {
  // A second app process on the same database: another worker, or another machine.
  const port = await freePort();
  secondUrl = `http://127.0.0.1:${port}`;
  second = spawn(process.execPath, ["server.js"], {
    cwd: root,
    env: { ...process.env, ...inject("appEnv"), PORT: String(port) },
    stdio: ["ignore", "ignore", "inherit"],
  });
  await waitForHttp(secondUrl, second);
}, 90_000);

afterAll(async () => {
  if (second && second.exitCode == null) {
    const exited = new Promise((resolve) => second.once("exit", resolve));
    second.kill("SIGTERM");
    await exited;
  }
  await db.destroy();
});

const get = (origin: string, url: string, headers: Record<string, string> = {}) =>
  fetch(new URL(url, origin), { redirect: "manual", headers });

/** GETs until two answers in a row carry the same ETag: the page is then served from the cache. */
async function warm(origin: string, url: string, headers: Record<string, string> = {}) {
  let last: string | null = null;
  for (let tries = 0; ; tries++) {
    if (tries > 200) throw new Error(`${url} never came from the cache at ${origin}`);
    const res = await get(origin, url, headers);
    expect(res.status).toBe(200);
    await res.arrayBuffer();
    const etag = res.headers.get("etag");
    if (etag && etag === last) return etag;
    last = etag;
  }
}

/**
 * A page's ETag and the 304 that answers it. Other test files accept reports meanwhile, and each
 * accept empties the cache, so a miss in between is tried again.
 */
async function notModified(origin: string, url: string) {
  for (let tries = 0; ; tries++) {
    if (tries > 50) throw new Error(`no 304 for ${url} at ${origin}`);
    const etag = await warm(origin, url);
    const res = await get(origin, url, { "if-none-match": etag });
    if (res.status === 304) return { etag, res };
    expect(res.status).toBe(200);
    await res.arrayBuffer();
  }
}

interface Raw {
  status: number;
  headers: Record<string, string>;
  body: Buffer;
}

/**
 * A request with node's own client. `target` is sent as written: "/models" (origin-form) is answered
 * by server.js before Express when the cache holds it; "http://host/models" (absolute-form, RFC 9112
 * §3.2.2) names the same page but always goes through Express and React Router's middleware.
 */
function raw(origin: string, target: string, method: string, headers: Record<string, string>): Promise<Raw> {
  const { hostname, port } = new URL(origin);
  return new Promise((resolve, reject) => {
    const req = httpRequest({ host: hostname, port, method, path: target, headers }, (res) => {
      const chunks: Buffer[] = [];
      res.on("data", (c: Buffer) => chunks.push(c));
      res.on("end", () => {
        const h: Record<string, string> = {};
        for (const [name, value] of Object.entries(res.headers))
          if (!["date", "connection", "keep-alive"].includes(name)) h[name] = String(value);
        resolve({ status: res.statusCode!, headers: h, body: Buffer.concat(chunks) });
      });
    });
    req.on("error", reject);
    req.end();
  });
}

describe("the page cache", () => {
  it("answers a hit before Express with the status, headers and bytes React Router's middleware sends", async () => {
    const origin = inject("baseUrl");
    for (const path of ["/models", "/models.data"]) {
      const etag = await warm(origin, path);
      const cases: [string, Record<string, string>][] = [
        ["GET", {}],
        ["GET", { "accept-encoding": "gzip, deflate, br, zstd", "accept-language": "de-DE" }],
        ["HEAD", { "accept-encoding": "gzip" }],
        ["GET", { "if-none-match": etag }],
      ];
      for (const [method, headers] of cases) {
        // Other files' accepts empty the cache now and then: compare two answers of the same stored page.
        for (let tries = 0; ; tries++) {
          const early = await raw(origin, path, method, headers);
          const long = await raw(origin, `${origin}${path}`, method, headers);
          const again = await raw(origin, path, method, headers);
          if (early.headers.etag !== again.headers.etag && tries < 20) continue;
          const label = `${method} ${path} ${JSON.stringify(headers)}`;
          expect(early.status, label).toBe(long.status);
          // A page's CSP names its scripts' hashes; a data answer's or a 304's carries a fresh nonce each
          // time. Every other header is the same.
          const { "content-security-policy": earlyCsp, ...earlyRest } = early.headers;
          const { "content-security-policy": longCsp, ...longRest } = long.headers;
          expect(earlyRest, label).toEqual(longRest);
          const nonceless = (csp?: string) => csp?.replace(/'nonce-[^']+'/, "'nonce-…'");
          expect(nonceless(earlyCsp), label).toBe(nonceless(longCsp));
          if (early.status === 304) expect(earlyCsp, label).toMatch(/'nonce-/);
          expect(early.body.equals(long.body), label).toBe(true);
          break;
        }
      }
    }
  });

  it("keeps the same bytes under the same ETag in every process", async () => {
    // Each render blanks its nonce, so two processes' renders of the same data are the same bytes.
    // (Another file's accept between the two warms changes the page: then try again.)
    let ours = "";
    let theirs = "";
    for (let tries = 0; tries < 20 && (ours === "" || ours !== theirs); tries++) {
      ours = await warm(inject("baseUrl"), JOB_PAGE);
      theirs = await warm(secondUrl, JOB_PAGE);
    }
    expect(theirs).toBe(ours);
  });

  it("serves a public page with a strong ETag, Cache-Control for a CDN, Vary, and 304 on If-None-Match", async () => {
    const origin = inject("baseUrl");
    const { etag, res: again } = await notModified(origin, "/models");
    expect(etag).toMatch(/^"[A-Za-z0-9_-]+"$/); // strong: no W/
    expect(await again.text()).toBe("");
    expect(again.headers.get("etag")).toBe(etag);
    expect(again.headers.get("cache-control")).toMatch(/s-maxage=/);
    expect(again.headers.get("vary")).toMatch(/Cookie/);
    expect((await get(origin, "/models", { "if-none-match": '"something-else"' })).status).toBe(200);

    const res = await get(origin, "/models");
    expect(res.headers.get("etag")).toMatch(/^"[A-Za-z0-9_-]+"$/);
    expect(res.headers.get("cache-control")).toBe("public, max-age=0, s-maxage=30, stale-while-revalidate=30");
    expect(res.headers.get("vary")).toMatch(/Cookie/);
    expect(res.headers.get("vary")).toMatch(/Accept-Language/);
    const body = await res.text();
    // A kept page allows its inline scripts by hash, never by a nonce shared between visitors.
    const csp = res.headers.get("content-security-policy")!;
    expect(csp).not.toMatch(/'nonce-/);
    const inline = [...body.matchAll(/<script\b([^>]*)>([\s\S]*?)<\/script>/g)].filter(([, a]) => !/\bsrc=/.test(a!));
    expect(inline.length).toBeGreaterThan(0);
    for (const [, , text] of inline)
      expect(csp).toContain(`'sha256-${createHash("sha256").update(text!).digest("base64")}'`);

    // Data requests (client-side navigation) are kept the same way.
    const data = await notModified(origin, "/models.data");
    expect(data.res.headers.get("etag")).toBe(data.etag);
  });

  it("keeps one render per unit system", async () => {
    const origin = inject("baseUrl");
    const us = await warm(origin, JOB_PAGE, { "accept-language": "en-US" });
    const metric = await warm(origin, JOB_PAGE, { "accept-language": "de-DE" });
    expect(us).not.toBe(metric);
    expect(await (await get(origin, JOB_PAGE, { "accept-language": "en-US" })).text()).toContain("psi");
    expect(await (await get(origin, JOB_PAGE, { "accept-language": "de-DE" })).text()).toContain("kPa");
    // The footer's cookie wins over the language, and is a variant of its own.
    const cookie = await new Browserish().post("/units", { system: "metric", back: JOB_PAGE });
    const units = cookie.headers.getSetCookie()[0]!.split(";")[0]!;
    const chosen = await warm(origin, JOB_PAGE, { "accept-language": "en-US", cookie: units });
    expect(chosen).not.toBe(us);
  });

  it("never keeps or marks public a signed-in visitor's page, an error page or a form page", async () => {
    const origin = inject("baseUrl");
    await warm(origin, JOB_PAGE);
    const member = await signedInAs(db, "reporter@demo.bayproof.test");
    for (let i = 0; i < 2; i++) {
      const res = await member.get(JOB_PAGE);
      expect(res.status).toBe(200);
      expect(res.headers.get("cache-control")).toBe("private, no-store");
      expect(res.headers.get("etag")).toBeNull();
      const html = await res.text();
      expect(html).toContain("My reports");
      expect(res.headers.get("content-security-policy")).toMatch(/'nonce-/);
    }
    // A session cookie that reads as nobody is still not an anonymous visitor's request.
    const stale = await get(origin, JOB_PAGE, { cookie: "bayproof_session=bm90LWEtc2Vzc2lvbg%3D%3D" });
    expect(stale.headers.get("cache-control")).toBe("private, no-store");
    const missing = await get(origin, "/jobs/no-such-job");
    expect(missing.status).toBe(404);
    expect(missing.headers.get("cache-control")).toBe("private, no-store");
    expect(missing.headers.get("etag")).toBeNull();
    for (const url of ["/sign-in", "/reports/new", "/review"]) {
      const res = await get(origin, url);
      expect(res.headers.get("cache-control"), url).toBe("private, no-store");
    }
  });

  it("shows an accepted report on every process within a second of the accept", async () => {
    // A new reporter files a report for the job; it needs two moderators' accepts.
    const { id } = await fileFirstReport(db, "cache");
    const marker = `id="report-${id}"`;
    const decide = async (moderator: string, reasonCode: string) => {
      const client = await signedInAs(db, moderator);
      const r = await db.selectFrom("reports").select("version").where("id", "=", id).executeTakeFirstOrThrow();
      const seen = await db
        .selectFrom("decisions")
        .select("id")
        .where("report_id", "=", id)
        .where("action", "in", ["accept", "return", "reject"])
        .execute();
      const res = await client.post(`/review/${id}`, {
        version: String(r.version),
        seenDecisions: String(seen.length),
        action: "accept",
        reasonCode,
        check_job_visible: "on",
        check_tool_identifiable: "on",
        check_gauge_readable: "on",
        check_matches_outcome: "on",
      });
      expect(res.status, await res.text()).toBeLessThan(400);
    };
    await decide("moderator@demo.bayproof.test", "evidence_clear");

    const origins = [inject("baseUrl"), secondUrl];
    for (const origin of origins) {
      await warm(origin, JOB_PAGE);
      expect(await (await get(origin, JOB_PAGE)).text()).not.toContain(marker);
    }

    await decide("moderator2@demo.bayproof.test", "second_look_agrees");
    const committed = Date.now(); // the answer comes after the transaction's commit
    expect(
      (await db.selectFrom("reports").select("status").where("id", "=", id).executeTakeFirstOrThrow()).status,
    ).toBe("accepted");
    // When each process stopped serving the old page: the moment the first request that got the new
    // one was sent. (How long that render then took depends on how busy the machine is, not on the cache.)
    const changedAfter = await Promise.all(
      origins.map(async (origin) => {
        for (;;) {
          const sent = Date.now();
          const html = await (await get(origin, JOB_PAGE)).text();
          if (html.includes(marker)) return sent - committed;
          if (sent - committed > 10_000) return Infinity;
        }
      }),
    );
    for (const ms of changedAfter) expect(ms).toBeLessThan(1_000);
    // And it stays changed: nothing stale was stored by a render that began before the accept.
    for (const origin of origins) expect(await (await get(origin, JOB_PAGE)).text()).toContain(marker);
  });
});
