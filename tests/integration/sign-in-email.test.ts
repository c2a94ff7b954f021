// One-time e-mail links, read back from the local mail catcher.
import { afterAll, describe, expect, it } from "vitest";
import { randomToken, sha256Hex } from "../../app/utils/tokens.server";
import { testDb } from "../support/db";
import { Browserish } from "../support/http";
import { latestMailTo, linkIn } from "../support/mail";

const db = testDb();
afterAll(() => db.destroy());

async function requestLink(client: Browserish, email: string) {
  const since = Date.now();
  const res = await client.post("/sign-in", { email, redirectTo: "/account" });
  return { res, since };
}

describe("sign-in by e-mail link", () => {
  it("mails a single-use link that signs the person in", async () => {
    const client = new Browserish();
    const { res, since } = await requestLink(client, "Moderator2@demo.bayproof.test");
    expect(res.status).toBe(200);
    expect(await res.text()).toContain("Check your mail");

    const mail = await latestMailTo("moderator2@demo.bayproof.test", since);
    const link = new URL(linkIn(mail.text ?? "")!);
    const token = link.searchParams.get("token")!;
    expect(Buffer.from(token, "base64url").length).toBeGreaterThanOrEqual(16); // ≥ 128 bits
    const stored = await db
      .selectFrom("sign_in_links")
      .selectAll()
      .where("token_hash", "=", sha256Hex(token))
      .executeTakeFirstOrThrow();
    expect(stored.email).toBe("moderator2@demo.bayproof.test");
    expect(new Date(stored.expires_at).getTime() - new Date(stored.created_at).getTime()).toBeLessThanOrEqual(
      10 * 60_000 + 1000,
    );

    const confirm = await client.get(link.pathname + link.search);
    expect(confirm.status).toBe(200); // opening the link spends nothing
    const done = await client.post("/sign-in/link", { token, redirectTo: "/account" });
    expect(done.status).toBe(302);
    expect(done.headers.get("location")).toBe("/account");
    expect(await (await client.get("/account")).text()).toContain("mod-quentin");

    const replay = await new Browserish().post("/sign-in/link", { token, redirectTo: "/account" });
    expect(replay.status).toBe(400);
    expect(await replay.text()).toMatch(/already been used/);
  });

  it("refuses an expired link", async () => {
    const token = randomToken();
    await db
      .insertInto("sign_in_links")
      .values({
        token_hash: sha256Hex(token),
        email: "reporter@demo.bayproof.test",
        client_key: "test",
        created_at: new Date(Date.now() - 20 * 60_000),
        expires_at: new Date(Date.now() - 10 * 60_000),
      })
      .execute();
    const res = await new Browserish().post("/sign-in/link", { token });
    expect(res.status).toBe(400);
    expect(await res.text()).toMatch(/expired/);
  });

  it("refuses a made-up or malformed token", async () => {
    expect((await new Browserish().post("/sign-in/link", { token: randomToken() })).status).toBe(400);
    expect((await new Browserish().get("/sign-in/link?token=short")).status).toBe(400);
  });

  it("keeps what was typed and says why when the address is not valid", async () => {
    const res = await new Browserish().post("/sign-in", { email: "not-an-address" });
    expect(res.status).toBe(400);
    const html = await res.text();
    expect(html).toContain('value="not-an-address"');
    expect(html).toMatch(/Enter an e-mail address/);
  });

  it("limits links per address", async () => {
    const client = new Browserish();
    const address = `limit-${Date.now()}@demo.bayproof.test`;
    for (let i = 0; i < 3; i++) expect((await requestLink(client, address)).res.status).toBe(200);
    const fourth = await requestLink(client, address);
    expect(fourth.res.status).toBe(429);
    expect(await fourth.res.text()).toMatch(/Several links were sent/);
  });

  it("creates an account on a first sign-in with a new address", async () => {
    const client = new Browserish();
    const address = `first-${Date.now()}@demo.bayproof.test`;
    const { since } = await requestLink(client, address);
    const link = new URL(linkIn((await latestMailTo(address, since)).text ?? "")!);
    await client.post("/sign-in/link", { token: link.searchParams.get("token")!, redirectTo: "/account" });
    const user = await db.selectFrom("users").select(["handle"]).where("email", "=", address).executeTakeFirst();
    expect(user?.handle).toMatch(/^tech-[a-z0-9]{6}$/);
  });

  it("sends the visitor home, not to another site, when redirectTo hides a host", async () => {
    const client = new Browserish();
    const address = `redirect-${Date.now()}@demo.bayproof.test`;
    const since = Date.now();
    expect((await client.post("/sign-in", { email: address, redirectTo: "/\t/evil.example/" })).status).toBe(200);
    const link = new URL(linkIn((await latestMailTo(address, since)).text ?? "")!);
    // The hostile path is dropped: the link carries none, and the new technician lands on a new report.
    expect(link.searchParams.get("redirectTo")).toBe("");
    // A forged confirmation form carrying the hostile path itself is refused the same way.
    const done = await client.post("/sign-in/link", {
      token: link.searchParams.get("token")!,
      redirectTo: "/\t/evil.example/",
    });
    expect(done.status).toBe(302);
    expect(done.headers.get("location")).toBe("/reports/new");
  });
});
