// Filing bench runs over HTTP: only a rig's owner files; an expired rig and a protocol version that
// does not exist are refused with the reason; bad typed peaks and bad traces come back as field
// errors with the typed values kept; a good run is stored whole, and a bad one not at all.
import { PutObjectCommand } from "@aws-sdk/client-s3";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { listRigs } from "../../app/bench/rigs.server";
import { storeAt } from "../../app/storage/s3.server";
import { testDb } from "../support/db";
import { type Browserish, signedInAs } from "../support/http";

const db = testDb();
let owner: Browserish;
let rigId: number;
let expiredRigId: number;
let modelId: number;
const made: number[] = [];

beforeAll(async () => {
  const rigs = await listRigs(db);
  const rig = rigs.find((r) => r.name === "Cinderlane drop-anvil force rig")!;
  rigId = rig.id;
  expiredRigId = rigs.find((r) => r.standing.status === "expired")!.id;
  const email = await db.selectFrom("users").select("email").where("id", "=", rig.owner_id).executeTakeFirstOrThrow();
  owner = await signedInAs(db, email.email);
  modelId = (
    await db.selectFrom("tool_models").select("id").where("slug", "=", "brackwater-bh-150").executeTakeFirstOrThrow()
  ).id;
});
afterAll(async () => {
  if (made.length) {
    await db.deleteFrom("bench_runs").where("id", "in", made).execute();
  }
  await db.destroy();
});

const PROTOCOL = "hammer-blow-force@2";
const peaks = "2100 2200 2150 2080 2190 2230";

function filled(extra: Record<string, string> = {}) {
  const form: Record<string, string> = {
    rig: String(rigId),
    protocol: PROTOCOL,
    intent: "submit",
    toolModelId: String(modelId),
    unitSerial: "TEST-0001",
    unitCondition: "new",
    unitHours: "",
    runOn: "2026-11-30",
    operator: "Test Operator",
    ambientC: "21",
  };
  for (const p of [1, 2, 3]) {
    form[`s${p}_static`] = p === 3 ? "120" : "90";
    form[`s${p}_running`] = p === 3 ? "112" : "88";
    for (let t = 1; t <= 5; t++) form[`s${p}_t${t}_peaks`] = peaks;
  }
  return { ...form, ...extra };
}

const runCount = async () =>
  Number(
    (
      await db
        .selectFrom("bench_runs")
        .select((eb) => eb.fn.countAll<string>().as("n"))
        .executeTakeFirstOrThrow()
    ).n,
  );

describe("filing a bench run", () => {
  it("refuses someone who owns no rig, and another owner's rig", async () => {
    const stranger = await signedInAs(db, "moderator@demo.bayproof.test");
    expect((await stranger.get("/bench/runs/new")).status).toBe(403);
    const other = (await listRigs(db)).find((r) => r.id !== rigId && r.owner_id !== undefined)!;
    const otherOwner = await db
      .selectFrom("users")
      .select("email")
      .where("id", "=", other.owner_id)
      .executeTakeFirstOrThrow();
    const client = await signedInAs(db, otherOwner.email);
    const res = await client.post("/bench/runs/new", filled());
    expect(res.status).toBe(403);
  });

  it("refuses an expired rig and a protocol version that does not exist, with the reason", async () => {
    const page = await owner.get(`/bench/runs/new?rig=${rigId}&protocol=hammer-blow-force@9`);
    expect(page.status).toBe(400);
    expect(await page.text()).toContain("There is no protocol version");
    const expiredOwner = (await listRigs(db)).find((r) => r.id === expiredRigId)!;
    const email = await db
      .selectFrom("users")
      .select("email")
      .where("id", "=", expiredOwner.owner_id)
      .executeTakeFirstOrThrow();
    const client = await signedInAs(db, email.email);
    const before = await runCount();
    const res = await client.post("/bench/runs/new", filled({ rig: String(expiredRigId) }));
    expect(res.status).toBe(400);
    expect(await res.text()).toMatch(/calibration expired on 2026-04-14/);
    expect(await runCount()).toBe(before);
  });

  it("answers bad typed peaks with field errors and keeps what was typed", async () => {
    const before = await runCount();
    const res = await owner.post("/bench/runs/new", filled({ s1_t2_peaks: "2100 abc 2200" }));
    expect(res.status).toBe(400);
    const html = await res.text();
    expect(html).toMatch(/Value 2 \(.{1,8}abc.{1,8}\) is not a positive number/);
    expect(html).toContain("2100 abc 2200");
    expect(await runCount()).toBe(before);
  });

  it("answers a broken trace with its line, and stores nothing", async () => {
    const key = `uploads/bench/${await ownerId()}/brokentracebrokentrace01`;
    const { endpoint, bucket } = inject("s3");
    await storeAt(endpoint, bucket).client.send(
      new PutObjectCommand({
        Bucket: bucket,
        Key: key,
        Body: "time_s,force_n\n0.0000,1\n0.0001,2\n0.0002,lots\n",
        ContentType: "text/csv",
      }),
    );
    const before = await runCount();
    const res = await owner.post("/bench/runs/new", filled({ s1_t1_peaks: "", s1_t1_trace: key }));
    expect(res.status).toBe(400);
    expect(await res.text()).toMatch(/line 4/);
    expect(await runCount()).toBe(before);
  });

  it("stores a whole run with typed peaks, submitted and flagged for nothing", async () => {
    const res = await owner.post("/bench/runs/new", filled());
    expect(res.status).toBe(302);
    const id = Number(/\/bench\/runs\/(\d+)$/.exec(res.headers.get("location") ?? "")![1]);
    made.push(id);
    const run = await db.selectFrom("bench_runs").selectAll().where("id", "=", id).executeTakeFirstOrThrow();
    expect(run.status).toBe("submitted");
    const trials = await db
      .selectFrom("bench_trials as t")
      .innerJoin("bench_run_series as rs", "rs.id", "t.run_series_id")
      .select("t.peaks")
      .where("rs.run_id", "=", id)
      .execute();
    expect(trials).toHaveLength(15);
    // Typed in lbf by this US-units owner, stored in newtons (1 lbf = 4.448222 N, NIST SP 811: published).
    expect(trials[0]!.peaks[0]).toBeCloseTo(2100 * 4.448222, 0);
  });
});

async function ownerId() {
  return (await db.selectFrom("rigs").select("owner_id").where("id", "=", rigId).executeTakeFirstOrThrow()).owner_id;
}
