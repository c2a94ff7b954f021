// Registering a rig and filing its calibration over HTTP: each bad field comes back with its message
// and the typed values kept; only the owner files a calibration; pasted rows are refused line by line;
// the stored fit is fitCalibration's; a moderator verifies (never on their own rig, and a reporter not
// at all); a run is refused on the rig until its calibration is verified, and filed after.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { fitCalibration } from "../../app/bench/calibration";
import { N_PER_LBF } from "../../app/domain";
import { testDb } from "../support/db";
import { type Browserish, signedInAs } from "../support/http";

const db = testDb();
let reporter: Browserish;
let moderator: Browserish;
let admin: Browserish;
let hammerId: number;
let wrenchId: number;
const rigs: number[] = [];

beforeAll(async () => {
  reporter = await signedInAs(db, "reporter@demo.bayproof.test");
  moderator = await signedInAs(db, "moderator@demo.bayproof.test");
  admin = await signedInAs(db, "admin@demo.bayproof.test");
  const model = (slug: string) =>
    db
      .selectFrom("tool_models as m")
      .innerJoin("tool_categories as c", "c.id", "m.category_id")
      .select("m.id")
      .where("c.slug", "=", slug)
      .orderBy("m.id")
      .executeTakeFirstOrThrow();
  hammerId = (await model("air-hammer")).id;
  wrenchId = (await model("impact-wrench")).id;
});
afterAll(async () => {
  if (rigs.length) {
    await db.deleteFrom("bench_runs").where("rig_id", "in", rigs).execute();
    await db.deleteFrom("rigs").where("id", "in", rigs).execute();
  }
  await db.destroy();
});

// No units cookie and no Accept-Language: the client reads US units (lbf).
const rigForm = (extra: Record<string, string> = {}) => ({
  name: `Test drop-anvil rig ${Date.now() % 1e6}`,
  kind: "percussive_force",
  capacity: "5000",
  sampleRateHz: "20000",
  fixture: "A 40 kg steel anvil on a load cell, bolted to the slab",
  checkToolModelId: String(hammerId),
  checkIntervalMonths: "12",
  ...extra,
});

async function register(client: Browserish, extra: Record<string, string> = {}) {
  const res = await client.post("/bench/rigs/new", rigForm(extra));
  expect(res.status).toBe(302);
  const id = Number(/^\/bench\/rigs\/(\d+)$/.exec(res.headers.get("location") ?? "")?.[1]);
  expect(id).toBeGreaterThan(0);
  rigs.push(id);
  return id;
}

const rigCount = async () =>
  Number(
    (
      await db
        .selectFrom("rigs")
        .select((eb) => eb.fn.countAll<string>().as("n"))
        .executeTakeFirstOrThrow()
    ).n,
  );

/** Rows with a little curvature: reading = ref + 2e-5·ref² + a small wobble (lbf). */
const curvedRows = () =>
  ["reference,reading"]
    .concat(
      [500, 1000, 1500, 2000, 2500, 3000, 3500, 4000].map(
        (r, i) => `${r},${(r + 2e-5 * r * r + (i % 2 ? 0.4 : -0.4)).toFixed(2)}`,
      ),
    )
    .join("\n");
const straightRows = "0,0.2\n1000,1000.9\n2000,2000.6\n3000,3001.3\n4000,4000.8";

