// The review queue and the review page's data.
import { sql } from "kysely";
import type { Db } from "../../db/database";
import { presignGet } from "~/storage/s3.server";
import { histories } from "./decide.server";
import { HIDDEN_FROM_MODERATORS } from "./visibility";
import { QUEUE_PAGE_SIZE, type QueueCriteria } from "./queue-filter";
import { trustLevel } from "./trust";

/** Accepted once on its current version: waiting for a second moderator's look. */
const acceptedOnce = sql<boolean>`exists (select 1 from decisions d where d.report_id = r.id and d.action = 'accept' and d.report_version = r.version)`;

/** The waiting reports a moderator may decide on, with the filters that SQL can apply. */
function waiting(db: Db, moderatorId: number, c: QueueCriteria) {
  let q = db
    .selectFrom("reports as r")
    .innerJoin("job_types as j", "j.id", "r.job_type_id")
    .innerJoin("tool_categories as c", "c.id", "r.category_id")
    .where("r.status", "=", "submitted")
    .where("r.reporter_id", "!=", moderatorId);
  if (c.flag) q = q.where(sql<boolean>`${c.flag} = any(r.flags)`);
  if (c.category) q = q.where("c.slug", "=", c.category);
  if (c.job) q = q.where("j.slug", "=", c.job);
  if (c.olderThanDays) q = q.where("r.submitted_at", "<", sql<Date>`now() - ${`${c.olderThanDays} days`}::interval`);
  if (c.secondLookOnly) q = q.where(acceptedOnce);
  return q;
}

/**
 * The whole filtered queue in its order, as ids: what the pager counts and "next report" walks.
 * The reporter's record is worked out by trust.ts (one rule for the queue and the decision), so
 * that filter applies here rather than in SQL; a queue holds hundreds of reports, not millions.
 */
export async function queueOrder(db: Db, moderatorId: number, c: QueueCriteria) {
  const dir = c.sort === "newest" ? "desc" : "asc";
  const rows = await waiting(db, moderatorId, c)
    .select([
      "r.id",
      "r.reporter_id",
      "r.submitted_at",
      sql<boolean>`exists (select 1 from decisions d where d.report_id = r.id and d.action = 'accept' and d.report_version = r.version and d.moderator_id = ${moderatorId})`.as(
        "mine",
      ),
    ])
    .orderBy("r.submitted_at", dir)
    .orderBy("r.id", dir)
    .execute();
  if (!c.reporter) return rows;
  const hist = await histories(db, [...new Set(rows.map((r) => r.reporter_id))]);
  return rows.filter((r) => trustLevel(hist.get(r.reporter_id)!) === c.reporter);
}

/** One page of the filtered queue, with the total it is a page of; a page past the end shows the last. */
export async function reviewQueue(db: Db, moderatorId: number, c: QueueCriteria, page = 1, pageSize = QUEUE_PAGE_SIZE) {
  const order = await queueOrder(db, moderatorId, c);
  const total = order.length;
  const pages = Math.max(1, Math.ceil(total / pageSize));
  const current = Math.min(page, pages);
  const ids = order.slice((current - 1) * pageSize, current * pageSize).map((r) => r.id);
  if (ids.length === 0) return { rows: [], total, page: current, pages, from: 0, to: 0 };
  const found = await db
    .selectFrom("reports as r")
    .innerJoin("tool_models as m", "m.id", "r.tool_model_id")
    .innerJoin("makers as mk", "mk.id", "m.maker_id")
    .innerJoin("job_types as j", "j.id", "r.job_type_id")
    .innerJoin("users as u", "u.id", "r.reporter_id")
    .leftJoin("report_claims as cl", (join) =>
      join.onRef("cl.report_id", "=", "r.id").on("cl.expires_at", ">", sql<Date>`now()`),
    )
    .leftJoin("users as holder", "holder.id", "cl.moderator_id")
    .select([
      "r.id",
      "r.submitted_at",
      "r.flags",
      "r.reporter_id",
      "u.handle as reporter",
      "m.model_code",
      "mk.name as maker",
      "j.name as job",
      "holder.handle as claimed_by",
      sql<number>`(select count(*)::int from decisions d where d.report_id = r.id and d.action = 'accept' and d.report_version = r.version)`.as(
        "accepts",
      ),
    ])
    .where("r.id", "in", ids)
    .execute();
  const hist = await histories(db, [...new Set(found.map((r) => r.reporter_id))]);
  const byId = new Map(found.map((r) => [r.id, r]));
  const mine = new Set(order.filter((r) => r.mine).map((r) => r.id));
  const rows = ids.flatMap((id) => {
    const r = byId.get(id);
    if (!r) return []; // decided between the two reads
    const h = hist.get(r.reporter_id)!;
    return [{ ...r, history: h, trust: trustLevel(h), acceptedByMe: mine.has(id) }];
  });
  const from = (current - 1) * pageSize + 1;
  return { rows, total, page: current, pages, from, to: from + ids.length - 1 };
}

