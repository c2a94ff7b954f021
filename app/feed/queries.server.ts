// The feed's reads. A report record is one row with the columns of fields.ts, in their order,
// timestamps already formatted by PostgreSQL. Pages and single records serialise that row; the
// NDJSON file has PostgreSQL concatenate each line from the same columns (reportLine) and the
// CSV takes them as text — see docs/decisions/005-open-feed.md.
import { type RawBuilder, sql } from "kysely";
import { type Db, PREPARED } from "../../db/database";
import { statRecords as statRecordsOfStats } from "~/stats/feed.server";
import { REPORT_FIELDS } from "./fields";
import { feedError } from "./http.server";

/** A timestamp as the feed writes it: UTC, microseconds, RFC 3339. */
export const iso = (column: RawBuilder<unknown>) =>
  sql`to_char(${column} at time zone 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.US"Z"')`;

/**
 * The SQL for each report field; every other field is the reports column of the same name.
 * `raw` is for the bulk files, read as text: the evidence links come as JSON text there.
 */
function reportExpressions(raw: boolean): Record<string, RawBuilder<unknown>> {
  const urls = sql`coalesce(ev.urls, '{}'::text[])`;
  const special: Record<string, RawBuilder<unknown>> = {
    model: sql`m.slug`,
    maker: sql`mk.slug`,
    category: sql`c.slug`,
    job: sql`j.slug`,
    reporter: sql`u.feed_pseudonym`,
    accepted_at: iso(sql`r.accepted_at`),
    evidence_count: sql`coalesce(ev.n, 0)::int`,
    evidence_urls: raw ? sql`to_json(${urls})::text` : urls,
  };
  return Object.fromEntries(REPORT_FIELDS.map((f) => [f.name, special[f.name] ?? sql.ref(`r.${f.name}`)]));
}

const reportFrom = (origin: string, evidence: "per-report" | "grouped" = "per-report") => {
  const agg = sql`count(*) as n, array_agg(${origin + "/api/v1/evidence/"} || e.id order by e.id) filter (where e.is_public) as urls`;
  const published = sql`e.status in ('uploaded', 'verified')`;
  return sql`
  from reports r
  join tool_models m on m.id = r.tool_model_id
  join makers mk on mk.id = m.maker_id
  join tool_categories c on c.id = r.category_id
  join job_types j on j.id = r.job_type_id
  join users u on u.id = r.reporter_id
  ${
    evidence === "grouped"
      ? sql`left join (select e.report_id, ${agg} from evidence e where ${published} group by e.report_id) ev on ev.report_id = r.id`
      : sql`left join lateral (select ${agg} from evidence e where e.report_id = r.id and ${published}) ev on true`
  }`;
};

/** The report fields as columns named after them, in the order of fields.ts. */
function reportColumns(raw = false) {
  const exprs = reportExpressions(raw);
  return sql.join(REPORT_FIELDS.map((f) => sql`${exprs[f.name]!} as ${sql.id(f.name)}`));
}

export interface SlugFilters {
  model?: string;
  job?: string;
  category?: string;
}

/** Filters as row ids, once their slugs are known to exist. */
export interface ReportFilters {
  modelId?: number;
  jobId?: number;
  categoryId?: number;
  accepted_since?: Date;
  accepted_until?: Date;
}

const SLUG_TABLES = {
  model: ["tool_models", "tool model", "models"],
  job: ["job_types", "job type", "job-types"],
  category: ["tool_categories", "tool category", "models"],
} as const;

/**
 * The ids behind the slugs given, in one query; a slug that names nothing is a 400 naming its
 * parameter. Queries then filter on the ids, which their indexes hold.
 */
