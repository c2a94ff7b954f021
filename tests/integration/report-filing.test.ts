// Filing a report through the route's action: validation, drafts, submission, flags, versions.
import { sql } from "kysely";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { testDb } from "../support/db";
import { type Browserish, signedInAs } from "../support/http";
import { validReport } from "../support/reports";

const db = testDb();
let reporter: Browserish;
let reporterId: number;

beforeAll(async () => {
  const email = `filer-${Date.now()}@demo.bayproof.test`;
  reporterId = (
    await db
      .insertInto("users")
      .values({ email, handle: `filer-${Date.now() % 1e8}` })
      .returning("id")
      .executeTakeFirstOrThrow()
  ).id;
  reporter = await signedInAs(db, email);
});
afterAll(() => db.destroy());

const countOwn = async () =>
  (await sql<{ n: number }>`select count(*)::int n from reports where reporter_id = ${reporterId}`.execute(db)).rows[0]!
    .n;

describe("the filing action refuses bad input and stores nothing", () => {
  const table: [string, Record<string, string>, RegExp][] = [
    ["a pressure that is not a number", { inlet: "abc" }, /Enter the pressure at the tool inlet/],
    ["a huge pressure", { inlet: "99999999", regulator: "99999999" }, /Between 0 and 2,000 kPa/],
    ["a negative time", { time: "-5" }, /Enter the time/],
    ["more than 8 hours", { time: "9 h" }, /At most 8 hours/],
    ["no attempts", { attempts: "0" }, /At least 1/],
    ["too many attempts", { attempts: "51" }, /At most 50/],
    ["a hose bore outside 4–25 mm", { hoseId: "2" }, /Between 5\/32 and 1 in/],
    ["a negative hose length", { hoseLength: "-10" }, /More than 0/],
    ["an inlet above the regulator beyond gauge error", { regulator: "80", inlet: "100" }, /Higher than the regulator/],
    ["HTML in the notes", { notes: "<script>alert(1)</script>" }, /Notes are plain text/],
    ["a job from another tool category", { jobType: "lug-nut-breakaway" }, /not one for an air hammer/],
    ["an unknown vehicle class", { vehicleClass: "spaceship" }, /Pick the vehicle class/],
    ["couplers as words", { couplerCount: "two" }, /Couplers come in whole numbers/],
    ["an unknown tool", { toolModel: "no-such-tool" }, /No such tool/],
    ["no outcome", { outcome: "" }, /Say how it ended/],
  ];
  for (const [what, change, message] of table) {
    it(`refuses ${what}`, async () => {
      const before = await countOwn();
      const res = await reporter.post("/reports/new", { ...validReport(), ...change });
      expect(res.status).toBe(400);
      const html = await res.text();
      expect(html).toMatch(message);
      // every value typed comes back (conform's reply carries them)
      if (!change.notes) expect(html).toContain("Soaked overnight.");
      else expect(html).toContain("&lt;script&gt;"); // kept, and shown as text
      expect(await countOwn()).toBe(before);
    });
  }

  it("refuses to touch someone else's report", async () => {
    const other =
      (await db
        .selectFrom("reports")
        .select(["id", "status", "updated_at"])
        .where("reporter_id", "!=", reporterId)
        .where("status", "=", "draft")
        .executeTakeFirst()) ??
      (await db
        .selectFrom("reports")
        .select(["id", "status", "updated_at"])
        .where("reporter_id", "!=", reporterId)
        .where("status", "=", "returned")
        .executeTakeFirstOrThrow());
    const res = await reporter.post(`/reports/${other.id}/edit`, { ...validReport(), reportId: String(other.id) });
    expect(res.status).toBe(404);
    const after = await db
      .selectFrom("reports")
      .select(["status", "updated_at"])
      .where("id", "=", other.id)
      .executeTakeFirstOrThrow();
    expect(after).toEqual({ status: other.status, updated_at: other.updated_at });
  });
});

