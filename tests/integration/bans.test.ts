// Bans from the admin's user page: sessions end, API keys stop, the reason is logged, and an unban
// brings back no old session.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createApiKey } from "../../app/auth/api-keys.server";
import { testDb } from "../support/db";
import { type Browserish, signedInAs } from "../support/http";

const db = testDb();
let admin: Browserish;
afterAll(() => db.destroy());
beforeAll(async () => {
  admin = await signedInAs(db, "admin@demo.bayproof.test");
});

/** A user of the test's own (never a demo person), signed in twice, with one API key. */
async function freshUser() {
  const stamp = `${Date.now()}${Math.floor(Math.random() * 1000)}`;
  const email = `ban-test-${stamp}@demo.bayproof.test`;
  const { id } = await db
    .insertInto("users")
    .values({ email, handle: `bantest-${stamp.slice(-9)}` })
    .returning("id")
    .executeTakeFirstOrThrow();
  const phone = await signedInAs(db, email);
  const laptop = await signedInAs(db, email);
  const key = await createApiKey(db, id, "bench scripts");
  return { id, phone, laptop, key };
}

const sessionsOf = async (userId: number) =>
  (await db.selectFrom("sessions").select("id_hash").where("user_id", "=", userId).execute()).length;
const feedWith = (key: string) =>
  fetch(new URL("/api/v1/job-types", admin.origin), {
    headers: { authorization: `Bearer ${key}`, "x-forwarded-for": `198.51.100.${Math.floor(Math.random() * 250) + 1}` },
  });
const banLog = (userId: number) =>
  db
    .selectFrom("ban_changes as b")
    .innerJoin("users as a", "a.id", "b.changed_by")
    .select(["b.change", "b.reason", "a.email as actor"])
    .where("b.user_id", "=", userId)
    .orderBy("b.id")
    .execute();

describe("banning from /admin/users/:id", () => {
  it("needs a reason, and changes nothing without one", async () => {
    const target = await freshUser();
    const res = await admin.post(`/admin/users/${target.id}`, { intent: "ban", reason: "  " });
    expect(res.status).toBe(400);
    expect(await res.text()).toMatch(/Say why, in at least 3 characters/);
    expect(await sessionsOf(target.id)).toBe(2);
    expect(await banLog(target.id)).toEqual([]);
  });

  it("deletes every session, revokes every API key and logs who banned and why", async () => {
    const target = await freshUser();
    expect((await target.phone.get("/account")).status).toBe(200);
    expect((await feedWith(target.key)).status).toBe(200);

    const res = await admin.post(`/admin/users/${target.id}`, { intent: "ban", reason: "Filed invented reports" });
    expect(res.status).toBe(200);
    expect(await res.text()).toMatch(/every session ended/);
    expect(await sessionsOf(target.id)).toBe(0);
    expect((await target.phone.get("/account")).status).toBe(302);
    expect((await target.laptop.get("/account")).status).toBe(302);
    const keys = await db.selectFrom("api_keys").select("revoked_at").where("user_id", "=", target.id).execute();
    expect(keys.every((k) => k.revoked_at !== null)).toBe(true);
    expect((await feedWith(target.key)).status).toBe(401);
    expect(await banLog(target.id)).toEqual([
      { change: "ban", reason: "Filed invented reports", actor: "admin@demo.bayproof.test" },
    ]);
    expect(await (await admin.get(`/admin/users/${target.id}`)).text()).toContain("Filed invented reports");
  });

  it("unbans with a logged reason, and the old sessions stay ended", async () => {
    const target = await freshUser();
    await admin.post(`/admin/users/${target.id}`, { intent: "ban", reason: "Spam in report notes" });
    const res = await admin.post(`/admin/users/${target.id}`, { intent: "unban", reason: "Appeal upheld" });
    expect(res.status).toBe(200);
    const user = await db.selectFrom("users").select("banned_at").where("id", "=", target.id).executeTakeFirstOrThrow();
    expect(user.banned_at).toBeNull();
    expect((await target.phone.get("/account")).status).toBe(302);
    expect((await feedWith(target.key)).status).toBe(401);
    expect((await banLog(target.id)).map((b) => [b.change, b.reason])).toEqual([
      ["ban", "Spam in report notes"],
      ["unban", "Appeal upheld"],
    ]);
  });

  it("does not let an admin ban themselves, and answers 404 for an unknown user", async () => {
    const me = await db
      .selectFrom("users")
      .select("id")
      .where("email", "=", "admin@demo.bayproof.test")
      .executeTakeFirstOrThrow();
    const self = await admin.post(`/admin/users/${me.id}`, { intent: "ban", reason: "Testing myself" });
    expect(self.status).toBe(400);
    expect(await self.text()).toMatch(/cannot ban yourself/);
    expect((await admin.get("/admin/users/2147483647")).status).toBe(404);
    expect((await admin.get("/admin/users/not-a-number")).status).toBe(404);
    expect((await admin.post("/admin/users/2147483647", { intent: "ban", reason: "Nobody" })).status).toBe(404);
  });
});
