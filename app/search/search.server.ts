// Search through the hosted search service (the meilisearch SDK; the local fake in development
// and tests), with PostgreSQL as the fallback when the service cannot be reached.
import { sql } from "kysely";
import { circuitBreaker, ConsecutiveBreaker, handleAll, type CircuitBreakerPolicy } from "cockatiel";
import { Meilisearch } from "meilisearch";
import { config } from "~/config.server";
import type { Db } from "../../db/database";
import { toolName } from "~/domain";

export const INDEX = "bayproof";

export const SEARCH_SETTINGS = {
  searchableAttributes: ["title", "maker", "model_code", "name", "category_name", "job_name", "vehicle_class", "notes"],
  filterableAttributes: ["kind", "category", "job", "shank"],
  sortableAttributes: [] as string[],
};

export interface SearchDoc {
  id: string;
  kind: "model" | "report";
  title: string;
  url: string;
  maker: string;
  model_code: string;
  name: string;
  category: string;
  category_name: string;
  shank: string;
  job?: string;
  job_name?: string;
  vehicle_class?: string;
  notes?: string;
  /** Reports only: what tells one report of a tool on a job from the next. */
  outcome?: string;
  accepted_on?: string;
  inlet_kpa?: number | null;
}

/**
 * A slow answer is not a down service (docs/decisions/008-search-fallback.md): a query waits up to
 * SEARCH_TIMEOUT_MS, and the service counts as down only after BREAK_AFTER failures in a row —
 * refused connections and errors fail at once, a timeout only after the wait. While it is down,
 * queries go straight to PostgreSQL; one query is let through every HALF_OPEN_AFTER_MS to see
 * whether it is back.
 */
export const SEARCH_TIMEOUT_MS = 5_000;
export const BREAK_AFTER = 3;
export const HALF_OPEN_AFTER_MS = 15_000;

export function searchClient(host = config.search.url, apiKey = config.search.apiKey) {
  return new Meilisearch({ host, apiKey, timeout: SEARCH_TIMEOUT_MS });
}

const breakers = new Map<string, CircuitBreakerPolicy>();
/** One breaker per service address, shared by every request of this process. */
export function searchBreaker(client: Meilisearch) {
  const host = client.config.host;
  let breaker = breakers.get(host);
  if (!breaker) {
    breaker = circuitBreaker(handleAll, {
      halfOpenAfter: HALF_OPEN_AFTER_MS,
      breaker: new ConsecutiveBreaker(BREAK_AFTER),
    });
    breakers.set(host, breaker);
  }
  return breaker;
}

/** A report's place: its card on its tool's page. */
const reportUrl = (modelSlug: string, reportId: number) => `/models/${modelSlug}#report-${reportId}`;

const modelDocs = (db: Db, modelIds?: number[]) => {
  let q = db
    .selectFrom("tool_models as m")
    .innerJoin("makers as mk", "mk.id", "m.maker_id")
    .innerJoin("tool_categories as c", "c.id", "m.category_id")
    .select([
      "m.slug",
      "m.model_code",
      "m.name",
      "m.fitting",
      "mk.name as maker",
      "c.slug as category",
      "c.name as category_name",
    ]);
  if (modelIds) q = q.where("m.id", "in", modelIds);
  return q.execute().then((rows) =>
    rows.map((m): SearchDoc => ({
      id: `model-${m.slug}`,
      kind: "model",
      title: toolName(m.maker, m.model_code),
      url: `/models/${m.slug}`,
      maker: m.maker,
      model_code: m.model_code,
      name: m.name,
      category: m.category,
      category_name: m.category_name,
      shank: m.fitting,
    })),
  );
};

