// Every protected route with each role, and the status it must answer. Guards run on the server:
// these requests skip every page and button.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { testDb } from "../support/db";
import { Browserish, signedInAs } from "../support/http";

const db = testDb();
afterAll(() => db.destroy());

type Who = "visitor" | "reporter" | "moderator" | "admin";
const clients = {} as Record<Who, Browserish>;
let targetId = "0";
let banTargetId = "0";

beforeAll(async () => {
  // Role changes in the matrix land on a user of the test's own, not on the demo people.
  const target = await db
    .insertInto("users")
    .values({ email: `matrix-${Date.now()}@demo.bayproof.test`, handle: `matrix-${Date.now() % 1e8}` })
    .returning("id")
    .executeTakeFirstOrThrow();
  targetId = String(target.id);
  const banTarget = await db
    .insertInto("users")
    .values({ email: `matrix-ban-${Date.now()}@demo.bayproof.test`, handle: `matrix-ban-${Date.now() % 1e8}` })
    .returning("id")
    .executeTakeFirstOrThrow();
  banTargetId = String(banTarget.id);
  clients.visitor = new Browserish();
  clients.reporter = await signedInAs(db, "reporter@demo.bayproof.test");
  clients.moderator = await signedInAs(db, "moderator@demo.bayproof.test");
  clients.admin = await signedInAs(db, "admin@demo.bayproof.test");
});

const SIGN_IN = 302; // a visitor is sent to /sign-in for any page that needs an account

// [method, path, form (for POST), expected status per role]
const matrix: [string, string, (() => Record<string, string>) | null, Record<Who, number>][] = [
  ["GET", "/account", null, { visitor: SIGN_IN, reporter: 200, moderator: 200, admin: 200 }],
  [
    "POST",
    "/account",
    () => ({ intent: "end-other-sessions" }),
    { visitor: SIGN_IN, reporter: 200, moderator: 200, admin: 200 },
  ],
  ["GET", "/admin/users", null, { visitor: SIGN_IN, reporter: 403, moderator: 403, admin: 200 }],
  ["GET", "/admin/users?q=mod", null, { visitor: SIGN_IN, reporter: 403, moderator: 403, admin: 200 }],
  [
    "POST",
    "/admin/users",
    () => ({ intent: "grant", userId: targetId, role: "moderator" }),
    { visitor: SIGN_IN, reporter: 403, moderator: 403, admin: 200 },
  ],
  ["GET", "/admin/jobs", null, { visitor: SIGN_IN, reporter: 403, moderator: 403, admin: 200 }],
  [
    "POST",
    "/admin/jobs",
    () => ({ intent: "send-again", jobId: "00000000-0000-4000-8000-000000000000" }),
    { visitor: SIGN_IN, reporter: 403, moderator: 403, admin: 404 },
  ],
  ["GET", "/admin/users/:target", null, { visitor: SIGN_IN, reporter: 403, moderator: 403, admin: 200 }],
  [
    "POST",
    "/admin/users/:target",
    () => ({ intent: "ban", reason: "Access matrix check" }),
    { visitor: SIGN_IN, reporter: 403, moderator: 403, admin: 200 },
  ],
  ["GET", "/reports/new", null, { visitor: SIGN_IN, reporter: 200, moderator: 200, admin: 200 }],
  ["GET", "/me/reports", null, { visitor: SIGN_IN, reporter: 200, moderator: 200, admin: 200 }],
  [
    "POST",
    "/reports/new",
    () => ({ intent: "autosave" }),
    { visitor: SIGN_IN, reporter: 400, moderator: 400, admin: 400 },
  ],
  ["POST", "/api/evidence/1/complete", () => ({}), { visitor: 401, reporter: 404, moderator: 404, admin: 404 }],
  ["GET", "/review", null, { visitor: SIGN_IN, reporter: 403, moderator: 200, admin: 200 }],
  ["GET", "/review/stats", null, { visitor: SIGN_IN, reporter: 403, moderator: 200, admin: 200 }],
  ["GET", "/review/999999", null, { visitor: SIGN_IN, reporter: 403, moderator: 404, admin: 404 }],
  [
    "POST",
    "/review/999999",
    () => ({ action: "reject", reasonCode: "duplicate", version: "1", seenDecisions: "0" }),
    { visitor: SIGN_IN, reporter: 403, moderator: 404, admin: 404 },
  ],
  [
    "POST",
    "/review/999999",
    () => ({ intent: "claim" }),
    { visitor: SIGN_IN, reporter: 403, moderator: 404, admin: 404 },
  ],
  ["GET", "/reports/999999/history", null, { visitor: SIGN_IN, reporter: 404, moderator: 404, admin: 404 }],
  [
    "POST",
    "/units",
    () => ({ system: "us", back: "/models" }),
    { visitor: 303, reporter: 303, moderator: 303, admin: 303 },
  ],
  ["GET", "/bench/rigs/new", null, { visitor: SIGN_IN, reporter: 200, moderator: 200, admin: 200 }],
  ["POST", "/bench/rigs/new", () => ({}), { visitor: SIGN_IN, reporter: 400, moderator: 400, admin: 400 }],
  ["GET", "/bench/rigs/999999/calibrations/new", null, { visitor: SIGN_IN, reporter: 404, moderator: 404, admin: 404 }],
  // A certificate is the rig owner's and moderators'; to anyone else it does not exist.
  [
    "GET",
    "/bench/rigs/999999/calibrations/1/certificate",
    null,
    { visitor: 404, reporter: 404, moderator: 404, admin: 404 },
  ],
  ["POST", "/api/bench/certificates", () => ({}), { visitor: 401, reporter: 415, moderator: 415, admin: 415 }],
  [
    "POST",
    "/bench/rigs/999999",
    () => ({ intent: "verify", calibrationId: "1" }),
    { visitor: SIGN_IN, reporter: 403, moderator: 404, admin: 404 },
  ],
  ["GET", "/air", null, { visitor: 200, reporter: 200, moderator: 200, admin: 200 }],
  ["GET", "/day", null, { visitor: 200, reporter: 200, moderator: 200, admin: 200 }],
  ["GET", "/", null, { visitor: 200, reporter: 200, moderator: 200, admin: 200 }],
  ["GET", "/models", null, { visitor: 200, reporter: 200, moderator: 200, admin: 200 }],
  ["GET", "/sign-in", null, { visitor: 200, reporter: 302, moderator: 302, admin: 302 }],
  // A form where JSON is expected: refused for its content type, once the caller is known.
  ["POST", "/api/evidence/1/publish", () => ({}), { visitor: 401, reporter: 415, moderator: 415, admin: 415 }],
  ["GET", "/data", null, { visitor: 200, reporter: 200, moderator: 200, admin: 200 }],
  ["GET", "/api/v1/job-types", null, { visitor: 200, reporter: 200, moderator: 200, admin: 200 }],
  ["POST", "/api/v1/job-types", () => ({}), { visitor: 405, reporter: 405, moderator: 405, admin: 405 }],
  ["GET", "/api/v1/bench-runs", null, { visitor: 200, reporter: 200, moderator: 200, admin: 200 }],
  // The bulk files take an API key, never a session: signed in or not, a browser gets 401.
  ["GET", "/api/v1/bench-runs.csv", null, { visitor: 401, reporter: 401, moderator: 401, admin: 401 }],
  ["POST", "/api/v1/bench-runs", () => ({}), { visitor: 405, reporter: 405, moderator: 405, admin: 405 }],
];

