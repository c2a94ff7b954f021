// The open feed's bench data under /api/v1 over the demo scenario: bench runs walked page by page with a
// cursor, one run, rigs, protocols and the figures across rigs, the bulk files — every answer checked
// against the feed's own published JSON Schemas (ajv, draft 2020-12) — and the model records' declared
// exposure fields. Only accepted runs appear; people appear only as pseudonyms.
import { parse } from "csv-parse/sync";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createApiKey } from "../../app/auth/api-keys.server";
import { BENCH_TRIAL_ROW_FIELDS } from "../../app/feed/bench-fields";
import { testDb } from "../support/db";
import { feedClient, publishedSchemas } from "../support/feed";

const db = testDb();

// The records' shapes as far as these checks read them (the schemas check the rest).
interface Trial {
  trial: number;
  source: "typed" | "trace";
  blows: number;
  peaks: number[];
  trace_url: string | null;
  trace_rate_hz: number | null;
}
interface Series {
  series: number;
  running_inlet_kpa: number;
  trials: Trial[];
}
interface Run {
  id: number;
  model: string;
  rig: number;
  protocol: string;
  protocol_version: number;
  operator: string;
  series: Series[];
}
interface Rig {
  id: number;
  name: string;
  calibration_status: string;
  last_check_in_control: boolean | null;
  accepted_runs: number;
}
interface Protocol {
  slug: string;
  version: number;
  quantity: string;
  frozen: boolean;
  accepted_runs: number;
  series: { id: number }[];
}
interface Figure {
  model: string;
  protocol: string;
  series: number;
  figure: string;
  trigger: string;
  estimate: number;
  pressure_slope: object | null;
}
interface Resource {
  name: string;
  path: string;
  schema: { fields: { name: string }[]; primaryKey: string[] };
}
interface Model {
  slug: string;
  vibration_ahv_ms2: number | null;
  vibration_source: string | null;
}
let check: Awaited<ReturnType<typeof publishedSchemas>>;
let key: string;
let get: ReturnType<typeof feedClient>;

beforeAll(async () => {
  check = await publishedSchemas();
  const { id } = await db
    .selectFrom("users")
    .select("id")
    .where("email", "=", "reporter@demo.bayproof.test")
    .executeTakeFirstOrThrow();
  key = await createApiKey(db, id, "bench feed tests");
  get = feedClient(undefined, key);
});
afterAll(() => db.destroy());

const json = async (path: string, expected = 200, headers: Record<string, string> = {}) => {
  const res = await get(path, headers);
  expect(res.status, path).toBe(expected);
  return res.json();
};

/** Every accepted run of one walk, following next_cursor; each page checked against bench-run-page. */
async function walk(query: string) {
  const records: Run[] = [];
  let path = `/api/v1/bench-runs?${query}`;
  let asOf = "";
  for (let page = 0; page < 500; page++) {
    const res = await get(path);
    expect(res.status, path).toBe(200);
    const body = await res.json();
    expect(check("bench-run-page", body)).toEqual([]);
    asOf ||= body.as_of;
    expect(body.as_of).toBe(asOf);
    records.push(...body.data);
    if (!body.next_cursor) {
      expect(res.headers.get("link")).toBeNull();
      return { records, asOf };
    }
    expect(res.headers.get("link")).toMatch(/^<.*\/api\/v1\/bench-runs\?.*cursor=.*>; rel="next"$/);
    const next = new URLSearchParams(query);
    next.set("cursor", body.next_cursor);
    path = `/api/v1/bench-runs?${next}`;
  }
  throw new Error("the walk did not end");
}

