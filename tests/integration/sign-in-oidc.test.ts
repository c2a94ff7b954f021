// The OpenID Connect flow end to end over HTTP: app → fake provider → app.
import { sql } from "kysely";
import { afterAll, describe, expect, it } from "vitest";
import { testDb } from "../support/db";
import { Browserish } from "../support/http";

const db = testDb();
afterAll(() => db.destroy());

const sessionCount = async () =>
  (await sql<{ n: number }>`select count(*)::int n from sessions`.execute(db)).rows[0]!.n;

/** Runs the flow up to the provider's redirect back, choosing `account` on its picker. */
async function toCallback(client: Browserish, account: string) {
  const start = await client.get("/auth/local?redirectTo=/account");
  expect(start.status).toBe(302);
  const authorize = new URL(start.headers.get("location")!);
  expect(authorize.searchParams.get("code_challenge_method")).toBe("S256");
  expect(authorize.searchParams.get("state")).toBeTruthy();
  expect(authorize.searchParams.get("nonce")).toBeTruthy();
  expect(client.cookies.has("bayproof_oidc")).toBe(true);

  const picker = await fetch(authorize, { redirect: "manual" });
  expect(picker.status).toBe(200);
  expect(await picker.text()).toContain("reporter@demo.bayproof.test");
  authorize.searchParams.set("account", account);
  const back = await fetch(authorize, { redirect: "manual" });
  expect(back.status).toBe(302);
  return new URL(back.headers.get("location")!);
}

describe("sign-in through the OpenID provider", () => {
  it("signs a demo account in by (provider, subject) and lands on the page asked for", async () => {
    const client = new Browserish();
    const callback = await toCallback(client, "demo-rustbelt-ana");
    const done = await client.get(callback.pathname + callback.search);
    expect(done.status).toBe(302);
    expect(done.headers.get("location")).toBe("/account");
    expect(client.cookies.has("bayproof_session")).toBe(true);
    expect(client.cookies.has("bayproof_oidc")).toBe(false);
    const account = await client.get("/account");
    expect(account.status).toBe(200);
    expect(await account.text()).toContain("rustbelt-ana");
  });

  it("creates an account for a new person and links it to the subject", async () => {
    const client = new Browserish();
    const callback = await toCallback(client, "new");
    const done = await client.get(callback.pathname + callback.search);
    expect(done.status).toBe(302);
    const page = await (await client.get("/account")).text();
    const email = page.match(/new-[0-9a-f]{8}@demo\.bayproof\.test/)?.[0];
    expect(email).toBeTruthy();
    const link = await db
      .selectFrom("oauth_accounts")
      .selectAll()
      .where("email_at_link", "=", email!)
      .executeTakeFirst();
    expect(link?.provider).toBe("local");
    expect(link?.subject).toMatch(/^new-/);
  });

  it("refuses a callback whose state does not match, and creates no session", async () => {
    const client = new Browserish();
    const callback = await toCallback(client, "demo-rustbelt-ana");
    callback.searchParams.set("state", "forged-state");
    const before = await sessionCount();
    const res = await client.get(callback.pathname + callback.search);
    expect(res.status).toBe(400);
    expect(await res.text()).toMatch(/does not match this attempt/);
    expect(await sessionCount()).toBe(before);
  });

  it("refuses a callback without the attempt's cookie (another browser, or expired)", async () => {
    const client = new Browserish();
    const callback = await toCallback(client, "demo-rustbelt-ana");
    const res = await new Browserish().get(callback.pathname + callback.search);
    expect(res.status).toBe(400);
    expect(await res.text()).toMatch(/expired or was started in another browser/);
  });

  it("reports a refusal at the provider", async () => {
    const client = new Browserish();
    const start = await client.get("/auth/local");
    const state = new URL(start.headers.get("location")!).searchParams.get("state")!;
    const res = await client.get(`/auth/local/callback?error=access_denied&state=${state}`);
    expect(res.status).toBe(401);
  });

  it("answers 400 for an unknown provider", async () => {
    const res = await new Browserish().get("/auth/nosuchprovider");
    expect(res.status).toBe(400);
    expect(await res.text()).toMatch(/Unknown sign-in provider/);
  });

  it("never sends the user to another site after sign-in", async () => {
    const client = new Browserish();
    const start = await client.get("/auth/local?redirectTo=//evil.example/steal");
    const authorize = new URL(start.headers.get("location")!);
    authorize.searchParams.set("account", "demo-rustbelt-ana");
    const back = new URL((await fetch(authorize, { redirect: "manual" })).headers.get("location")!);
    const done = await client.get(back.pathname + back.search);
    // Not the hostile path: the page where a reporter works.
    expect(done.headers.get("location")).toMatch(/^\/(me\/reports|reports\/new)$/);
  });
});
