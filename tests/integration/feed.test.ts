// The open feed under /api/v1: every answer checked against the feed's own published JSON
// Schemas (ajv, draft 2020-12), the bulk files against the pages and RFC 4180, privacy, HTTP
// caching, CORS, rate limits and API keys, and bad input.
import { parse } from "csv-parse/sync";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { createApiKey, revokeApiKey } from "../../app/auth/api-keys.server";
import { testDb } from "../support/db";
import { feedClient, publishedSchemas } from "../support/feed";
import { serverLogDuring } from "../support/server-log";

const db = testDb();
let check: Awaited<ReturnType<typeof publishedSchemas>>;
let key: string;
let userId: number;
// Most checks use an API key, so they fit in its 600 a minute; the limits have their own clients.
let get: ReturnType<typeof feedClient>;

beforeAll(async () => {
  check = await publishedSchemas();
  userId = (
    await db
      .selectFrom("users")
      .select("id")
      .where("email", "=", "reporter@demo.bayproof.test")
      .executeTakeFirstOrThrow()
  ).id;
  key = await createApiKey(db, userId, "feed tests");
  get = feedClient(undefined, key);
});
afterAll(() => db.destroy());

const json = async (path: string, expected = 200, headers: Record<string, string> = {}) => {
  const res = await get(path, headers);
  expect(res.status, path).toBe(expected);
  return res.json();
};

