// Reads of the stored bench figures for the model, job, bench and compare pages and the feed. The
// derived figures (per kilogram, per 100 mm, per $100, the trigger control range) come from
// derived-figures.ts, the same for the model page and /compare; they are shown, never added up.
import type { Db } from "../../db/database";
import { RATED_INLET_KPA } from "~/domain";
import type { LogisticFit } from "~/stats";
import { derivedFigures } from "./derived-figures";
import { benchForces } from "./figures.server";
import { runsForModel } from "./runs.server";
import { forceCurve } from "./force-for-job";
import { benchForceAt } from "./stored-figures";
import type { BenchQuantity } from "./terms";

/** Stored pooled figures with their series and protocol, in the model page's order. */
const pooledWithSeries = (db: Db) =>
  db
    .selectFrom("bench_pooled_figures as f")
    .innerJoin("bench_protocol_series as s", "s.id", "f.series_id")
    .innerJoin("bench_protocols as p", "p.id", "f.protocol_id")
    .selectAll("f")
    .select(["s.label", "s.trigger", "s.inlet", "s.inlet_kpa", "s.position", "p.title", "p.version", "p.quantity"])
    .orderBy("p.slug")
    .orderBy("p.version", "desc")
    .orderBy("s.position");

const MEASURES = ["weight_kg", "length_mm", "street_price_cents"] as const;

/** One model's pooled figures per series, its trigger control ranges, pressure line and derived figures. */
export async function modelAcrossRigs(db: Db, modelId: number) {
  const model = await db.selectFrom("tool_models").select(MEASURES).where("id", "=", modelId).executeTakeFirst();
  const figures = await pooledWithSeries(db).where("f.tool_model_id", "=", modelId).execute();
  const slope = await db
    .selectFrom("bench_pressure_slopes as s")
    .innerJoin("bench_protocols as p", "p.id", "s.protocol_id")
    .selectAll("s")
    .select(["p.quantity", "p.title"])
    .where("s.tool_model_id", "=", modelId)
    .orderBy("s.n", "desc")
    .executeTakeFirst();
  const forces = figures.filter((f) => f.figure === "force");
  const ranges = figures.filter((f) => f.figure === "trigger_range");
  const derived = derivedFigures(figures, model);
  return { forces, ranges, slope: slope ?? null, derived };
}

export type ModelAcrossRigs = Awaited<ReturnType<typeof modelAcrossRigs>>;

/** Every stored rig agreement, the check-standard ones first, with each rig's bias and name. */
export async function rigAgreements(db: Db) {
  const rows = await db
    .selectFrom("bench_rig_agreement as a")
    .innerJoin("tool_models as m", "m.id", "a.tool_model_id")
    .innerJoin("makers as mk", "mk.id", "m.maker_id")
    .leftJoin("bench_protocol_series as s", "s.id", "a.series_id")
    .leftJoin("bench_protocols as p", "p.id", "s.protocol_id")
    .innerJoin("tool_categories as c", "c.id", "m.category_id")
    .selectAll("a")
    .select(["m.slug", "m.model_code", "mk.name as maker_name", "s.label as series_label", "c.action"])
    .select((eb) => eb.fn.coalesce("p.quantity", eb.val("peak_force_n")).as("quantity"))
    .orderBy("a.source")
    .orderBy("a.rigs", "desc")
    .orderBy("a.id")
    .execute();
  const bias = rows.length
    ? await db
        .selectFrom("bench_rig_bias as b")
        .innerJoin("rigs as r", "r.id", "b.rig_id")
        .selectAll("b")
        .select("r.name as rig_name")
        .where(
          "b.agreement_id",
          "in",
          rows.map((r) => r.id),
        )
        .orderBy("r.name")
        .execute()
    : [];
  return rows.map((a) => ({
    ...a,
    // A torque fixture's check tool is an impact wrench; its readings are torques.
    quantity: (a.source === "check_readings" && a.action === "rotary" ? "peak_torque_nm" : a.quantity) as BenchQuantity,
    rigs: bias.filter((b) => b.agreement_id === a.id),
  }));
}