describe("access by role", () => {
  for (const [method, path, form, expected] of matrix) {
    for (const who of Object.keys(expected) as Who[]) {
      it(`${method} ${path} as ${who} → ${expected[who]}`, async () => {
        const client = clients[who];
        const url = path.replace(":target", banTargetId);
        const res = method === "GET" ? await client.get(url) : await client.post(url, form!());
        expect(res.status).toBe(expected[who]);
        if (expected[who] === SIGN_IN && who === "visitor") {
          expect(res.headers.get("location")).toMatch(/^\/sign-in\?redirectTo=/);
        }
      });
    }
  }

  it("logs who changed a role and when", async () => {
    const target = { id: Number(targetId) };
    await clients.admin.post("/admin/users", { intent: "revoke", userId: targetId, role: "moderator" });
    const res = await clients.admin.post("/admin/users", {
      intent: "grant",
      userId: String(target.id),
      role: "moderator",
    });
    expect(res.status).toBe(200);
    const log = await db
      .selectFrom("role_changes as rc")
      .innerJoin("users as a", "a.id", "rc.changed_by")
      .select(["rc.change", "rc.role", "a.email"])
      .where("rc.user_id", "=", target.id)
      .orderBy("rc.id", "desc")
      .executeTakeFirstOrThrow();
    expect(log).toEqual({ change: "grant", role: "moderator", email: "admin@demo.bayproof.test" });
    await clients.admin.post("/admin/users", { intent: "revoke", userId: String(target.id), role: "moderator" });
  });

  it("does not let an admin remove their own admin role", async () => {
    const me = await db
      .selectFrom("users")
      .select("id")
      .where("email", "=", "admin@demo.bayproof.test")
      .executeTakeFirstOrThrow();
    const res = await clients.admin.post("/admin/users", { intent: "revoke", userId: String(me.id), role: "admin" });
    expect(res.status).toBe(400);
    const still = await db
      .selectFrom("user_roles")
      .select("role")
      .where("user_id", "=", me.id)
      .where("role", "=", "admin")
      .executeTakeFirst();
    expect(still).toBeTruthy();
  });
});