describe("each endpoint's answer matches its published JSON Schema", () => {
  it("reports: a page, and one report", async () => {
    const page = await json("/api/v1/reports?limit=20");
    expect(check("report-page", page)).toEqual([]);
    expect(page.data).toHaveLength(20);
    const one = await json(`/api/v1/reports/${page.data[3].id}`);
    expect(check("report", one)).toEqual([]);
    expect(one).toEqual(page.data[3]);
  });

  it("models, job types and stats", async () => {
    const models = await json("/api/v1/models");
    expect(check("model-list", models)).toEqual([]);
    expect(models.data.length).toBeGreaterThanOrEqual(25);
    const jobs = await json("/api/v1/job-types?category=air-hammer");
    expect(check("job-type-list", jobs)).toEqual([]);
    expect(jobs.data.every((j: { category: string }) => j.category === "air-hammer")).toBe(true);
    const stats = await json("/api/v1/stats");
    expect(check("stat-list", stats)).toEqual([]);
    expect(stats.data.some((s: { pressure_adjusted: unknown }) => s.pressure_adjusted !== null)).toBe(true);
    expect(
      stats.data.some(
        (s: { pressure_adjusted: unknown; pressure_adjusted_reason: unknown }) =>
          s.pressure_adjusted === null && s.pressure_adjusted_reason,
      ),
    ).toBe(true);
  });

  it("stats agree with the stored cells", async () => {
    const row = await db
      .selectFrom("stats_cells as s")
      .innerJoin("tool_models as m", "m.id", "s.tool_model_id")
      .innerJoin("job_types as j", "j.id", "s.job_type_id")
      .select(["m.slug as model", "j.slug as job", "s.n", "s.successes", "s.lower", "s.upper"])
      .orderBy("s.n", "desc")
      .executeTakeFirstOrThrow();
    const { data } = await json(`/api/v1/stats?model=${row.model}&job=${row.job}`);
    expect(data).toHaveLength(1);
    expect(data[0]).toMatchObject({
      n: row.n,
      successes: row.successes,
      lower: row.lower,
      upper: row.upper,
      method: "wilson_score",
      confidence: 0.95,
    });
  });

  it("errors", async () => {
    expect(check("error", await json("/api/v1/reports?limit=0", 400))).toEqual([]);
    expect(check("error", await json("/api/v1/reports/999999", 404))).toEqual([]);
    expect(check("error", await json("/api/v1/no-such-thing", 404))).toEqual([]);
  });

  it("the bulk files: NDJSON lines are reports, the CSV (RFC 4180) holds the same rows", async () => {
    const withKey = feedClient(undefined, key);
    const nd = await withKey("/api/v1/reports.ndjson");
    expect(nd.status).toBe(200);
    expect(nd.headers.get("content-type")).toMatch(/^application\/x-ndjson/);
    expect(nd.headers.get("content-disposition")).toMatch(
      /^attachment; filename="bayproof-reports-\d{4}-\d{2}-\d{2}\.ndjson"$/,
    );
    const text = await nd.text();
    expect(text.endsWith("\n")).toBe(true);
    const lines = text
      .trimEnd()
      .split("\n")
      .map((l) => JSON.parse(l));
    const accepted = await db.selectFrom("reports").select(["id"]).where("status", "=", "accepted").execute();
    expect(lines.length).toBeGreaterThanOrEqual(accepted.length);
    for (const line of lines.slice(0, 300)) expect(check("report", line)).toEqual([]);
    const ids = lines.map((l) => l.id);
    expect(new Set(ids).size).toBe(ids.length);
    // The same report reads the same in the file and from /api/v1/reports/{id}.
    for (const line of [lines[0], lines[Math.floor(lines.length / 2)], lines.at(-1)])
      expect(await json(`/api/v1/reports/${line.id}`)).toEqual(line);
    const withLinks = lines.find((l) => l.evidence_urls.length > 0);
    expect(await json(`/api/v1/reports/${withLinks.id}`)).toEqual(withLinks);

    const csv = await withKey("/api/v1/reports.csv");
    expect(csv.headers.get("content-type")).toMatch(/^text\/csv/);
    expect(csv.headers.get("content-disposition")).toMatch(/filename="bayproof-reports-\d{4}-\d{2}-\d{2}\.csv"/);
    const raw = await csv.text();
    expect(raw.slice(0, 200)).toMatch(/^id,model,maker,category,job,reporter,accepted_at,/);
    expect(raw.endsWith("\r\n")).toBe(true);
    // RFC 4180 §2: CRLF line breaks, double quotes doubled inside quoted fields.
    const rows: Record<string, string>[] = parse(raw, { columns: true, record_delimiter: "\r\n", relax_quotes: false });
    const byId = new Map(lines.map((l) => [String(l.id), l]));
    expect(rows.length).toBe(lines.length);
    for (const row of rows.slice(0, 300)) {
      const rec = byId.get(row.id!)!;
      expect(row.notes).toBe(rec.notes ?? "");
      expect(Number(row.inlet_kpa)).toBe(rec.inlet_kpa);
      expect(JSON.parse(row.evidence_urls!)).toEqual(rec.evidence_urls);
    }
  });

  it("asks for an API key for the bulk files", async () => {
    const res = await feedClient()("/api/v1/reports.csv");
    expect(res.status).toBe(401);
    expect((await res.json()).error.code).toBe("api_key_required");
  });
});