export type RigAgreementRow = Awaited<ReturnType<typeof rigAgreements>>[number];

const logit = (p: number) => Math.log(p / (1 - p));

/**
 * The force a job takes: the stored fit, its curve with the band, and the models placed on it — by
 * their bench force where they have one (at the rated 90 psi, from their pressure line or pooled
 * figure), else where the curve meets their field success (the cell's estimate), marked as such.
 */
export async function jobForce(db: Db, jobTypeId: number) {
  const job = await db.selectFrom("job_types").select("category_id").where("id", "=", jobTypeId).executeTakeFirst();
  const stored = await db
    .selectFrom("bench_job_force")
    .selectAll()
    .where("job_type_id", "=", jobTypeId)
    .executeTakeFirst();
  if (!stored || !job) return null;
  const categoryId = job.category_id;
  const fit: LogisticFit = {
    intercept: stored.intercept,
    slope: stored.slope,
    interceptSE: Math.sqrt(stored.var_intercept),
    slopeSE: Math.sqrt(stored.var_slope),
    covariance: [
      [stored.var_intercept, stored.cov_intercept_slope],
      [stored.cov_intercept_slope, stored.var_slope],
    ],
    converged: stored.converged,
    iterations: 0,
  };
  const forces = await benchForces(db);
  const cells = await db
    .selectFrom("stats_cells as c")
    .innerJoin("tool_models as m", "m.id", "c.tool_model_id")
    .innerJoin("makers as mk", "mk.id", "m.maker_id")
    .select(["m.id", "m.slug", "m.model_code", "mk.name as maker_name", "c.estimate", "c.n"])
    .where("c.job_type_id", "=", jobTypeId)
    .execute();
  const models = cells.flatMap((c): (typeof c & { force: number; placedFrom: "bench" | "field" })[] => {
    const f = forces.get(categoryId, c.id);
    const bench = f ? benchForceAt(f, RATED_INLET_KPA) : null;
    if (bench !== null) return [{ ...c, force: bench, placedFrom: "bench" }];
    if (!(stored.slope > 0) || c.estimate <= 0 || c.estimate >= 1) return [];
    return [{ ...c, force: (logit(c.estimate) - stored.intercept) / stored.slope, placedFrom: "field" }];
  });
  const xs = [stored.force_min, stored.force_max, stored.ed50, ...models.map((m) => m.force)].filter(Number.isFinite);
  const span = Math.max(...xs) - Math.min(...xs) || 1;
  const from = Math.max(0, Math.min(...xs) - 0.1 * span);
  const to = Math.max(...xs) + 0.1 * span;
  return {
    ...stored,
    curve: forceCurve(fit, from, to, 40, stored.confidence),
    placed: models.sort((a, b) => a.force - b.force),
  };
}

export type JobForce = NonNullable<Awaited<ReturnType<typeof jobForce>>>;

/**
 * Each compared model's bench figures for /compare, in the order asked: the headline pooled force and
 * the figures derived from it, as the model page has them; `derived` null where there is no headline.
 */
export async function compareBench(db: Db, modelSlugs: readonly string[]) {
  if (modelSlugs.length === 0) return [];
  const models = await db
    .selectFrom("tool_models")
    .select(["id", "slug", ...MEASURES])
    .where("slug", "in", [...modelSlugs])
    .execute();
  const figures = models.length
    ? await pooledWithSeries(db)
        .where(
          "f.tool_model_id",
          "in",
          models.map((m) => m.id),
        )
        .execute()
    : [];
  return modelSlugs.map((slug) => {
    const model = models.find((m) => m.slug === slug);
    const own = figures.filter((f) => f.tool_model_id === model?.id);
    return { slug, benchFigures: own.length, derived: derivedFigures(own, model) };
  });
}

export type CompareBenchRow = Awaited<ReturnType<typeof compareBench>>[number];

/** A model page's bench reads: its accepted runs and its figures across rigs. */
export async function benchForModel(db: Db, modelId: number) {
  const [runs, acrossRigs] = await Promise.all([runsForModel(db, modelId), modelAcrossRigs(db, modelId)]);
  return { runs, acrossRigs };
}
