// Forged cross-site posts, tampered cookies, sign-out, and the security headers.
import { afterAll, describe, expect, it } from "vitest";
import { sha256Hex } from "../../app/utils/tokens.server";
import { testDb } from "../support/db";
import { Browserish, cookieValue, signedInAs } from "../support/http";
import { serverLogDuring } from "../support/server-log";

const db = testDb();
afterAll(() => db.destroy());

const sessionToken = (client: Browserish) =>
  JSON.parse(Buffer.from(decodeURIComponent(client.cookies.get("bayproof_session")!), "base64").toString()) as string;
const sessionExists = async (client: Browserish) =>
  !!(await db
    .selectFrom("sessions")
    .select("id_hash")
    .where("id_hash", "=", sha256Hex(sessionToken(client)))
    .executeTakeFirst());

describe("cross-site request protection", () => {
  it("refuses a POST from another origin and changes nothing", async () => {
    const client = await signedInAs(db, "reporter@demo.bayproof.test");
    const res = await client.post("/sign-out", {}, { origin: "http://evil.example" });
    expect(res.status).toBe(403);
    expect(await res.text()).toMatch(/Cross-site request refused/);
    expect(await sessionExists(client)).toBe(true);
  });

  it("refuses a cross-site POST to a page with 403 and a reason, and logs no stack trace", async () => {
    const client = await signedInAs(db, "reporter@demo.bayproof.test");
    const log = await serverLogDuring(async () => {
      for (const [path, origin] of [
        ["/account", "http://evil.example"],
        ["/account.data", "http://evil.example"],
        ["/reports/new", "not a url"],
        ["/account", "null"],
      ] as const) {
        const res = await client.post(path, { intent: "create-key", name: "forged" }, { origin });
        expect(res.status, `${path} from ${origin}`).toBe(403);
        expect(await res.text()).toMatch(/Cross-site request refused/);
      }
    });
    // React Router's own check would have refused first, with a bare 400 and this in the log.
    expect(log).not.toMatch(/Aborting the action|origin` header/);
    const me = await db
      .selectFrom("users")
      .select("id")
      .where("email", "=", "reporter@demo.bayproof.test")
      .executeTakeFirstOrThrow();
    expect(
      await db
        .selectFrom("api_keys")
        .select("id")
        .where("user_id", "=", me.id)
        .where("name", "=", "forged")
        .executeTakeFirst(),
    ).toBeUndefined();
  });

  it("refuses a POST that carries neither Origin nor Sec-Fetch-Site", async () => {
    const client = await signedInAs(db, "reporter@demo.bayproof.test");
    const res = await client.post("/account", { intent: "create-key", name: "forged" }, {});
    expect(res.status).toBe(403);
    const me = await db
      .selectFrom("users")
      .select("id")
      .where("email", "=", "reporter@demo.bayproof.test")
      .executeTakeFirstOrThrow();
    expect(
      await db
        .selectFrom("api_keys")
        .select("id")
        .where("user_id", "=", me.id)
        .where("name", "=", "forged")
        .executeTakeFirst(),
    ).toBeUndefined();
  });

  it("signs out on a same-origin POST and deletes the session", async () => {
    const client = await signedInAs(db, "reporter@demo.bayproof.test");
    const token = sessionToken(client);
    const res = await client.post("/sign-out", {});
    expect(res.status).toBe(302);
    expect(
      await db.selectFrom("sessions").select("id_hash").where("id_hash", "=", sha256Hex(token)).executeTakeFirst(),
    ).toBeUndefined();
    expect((await client.get("/account")).status).toBe(302);
  });
});

describe("cookies", () => {
  it("treats a tampered or unknown session cookie as signed out", async () => {
    for (const value of ["garbage", cookieValue("A".repeat(43)), "%%%"]) {
      const client = new Browserish();
      client.cookies.set("bayproof_session", value);
      const res = await client.get("/account");
      expect(res.status).toBe(302);
      expect(res.headers.get("location")).toMatch(/^\/sign-in/);
    }
  });

  it("sets the session cookie HttpOnly and SameSite=Lax", async () => {
    const client = new Browserish();
    const start = await client.get("/auth/local");
    expect(start.headers.getSetCookie().join()).toMatch(/HttpOnly/i);
    const authorize = new URL(start.headers.get("location")!);
    authorize.searchParams.set("account", "demo-bay3-lenka");
    const back = new URL((await fetch(authorize, { redirect: "manual" })).headers.get("location")!);
    const done = await client.get(back.pathname + back.search);
    const session = done.headers.getSetCookie().find((c) => c.startsWith("bayproof_session="))!;
    expect(session).toMatch(/HttpOnly/i);
    expect(session).toMatch(/SameSite=Lax/i);
  });

  it("ends a session that has been idle past the timeout", async () => {
    const client = await signedInAs(db, "reporter@demo.bayproof.test");
    await db
      .updateTable("sessions")
      .set({ last_seen_at: new Date(Date.now() - 15 * 24 * 3600_000) })
      .where("id_hash", "=", sha256Hex(sessionToken(client)))
      .execute();
    expect((await client.get("/account")).status).toBe(302);
  });
});

describe("security headers", () => {
  it("sends an enforced CSP and the usual headers on pages", async () => {
    // A page only this visitor sees carries a nonce; a shared (cached) one hashes its inline scripts
    // instead (docs/decisions/012, tests/integration/page-cache.test.ts).
    const shared = (await new Browserish().get("/")).headers.get("content-security-policy")!;
    expect(shared).toMatch(/script-src 'self' 'sha256-[A-Za-z0-9+/=]+'/);
    expect(shared).not.toMatch(/'nonce-/);
    const res = await new Browserish().get("/sign-in");
    const csp = res.headers.get("content-security-policy")!;
    expect(csp).toMatch(/default-src 'self'/);
    expect(csp).toMatch(/script-src 'self' 'nonce-[A-Za-z0-9+/=]+'/);
    expect(csp).toMatch(/frame-ancestors 'none'/);
    expect(res.headers.get("content-security-policy-report-only")).toBeNull();
    expect(res.headers.get("x-content-type-options")).toBe("nosniff");
    expect(res.headers.get("referrer-policy")).toBe("strict-origin-when-cross-origin");
    const nonce = csp.match(/'nonce-([^']+)'/)![1]!;
    expect(await res.text()).toContain(`nonce="${nonce}"`);
  });
});

describe("static files", () => {
  it("carry nosniff and a CSP that loads nothing but our own styles, fonts and images", async () => {
    const page = await (await new Browserish().get("/")).text();
    const css = page.match(/href="(\/assets\/[^"]+\.css)"/)?.[1];
    expect(css).toBeTruthy();
    const stylesheet = await new Browserish().get(css!);
    const font = (await stylesheet.clone().text()).match(/url\((\/assets\/[^)]+\.woff2)\)/)?.[1];
    expect(font).toBeTruthy();
    for (const path of ["/favicon.svg", css!, font!]) {
      const res = await new Browserish().get(path);
      expect(res.status, path).toBe(200);
      expect(res.headers.get("x-content-type-options"), path).toBe("nosniff");
      expect(res.headers.get("content-security-policy"), path).toBe(
        "default-src 'none'; style-src 'self'; font-src 'self'; img-src 'self'; frame-ancestors 'none'",
      );
      await res.body?.cancel();
    }
    expect((await new Browserish().get(font!)).headers.get("content-type")).toMatch(/font\/woff2/);
  });
});

describe("API keys", () => {
  it("shows a new key once, stores only its hash, and revokes it", async () => {
    const client = await signedInAs(db, "reporter@demo.bayproof.test");
    const res = await client.post("/account", { intent: "create-key", name: "trade school project" });
    expect(res.status).toBe(200);
    const key = (await res.text()).match(/bpk_[A-Za-z0-9_-]{43}/)?.[0];
    expect(key).toBeTruthy();
    const row = await db
      .selectFrom("api_keys")
      .selectAll()
      .where("key_hash", "=", sha256Hex(key!))
      .executeTakeFirstOrThrow();
    expect(row.name).toBe("trade school project");
    expect(JSON.stringify(row)).not.toContain(key!);
    const page = await (await client.get("/account")).text();
    expect(page).not.toContain(key!);
    expect((await client.post("/account", { intent: "revoke-key", keyId: String(row.id) })).status).toBe(200);
    const revoked = await db
      .selectFrom("api_keys")
      .select("revoked_at")
      .where("id", "=", row.id)
      .executeTakeFirstOrThrow();
    expect(revoked.revoked_at).not.toBeNull();
  });

  it("will not revoke someone else's key", async () => {
    const owner = await signedInAs(db, "moderator@demo.bayproof.test");
    await owner.post("/account", { intent: "create-key", name: "mine" });
    const me = await db
      .selectFrom("users")
      .select("id")
      .where("email", "=", "moderator@demo.bayproof.test")
      .executeTakeFirstOrThrow();
    const key = await db.selectFrom("api_keys").select("id").where("user_id", "=", me.id).executeTakeFirstOrThrow();
    const other = await signedInAs(db, "reporter@demo.bayproof.test");
    expect((await other.post("/account", { intent: "revoke-key", keyId: String(key.id) })).status).toBe(404);
  });
});

describe("an /api address that does not exist", () => {
  it("answers a JSON 404, for reads and writes alike, never the HTML page", async () => {
    for (const res of [
      await new Browserish().get("/api/nope"),
      await new Browserish().get("/api/"),
      await new Browserish().post("/api/nope", { a: "1" }),
    ]) {
      expect(res.status).toBe(404);
      expect(res.headers.get("content-type")).toMatch(/application\/json/);
      expect((await res.json()).error.code).toBe("not_found");
    }
  });
});