describe("registering a rig", () => {
  it("registers a rig owned by the signed-in user, with the capacity stored in N", async () => {
    const page = await reporter.get("/bench/rigs/new");
    expect(page.status).toBe(200);
    const html = await page.text();
    expect(html).toContain("Register your rig");
    expect(html).toContain("No shank adapters"); // the rig cautions (components/bench/bench-safety)
    const id = await register(reporter);
    const rig = await db.selectFrom("rigs").selectAll().where("id", "=", id).executeTakeFirstOrThrow();
    const me = await db
      .selectFrom("users")
      .select("id")
      .where("email", "=", "reporter@demo.bayproof.test")
      .executeTakeFirstOrThrow();
    expect(rig.owner_id).toBe(me.id);
    expect(rig.sensor_kind).toBe("load_cell");
    expect(rig.sensor_capacity).toBeCloseTo(5000 * N_PER_LBF, 6);
    expect(rig.check_tool_model_id).toBe(hammerId);
    expect((await reporter.get("/bench")).status).toBe(200);
    expect(await (await reporter.get("/bench")).text()).toContain('href="/bench/rigs/new"');
  });

  const bad: [string, Record<string, string>, RegExp][] = [
    ["name", { name: "x" }, /Name the rig/],
    ["kind", { kind: "wind_tunnel" }, /Choose what the rig measures/],
    ["capacity", { capacity: "lots" }, /as a positive number/],
    ["capacity", { capacity: "0" }, /as a positive number/],
    ["capacity", { capacity: "900000" }, /At most 449,617 lbf/],
    ["sampleRateHz", { sampleRateHz: "50" }, /From 100 to 100,000 Hz/],
    ["fixture", { fixture: "ab" }, /Describe the anvil or fixture/],
    ["checkToolModelId", { checkToolModelId: "abc" }, /Choose the check-standard tool/],
    ["checkToolModelId", { checkToolModelId: "2147483000" }, /Choose the check-standard tool/],
    ["checkIntervalMonths", { checkIntervalMonths: "40" }, /1 to 36/],
  ];
  for (const [field, extra, message] of bad) {
    it(`answers a bad ${field} (${Object.values(extra)[0]}) with its message and keeps what was typed`, async () => {
      const before = await rigCount();
      const form = rigForm({ ...extra, fixture: extra.fixture ?? "Anvil kept: typed text survives" });
      const res = await reporter.post("/bench/rigs/new", form);
      expect(res.status).toBe(400);
      const html = await res.text();
      expect(html).toMatch(message);
      expect(html).toContain(`href="#${field}"`); // the error summary links to the field
      expect(html).toContain(form.fixture);
      expect(await rigCount()).toBe(before);
    });
  }

  it("refuses a check standard of the wrong kind", async () => {
    const res = await reporter.post("/bench/rigs/new", rigForm({ checkToolModelId: String(wrenchId) }));
    expect(res.status).toBe(400);
    expect(await res.text()).toContain("A force rig&#x27;s check standard is an air hammer");
  });

  it("sends a visitor to sign in", async () => {
    const { Browserish: Visitor } = await import("../support/http");
    const res = await new Visitor().get("/bench/rigs/new");
    expect(res.status).toBe(302);
  });
});

