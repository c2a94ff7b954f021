// The review queue and the review page's data.
import { sql } from "kysely";
import type { Db } from "../../db/database";
import { presignGet } from "~/storage/s3.server";
import { histories } from "./decide.server";
import { HIDDEN_FROM_MODERATORS } from "./visibility";
import { trustLevel, type TrustLevel } from "./trust";


export interface QueueFilter {
  flag?: string;
  category?: string;
  job?: string;
  trust?: TrustLevel;
  olderThanDays?: number;
}

export async function reviewQueue(db: Db, moderatorId: number, f: QueueFilter, limit = 100) {
  let q = db.selectFrom("reports as r")
    .innerJoin("tool_models as m", "m.id", "r.tool_model_id").innerJoin("makers as mk", "mk.id", "m.maker_id")
    .innerJoin("job_types as j", "j.id", "r.job_type_id").innerJoin("tool_categories as c", "c.id", "r.category_id")
    .innerJoin("users as u", "u.id", "r.reporter_id")
    .leftJoin("report_claims as cl", (join) => join.onRef("cl.report_id", "=", "r.id").on("cl.expires_at", ">", sql<Date>`now()`))
    .leftJoin("users as holder", "holder.id", "cl.moderator_id")
    .select([
      "r.id", "r.submitted_at", "r.flags", "r.version", "r.reporter_id", "u.handle as reporter", "m.model_code", "mk.name as maker",
      "j.name as job", "c.name as category", "holder.handle as claimed_by",
      sql<number>`(select count(*)::int from decisions d where d.report_id = r.id and d.action = 'accept' and d.report_version = r.version)`.as("accepts"),
    ])
    .where("r.status", "=", "submitted")
    .where("r.reporter_id", "!=", moderatorId);
  if (f.flag) q = q.where(sql<boolean>`${f.flag} = any(r.flags)`);
  if (f.category) q = q.where("c.slug", "=", f.category);
  if (f.job) q = q.where("j.slug", "=", f.job);
  if (f.olderThanDays) q = q.where("r.submitted_at", "<", sql<Date>`now() - ${`${f.olderThanDays} days`}::interval`);
  const rows = await q.orderBy("r.submitted_at").orderBy("r.id").limit(f.trust ? 1000 : limit).execute();
  const hist = await histories(db, [...new Set(rows.map((r) => r.reporter_id))]);
  const withTrust = rows.map((r) => ({ ...r, trust: trustLevel(hist.get(r.reporter_id)!) }));
  return (f.trust ? withTrust.filter((r) => r.trust === f.trust) : withTrust).slice(0, limit);
}

export async function queueCounts(db: Db) {
  const row = await db.selectFrom("reports").where("status", "=", "submitted").select([
    sql<number>`count(*)::int`.as("waiting"),
    sql<number>`(count(*) filter (where cardinality(flags) > 0))::int`.as("flagged"),
    sql<Date | null>`min(submitted_at)`.as("oldest"),
  ]).executeTakeFirstOrThrow();
  return row;
}

/** Everything the review page shows about one report. */
export async function reviewDetail(db: Db, reportId: number) {
  const report = await db.selectFrom("reports as r")
    .innerJoin("tool_models as m", "m.id", "r.tool_model_id").innerJoin("makers as mk", "mk.id", "m.maker_id")
    .innerJoin("job_types as j", "j.id", "r.job_type_id").innerJoin("tool_categories as c", "c.id", "r.category_id")
    .innerJoin("users as u", "u.id", "r.reporter_id")
    .selectAll("r")
    .select([
      "u.handle as reporter", "m.slug as model_slug", "m.model_code", "m.name as model_name", "m.fitting", "m.bore_mm", "m.stroke_mm",
      "m.blows_per_minute", "m.free_speed_rpm", "m.max_torque_nm", "m.weight_kg", "m.rated_air_lps", "m.max_inlet_kpa",
      "mk.name as maker", "j.name as job", "j.id as job_id", "c.name as category", "c.action as category_action",
    ])
    .where("r.id", "=", reportId).where("r.status", "not in", HIDDEN_FROM_MODERATORS).executeTakeFirst();
  if (!report) return null;
  const [evidence, usual, versions, hist] = await Promise.all([
    db.selectFrom("evidence").select(["id", "kind", "content_type", "size_bytes", "sha256", "status", "object_key"])
      .where("report_id", "=", reportId).where("status", "!=", "pending").orderBy("id").execute(),
    db.selectFrom("reports").where("job_type_id", "=", report.job_id).where("status", "=", "accepted").select([
      sql<number>`count(*)::int`.as("n"),
      sql<number | null>`percentile_cont(0.25) within group (order by time_to_result_s)`.as("time_q1"),
      sql<number | null>`percentile_cont(0.5) within group (order by time_to_result_s)`.as("time_median"),
      sql<number | null>`percentile_cont(0.75) within group (order by time_to_result_s)`.as("time_q3"),
      sql<number | null>`percentile_cont(0.25) within group (order by inlet_kpa)`.as("inlet_q1"),
      sql<number | null>`percentile_cont(0.75) within group (order by inlet_kpa)`.as("inlet_q3"),
    ]).executeTakeFirstOrThrow(),
    db.selectFrom("report_versions").select(["version", "snapshot", "created_at"]).where("report_id", "=", reportId).orderBy("version").execute(),
    histories(db, [report.reporter_id]),
  ]);
  const media = await Promise.all(evidence.map(async (e) => ({
    id: e.id, kind: e.kind, contentType: e.content_type, size: e.size_bytes == null ? null : Number(e.size_bytes), sha256: e.sha256, status: e.status,
    // Short-lived, signed: the objects themselves are never public.
    url: await presignGet(e.object_key, 600),
  })));
  return { report, media, usual, versions, trust: trustLevel(hist.get(report.reporter_id)!) };
}

