// The stored bench figures over the demo's bench runs and reports: the refresh stores exactly what the
// pure functions give (recomputed here from the raw trial peaks), and the pages show the panels.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { randomEffects, rigAgreement } from "../../app/bench";
import { fitJobForce, jobForceRows, loadRunSeries, refreshBenchFigures } from "../../app/bench/figures.server";
import { testDb } from "../support/db";
import { Browserish } from "../support/http";

const db = testDb();
afterAll(() => db.destroy());
const NOW = new Date("2026-12-02T12:00:00Z");
const close = (a: number, b: number) => expect(a).toBeCloseTo(b, 6);

beforeAll(async () => {
  const counts = await refreshBenchFigures(db, { now: NOW });
  expect(counts.pooled).toBeGreaterThan(0);
});

describe("refresh", () => {
  it("stores each model and series pooled across runs as randomEffects gives it (variance s²/n of trial means)", async () => {
    const series = await loadRunSeries(db, NOW);
    const stored = await db.selectFrom("bench_pooled_figures").selectAll().where("figure", "=", "force").execute();
    expect(stored.length).toBeGreaterThan(10);
    for (const row of stored.slice(0, 12)) {
      const studies = series
        .filter((s) => s.modelId === row.tool_model_id && s.seriesId === row.series_id)
        .map((s) => {
          const means = s.trials.map((t) => t.reduce((a, v) => a + v, 0) / t.length);
          const m = means.reduce((a, v) => a + v, 0) / means.length;
          const s2 = means.reduce((a, v) => a + (v - m) ** 2, 0) / (means.length - 1);
          return { mean: m, variance: s2 / means.length };
        });
      const re = randomEffects(studies);
      expect(row.runs).toBe(studies.length);
      close(row.estimate, re.estimate);
      close(row.lower, re.lower);
      close(row.upper, re.upper);
      close(row.tau2, re.tau2);
      close(row.i2, re.i2);
      expect(row.method).toBe(re.method);
    }
  });

  it("stores the rigs' agreement on their check tool from in-control check readings as rigAgreement gives it", async () => {
    const stored = await db
      .selectFrom("bench_rig_agreement")
      .selectAll()
      .where("source", "=", "check_readings")
      .execute();
    expect(stored.length).toBeGreaterThan(0);
    const a = stored[0]!;
    const readings = await db
      .selectFrom("rig_check_readings as c")
      .innerJoin("rigs as r", "r.id", "c.rig_id")
      .innerJoin("bench_rig_bias as b", (j) => j.onRef("b.rig_id", "=", "c.rig_id").on("b.agreement_id", "=", a.id))
      .select(["c.rig_id", "c.value"])
      .where("c.in_control", "=", true)
      .execute();
    const g = rigAgreement(readings.map((r) => ({ rig: String(r.rig_id), value: r.value })));
    close(a.repeatability_sd, g.repeatabilitySD);
    close(a.reproducibility_sd, g.reproducibilitySD);
    const bias = await db.selectFrom("bench_rig_bias").selectAll().where("agreement_id", "=", a.id).execute();
    for (const b of bias) close(b.bias, g.rigs.find((r) => r.rig === String(b.rig_id))!.bias);
  });

  it("stores each job's force fit as forceForJob gives it on the same rows", async () => {
    const stored = await db.selectFrom("bench_job_force").selectAll().execute();
    expect(stored.length).toBeGreaterThan(0);
    const s = stored[0]!;
    const { rows } = await jobForceRows(db, s.job_type_id);
    const fit = fitJobForce(rows)!;
    expect(s.reports).toBe(rows.length);
    close(s.ed50, fit.ed50);
    close(s.slope, fit.slope);
  });

  it("gives the same figures on a second refresh (one transaction, nothing left over)", async () => {
    const before = await db
      .selectFrom("bench_pooled_figures")
      .select(["estimate"])
      .orderBy("series_id")
      .orderBy("tool_model_id")
      .execute();
    await refreshBenchFigures(db, { now: NOW });
    const after = await db
      .selectFrom("bench_pooled_figures")
      .select(["estimate"])
      .orderBy("series_id")
      .orderBy("tool_model_id")
      .execute();
    expect(after).toEqual(before);
  });
});

describe("pages", () => {
  const client = new Browserish();

  it("shows the across-rigs panel on a model with pooled figures, and the rig agreement on /bench", async () => {
    const model = await db
      .selectFrom("bench_pooled_figures as f")
      .innerJoin("tool_models as m", "m.id", "f.tool_model_id")
      .select("m.slug")
      .orderBy("f.runs", "desc")
      .executeTakeFirstOrThrow();
    const page = await client.get(`/models/${model.slug}`);
    expect(page.status).toBe(200);
    const html = await page.text();
    expect(html).toContain("Across rigs");
    expect(html).toContain("How this is worked out");
    const bench = await (await client.get("/bench")).text();
    expect(bench).toContain("How well the rigs agree");
  });

  it("shows the force a job takes on a job with a stored fit", async () => {
    const job = await db
      .selectFrom("bench_job_force as f")
      .innerJoin("job_types as j", "j.id", "f.job_type_id")
      .select("j.slug")
      .executeTakeFirstOrThrow();
    const html = await (await client.get(`/jobs/${job.slug}`)).text();
    expect(html).toContain("The force this job takes");
    expect(html).toContain('id="job-force-curve-title"');
  });

  it("answers 404 for a model or job that does not exist and 400 for a malformed slug", async () => {
    expect((await client.get("/models/no-such-model-here")).status).toBe(404);
    expect((await client.get("/jobs/no-such-job-here")).status).toBe(404);
    expect([400, 404]).toContain((await client.get("/jobs/Bad%20Slug!")).status);
  });
});
