// Reads for the exposure panels and the day calculator: a model's declared figures, the jobs' median
// times to free them (Kaplan–Meier, give-ups counted) from the stored stats cells, and the day worked
// out from them. Reads stats_cells directly (not through app/stats), so app/stats may use this module's
// pure functions without an import circle.
import type { Db } from "../../db/database";
import { modelsBase } from "~/catalogue/queries.server";
import { toolName } from "~/domain";
import { invariantResponse } from "~/utils/http";
import { dayExposure, type CarriedInterval, type DayExposure } from "./day";
import { readBasis, readDayQuery, readJobsPerDay, type DayQuery } from "./day-query";
import { inUseValue, type VibrationBasis } from "./in-use";

const declaredColumns = [
  "m.vibration_ahv_ms2",
  "m.vibration_k_ms2",
  "m.vibration_iso28927_part",
  "m.vibration_source",
  "m.sound_pressure_db",
  "m.sound_pressure_k_db",
  "m.sound_pressure_source",
  "m.sound_power_db",
  "m.sound_power_k_db",
  "m.sound_power_source",
] as const;

async function declaredFigures(db: Db, modelIds: readonly number[]) {
  if (modelIds.length === 0) return [];
  return db
    .selectFrom("tool_models as m")
    .select(["m.id", ...declaredColumns])
    .where("m.id", "in", modelIds)
    .execute();
}
export type DeclaredFigures = Awaited<ReturnType<typeof declaredFigures>>[number];

type TimeCell = {
  km_median_s: number | null;
  km_lower_s: number | null;
  km_upper_s: number | null;
  time_median_s: number | null;
  time_lower_s: number | null;
  time_upper_s: number | null;
};
const timeColumns = [
  "s.km_median_s",
  "s.km_lower_s",
  "s.km_upper_s",
  "s.time_median_s",
  "s.time_lower_s",
  "s.time_upper_s",
] as const;

/**
 * Minutes per job with the interval: the Kaplan–Meier median time to free it, give-ups counted ("km").
 * Where most gave up the curve never reaches one half; then the median of the jobs freed ("freed"),
 * which understates the day (the give-ups took longer) and is labelled so. Null without either.
 */
function minutesFromCell(cell: TimeCell): (CarriedInterval & { from: "km" | "freed" }) | null {
  const minutes = (s: number | null) => (s == null ? null : s / 60);
  if (cell.km_median_s != null)
    return {
      estimate: cell.km_median_s / 60,
      lower: minutes(cell.km_lower_s),
      upper: minutes(cell.km_upper_s),
      from: "km",
    };
  if (cell.time_median_s != null)
    return {
      estimate: cell.time_median_s / 60,
      lower: minutes(cell.time_lower_s),
      upper: minutes(cell.time_upper_s),
      from: "freed",
    };
  return null;
}

/** One tool doing `perDay` jobs of one kind: the day, or why there is none. */
function oneJobDay(
  d: DeclaredFigures | undefined,
  minutes: CarriedInterval | null,
  perDay: number,
  basis: VibrationBasis,
) {
  if (!d || d.vibration_ahv_ms2 == null || d.sound_pressure_db == null) return null;
  if (!minutes) return null;
  return dayExposure([
    {
      ahv: inUseValue(d.vibration_ahv_ms2, basis).value,
      lpa: d.sound_pressure_db,
      minutesPerJob: minutes,
      jobsPerDay: perDay,
    },
  ]);
}

/** The settings the panels read from the URL (perday, vib); a malformed one is a 400 with its reason. */
function panelSettings(url: URL) {
  const { perDay, error } = readJobsPerDay(url.searchParams);
  invariantResponse(!error, error ?? "", 400);
  const basis = readBasis(url.searchParams);
  invariantResponse(!basis.error, basis.error ?? "", 400);
  return { perDay, basis: basis.basis };
}

/** The model page's exposure panel: declared figures, and a day of `perday` jobs of each job type. */
export async function modelExposure(db: Db, modelId: number, url: URL) {
  const { perDay, basis } = panelSettings(url);
  const [declared, cells] = await Promise.all([
    declaredFigures(db, [modelId]).then((rows) => rows[0]),
    db
      .selectFrom("stats_cells as s")
      .innerJoin("job_types as j", "j.id", "s.job_type_id")
      .select(["j.slug", "j.name", "s.n", ...timeColumns])
      .where("s.tool_model_id", "=", modelId)
      .orderBy("s.n", "desc")
      .execute(),
  ]);
  const jobs = cells.map((c) => {
    const minutes = minutesFromCell(c);
    return { slug: c.slug, name: c.name, n: c.n, minutes, day: oneJobDay(declared, minutes, perDay, basis) };
  });
  return { declared: declared ?? null, perDay, basis, jobs };
}
export type ModelExposure = Awaited<ReturnType<typeof modelExposure>>;

