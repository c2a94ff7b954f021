// Where each role lands after signing in without asking for a page (issue 18, item 6).
import { afterAll, describe, expect, it } from "vitest";
import { landingPath } from "../../app/auth/landing.server";
import { testDb } from "../support/db";

const db = testDb();
afterAll(() => db.destroy());

const idOf = async (email: string) =>
  (await db.selectFrom("users").select("id").where("email", "=", email).executeTakeFirstOrThrow()).id;

describe("landing after sign-in", () => {
  it("sends a moderator to the review queue", async () => {
    expect(await landingPath(db, await idOf("moderator@demo.bayproof.test"), undefined)).toBe("/review");
  });

  it("sends a technician who has filed to their reports, and a new one to a first report", async () => {
    expect(await landingPath(db, await idOf("reporter@demo.bayproof.test"), "")).toBe("/me/reports");
    const email = `landing-${Date.now()}@demo.bayproof.test`;
    const [user] = await db
      .insertInto("users")
      .values({ email, handle: `land-${String(Date.now()).slice(-8)}` })
      .returning("id")
      .execute();
    expect(await landingPath(db, user!.id, null)).toBe("/reports/new");
  });

  it("lets a safe redirectTo win and ignores an unsafe one", async () => {
    const id = await idOf("moderator@demo.bayproof.test");
    expect(await landingPath(db, id, "/models?job=lug-nut-breakaway")).toBe("/models?job=lug-nut-breakaway");
    expect(await landingPath(db, id, "//evil.example/")).toBe("/review");
  });
});
