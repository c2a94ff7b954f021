// The bench's server modules and pages over the demo scenario: rigs with their calibration standing,
// protocols and their versions, runs with their figures, and the pages that show them.
import { afterAll, describe, expect, it } from "vitest";
import { getProtocol, listProtocols, protocolVersions } from "../../app/bench/protocols.server";
import { getRig, listRigs, rigFilingRefusal } from "../../app/bench/rigs.server";
import { getRun, latestAcceptedRuns, runFigures, runsForModel } from "../../app/bench/runs.server";
import { testDb } from "../support/db";
import { Browserish } from "../support/http";

const db = testDb();
afterAll(() => db.destroy());
const NOW = new Date("2026-12-02T12:00:00Z");

describe("rigs", () => {
  it("lists the demo rigs with one expired calibration and one check standard out of control", async () => {
    const rigs = await listRigs(db, NOW);
    expect(rigs.length).toBeGreaterThanOrEqual(6);
    expect(rigs.filter((r) => r.standing.status === "expired").map((r) => r.name)).toEqual([
      "Tamarind trailer-bay force rig",
    ]);
    const drifting = rigs.find((r) => r.name === "Ridgeback heavy anvil")!;
    expect(drifting.standing.status).toBe("current");
    expect(drifting.standing.lastCheckInControl).toBe(false);
  });

  it("gives a rig's calibration fit with residuals and its check-standard chart", async () => {
    const rig = (await listRigs(db, NOW)).find((r) => r.name === "Ridgeback heavy anvil")!;
    const detail = (await getRig(db, rig.id, NOW))!;
    expect(detail.fit!.residuals).toHaveLength(8);
    expect(detail.fit!.rSquared).toBeGreaterThan(0.999);
    expect(detail.chart!.points.length).toBe(detail.checkReadings.length);
    // The stored in-control marks are the chart's own.
    expect(detail.chart!.points.map((p) => p.outOfControl)).toEqual(detail.checkReadings.map((r) => !r.in_control));
    expect(detail.chart!.points.slice(-3).some((p) => p.outOfControl)).toBe(true);
    expect(await getRig(db, 2_000_000_000, NOW)).toBeNull();
  });

  it("refuses filing on an expired rig with the reason, and allows it on a current one", async () => {
    const rigs = await listRigs(db, NOW);
    const expired = rigs.find((r) => r.standing.status === "expired")!;
    expect(await rigFilingRefusal(db, expired.id, NOW)).toMatch(/expired on 2026-04-14/);
    const current = rigs.find((r) => r.standing.status === "current")!;
    expect(await rigFilingRefusal(db, current.id, NOW)).toBeNull();
  });
});

describe("protocols", () => {
  it("lists the newest version of each protocol with its series", async () => {
    const protocols = await listProtocols(db);
    expect(protocols.map((p) => `${p.slug}@${p.version}`).sort()).toEqual([
      "hammer-blow-force@2",
      "impact-peak-torque@1",
    ]);
    const hammer = protocols.find((p) => p.slug === "hammer-blow-force")!;
    expect(hammer.series.map((s) => [s.trigger, s.inlet])).toEqual([
      ["full", "regulated_at_tool"],
      ["lightest_steady", "regulated_at_tool"],
      ["full", "open_line"],
    ]);
    expect(hammer.accepted_runs).toBeGreaterThan(10);
  });

  it("keeps every version of a slug, and none that does not exist", async () => {
    const versions = (await protocolVersions(db, "hammer-blow-force"))!;
    expect(versions.map((v) => v.version)).toEqual([2, 1]);
    expect(versions.every((v) => v.frozen_at != null)).toBe(true);
    expect(await getProtocol(db, "hammer-blow-force", 7)).toBeNull();
    expect(await protocolVersions(db, "no-such-protocol")).toBeNull();
  });
});

describe("runs", () => {
  it("lists accepted runs over at least 15 models, newest first", async () => {
    const runs = await latestAcceptedRuns(db, 100);
    expect(runs.length).toBeGreaterThan(40);
    expect(new Set(runs.map((r) => r.tool_model_id)).size).toBeGreaterThanOrEqual(15);
    expect(runs.every((r) => r.status === "accepted" && r.full_trigger_mean! > 0)).toBe(true);
  });

  it("gives a run's series, trials and figures (the trial is the unit)", async () => {
    const [first] = await latestAcceptedRuns(db, 1);
    const detail = (await getRun(db, first!.id))!;
    const figures = runFigures(detail);
    expect(figures.series).toHaveLength(detail.series.length);
    const full = figures.series[0]!.figures!;
    expect(full.n).toBe(5);
    expect(full.lower!).toBeLessThan(full.mean!);
    expect(full.upper!).toBeGreaterThan(full.mean!);
    expect(full.mean).toBeCloseTo(first!.full_trigger_mean!, 0);
  });

  it("has more force for the bigger hammer, as in the field", async () => {
    const model = (slug: string) =>
      db.selectFrom("tool_models").select("id").where("slug", "=", slug).executeTakeFirstOrThrow();
    const small = await runsForModel(db, (await model("brackwater-bh-150")).id);
    const big = await runsForModel(db, (await model("halvard-hp-50")).id);
    const mean = (rs: typeof small) => rs.reduce((s, r) => s + r.full_trigger_mean!, 0) / rs.length;
    expect(small.length).toBeGreaterThan(0);
    expect(mean(big)).toBeGreaterThan(mean(small));
  });
});

describe("pages", () => {
  const client = new Browserish();

  it("serves the bench page, a protocol, a rig and a run with a trace", async () => {
    const bench = await client.get("/bench");
    expect(bench.status).toBe(200);
    const html = await bench.text();
    expect(html).toContain("Hammer blow force at the anvil");
    expect(html).toContain("Calibration expired");
    expect(html).toContain("No shank adapters");
    expect((await client.get("/bench/protocols/hammer-blow-force")).status).toBe(200);
    expect((await client.get("/bench/protocols/no-such-thing")).status).toBe(404);

    const rig = (await listRigs(db, NOW)).find((r) => r.name === "Ridgeback heavy anvil")!;
    const rigPage = await client.get(`/bench/rigs/${rig.id}`);
    expect(rigPage.status).toBe(200);
    expect(await rigPage.text()).toContain("Sessions outside the limits");
    expect((await client.get("/bench/rigs/abc")).status).toBe(404);

    const traced = await db
      .selectFrom("bench_trials as t")
      .innerJoin("bench_run_series as rs", "rs.id", "t.run_series_id")
      .innerJoin("bench_runs as br", "br.id", "rs.run_id")
      .select("br.id")
      .where("t.trace_key", "is not", null)
      .where("br.status", "=", "accepted")
      .executeTakeFirstOrThrow();
    const runPage = await client.get(`/bench/runs/${traced.id}`);
    expect(runPage.status).toBe(200);
    const runHtml = await runPage.text();
    expect(runHtml).toContain("Trigger control range");
    expect(runHtml).toMatch(/blows detected/);
    expect(runHtml).toContain("data-blow");
  });

  it("hides a run still under review from visitors", async () => {
    const held = await db
      .selectFrom("bench_runs")
      .select("id")
      .where("status", "=", "submitted")
      .executeTakeFirstOrThrow();
    expect((await client.get(`/bench/runs/${held.id}`)).status).toBe(404);
  });

  it("shows the bench panel on a model page", async () => {
    const page = await client.get("/models/brackwater-bh-150");
    expect(page.status).toBe(200);
    expect(await page.text()).toContain("On the bench");
  });
});