describe("privacy", () => {
  it("carries no e-mail, handle or account data; reporters are stable pseudonyms; only published evidence is linked", async () => {
    const text = await (await feedClient(undefined, key)("/api/v1/reports.ndjson")).text();
    expect(text).not.toMatch(/@demo\.bayproof\.test|@[a-z0-9-]+\.[a-z]{2,}/i);
    const handles = await db.selectFrom("users").select(["handle", "feed_pseudonym", "id"]).execute();
    for (const h of handles) expect(text).not.toContain(`"${h.handle}"`);
    const records = text
      .trimEnd()
      .split("\n")
      .map((l) => JSON.parse(l));
    const owners = await db
      .selectFrom("reports")
      .select(["id", "reporter_id"])
      .where("status", "=", "accepted")
      .execute();
    const pseudonymOf = new Map(handles.map((h) => [h.id, h.feed_pseudonym]));
    const ownerOf = new Map(owners.map((o) => [o.id, o.reporter_id]));
    for (const r of records) expect(r.reporter).toBe(pseudonymOf.get(ownerOf.get(r.id)!));

    const evidence = await db
      .selectFrom("evidence as e")
      .innerJoin("reports as r", "r.id", "e.report_id")
      .select(["e.id", "e.report_id", "e.is_public", "e.status"])
      .where("r.status", "=", "accepted")
      .execute();
    const counted = evidence.filter((e) => e.status === "uploaded" || e.status === "verified");
    const published = counted.filter((e) => e.is_public);
    expect(published.length).toBeGreaterThan(0);
    expect(published.length).toBeLessThan(counted.length);
    const linked = records.flatMap((r) => r.evidence_urls.map((u: string) => Number(u.split("/").at(-1))));
    expect(linked.sort((a, b) => a - b)).toEqual(published.map((e) => e.id).sort((a, b) => a - b));
    expect(records.reduce((s, r) => s + r.evidence_count, 0)).toBe(counted.length);
  });

  it("a published file redirects to a short-lived link; an unpublished one is a 404", async () => {
    const [pub] = await db
      .selectFrom("evidence as e")
      .innerJoin("reports as r", "r.id", "e.report_id")
      .select("e.id")
      .where("r.status", "=", "accepted")
      .where("e.is_public", "=", true)
      .where("e.status", "in", ["uploaded", "verified"])
      .limit(1)
      .execute();
    const [priv] = await db
      .selectFrom("evidence as e")
      .innerJoin("reports as r", "r.id", "e.report_id")
      .select("e.id")
      .where("r.status", "=", "accepted")
      .where("e.is_public", "=", false)
      .limit(1)
      .execute();
    const ok = await get(`/api/v1/evidence/${pub!.id}`);
    expect(ok.status).toBe(302);
    expect(ok.headers.get("location")).toMatch(/X-Amz-Expires=600/);
    expect((await get(`/api/v1/evidence/${priv!.id}`)).status).toBe(404);
  });
});