/** The compare page's exposure columns: each chosen tool doing `perday` jobs of the compared job. */
export async function compareExposure(
  db: Db,
  jobTypeId: number,
  tools: readonly { slug: string; label: string }[],
  url: URL,
) {
  const { perDay, basis } = panelSettings(url);
  const rows = await db
    .selectFrom("tool_models as m")
    .leftJoin("stats_cells as s", (join) =>
      join.onRef("s.tool_model_id", "=", "m.id").on("s.job_type_id", "=", jobTypeId),
    )
    .select(["m.slug", ...declaredColumns, "m.id", ...timeColumns])
    .where(
      "m.slug",
      "in",
      tools.map((t) => t.slug),
    )
    .execute();
  const bySlug = new Map(rows.map((r) => [r.slug, r]));
  const list = tools.flatMap((t) => {
    const r = bySlug.get(t.slug);
    if (!r) return [];
    const minutes = minutesFromCell(r);
    return [{ slug: t.slug, label: t.label, declared: r, minutes, day: oneJobDay(r, minutes, perDay, basis) }];
  });
  return { perDay, basis, tools: list };
}
export type CompareExposure = Awaited<ReturnType<typeof compareExposure>>;

/** Everything the day calculator shows: the choices, the rows as typed with their errors, and the day. */
export async function dayCalculator(db: Db, url: URL) {
  const [models, jobs] = await Promise.all([
    modelsBase(db).orderBy("c.name").orderBy("mk.name").orderBy("m.model_code").execute(),
    db
      .selectFrom("job_types as j")
      .innerJoin("tool_categories as c", "c.id", "j.category_id")
      .select(["j.id", "j.slug", "j.name", "c.slug as category", "c.name as category_name"])
      .orderBy("c.name")
      .orderBy("j.name")
      .execute(),
  ]);
  const tools = models.map((m) => ({
    id: m.id,
    slug: m.slug,
    model_code: m.model_code,
    maker_name: m.maker_name,
    category: m.category_slug,
    category_name: m.category_name,
    label: toolName(m.maker_name, m.model_code),
  }));
  const toolBySlug = new Map(tools.map((t) => [t.slug, t]));
  const jobBySlug = new Map(jobs.map((j) => [j.slug, j]));
  const query: DayQuery = readDayQuery(url.searchParams, { tools: toolBySlug, jobs: jobBySlug });
  const ids = [...new Set(query.valid.map((r) => toolBySlug.get(r.tool)!.id))];
  const [declared, cells] = await Promise.all([
    declaredFigures(db, ids),
    ids.length === 0
      ? Promise.resolve([])
      : db
          .selectFrom("stats_cells as s")
          .select(["s.tool_model_id", "s.job_type_id", "s.n", ...timeColumns])
          .where("s.tool_model_id", "in", ids)
          .execute(),
  ]);
  const declaredById = new Map(declared.map((d) => [d.id, d]));
  const errors = { ...query.errors };
  const worked = query.valid.flatMap((row) => {
    const tool = toolBySlug.get(row.tool)!;
    const job = jobBySlug.get(row.job)!;
    const d = declaredById.get(tool.id);
    if (!d || d.vibration_ahv_ms2 == null || d.sound_pressure_db == null) {
      errors[`tool-${row.index}`] = "No declared vibration and noise for this tool yet";
      return [];
    }
    const cell = cells.find((c) => c.tool_model_id === tool.id && c.job_type_id === job.id);
    const fromReports = cell ? minutesFromCell(cell) : null;
    const minutes: CarriedInterval | null =
      row.minutesPerJob != null ? { estimate: row.minutesPerJob, lower: null, upper: null } : fromReports;
    const timeFrom = row.minutesPerJob != null ? ("typed" as const) : (fromReports?.from ?? ("km" as const));
    if (!minutes) {
      errors[`min-${row.index}`] = "No median time from reports for this tool on this job yet: give minutes per job";
      return [];
    }
    const vibration = inUseValue(d.vibration_ahv_ms2, query.basis);
    const item = { ahv: vibration.value, lpa: d.sound_pressure_db, minutesPerJob: minutes, jobsPerDay: row.jobsPerDay };
    return [
      {
        index: row.index,
        toolLabel: tool.label,
        toolSlug: tool.slug,
        jobName: job.name,
        jobSlug: job.slug,
        jobsPerDay: row.jobsPerDay,
        minutes,
        timeFrom,
        reports: cell?.n ?? 0,
        declared: d,
        item,
        own: dayExposure([item]),
      },
    ];
  });
  const day: DayExposure | null =
    worked.length > 0 && Object.keys(errors).length === 0 ? dayExposure(worked.map((w) => w.item)) : null;
  return { tools, jobs, rows: query.rows, basis: query.basis, errors, worked, day };
}
export type DayCalculator = Awaited<ReturnType<typeof dayCalculator>>;