describe("bench runs", () => {
  it("walks every accepted run once, in (accepted_at, id) order, a page at a time", async () => {
    const { records, asOf } = await walk("limit=7");
    const accepted = await db
      .selectFrom("bench_runs")
      .select("id")
      .where("status", "=", "accepted")
      .where("accepted_at", "<=", new Date(asOf))
      .orderBy("accepted_at")
      .orderBy("id")
      .execute();
    expect(accepted.length).toBeGreaterThan(14);
    expect(records.map((r) => r.id)).toEqual(accepted.map((r) => r.id));
    for (const r of records) expect(r.series.length).toBeGreaterThan(0);
  });

  it("filters by model, rig and protocol; the filters' slugs and rig must exist", async () => {
    const { records } = await walk("limit=100");
    const sample = records[Math.floor(records.length / 2)]!;
    for (const [param, value, field] of [
      ["model", sample.model, "model"],
      ["rig", String(sample.rig), "rig"],
      ["protocol", sample.protocol, "protocol"],
    ] as const) {
      const { records: only } = await walk(`${param}=${value}&limit=5`);
      expect(only.length, param).toBe(records.filter((r) => String(r[field]) === value).length);
      expect(only.length).toBeGreaterThan(0);
    }
  });

  it("one run reads as it does on its page, with its series and trials as stored", async () => {
    const page = await json("/api/v1/bench-runs?limit=20");
    const fromPage = page.data[5];
    const one = await json(`/api/v1/bench-runs/${fromPage.id}`);
    expect(check("bench-run", one)).toEqual([]);
    expect(one).toEqual(fromPage);
    const trials = await db
      .selectFrom("bench_trials as t")
      .innerJoin("bench_run_series as rs", "rs.id", "t.run_series_id")
      .select(["t.peaks", "t.trace_key"])
      .where("rs.run_id", "=", one.id)
      .orderBy("rs.id")
      .orderBy("t.trial_number")
      .execute();
    const published = (one as Run).series.flatMap((s) => s.trials);
    expect(published.map((t) => t.peaks)).toEqual(trials.map((t) => t.peaks.map(Number)));
    expect(published.map((t) => t.source)).toEqual(trials.map((t) => (t.trace_key ? "trace" : "typed")));
    for (const t of published) expect(t.blows).toBe(t.peaks.length);
  });

  it("links a traced trial's raw trace (a short-lived redirect); a typed trial has none", async () => {
    const { data } = await json("/api/v1/bench-runs?limit=500");
    const trials = (data as Run[]).flatMap((r) => r.series.flatMap((s) => s.trials));
    const traced = trials.find((t) => t.source === "trace")!;
    expect(traced, "the demo has traced trials").toBeTruthy();
    expect(traced.trace_url).toMatch(/\/api\/v1\/bench-traces\/\d+$/);
    expect(traced.trace_rate_hz).toBeGreaterThan(0);
    const res = await get(new URL(traced.trace_url!).pathname);
    expect(res.status).toBe(302);
    expect(res.headers.get("location")).toMatch(/X-Amz-Expires=600/);
    expect(trials.filter((t) => t.source === "typed").every((t) => t.trace_url === null)).toBe(true);
  });

  it("answers 404 for a run that is not accepted, and for its traces", async () => {
    const others = await db
      .selectFrom("bench_runs")
      .select(["id", "status"])
      .where("status", "!=", "accepted")
      .execute();
    expect(new Set(others.map((o) => o.status)).size).toBeGreaterThanOrEqual(2);
    for (const o of others.slice(0, 6)) {
      const body = await json(`/api/v1/bench-runs/${o.id}`, 404);
      expect(check("error", body)).toEqual([]);
      expect(body.error.code).toBe("not_found");
    }
    expect((await json("/api/v1/bench-runs/999999", 404)).error.code).toBe("not_found");
    const held = await db
      .selectFrom("bench_trials as t")
      .innerJoin("bench_run_series as rs", "rs.id", "t.run_series_id")
      .innerJoin("bench_runs as br", "br.id", "rs.run_id")
      .select("t.id")
      .where("br.status", "!=", "accepted")
      .limit(1)
      .executeTakeFirstOrThrow();
    expect((await get(`/api/v1/bench-traces/${held.id}`)).status).toBe(404);
  });
});