const reportDocs = (db: Db, reportIds?: number[]) => {
  let q = db
    .selectFrom("reports as r")
    .innerJoin("tool_models as m", "m.id", "r.tool_model_id")
    .innerJoin("makers as mk", "mk.id", "m.maker_id")
    .innerJoin("tool_categories as c", "c.id", "r.category_id")
    .innerJoin("job_types as j", "j.id", "r.job_type_id")
    .select([
      "r.id",
      "r.vehicle_class",
      "r.notes",
      "r.outcome",
      "r.accepted_at",
      "r.inlet_kpa",
      "m.slug",
      "m.model_code",
      "m.name",
      "m.fitting",
      "mk.name as maker",
      "c.slug as category",
      "c.name as category_name",
      "j.slug as job",
      "j.name as job_name",
    ])
    .where("r.status", "=", "accepted");
  if (reportIds) q = q.where("r.id", "in", reportIds);
  return q.execute().then((rows) =>
    rows.map((r): SearchDoc => ({
      id: `report-${r.id}`,
      kind: "report",
      title: `${r.job_name} with the ${toolName(r.maker, r.model_code)}`,
      url: reportUrl(r.slug, r.id),
      maker: r.maker,
      model_code: r.model_code,
      name: r.name,
      category: r.category,
      category_name: r.category_name,
      shank: r.fitting,
      job: r.job,
      job_name: r.job_name,
      vehicle_class: r.vehicle_class?.replaceAll("_", " ") ?? "",
      notes: r.notes ?? "",
      outcome: r.outcome ?? undefined,
      accepted_on: r.accepted_at ? new Date(r.accepted_at).toISOString().slice(0, 10) : undefined,
      inlet_kpa: r.inlet_kpa,
    })),
  );
};

/** `npm run reindex`, and every start with the local fake: the whole index from PostgreSQL. */
export async function reindexAll(db: Db, client = searchClient()) {
  await client.createIndex(INDEX, { primaryKey: "id" }).waitTask();
  await client.index(INDEX).updateSettings(SEARCH_SETTINGS).waitTask();
  await client.index(INDEX).deleteAllDocuments().waitTask();
  const docs = [...(await modelDocs(db)), ...(await reportDocs(db))];
  for (let i = 0; i < docs.length; i += 1000)
    await client
      .index(INDEX)
      .addDocuments(docs.slice(i, i + 1000))
      .waitTask();
  return docs.length;
}

/** After an accept: the report's document (a model's own document changes only with a full reindex). */
export async function indexReport(db: Db, reportId: number, client = searchClient()) {
  const docs = await reportDocs(db, [reportId]);
  if (docs.length) await client.index(INDEX).addDocuments(docs).waitTask();
  return docs.length;
}

export interface SearchFilters {
  kind?: "model" | "report";
  category?: string;
  job?: string;
  shank?: string;
}

export interface SearchResult {
  source: "search" | "database";
  hits: Pick<
    SearchDoc,
    | "id"
    | "kind"
    | "title"
    | "url"
    | "category_name"
    | "job_name"
    | "notes"
    | "shank"
    | "vehicle_class"
    | "outcome"
    | "accepted_on"
    | "inlet_kpa"
  >[];
  total: number;
  facets: Record<string, Record<string, number>>;
}

const FACETS = ["category", "job", "shank"];

export async function search(
  db: Db,
  q: string,
  filters: SearchFilters = {},
  limit = 20,
  client = searchClient(),
  { facets = true, offset = 0 } = {},
): Promise<SearchResult> {
  const filter = Object.entries(filters)
    .filter(([, v]) => v)
    .map(([k, v]) => `${k} = '${String(v).replace(/'/g, "")}'`);
  try {
    const r = await searchBreaker(client).execute(() =>
      client.index(INDEX).search<SearchDoc>(q, { filter, facets: facets ? FACETS : [], limit, offset }),
    );
    return {
      source: "search",
      hits: r.hits,
      total: r.estimatedTotalHits ?? r.hits.length,
      facets: r.facetDistribution ?? {},
    };
  } catch {
    return databaseSearch(db, q, filters, limit, offset);
  }
}