/**
 * Where a report stands in the filtered queue and the next one this moderator can act on: the
 * first after it in the queue's order that they have not already accepted. Works for a report that
 * has just left the queue too (it was decided), by its place in the order.
 */
export async function queueNeighbours(
  db: Db,
  moderatorId: number,
  c: QueueCriteria,
  report: { id: number; submitted_at: Date | string | null },
) {
  const order = await queueOrder(db, moderatorId, c);
  const sign = c.sort === "newest" ? -1 : 1;
  const at = (t: Date | string | null) => (t ? new Date(t).getTime() : 0);
  const after = (r: { id: number; submitted_at: Date | string | null }) => {
    const dt = at(r.submitted_at) - at(report.submitted_at);
    return sign * (dt !== 0 ? dt : r.id - report.id) > 0;
  };
  const index = order.findIndex((r) => r.id === report.id);
  const next = order.find((r) => r.id !== report.id && !r.mine && after(r));
  return { total: order.length, position: index >= 0 ? index + 1 : null, next: next?.id ?? null };
}

export async function queueCounts(db: Db) {
  const row = await db
    .selectFrom("reports")
    .where("status", "=", "submitted")
    .select([
      sql<number>`count(*)::int`.as("waiting"),
      sql<number>`(count(*) filter (where cardinality(flags) > 0))::int`.as("flagged"),
      sql<Date | null>`min(submitted_at)`.as("oldest"),
    ])
    .executeTakeFirstOrThrow();
  return row;
}

/** Everything the review page shows about one report. */
export async function reviewDetail(db: Db, reportId: number) {
  const report = await db
    .selectFrom("reports as r")
    .innerJoin("tool_models as m", "m.id", "r.tool_model_id")
    .innerJoin("makers as mk", "mk.id", "m.maker_id")
    .innerJoin("job_types as j", "j.id", "r.job_type_id")
    .innerJoin("tool_categories as c", "c.id", "r.category_id")
    .innerJoin("users as u", "u.id", "r.reporter_id")
    .selectAll("r")
    .select([
      "u.handle as reporter",
      "m.slug as model_slug",
      "m.model_code",
      "m.name as model_name",
      "m.fitting",
      "m.bore_mm",
      "m.stroke_mm",
      "m.blows_per_minute",
      "m.free_speed_rpm",
      "m.max_torque_nm",
      "m.weight_kg",
      "m.rated_air_lps",
      "m.max_inlet_kpa",
      "mk.name as maker",
      "j.name as job",
      "j.id as job_id",
      "c.name as category",
      "c.action as category_action",
    ])
    .where("r.id", "=", reportId)
    .where("r.status", "not in", HIDDEN_FROM_MODERATORS)
    .executeTakeFirst();
  if (!report) return null;
  const [evidence, usual, versions, hist] = await Promise.all([
    db
      .selectFrom("evidence")
      .select(["id", "kind", "content_type", "size_bytes", "sha256", "status", "object_key"])
      .where("report_id", "=", reportId)
      .where("status", "!=", "pending")
      .orderBy("id")
      .execute(),
    db
      .selectFrom("reports")
      .where("job_type_id", "=", report.job_id)
      .where("status", "=", "accepted")
      .select([
        sql<number>`count(*)::int`.as("n"),
        sql<number | null>`percentile_cont(0.25) within group (order by time_to_result_s)`.as("time_q1"),
        sql<number | null>`percentile_cont(0.5) within group (order by time_to_result_s)`.as("time_median"),
        sql<number | null>`percentile_cont(0.75) within group (order by time_to_result_s)`.as("time_q3"),
        sql<number | null>`percentile_cont(0.25) within group (order by inlet_kpa)`.as("inlet_q1"),
        sql<number | null>`percentile_cont(0.75) within group (order by inlet_kpa)`.as("inlet_q3"),
      ])
      .executeTakeFirstOrThrow(),
    db
      .selectFrom("report_versions")
      .select(["version", "snapshot", "created_at"])
      .where("report_id", "=", reportId)
      .orderBy("version")
      .execute(),
    histories(db, [report.reporter_id]),
  ]);
  const media = await Promise.all(
    evidence.map(async (e) => ({
      id: e.id,
      kind: e.kind,
      contentType: e.content_type,
      size: e.size_bytes == null ? null : Number(e.size_bytes),
      sha256: e.sha256,
      status: e.status,
      // Short-lived, signed: the objects themselves are never public.
      url: await presignGet(e.object_key, 600),
    })),
  );
  const history = hist.get(report.reporter_id)!;
  return {
    report,
    media,
    usual,
    versions,
    history,
    trust: trustLevel(history),
    duplicateOf: await sameFileElsewhere(db, reportId),
  };
}