describe("bad input is a 400 naming the parameter", () => {
  const cases: [string, string, string][] = [
    ["/api/v1/bench-runs/abc", "id", "invalid_parameter"],
    ["/api/v1/bench-runs/0", "id", "invalid_parameter"],
    ["/api/v1/bench-runs/99999999999", "id", "invalid_parameter"],
    ["/api/v1/bench-runs/1?full=yes", "full", "unknown_parameter"],
    ["/api/v1/bench-runs?colour=red", "colour", "unknown_parameter"],
    ["/api/v1/bench-runs?limit=0", "limit", "invalid_parameter"],
    ["/api/v1/bench-runs?cursor=not-a-cursor", "cursor", "invalid_cursor"],
    ["/api/v1/bench-runs?model=no-such-model", "model", "unknown_value"],
    ["/api/v1/bench-runs?rig=abc", "rig", "invalid_parameter"],
    ["/api/v1/bench-runs?rig=999999", "rig", "unknown_value"],
    ["/api/v1/bench-runs?protocol=Not%20A%20Slug", "protocol", "invalid_parameter"],
    ["/api/v1/bench-runs?protocol=no-such-protocol", "protocol", "unknown_value"],
    ["/api/v1/bench-traces/x", "id", "invalid_parameter"],
    ["/api/v1/rigs?kind=percussive_force", "kind", "unknown_parameter"],
    ["/api/v1/bench-protocols?slug=x", "slug", "unknown_parameter"],
    ["/api/v1/bench-figures?series=first", "series", "invalid_parameter"],
    ["/api/v1/bench-figures?series=999999", "series", "unknown_value"],
    ["/api/v1/bench-figures?model=no-such-model", "model", "unknown_value"],
  ];
  it.each(cases)("%s", async (path, parameter, code) => {
    const body = await json(path, 400);
    expect(check("error", body)).toEqual([]);
    expect(body.error).toMatchObject({ code, parameter });
    expect(body.error.message).toContain(parameter);
  });

  it("refuses an altered cursor, a cursor used with other filters, and a report walk's cursor", async () => {
    const page = await json("/api/v1/bench-runs?limit=2");
    const [payload, mac] = page.next_cursor.split(".");
    const state = JSON.parse(Buffer.from(payload, "base64url").toString());
    state[2] = 1;
    const forged = `${Buffer.from(JSON.stringify(state)).toString("base64url")}.${mac}`;
    expect((await json(`/api/v1/bench-runs?limit=2&cursor=${forged}`, 400)).error.code).toBe("invalid_cursor");
    const model = page.data[0].model;
    expect((await json(`/api/v1/bench-runs?model=${model}&cursor=${page.next_cursor}`, 400)).error.code).toBe(
      "cursor_mismatch",
    );
    const reports = await json("/api/v1/reports?limit=2");
    expect((await json(`/api/v1/bench-runs?cursor=${reports.next_cursor}`, 400)).error.code).toBe("cursor_mismatch");
    expect((await json(`/api/v1/bench-runs?limit=3&cursor=${page.next_cursor}`)).data).toHaveLength(3);
  });
});

describe("rigs, protocols and figures", () => {
  it("rigs: every rig with its standing, the expired one among them", async () => {
    const body = await json("/api/v1/rigs");
    expect(check("rig-list", body)).toEqual([]);
    const rigs = await db.selectFrom("rigs").select(["id", "name"]).orderBy("id").execute();
    expect(body.data.map((r: Rig) => r.id)).toEqual(rigs.map((r) => r.id));
    expect(body.data.filter((r: Rig) => r.calibration_status === "expired").map((r: Rig) => r.name)).toEqual([
      "Tamarind trailer-bay force rig",
    ]);
    expect(body.data.find((r: Rig) => r.name === "Ridgeback heavy anvil").last_check_in_control).toBe(false);
    const runs = await json("/api/v1/bench-runs?limit=500");
    for (const rig of body.data)
      expect(rig.accepted_runs, rig.name).toBe(runs.data.filter((r: Run) => r.rig === rig.id).length);
  });

  it("protocols: every version with its series; runs name a version that is listed", async () => {
    const body = await json("/api/v1/bench-protocols");
    expect(check("bench-protocol-list", body)).toEqual([]);
    expect(new Set(body.data.map((p: Protocol) => p.quantity))).toEqual(new Set(["peak_force_n", "peak_torque_nm"]));
    const versions = new Set(body.data.map((p: Protocol) => `${p.slug}@${p.version}`));
    const { data: runs } = await json("/api/v1/bench-runs?limit=500");
    for (const r of runs) expect(versions).toContain(`${r.protocol}@${r.protocol_version}`);
    for (const p of body.data) if (p.accepted_runs > 0) expect(p.frozen).toBe(true);
    const series = new Set(body.data.flatMap((p: Protocol) => p.series.map((s) => s.id)));
    for (const r of runs) for (const s of r.series) expect(series).toContain(s.series);
  });

  it("figures across rigs: as stored, filtered by model, protocol and series", async () => {
    const body = await json("/api/v1/bench-figures");
    expect(check("bench-figure-list", body)).toEqual([]);
    const stored = await db.selectFrom("bench_pooled_figures").selectAll().execute();
    expect(body.data.length).toBe(stored.length);
    expect(body.data.length).toBeGreaterThan(0);
    const first = body.data[0];
    const row = stored.find(
      (s) => s.series_id === first.series && s.figure === first.figure && s.estimate === first.estimate,
    );
    expect(row).toBeTruthy();
    expect(first).toMatchObject({ lower: row!.lower, upper: row!.upper, tau2: row!.tau2, runs: row!.runs });
    const byModel = await json(`/api/v1/bench-figures?model=${first.model}`);
    expect(byModel.data.every((f: Figure) => f.model === first.model)).toBe(true);
    const bySeries = await json(`/api/v1/bench-figures?series=${first.series}&protocol=${first.protocol}`);
    expect(bySeries.data.length).toBeGreaterThan(0);
    expect(bySeries.data.every((f: Figure) => f.series === first.series)).toBe(true);
    const slopes = await db.selectFrom("bench_pressure_slopes").select(["tool_model_id"]).execute();
    if (slopes.length) expect(body.data.some((f: Figure) => f.pressure_slope !== null)).toBe(true);
    for (const f of body.data) if (f.pressure_slope) expect([f.figure, f.trigger]).toEqual(["force", "full"]);
  });
});