/** The plainer search when the search service is down: words matched in PostgreSQL, no typo tolerance. */
async function databaseSearch(db: Db, q: string, f: SearchFilters, limit: number, offset = 0): Promise<SearchResult> {
  const words = q
    .toLowerCase()
    .split(/\s+/)
    .filter(Boolean)
    .slice(0, 6)
    .map((w) => `%${w.replace(/[\\%_]/g, (c) => `\\${c}`)}%`);
  const models =
    f.kind === "report" || f.job
      ? []
      : await db
          .selectFrom("tool_models as m")
          .innerJoin("makers as mk", "mk.id", "m.maker_id")
          .innerJoin("tool_categories as c", "c.id", "m.category_id")
          .select([
            "m.slug",
            "m.model_code",
            "m.fitting",
            "mk.name as maker",
            "c.name as category_name",
            "c.slug as category",
          ])
          .where((eb) =>
            eb.and(
              words.map((w) =>
                eb(sql<string>`lower(mk.name || ' ' || m.model_code || ' ' || m.name || ' ' || c.name)`, "like", w),
              ),
            ),
          )
          .$if(!!f.category, (qb) => qb.where("c.slug", "=", f.category!))
          .$if(!!f.shank, (qb) => qb.where("m.fitting", "=", f.shank as never))
          .limit(limit)
          .offset(offset)
          .execute();
  const reports =
    f.kind === "model"
      ? []
      : await db
          .selectFrom("reports as r")
          .innerJoin("tool_models as m", "m.id", "r.tool_model_id")
          .innerJoin("makers as mk", "mk.id", "m.maker_id")
          .innerJoin("job_types as j", "j.id", "r.job_type_id")
          .innerJoin("tool_categories as c", "c.id", "r.category_id")
          .select([
            "r.id",
            "r.notes",
            "r.outcome",
            "r.accepted_at",
            "r.inlet_kpa",
            "r.vehicle_class",
            "m.slug",
            "m.model_code",
            "m.fitting",
            "mk.name as maker",
            "j.name as job_name",
            "c.name as category_name",
          ])
          .where("r.status", "=", "accepted")
          .where((eb) =>
            eb.and(
              words.map((w) =>
                eb(
                  sql<string>`lower(j.name || ' ' || coalesce(r.notes, '') || ' ' || mk.name || ' ' || m.model_code || ' ' || replace(coalesce(r.vehicle_class, ''), '_', ' '))`,
                  "like",
                  w,
                ),
              ),
            ),
          )
          .$if(!!f.category, (qb) => qb.where("c.slug", "=", f.category!))
          .$if(!!f.job, (qb) => qb.where("j.slug", "=", f.job!))
          .$if(!!f.shank, (qb) => qb.where("m.fitting", "=", f.shank as never))
          .orderBy("r.accepted_at", "desc")
          .limit(limit)
          .offset(offset)
          .execute();
  const hits: SearchResult["hits"] = [
    ...models.map((m) => ({
      id: `model-${m.slug}`,
      kind: "model" as const,
      title: toolName(m.maker, m.model_code),
      url: `/models/${m.slug}`,
      category_name: m.category_name,
      shank: m.fitting,
    })),
    ...reports.map((r) => ({
      id: `report-${r.id}`,
      kind: "report" as const,
      title: `${r.job_name} with the ${toolName(r.maker, r.model_code)}`,
      url: reportUrl(r.slug, r.id),
      category_name: r.category_name,
      job_name: r.job_name,
      notes: r.notes ?? "",
      shank: r.fitting,
      vehicle_class: r.vehicle_class ?? undefined,
      outcome: r.outcome ?? undefined,
      accepted_on: r.accepted_at ? new Date(r.accepted_at).toISOString().slice(0, 10) : undefined,
      inlet_kpa: r.inlet_kpa,
    })),
  ].slice(0, limit);
  return { source: "database", hits, total: hits.length, facets: {} };
}