describe("HTTP", () => {
  it("sends an ETag on every JSON answer and 304 when it is sent back", async () => {
    for (const path of [
      "/api/v1/models",
      "/api/v1/reports?limit=5",
      "/api/v1/stats?job=ball-joint-separation",
      "/api/v1/schema/report.json",
      "/api/v1/openapi.json",
    ]) {
      const first = await get(path);
      const etag = first.headers.get("etag");
      expect(etag, path).toMatch(/^"[A-Za-z0-9_-]{32}"$/);
      expect(first.headers.get("cache-control"), path).toMatch(
        /^public, max-age=\d+(, s-maxage=\d+, stale-while-revalidate=\d+)?$/,
      );
      expect(first.headers.get("vary"), path).toMatch(/Authorization/);
      const again = await get(path, { "if-none-match": etag! });
      expect(again.status, path).toBe(304);
      expect(await again.text()).toBe("");
      expect((await get(path, { "if-none-match": `W/${etag}, "other"` })).status).toBe(304);
      expect((await get(path, { "if-none-match": '"something-else"' })).status).toBe(200);
    }
  });

  it("answers HEAD like GET, without a body", async () => {
    const res = await fetch(new URL("/api/v1/models", (await import("../support/http")).baseUrl()), {
      method: "HEAD",
      headers: { authorization: `Bearer ${key}` },
    });
    expect(res.status).toBe(200);
    expect(res.headers.get("etag")).toMatch(/^"/);
    expect(await res.text()).toBe("");
  });

  it("opens CORS for GET and answers the preflight", async () => {
    const res = await get("/api/v1/models");
    expect(res.headers.get("access-control-allow-origin")).toBe("*");
    expect(res.headers.get("access-control-expose-headers")).toMatch(/ETag.*RateLimit/);
    const pre = await fetch(new URL("/api/v1/reports", (await import("../support/http")).baseUrl()), {
      method: "OPTIONS",
      headers: {
        origin: "https://example.org",
        "access-control-request-method": "GET",
        "access-control-request-headers": "authorization",
      },
    });
    expect(pre.status).toBe(204);
    expect(pre.headers.get("access-control-allow-headers")).toMatch(/Authorization/);
    expect(pre.headers.get("access-control-allow-methods")).toMatch(/GET/);
  });
});

describe("rate limits and API keys", () => {
  it("lets an anonymous client make 60 requests a minute, then 429 with Retry-After", async () => {
    const client = feedClient();
    for (let i = 0; i < 60; i++) {
      const res = await client("/api/v1");
      expect(res.status).toBe(200);
      if (i === 0) {
        expect(res.headers.get("ratelimit-policy")).toBe('"anonymous";q=60;w=60');
        expect(res.headers.get("ratelimit")).toMatch(/^"anonymous";r=59;t=\d+$/);
      }
    }
    const over = await client("/api/v1");
    expect(over.status).toBe(429);
    expect(Number(over.headers.get("retry-after"))).toBeGreaterThan(0);
    expect(over.headers.get("ratelimit")).toMatch(/^"anonymous";r=0;t=\d+$/);
    const body = await over.json();
    expect(check("error", body)).toEqual([]);
    expect(body.error.code).toBe("rate_limited");
  });

  it("gives an API key 600 a minute of its own; a revoked or unknown key gets 401", async () => {
    const address = "198.51.100.7";
    const mine = await createApiKey(db, userId, "to revoke");
    const withKey = feedClient(address, mine);
    const ok = await withKey("/api/v1");
    expect(ok.status).toBe(200);
    expect(ok.headers.get("ratelimit-policy")).toBe('"key";q=600;w=60');
    expect(ok.headers.get("ratelimit")).toMatch(/^"key";r=599;t=\d+$/);
    const { id } = await db
      .selectFrom("api_keys")
      .select("id")
      .where("name", "=", "to revoke")
      .executeTakeFirstOrThrow();
    expect(await revokeApiKey(db, userId, id)).toBe(true);
    const revoked = await withKey("/api/v1/models");
    expect(revoked.status).toBe(401);
    expect(revoked.headers.get("www-authenticate")).toMatch(/invalid_token/);
    expect((await revoked.json()).error.code).toBe("invalid_api_key");
    expect((await feedClient(address, "bpk_not-a-real-key")("/api/v1")).status).toBe(401);
    expect((await feedClient(address)("/api/v1", { authorization: "Basic abc" })).status).toBe(401);
  });

  it("stops the keys of a banned account", async () => {
    const { id } = await db
      .insertInto("users")
      .values({ email: `feed-ban-${Date.now()}@demo.bayproof.test`, handle: `feed-ban-${Date.now() % 1e8}` })
      .returning("id")
      .executeTakeFirstOrThrow();
    const banned = await createApiKey(db, id, "soon banned");
    const client = feedClient("198.51.100.9", banned);
    expect((await client("/api/v1")).status).toBe(200);
    await db.updateTable("users").set({ banned_at: new Date() }).where("id", "=", id).execute();
    expect((await client("/api/v1")).status).toBe(401);
  });
});

describe("bad input is a 400 naming the parameter", () => {
  const cases: [string, string, string][] = [
    ["/api/v1/reports?colour=red", "colour", "unknown_parameter"],
    ["/api/v1/reports?limit=100000", "limit", "invalid_parameter"],
    ["/api/v1/reports?limit=ten", "limit", "invalid_parameter"],
    ["/api/v1/reports?limit=5&limit=6", "limit", "repeated_parameter"],
    ["/api/v1/reports?cursor=not-a-cursor", "cursor", "invalid_cursor"],
    ["/api/v1/reports?model=no-such-model", "model", "unknown_value"],
    ["/api/v1/reports?job=%3Cscript%3E", "job", "invalid_parameter"],
    ["/api/v1/reports?accepted_since=last+tuesday", "accepted_since", "invalid_parameter"],
    ["/api/v1/reports?accepted_since=2026-02-01&accepted_until=2026-01-01", "accepted_until", "invalid_parameter"],
    ["/api/v1/reports/abc", "id", "invalid_parameter"],
    ["/api/v1/reports/99999999999", "id", "invalid_parameter"],
    ["/api/v1/models?maker=x", "maker", "unknown_parameter"],
    ["/api/v1/stats?category=ALL", "category", "invalid_parameter"],
    ["/api/v1/evidence/-1", "id", "invalid_parameter"],
  ];
  it.each(cases)("%s", async (path, parameter, code) => {
    const body = await json(path, 400);
    expect(body.error).toMatchObject({ code, parameter });
    expect(body.error.message).toContain(parameter);
  });

  it("refuses a forged cursor, and a cursor used with other filters", async () => {
    const page = await json("/api/v1/reports?limit=2&job=ball-joint-separation");
    const [payload, mac] = page.next_cursor.split(".");
    const state = JSON.parse(Buffer.from(payload, "base64url").toString());
    state[2] = 1; // jump to another report
    const forged = `${Buffer.from(JSON.stringify(state)).toString("base64url")}.${mac}`;
    expect((await json(`/api/v1/reports?limit=2&job=ball-joint-separation&cursor=${forged}`, 400)).error.code).toBe(
      "invalid_cursor",
    );
    expect(
      (await json(`/api/v1/reports?limit=2&job=tie-rod-end-release&cursor=${page.next_cursor}`, 400)).error.code,
    ).toBe("cursor_mismatch");
    expect(
      (await json(`/api/v1/reports?limit=7&job=ball-joint-separation&cursor=${page.next_cursor}`)).data,
    ).toHaveLength(7);
  });
});

describe("documentation", () => {
  it("the OpenAPI 3.1 document lists every endpoint, and its component schemas describe the answers", async () => {
    const doc = await json("/api/v1/openapi.json");
    expect(doc.openapi).toBe("3.1.0");
    expect(doc.info.license.identifier).toBe("CC-BY-4.0");
    const Ajv2020 = (await import("ajv/dist/2020.js")).default;
    const ajv = new Ajv2020({ strict: false });
    (await import("ajv-formats")).default(ajv);
    ajv.addSchema(doc, "openapi");
    const answers: Record<string, string> = {
      "/api/v1/reports": "report-page",
      "/api/v1/models": "model-list",
      "/api/v1/job-types": "job-type-list",
      "/api/v1/stats": "stat-list",
      "/api/v1/bench-runs": "bench-run-page",
      "/api/v1/rigs": "rig-list",
      "/api/v1/bench-protocols": "bench-protocol-list",
      "/api/v1/bench-figures": "bench-figure-list",
    };
    for (const path of Object.keys(doc.paths)) {
      if (path.includes("{")) continue;
      const res = await get(path);
      expect([200, 302], path).toContain(res.status);
      const component = answers[path];
      if (component) {
        const validate = ajv.getSchema(`openapi#/components/schemas/${component}`)!;
        expect(validate(await res.json()), `${path} ${JSON.stringify(validate.errors)}`).toBe(true);
      } else await res.body?.cancel();
    }
  });

  it("the Data Package describes the bulk files: their columns, types, units and constraints", async () => {
    const pkg = await json("/api/v1/datapackage.json");
    expect(pkg.licenses[0]).toMatchObject({ name: "CC-BY-4.0" });
    const csvResource = pkg.resources.find((r: { format: string }) => r.format === "csv");
    const header = (await (await get("/api/v1/reports.csv")).text()).split("\r\n")[0]!.split(",");
    expect(csvResource.schema.fields.map((f: { name: string }) => f.name)).toEqual(header);
    expect(csvResource.dialect.lineTerminator).toBe("\r\n");
    const TABLE_TYPES = ["string", "number", "integer", "boolean", "datetime", "array", "object"];
    for (const f of csvResource.schema.fields) expect(TABLE_TYPES).toContain(f.type);
    const inlet = csvResource.schema.fields.find((f: { name: string }) => f.name === "inlet_kpa");
    expect(inlet).toMatchObject({
      type: "number",
      unit: "kPa",
      constraints: { required: true, minimum: 0, maximum: 2000 },
    });
    expect(csvResource.schema.primaryKey).toEqual(["id"]);
  });

  it("the /data page has the dictionary (SI units per field), curl examples, the licence and a citation", async () => {
    const res = await get("/data");
    expect(res.status).toBe(200);
    const html = await res.text();
    for (const text of [
      "Data dictionary",
      "SI units",
      "CC BY 4.0",
      "curl -s",
      "Cite it as",
      "inlet_kpa",
      "kPa",
      "evidence_urls",
      "pressure_adjusted.estimate",
      "rp_",
    ]) {
      expect(html, text).toContain(text);
    }
  });
});

describe("the published contract", () => {
  it("documents 400, 401 and 429 with the error schema on every operation", async () => {
    const doc = await json("/api/v1/openapi.json");
    for (const [path, item] of Object.entries(
      doc.paths as Record<
        string,
        { get: { responses: Record<string, { content?: Record<string, { schema: unknown }> }> } }
      >,
    )) {
      for (const status of ["400", "401", "429"]) {
        expect(item.get.responses[status]?.content?.["application/json"]?.schema, `${path} ${status}`).toEqual({
          $ref: "#/components/schemas/error",
        });
      }
    }
  });

  it("declares what the date parameters take, and the feed takes exactly that", async () => {
    const doc = await json("/api/v1/openapi.json");
    const params = doc.paths["/api/v1/reports"].get.parameters as { name: string; schema: object }[];
    const Ajv2020 = (await import("ajv/dist/2020.js")).default;
    const ajv = new Ajv2020({ strict: false });
    (await import("ajv-formats")).default(ajv);
    for (const name of ["accepted_since", "accepted_until"]) {
      const schema = params.find((p) => p.name === name)!.schema;
      expect(schema).toEqual({ type: "string", anyOf: [{ format: "date" }, { format: "date-time" }] });
      const validate = ajv.compile(schema);
      // RFC 3339 full-date and date-time (published) are what ajv-formats checks.
      for (const value of ["2026-12-01", "2026-12-01T08:00:00Z", "2026-12-01T08:00:00+01:00"]) {
        expect(validate(value), value).toBe(true);
        expect((await get(`/api/v1/reports?${name}=${encodeURIComponent(value)}&limit=1`)).status, value).toBe(200);
      }
      for (const value of ["last tuesday", "2026-13-01", "2026-12-01T08:00:00"]) {
        expect(validate(value), value).toBe(false);
        expect((await json(`/api/v1/reports?${name}=${encodeURIComponent(value)}`, 400)).error.parameter, value).toBe(
          name,
        );
      }
    }
  });

  it("answers a path with a broken %-escape with the JSON error, and logs no stack", async () => {
    const log = await serverLogDuring(async () => {
      for (const path of ["/api/v1/reports/%C0%AF", "/api/v1/%E0%A4%A"]) {
        const res = await get(path);
        expect(res.status, path).toBe(400);
        expect(res.headers.get("content-type")).toMatch(/^application\/json/);
        const body = await res.json();
        expect(check("error", body)).toEqual([]);
        expect(body.error.code).toBe("invalid_path");
      }
      const page = await fetch(new URL("/models/%C0%AF", inject("baseUrl")));
      expect(page.status).toBe(400);
      expect(page.headers.get("content-type")).toMatch(/^text\/plain/);
      expect(await page.text()).toMatch(/broken %-escape/);
    });
    expect(log).not.toMatch(/URIError|Failed to decode param/);
  });
});