describe("drafts and submission", () => {
  it("saves a draft as soon as it has a tool and a job, keeping only valid fields", async () => {
    const res = await reporter.post("/reports/new", {
      intent: "save-draft",
      pu: "psi",
      lu: "in",
      toolModel: "brackwater-bh-150",
      jobType: "tie-rod-end-release",
      inlet: "abc",
      regulator: "95",
    });
    expect(res.status).toBe(302);
    const id = Number(res.headers.get("location")!.match(/\/reports\/(\d+)\/edit/)![1]);
    const row = await db.selectFrom("reports").selectAll().where("id", "=", id).executeTakeFirstOrThrow();
    expect(row.status).toBe("draft");
    expect(row.reporter_id).toBe(reporterId);
    expect(row.inlet_kpa).toBeNull();
    // 95 psi = 655.0019 kPa (NIST SP 811), stored at the 0.1 kPa it is entered at
    expect(row.regulator_kpa).toBe(655);
  });

  it("accepts a typed tool without JavaScript when it names exactly one model", async () => {
    const res = await reporter.post("/reports/new", { ...validReport(), toolModel: "", toolQuery: "bh-150" });
    expect(res.status).toBe(302);
    const ambiguous = await reporter.post("/reports/new", { ...validReport(), toolModel: "", toolQuery: "brackwater" });
    expect(ambiguous.status).toBe(400);
    expect(await ambiguous.text()).toMatch(/Pick the tool from the suggestions/);
  });

  it("refuses a draft without a tool", async () => {
    const res = await reporter.post("/reports/new", {
      intent: "autosave",
      pu: "psi",
      lu: "in",
      jobType: "tie-rod-end-release",
    });
    expect(res.status).toBe(400);
  });

  it("submits a complete report in SI, with flags and a version snapshot", async () => {
    const res = await reporter.post("/reports/new", validReport());
    expect(res.status).toBe(302);
    const id = Number(res.headers.get("location")!.match(/submitted=(\d+)/)![1]);
    const row = await db.selectFrom("reports").selectAll().where("id", "=", id).executeTakeFirstOrThrow();
    expect(row.status).toBe("submitted");
    // 92 psi × 6.894757 kPa/psi (NIST SP 811); 3/8 in × 25.4 mm; 50 ft × 0.3048 m; 60 US gal × 3.785411784 l,
    // stored at the precision they are entered at (0.1 kPa, 0.001 mm, 0.01 m, 0.1 l): 634.3176 → 634.3, 227.1247 → 227.1
    expect(row.inlet_kpa).toBe(634.3);
    expect(row.hose_id_mm).toBeCloseTo(9.525, 6);
    expect(row.hose_length_m).toBeCloseTo(15.24, 6);
    expect(row.tank_l).toBe(227.1);
    expect(row.time_to_result_s).toBe(45);
    expect(row.flags).toEqual(expect.arrayContaining(["no_evidence"]));
    const snapshot = await db
      .selectFrom("report_versions")
      .select(["version", "snapshot"])
      .where("report_id", "=", id)
      .executeTakeFirstOrThrow();
    expect(snapshot.version).toBe(1);
    expect((snapshot.snapshot as { inlet_kpa: number }).inlet_kpa).toBe(634.3);
    const mine = await (await reporter.get("/me/reports")).text();
    expect(mine).toMatch(new RegExp(`#(<!-- -->)?${id}<`));
    expect(mine).toContain("Waiting for a moderator");
  });

  it("flags a reporter's first report, running above the tool's rating, shop-air limits and outlying times", async () => {
    const email = `flags-${Date.now()}@demo.bayproof.test`;
    await db
      .insertInto("users")
      .values({ email, handle: `flags-${Date.now() % 1e8}` })
      .execute();
    const fresh = await signedInAs(db, email);
    const res = await fresh.post("/reports/new", { ...validReport(), regulator: "250", inlet: "240", time: "8 h" });
    expect(res.status).toBe(302);
    const id = Number(res.headers.get("location")!.match(/submitted=(\d+)/)![1]);
    const row = await db.selectFrom("reports").select("flags").where("id", "=", id).executeTakeFirstOrThrow();
    expect(row.flags).toEqual(
      expect.arrayContaining([
        "first_report",
        "above_rated_inlet",
        "pressure_above_limit",
        "time_outlier",
        "no_evidence",
      ]),
    );
    expect(row.flags).not.toContain("inlet_above_regulator");
  });

  it("withdraws an incomplete draft, from the form and from the reports list", async () => {
    for (const from of ["form", "list"] as const) {
      const saved = await reporter.post("/reports/new", {
        toolModel: "brackwater-bh-150",
        jobType: "ball-joint-separation",
        intent: "save-draft",
      });
      expect(saved.status).toBe(302);
      const id = Number(saved.headers.get("location")!.match(/\/reports\/(\d+)\/edit/)![1]);
      // The report form posts every field it has (here: almost none); the list posts only the id.
      const body: Record<string, string> =
        from === "list"
          ? { intent: "withdraw", reportId: String(id) }
          : {
              intent: "withdraw",
              reportId: String(id),
              toolModel: "brackwater-bh-150",
              jobType: "ball-joint-separation",
              notes: "",
              inlet: "",
            };
      const res = await reporter.post(`/reports/${id}/edit`, body);
      expect(res.status).toBe(302);
      expect(res.headers.get("location")).toBe("/me/reports?withdrawn=1");
      const row = await db
        .selectFrom("reports")
        .select(["status", "outcome", "submitted_at"])
        .where("id", "=", id)
        .executeTakeFirstOrThrow();
      expect(row).toEqual({ status: "withdrawn", outcome: null, submitted_at: null });
    }
  });

  it("withdraws before a decision, never after", async () => {
    const res = await reporter.post("/reports/new", validReport());
    const id = Number(res.headers.get("location")!.match(/submitted=(\d+)/)![1]);
    expect((await reporter.post(`/reports/${id}/edit`, { intent: "withdraw", reportId: String(id) })).status).toBe(302);
    expect(
      (await db.selectFrom("reports").select("status").where("id", "=", id).executeTakeFirstOrThrow()).status,
    ).toBe("withdrawn");

    const accepted = await db
      .selectFrom("reports")
      .innerJoin("users", "users.id", "reports.reporter_id")
      .select(["reports.id", "users.email"])
      .where("reports.status", "=", "accepted")
      .executeTakeFirstOrThrow();
    const owner = await signedInAs(db, accepted.email);
    const refused = await owner.post(`/reports/${accepted.id}/edit`, {
      intent: "withdraw",
      reportId: String(accepted.id),
    });
    expect(refused.status).toBe(409);
  });

  it("resubmits a returned report as a new version, keeping the earlier one", async () => {
    const returned = await db
      .selectFrom("reports")
      .innerJoin("users", "users.id", "reports.reporter_id")
      .select(["reports.id", "reports.version", "reports.inlet_kpa", "users.email"])
      .where("reports.status", "=", "returned")
      .orderBy("reports.id", "desc")
      .executeTakeFirstOrThrow();
    const owner = await signedInAs(db, returned.email);
    expect((await owner.get(`/reports/${returned.id}/edit`)).status).toBe(200);
    const job = await db
      .selectFrom("job_types")
      .innerJoin("reports", "reports.job_type_id", "job_types.id")
      .innerJoin("tool_models", "tool_models.id", "reports.tool_model_id")
      .select(["job_types.slug as job", "tool_models.slug as tool"])
      .where("reports.id", "=", returned.id)
      .executeTakeFirstOrThrow();
    const res = await owner.post(`/reports/${returned.id}/edit`, {
      ...validReport(),
      toolModel: job.tool,
      jobType: job.job,
      reportId: String(returned.id),
      inlet: "88",
    });
    expect(res.status).toBe(302);
    const row = await db
      .selectFrom("reports")
      .select(["status", "version"])
      .where("id", "=", returned.id)
      .executeTakeFirstOrThrow();
    expect(row).toEqual({ status: "submitted", version: returned.version + 1 });
    const versions = await db
      .selectFrom("report_versions")
      .select("version")
      .where("report_id", "=", returned.id)
      .execute();
    expect(versions.map((v) => v.version)).toContain(returned.version + 1);
  });
});