describe("filing and verifying a calibration", () => {
  let rigId: number;
  beforeAll(async () => {
    rigId = await register(reporter, { name: "Test rig for calibrations" });
  });

  it("lets only the owner file a calibration", async () => {
    expect((await reporter.get(`/bench/rigs/${rigId}/calibrations/new`)).status).toBe(200);
    expect((await moderator.get(`/bench/rigs/${rigId}/calibrations/new`)).status).toBe(403);
    const post = await moderator.post(`/bench/rigs/${rigId}/calibrations/new`, {
      points: straightRows,
      calibratedOn: "2026-11-01",
      intent: "save",
    });
    expect(post.status).toBe(403);
    expect((await reporter.get(`/bench/rigs/999999/calibrations/new`)).status).toBe(404);
    expect((await reporter.get(`/bench/rigs/abc/calibrations/new`)).status).toBe(404);
  });

  it("refuses bad rows naming their lines, and a day in the future", async () => {
    const post = (points: string, calibratedOn = "2026-11-01") =>
      reporter.post(`/bench/rigs/${rigId}/calibrations/new`, { points, calibratedOn, intent: "save" });
    let res = await post("reference,reading\n1000,1004\nabc,2\n-5,3\n1000,7\n2000,2001 9");
    expect(res.status).toBe(400);
    const html = await res.text();
    expect(html).toMatch(/Line 3: .{1,8}abc.{1,8} is not a number/);
    expect(html).toContain("Line 4: loads and readings cannot be negative");
    expect(html).toContain("Line 5: the reference 1000 is already on line 2");
    expect(html).toMatch(/Line 6: two values are needed/);
    expect(html).toContain("-5,3"); // what was pasted is kept
    res = await post("1,2\n3,4");
    expect(await res.text()).toContain("At least 3 rows are needed; found 2");
    res = await post(Array.from({ length: 201 }, (_, i) => `${i + 1},${i + 1}`).join("\n"));
    expect(await res.text()).toContain("At most 200 rows; found 201");
    res = await post("1000,5\n2000,5\n3000,5");
    expect(res.status).toBe(400);
    expect(await res.text()).toContain("every reading is the same");
    const tomorrow = new Date(Date.now() + 2 * 86_400_000).toISOString().slice(0, 10);
    res = await post(straightRows, tomorrow);
    expect(res.status).toBe(400);
    expect(await res.text()).toContain("The calibration cannot be in the future");
    const stored = await db.selectFrom("rig_calibrations").select("id").where("rig_id", "=", rigId).execute();
    expect(stored).toEqual([]);
  });

  it("shows the fit before saving, then stores fitCalibration's fit unverified", async () => {
    const preview = await reporter.post(`/bench/rigs/${rigId}/calibrations/new`, {
      points: curvedRows(),
      calibratedOn: "2026-11-01",
      intent: "preview",
    });
    expect(preview.status).toBe(200);
    const html = await preview.text();
    expect(html).toMatch(/A quadratic: the straight line.s residuals bend/);
    expect(html).toContain("Residuals of the calibration fit"); // the residual chart's accessible name
    expect(await db.selectFrom("rig_calibrations").select("id").where("rig_id", "=", rigId).execute()).toEqual([]);

    const save = await reporter.post(`/bench/rigs/${rigId}/calibrations/new`, {
      points: curvedRows(),
      calibratedOn: "2026-11-01",
      intent: "save",
    });
    expect(save.status).toBe(302);
    const row = await db
      .selectFrom("rig_calibrations")
      .selectAll()
      .where("rig_id", "=", rigId)
      .executeTakeFirstOrThrow();
    const fit = fitCalibration(row.points, "auto");
    expect(row.degree).toBe(2);
    expect(row.degree).toBe(fit.degree);
    expect(row.coefficients).toEqual(fit.coefficients);
    expect(row.residual_sd).toBe(fit.residualSD);
    expect(row.points[0]!.reference).toBeCloseTo(500 * N_PER_LBF, 6); // typed in lbf, stored in N
    expect(row.verified_at).toBeNull();
    expect(await (await reporter.get(`/bench/rigs/${rigId}`)).text()).toContain("Calibration awaiting a moderator");
  });

  it("refuses a run before verification, lets a moderator verify, and then files the run", async () => {
    const run = {
      rig: String(rigId),
      protocol: "hammer-blow-force@2",
      intent: "draft",
      toolModelId: String(hammerId),
      unitSerial: "TEST-RIG-0001",
      unitCondition: "new",
      unitHours: "",
      runOn: "2026-11-30",
      operator: "Test Operator",
      ambientC: "21",
      ...Object.fromEntries(
        [1, 2, 3].flatMap((p) => [
          [`s${p}_static`, p === 3 ? "120" : "90"],
          [`s${p}_running`, p === 3 ? "112" : "88"],
          ...[1, 2, 3, 4, 5].map((t) => [`s${p}_t${t}_peaks`, "1100 1150 1120 1090 1130"]),
        ]),
      ),
    };
    const refused = await reporter.post("/bench/runs/new", run);
    expect(refused.status).toBe(400);
    expect(await refused.text()).toContain("not yet verified by a moderator");

    const calibration = await db
      .selectFrom("rig_calibrations")
      .select("id")
      .where("rig_id", "=", rigId)
      .executeTakeFirstOrThrow();
    const verify = { intent: "verify", calibrationId: String(calibration.id) };
    expect((await reporter.post(`/bench/rigs/${rigId}`, verify)).status).toBe(403);
    const queue = await (await moderator.get("/bench")).text();
    expect(queue).toContain("Calibrations waiting for a moderator");
    expect(queue).toContain(`action="/bench/rigs/${rigId}"`);
    expect(await (await moderator.get(`/bench/rigs/${rigId}`)).text()).toContain(
      "Calibrations waiting for a moderator",
    );
    const verified = await moderator.post(`/bench/rigs/${rigId}`, verify);
    expect(verified.status).toBe(302);
    const row = await db
      .selectFrom("rig_calibrations as c")
      .innerJoin("users as u", "u.id", "c.verified_by")
      .select(["u.email", "c.verified_at"])
      .where("c.id", "=", calibration.id)
      .executeTakeFirstOrThrow();
    expect(row.email).toBe("moderator@demo.bayproof.test");
    expect(row.verified_at).not.toBeNull();
    const again = await admin.post(`/bench/rigs/${rigId}`, verify);
    expect(again.status).toBe(400);
    expect(await again.text()).toContain("already verified");
    expect(await (await reporter.get(`/bench/rigs/${rigId}`)).text()).toContain("Calibration verified and current");

    const filed = await reporter.post("/bench/runs/new", run);
    expect(filed.status).toBe(302);
    expect(filed.headers.get("location")).toMatch(/^\/bench\/runs\/\d+$/);
  });

  it("does not let a moderator verify the calibration of their own rig", async () => {
    const own = await register(moderator, { name: "Moderator's own test rig" });
    const save = await moderator.post(`/bench/rigs/${own}/calibrations/new`, {
      points: straightRows,
      calibratedOn: "2026-11-01",
      intent: "save",
    });
    expect(save.status).toBe(302);
    const calibration = await db
      .selectFrom("rig_calibrations")
      .select(["id", "degree"])
      .where("rig_id", "=", own)
      .executeTakeFirstOrThrow();
    expect(calibration.degree).toBe(1);
    const page = await moderator.get(`/bench/rigs/${own}`);
    expect(await page.text()).not.toContain("Calibrations waiting for a moderator");
    expect(await (await moderator.get("/bench")).text()).not.toContain(`action="/bench/rigs/${own}"`);
    const res = await moderator.post(`/bench/rigs/${own}`, { intent: "verify", calibrationId: String(calibration.id) });
    expect(res.status).toBe(403);
    const row = await db
      .selectFrom("rig_calibrations")
      .select("verified_at")
      .where("id", "=", calibration.id)
      .executeTakeFirstOrThrow();
    expect(row.verified_at).toBeNull();
  });
});