/** A CSV row's cells as the values of its fields (BENCH_TRIAL_ROW_FIELDS): numbers, booleans, lists, nulls. */
function typedRow(row: Record<string, string>) {
  return Object.fromEntries(
    BENCH_TRIAL_ROW_FIELDS.map((f) => {
      const raw = row[f.name]!;
      if (raw === "" && f.nullable) return [f.name, null];
      if (f.type === "integer" || f.type === "number") return [f.name, Number(raw)];
      if (f.type === "boolean") return [f.name, raw === "true" ? true : raw === "false" ? false : raw];
      if (f.type === "number-array" || f.type === "string-array") return [f.name, JSON.parse(raw)];
      return [f.name, raw];
    }),
  );
}

describe("the bench bulk files", () => {
  it("ask for an API key", async () => {
    for (const file of ["bench-runs.ndjson", "bench-runs.csv"]) {
      const res = await feedClient()(`/api/v1/${file}`);
      expect(res.status, file).toBe(401);
      const body = await res.json();
      expect(check("error", body)).toEqual([]);
      expect(body.error.code).toBe("api_key_required");
    }
  });

  it("NDJSON: every line is a bench run, the same as from its own endpoint; CSV: a row per trial, each valid", async () => {
    const nd = await get("/api/v1/bench-runs.ndjson");
    expect(nd.status).toBe(200);
    expect(nd.headers.get("content-type")).toMatch(/^application\/x-ndjson/);
    expect(nd.headers.get("content-disposition")).toMatch(/filename="bayproof-bench-runs-\d{4}-\d{2}-\d{2}\.ndjson"/);
    const text = await nd.text();
    expect(text.endsWith("\n")).toBe(true);
    const runs = text
      .trimEnd()
      .split("\n")
      .map((l) => JSON.parse(l) as Run);
    for (const run of runs) expect(check("bench-run", run), `run ${run.id}`).toEqual([]);
    const accepted = await db.selectFrom("bench_runs").select("id").where("status", "=", "accepted").execute();
    expect(runs.map((r) => r.id).sort((a, b) => a - b)).toEqual(accepted.map((r) => r.id).sort((a, b) => a - b));
    for (const run of [runs[0]!, runs.at(-1)!]) expect(await json(`/api/v1/bench-runs/${run.id}`)).toEqual(run);

    const csv = await get("/api/v1/bench-runs.csv");
    expect(csv.headers.get("content-type")).toMatch(/^text\/csv/);
    const raw = await csv.text();
    expect(raw.endsWith("\r\n")).toBe(true);
    expect(raw.split("\r\n")[0]!.split(",")).toEqual(BENCH_TRIAL_ROW_FIELDS.map((f) => f.name));
    const rows: Record<string, string>[] = parse(raw, { columns: true, record_delimiter: "\r\n" });
    const trials = runs.flatMap((r) => r.series.flatMap((s) => s.trials.map((t) => ({ r, s, t }))));
    expect(rows.length).toBe(trials.length);
    for (const [i, row] of rows.entries()) {
      const value = typedRow(row);
      expect(check("bench-trial-row", value), `row ${i + 1}`).toEqual([]);
      const { r, s, t } = trials[i]!;
      expect([value.run, value.series, value.trial]).toEqual([r.id, s.series, t.trial]);
      expect(value.peaks).toEqual(t.peaks);
      expect(value.series_running_inlet_kpa).toBe(s.running_inlet_kpa);
    }
  });

  it("the Data Package describes the bench CSV's columns", async () => {
    const pkg = await json("/api/v1/datapackage.json");
    const resource = pkg.resources.find((r: Resource) => r.name === "bench-runs-csv");
    expect(resource.schema.fields.map((f: { name: string }) => f.name)).toEqual(
      BENCH_TRIAL_ROW_FIELDS.map((f) => f.name),
    );
    expect(resource.schema.primaryKey).toEqual(["run", "series", "trial"]);
    expect(resource.schema.fields.find((f: { name: string }) => f.name === "series_static_inlet_kpa")).toMatchObject({
      type: "number",
      unit: "kPa",
    });
    expect(pkg.resources.find((r: Resource) => r.name === "bench-runs-ndjson").path).toMatch(
      /\/api\/v1\/bench-runs\.ndjson$/,
    );
  });
});