/** Other reports (that moderators may see) holding a file byte-for-byte the same as one of this report's. */
async function sameFileElsewhere(db: Db, reportId: number): Promise<number[]> {
  const rows = await db
    .selectFrom("evidence as e")
    .innerJoin("evidence as other", (join) =>
      join.onRef("other.sha256", "=", "e.sha256").onRef("other.report_id", "!=", "e.report_id"),
    )
    .innerJoin("reports as r", "r.id", "other.report_id")
    .select("other.report_id")
    .distinct()
    .where("e.report_id", "=", reportId)
    .where("e.sha256", "is not", null)
    .where("r.status", "not in", HIDDEN_FROM_MODERATORS)
    .orderBy("other.report_id")
    .limit(10)
    .execute();
  return rows.map((r) => r.report_id);
}

const COMPARED = [
  "vehicle_class",
  "component_age_years",
  "corrosion_level",
  "attachment",
  "attachment_length_mm",
  "regulator_kpa",
  "inlet_kpa",
  "inlet_source",
  "hose_id_mm",
  "hose_length_m",
  "coupler_profile",
  "coupler_count",
  "compressor_lps",
  "tank_l",
  "outcome",
  "time_to_result_s",
  "attempts",
  "trigger_control",
  "notes",
  "tool_model_id",
  "job_type_id",
] as const;

/** Fields that differ between the last two submitted versions. */
export function changesSinceLastVersion(versions: { version: number; snapshot: Record<string, unknown> }[]) {
  if (versions.length < 2) return [];
  const [before, after] = [versions.at(-2)!.snapshot, versions.at(-1)!.snapshot];
  return COMPARED.filter((k) => JSON.stringify(before[k] ?? null) !== JSON.stringify(after[k] ?? null)).map(
    (field) => ({ field, before: before[field] ?? null, after: after[field] ?? null }),
  );
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
      from reports where decided_at is not null and submitted_at is not null and decided_at > now() - interval '90 days'`.execute(
      db,
    ),
    sql<{ moderator: string; week: string; decisions: number }>`
      select u.handle as moderator, to_char(date_trunc('week', d.created_at), 'YYYY-MM-DD') as week, count(*)::int as decisions
      from decisions d join users u on u.id = d.moderator_id
      where d.action in ('accept', 'return', 'reject') and d.created_at > date_trunc('week', now()) - interval '7 weeks'
      group by 1, 2 order by 2 desc, 1`.execute(db),
  ]);
  const waitingNow = (await queueCounts(db)).waiting;
  // Backlog at the end of each week, walking back from today's queue size.
  const rows = weekly.rows;
  const backlog = new Array<number>(rows.length);
  let level = waitingNow;
  for (let i = rows.length - 1; i >= 0; i--) {
    backlog[i] = level;
    level = Math.max(0, level - rows[i]!.submitted + rows[i]!.decided);
  }
  return {
    weeks: rows.map((r, i) => ({ ...r, backlog: backlog[i]! })),
    medianHours: medianHours.rows[0]!,
    perModerator: perModerator.rows,
  };
}