const COMPARED = [
  "vehicle_class", "component_age_years", "corrosion_level", "attachment", "attachment_length_mm", "regulator_kpa", "inlet_kpa",
  "inlet_source", "hose_id_mm", "hose_length_m", "coupler_profile", "coupler_count", "compressor_lps", "tank_l", "outcome",
  "time_to_result_s", "attempts", "trigger_control", "notes", "tool_model_id", "job_type_id",
] as const;

/** Fields that differ between the last two submitted versions. */
export function changesSinceLastVersion(versions: { version: number; snapshot: Record<string, unknown> }[]) {
  if (versions.length < 2) return [];
  const [before, after] = [versions.at(-2)!.snapshot, versions.at(-1)!.snapshot];
  return COMPARED.filter((k) => JSON.stringify(before[k] ?? null) !== JSON.stringify(after[k] ?? null))
    .map((field) => ({ field, before: before[field] ?? null, after: after[field] ?? null }));
}

/** Review workload figures for /review/stats. */
export async function reviewStats(db: Db) {
  const [weekly, medianHours, perModerator] = await Promise.all([
    sql<{ week: string; submitted: number; decided: number }>`
      with weeks as (select generate_series(date_trunc('week', now()) - interval '11 weeks', date_trunc('week', now()), interval '1 week') as week)
      select to_char(w.week, 'YYYY-MM-DD') as week,
        (select count(*)::int from reports r where r.submitted_at >= w.week and r.submitted_at < w.week + interval '1 week') as submitted,
        (select count(*)::int from reports r where r.decided_at >= w.week and r.decided_at < w.week + interval '1 week') as decided
      from weeks w order by w.week`.execute(db),
    sql<{ hours: number | null; n: number }>`
      select percentile_cont(0.5) within group (order by extract(epoch from decided_at - submitted_at) / 3600) as hours, count(*)::int as n
      from reports where decided_at is not null and submitted_at is not null and decided_at > now() - interval '90 days'`.execute(db),
    sql<{ moderator: string; week: string; decisions: number }>`
      select u.handle as moderator, to_char(date_trunc('week', d.created_at), 'YYYY-MM-DD') as week, count(*)::int as decisions
      from decisions d join users u on u.id = d.moderator_id
      where d.action in ('accept', 'return', 'reject') and d.created_at > date_trunc('week', now()) - interval '7 weeks'
      group by 1, 2 order by 2 desc, 1`.execute(db),
  ]);
  const waitingNow = (await queueCounts(db)).waiting;
  // Backlog at the end of each week, walking back from today's queue size.
  const rows = weekly.rows;
  const backlog: number[] = new Array(rows.length);
  let level = waitingNow;
  for (let i = rows.length - 1; i >= 0; i--) {
    backlog[i] = level;
    level = Math.max(0, level - rows[i]!.submitted + rows[i]!.decided);
  }
  return { weeks: rows.map((r, i) => ({ ...r, backlog: backlog[i]! })), medianHours: medianHours.rows[0]!, perModerator: perModerator.rows };
}