export async function resolveSlugs(
  db: Db,
  f: SlugFilters,
): Promise<Pick<ReportFilters, "modelId" | "jobId" | "categoryId">> {
  const given = (Object.keys(SLUG_TABLES) as (keyof SlugFilters)[]).filter((k) => f[k] !== undefined);
  if (given.length === 0) return {};
  const row = (
    await sql<Record<string, number | null>>`select ${sql.join(
      given.map((k) => sql`(select id from ${sql.table(SLUG_TABLES[k][0])} where slug = ${f[k]!}) as ${sql.id(k)}`),
    )}`.execute(db)
  ).rows[0]!;
  for (const k of given) {
    if (row[k] == null)
      throw feedError(
        400,
        "unknown_value",
        `"${k}": no ${SLUG_TABLES[k][1]} has the slug "${f[k]}" (see /api/v1/${SLUG_TABLES[k][2]}).`,
        k,
      );
  }
  return { modelId: row.model ?? undefined, jobId: row.job ?? undefined, categoryId: row.category ?? undefined };
}

const reportWhere = (f: ReportFilters) =>
  sql.join(
    [
      sql`r.status = 'accepted'`,
      ...(f.modelId ? [sql`r.tool_model_id = ${f.modelId}`] : []),
      ...(f.jobId ? [sql`r.job_type_id = ${f.jobId}`] : []),
      ...(f.categoryId ? [sql`r.category_id = ${f.categoryId}`] : []),
      ...(f.accepted_since ? [sql`r.accepted_at >= ${f.accepted_since}`] : []),
      ...(f.accepted_until ? [sql`r.accepted_at < ${f.accepted_until}`] : []),
    ],
    sql` and `,
  );

/** Microseconds since 1970 as timestamptz, exactly (no float on the way). */
export const fromMicros = (micros: string) => sql`(timestamptz 'epoch' + ${micros}::bigint * interval '1 microsecond')`;

/** Reports accepted this long ago are safe to page over: any transaction accepting one has ended. */
export const SETTLE = "5 seconds";

/** The horizon of a new walk: the newest accepted time that has settled, in microseconds. */
export async function newHorizon(db: Db): Promise<string> {
  const r = await sql<{ micros: string }>`${sql.raw(PREPARED)}
    select (extract(epoch from coalesce(
      (select max(accepted_at) from reports where status = 'accepted' and accepted_at <= now() - ${SETTLE}::interval),
      now() - ${SETTLE}::interval)) * 1000000)::bigint::text as micros`.execute(db);
  return r.rows[0]!.micros;
}

export const microsToIso = (micros: string) => {
  const ms = BigInt(micros) / 1000n;
  const rest = (BigInt(micros) % 1000n).toString().padStart(3, "0");
  return new Date(Number(ms)).toISOString().replace("Z", `${rest}Z`);
};

export async function reportPage(
  db: Db,
  origin: string,
  f: ReportFilters,
  limit: number,
  asOfMicros: string,
  after?: { micros: string; id: number },
) {
  const rows = await sql<Record<string, unknown> & { feed_cursor_micros: string; id: number }>`${sql.raw(PREPARED)}
    select ${reportColumns()}, (extract(epoch from r.accepted_at) * 1000000)::bigint::text as feed_cursor_micros
    ${reportFrom(origin)}
    where ${reportWhere(f)} and r.accepted_at <= ${fromMicros(asOfMicros)}
      ${after ? sql`and (r.accepted_at, r.id) > (${fromMicros(after.micros)}, ${after.id})` : sql``}
    order by r.accepted_at, r.id
    limit ${limit + 1}`.execute(db);
  const more = rows.rows.length > limit;
  const page = rows.rows.slice(0, limit);
  const last = page.at(-1);
  const records = page.map(({ feed_cursor_micros: _, ...record }) => record);
  return { records, next: more && last ? { micros: last.feed_cursor_micros, id: last.id } : null };
}

export async function reportById(db: Db, origin: string, id: number) {
  const r = await sql<Record<string, unknown>>`
    select ${reportColumns()} ${reportFrom(origin)} where r.status = 'accepted' and r.id = ${id}`.execute(db);
  return r.rows[0] ?? null;
}