describe("privacy", () => {
  it("carries no e-mail, handle or typed operator name; filers and owners appear as their pseudonyms", async () => {
    const text = [
      await (await get("/api/v1/bench-runs.ndjson")).text(),
      await (await get("/api/v1/bench-runs.csv")).text(),
      JSON.stringify(await json("/api/v1/rigs")),
    ].join("\n");
    expect(text).not.toMatch(/@demo\.bayproof\.test|@[a-z0-9-]+\.[a-z]{2,}/i);
    const users = await db.selectFrom("users").select(["id", "handle", "feed_pseudonym"]).execute();
    for (const u of users) expect(text).not.toContain(`"${u.handle}"`);
    const runs = await db
      .selectFrom("bench_runs")
      .select(["id", "operator", "filed_by"])
      .where("status", "=", "accepted")
      .execute();
    for (const r of runs) expect(text).not.toContain(r.operator);
    const pseudonymOf = new Map(users.map((u) => [u.id, u.feed_pseudonym]));
    const { data } = await json("/api/v1/bench-runs?limit=500");
    for (const r of data) expect(r.operator).toBe(pseudonymOf.get(runs.find((x) => x.id === r.id)!.filed_by));
  });
});

describe("HTTP", () => {
  it("sends an ETag and answers 304 when it is sent back", async () => {
    for (const path of [
      "/api/v1/bench-runs?limit=5",
      "/api/v1/rigs",
      "/api/v1/bench-protocols",
      "/api/v1/bench-figures",
    ]) {
      const first = await get(path);
      const etag = first.headers.get("etag");
      expect(etag, path).toMatch(/^"[A-Za-z0-9_-]{32}"$/);
      expect(first.headers.get("cache-control"), path).toMatch(/^public, max-age=\d+/);
      expect((await get(path, { "if-none-match": etag! })).status, path).toBe(304);
    }
  });
});

describe("the model records' declared exposure figures", () => {
  it("are published with their sources, as the catalogue holds them", async () => {
    const body = await json("/api/v1/models");
    expect(check("model-list", body)).toEqual([]);
    const row = await db
      .selectFrom("tool_models")
      .select([
        "slug",
        "vibration_ahv_ms2",
        "vibration_k_ms2",
        "vibration_iso28927_part",
        "vibration_source",
        "sound_pressure_db",
        "sound_power_db",
        "sound_power_source",
        "bit_retainer",
        "weight_with_whip_kg",
        "running_air_lps",
        "running_air_source",
      ])
      .where("vibration_ahv_ms2", "is not", null)
      .orderBy("slug")
      .executeTakeFirstOrThrow();
    expect(body.data.find((m: Model) => m.slug === row.slug)).toMatchObject(row);
    expect(body.data.filter((m: Model) => m.vibration_ahv_ms2 !== null).every((m: Model) => m.vibration_source)).toBe(
      true,
    );
  });
});