/**
 * One report as a JSON line, written by PostgreSQL with plain text concatenation (far cheaper
 * than json_build_object): numbers in their shortest exact text, slugs, codes and timestamps
 * (nothing to escape in them) quoted as they are, free text escaped by to_json.
 */
function reportLine() {
  const exprs = reportExpressions(true);
  const pieces = REPORT_FIELDS.map((f, i) => {
    const e = exprs[f.name]!;
    const key = sql.lit(`${i === 0 ? "{" : ","}${JSON.stringify(f.name)}:`);
    const value =
      f.type === "integer" || f.type === "number"
        ? sql`coalesce((${e})::text, 'null')`
        : f.type === "string-array"
          ? e
          : f.type === "boolean"
            ? sql`coalesce(case when ${e} then 'true' else 'false' end, 'null')`
            : f.pattern || f.enum || f.type === "datetime"
              ? sql`coalesce('"' || ${e} || '"', 'null')`
              : sql`coalesce(to_json(${e})::text, 'null')`;
    return sql`${key} || ${value}`;
  });
  return sql`${sql.join(pieces, sql` || `)} || '}'`;
}

/** The bulk files' query: every accepted report in feed order, as JSON lines or as columns of text. */
export function bulkQuery(db: Db, origin: string, format: "ndjson" | "csv") {
  const select = format === "ndjson" ? sql`${reportLine()} as line` : reportColumns(true);
  return sql`select ${select} ${reportFrom(origin, "grouped")} where r.status = 'accepted' order by r.accepted_at, r.id`.compile(
    db,
  );
}

export async function modelRecords(db: Db, categoryId?: number) {
  const rows = await db
    .selectFrom("tool_models as m")
    .innerJoin("makers as mk", "mk.id", "m.maker_id")
    .innerJoin("tool_categories as c", "c.id", "m.category_id")
    .leftJoin(
      db
        .selectFrom("stats_cells")
        .select(["tool_model_id", sql<number>`sum(n)::int`.as("n")])
        .groupBy("tool_model_id")
        .as("s"),
      "s.tool_model_id",
      "m.id",
    )
    .select([
      "m.slug",
      "mk.slug as maker",
      "mk.name as maker_name",
      "c.slug as category",
      "m.model_code",
      "m.name",
      "m.fitting",
      "m.bore_mm",
      "m.stroke_mm",
      "m.blows_per_minute",
      "m.free_speed_rpm",
      "m.max_torque_nm",
      "m.weight_kg",
      "m.length_mm",
      "m.street_price_cents",
      "m.air_inlet",
      "m.rated_air_lps",
      "m.max_inlet_kpa",
      "m.running_air_lps",
      "m.running_air_source",
      "m.running_air_factor",
      "m.vibration_ahv_ms2",
      "m.vibration_source",
      "m.vibration_k_ms2",
      "m.vibration_iso28927_part",
      "m.sound_pressure_db",
      "m.sound_pressure_source",
      "m.sound_pressure_k_db",
      "m.sound_power_db",
      "m.sound_power_source",
      "m.sound_power_k_db",
      "m.bit_retainer",
      "m.weight_with_whip_kg",
      "m.weight_with_whip_source",
      "m.measured_specs",
      sql<number>`coalesce(s.n, 0)`.as("accepted_reports"),
    ])
    .$if(!!categoryId, (q) => q.where("m.category_id", "=", categoryId!))
    .orderBy("m.slug")
    .execute();
  return rows;
}

export async function jobTypeRecords(db: Db, categoryId?: number) {
  return db
    .selectFrom("job_types as j")
    .innerJoin("tool_categories as c", "c.id", "j.category_id")
    .select(["j.slug", "c.slug as category", "j.name", "j.description", "j.seized"])
    .$if(!!categoryId, (q) => q.where("j.category_id", "=", categoryId!))
    .orderBy("j.slug")
    .execute();
}

export async function statRecords(db: Db, f: Pick<ReportFilters, "modelId" | "jobId" | "categoryId">) {
  return statRecordsOfStats(db, f);
}
