// The feed described for machines: an OpenAPI 3.1 document and a Frictionless Data Package
// descriptor of the bulk files, both made from fields.ts and schemas.ts.
import { SLUG_PATTERN } from "~/domain";
import { BENCH_TRIAL_ROW_FIELDS } from "./bench-fields";
import { type Field, REPORT_FIELDS } from "./fields";
import { componentSchema, SCHEMA_NAMES } from "./schemas";
import { ANONYMOUS_LIMIT, DEFAULT_LIMIT, MAX_LIMIT } from "./params";

export const LICENCE = {
  name: "CC-BY-4.0",
  title: "Creative Commons Attribution 4.0 International",
  path: "https://creativecommons.org/licenses/by/4.0/",
};
export const FEED_VERSION = "1.0.0";

export const citation = (origin: string, day: string) =>
  `Bayproof contributors (${day.slice(0, 4)}). Bayproof open data: accepted air-tool job reports [data set], version ${FEED_VERSION}. ${origin}/data (retrieved ${day}). Licence CC BY 4.0.`;

type Json = Record<string, unknown>;

/** The latest daily snapshot of the bulk files, as pages and documents describe it. */
export interface SnapshotInfo {
  id: number;
  createdAt: string;
  reportCount: number;
  files: { format: "ndjson" | "csv"; path: string; key: string; bytes: number; sha256: string }[];
}
const ref = (name: string) => ({ $ref: `#/components/schemas/${name}` });
const json = (schema: string, description: string) => ({
  description,
  content: { "application/json": { schema: ref(schema) } },
});
const q = (name: string, description: string, schema: Json = { type: "string" }) => ({
  name,
  in: "query",
  required: false,
  description,
  schema,
});
// What params.ts accepts: a plain date (2026-12-01) or an RFC 3339 date-time with its offset.
const dateOrDateTime = { type: "string", anyOf: [{ format: "date" }, { format: "date-time" }] };
const slugQ = (name: string, what: string) =>
  q(name, `Only ${what} with this slug.`, { type: "string", pattern: SLUG_PATTERN });

// Every operation can answer these: the parent route refuses unknown parameters and bad paths
// (400), bad or revoked keys (401) and callers over their limit (429) before any endpoint runs.
const errors = {
  "400": json("error", "A parameter or the path could not be read; `error.parameter` names the parameter."),
  "401": json("error", "The API key is unknown or revoked (or, for bulk files, missing)."),
  "429": {
    ...json("error", "Too many requests; wait `Retry-After` seconds."),
    headers: { "Retry-After": { schema: { type: "integer" } } },
  },
};
const cached = (schema: string, description: string) => ({
  "200": {
    ...json(schema, description),
    headers: {
      ETag: { schema: { type: "string" } },
      "RateLimit-Policy": { schema: { type: "string" }, description: 'e.g. `"anonymous";q=60;w=60`' },
      RateLimit: { schema: { type: "string" }, description: 'e.g. `"anonymous";r=59;t=60`' },
    },
  },
  "304": { description: "Not modified (If-None-Match matched the ETag)." },
  ...errors,
});

function withLink(responses: ReturnType<typeof cached>) {
  const link = { schema: { type: "string" }, description: '`<…>; rel="next"` when there is a next page' };
  return { ...responses, "200": { ...responses["200"], headers: { ...responses["200"].headers, Link: link } } };
}

/** The OpenAPI document; `keyLimit` is the configured requests a minute per API key. */
export function openApi(origin: string, keyLimit: number): Json {
  return {
    openapi: "3.1.0",
    info: {
      title: "Bayproof open data feed",
      version: FEED_VERSION,
      description: `Accepted reports of air tools on real repair jobs, the tool models and job types, and the computed stats; accepted bench runs (peak force or torque measured on calibrated rigs under declared protocols), the rigs, the protocols and the bench figures across rigs. Units are SI. Anonymous clients may make ${ANONYMOUS_LIMIT.points} requests a minute, API keys ${keyLimit}. See ${origin}/data.`,
      license: { name: LICENCE.title, identifier: LICENCE.name },
    },
    servers: [{ url: origin }],
    security: [{}, { apiKey: [] }],
    components: {
      securitySchemes: {
        apiKey: { type: "http", scheme: "bearer", description: "An API key from your account page." },
      },
      schemas: Object.fromEntries(SCHEMA_NAMES.map((n) => [n, componentSchema(n)])),
    },
    paths: {
      "/api/v1/reports": {
        get: {
          summary: "Accepted reports, a page at a time",
          description:
            "Ordered by (accepted_at, id). Follow `next_cursor` (or the Link rel=next header) until it is null; a walk covers the reports accepted up to its `as_of`.",
          parameters: [
            slugQ("model", "reports of the tool model"),
            slugQ("job", "reports of the job type"),
            slugQ("category", "reports in the tool category"),
            q("accepted_since", "Accepted at or after this date (midnight UTC) or RFC 3339 date-time.", dateOrDateTime),
            q("accepted_until", "Accepted before this date (midnight UTC) or RFC 3339 date-time.", dateOrDateTime),
            q("limit", `Reports per page (default ${DEFAULT_LIMIT}).`, {
              type: "integer",
              minimum: 1,
              maximum: MAX_LIMIT,
              default: DEFAULT_LIMIT,
            }),
            q("cursor", "The next_cursor of the previous page; keep the other parameters the same."),
          ],
          responses: withLink(cached("report-page", "A page of reports")),
        },
      },
      "/api/v1/reports/{id}": {
        get: {
          summary: "One accepted report",
          parameters: [{ name: "id", in: "path", required: true, schema: { type: "integer", minimum: 1 } }],
          responses: { ...cached("report", "The report"), "404": json("error", "No accepted report has this number.") },
        },
      },
      "/api/v1/snapshots/{snapshot}/{file}": {
        get: {
          summary: "The daily snapshot of every accepted report, gzipped (no key needed)",
          description:
            "Written daily at 03:15 UTC. `latest` is the newest snapshot; a number names one (the Data Package lists the newest with its size and SHA-256, and that URL never changes content). Supports Range (206) and If-None-Match (304); the ETag is the file's SHA-256.",
          security: [{}],
          parameters: [
            {
              name: "snapshot",
              in: "path",
              required: true,
              schema: {
                oneOf: [
                  { type: "string", const: "latest" },
                  { type: "integer", minimum: 1 },
                ],
              },
            },
            {
              name: "file",
              in: "path",
              required: true,
              schema: { type: "string", enum: ["reports.ndjson.gz", "reports.csv.gz"] },
            },
            {
              name: "Range",
              in: "header",
              required: false,
              description: "One byte range, e.g. `bytes=0-99`.",
              schema: { type: "string" },
            },
          ],
          responses: {
            "200": {
              description: "The gzipped file: NDJSON of report records, or CSV with the columns of the Data Package",
              headers: {
                ETag: { schema: { type: "string" } },
                "Accept-Ranges": { schema: { type: "string", const: "bytes" } },
                "Content-Length": { schema: { type: "integer" } },
              },
              content: { "application/gzip": { schema: { type: "string", contentMediaType: "application/gzip" } } },
            },
            "206": {
              description: "The requested byte range",
              headers: { "Content-Range": { schema: { type: "string" } } },
              content: { "application/gzip": { schema: { type: "string" } } },
            },
            "304": { description: "Not modified (If-None-Match matched the ETag)." },
            "404": json("error", "No such snapshot (there is none yet, or it was replaced by newer ones)."),
            "416": json("error", "The range lies outside the file."),
            ...errors,
          },
        },
      },
      "/api/v1/reports.ndjson": {
        get: {
          summary: "Every accepted report, one JSON object per line (API key needed)",
          security: [{ apiKey: [] }],
          responses: {
            "200": { description: "The file", content: { "application/x-ndjson": { schema: ref("report") } } },
            ...errors,
          },
        },
      },
      "/api/v1/reports.csv": {
        get: {
          summary: "Every accepted report as CSV, RFC 4180 (API key needed)",
          security: [{ apiKey: [] }],
          responses: {
            "200": {
              description: "The file; columns as in the datapackage descriptor",
              content: { "text/csv": { schema: { type: "string" } } },
            },
            ...errors,
          },
        },
      },
      "/api/v1/models": {
        get: {
          summary: "Tool models",
          parameters: [slugQ("category", "models in the tool category")],
          responses: cached("model-list", "Tool models"),
        },
      },
      "/api/v1/job-types": {
        get: {
          summary: "Job types",
          parameters: [slugQ("category", "job types of the tool category")],
          responses: cached("job-type-list", "Job types"),
        },
      },
      "/api/v1/stats": {
        get: {
          summary: "Stats cells",
          parameters: [
            slugQ("model", "cells of the tool model"),
            slugQ("job", "cells of the job type"),
            slugQ("category", "cells in the tool category"),
          ],
          responses: cached("stat-list", "Stats cells"),
        },
      },
      "/api/v1/evidence/{id}": {
        get: {
          summary: "A published evidence file (redirects to it)",
          parameters: [{ name: "id", in: "path", required: true, schema: { type: "integer", minimum: 1 } }],
          responses: {
            "302": { description: "To a short-lived link to the file" },
            "404": json("error", "No published file has this number."),
            ...errors,
          },
        },
      },
      ...benchPaths(),
      "/api/v1/schema/{name}.json": {
        get: {
          summary: "JSON Schema (2020-12) of a record or response",
          parameters: [{ name: "name", in: "path", required: true, schema: { type: "string", enum: SCHEMA_NAMES } }],
          responses: {
            "200": {
              description: "The schema",
              content: { "application/schema+json": { schema: { type: "object" } } },
            },
            "404": json("error", "No schema has this name."),
            ...errors,
          },
        },
      },
      "/api/v1/openapi.json": {
        get: {
          summary: "This document",
          responses: {
            "200": { description: "OpenAPI 3.1", content: { "application/json": { schema: { type: "object" } } } },
            ...errors,
          },
        },
      },
      "/api/v1/datapackage.json": {
        get: {
          summary: "Data Package descriptor of the bulk files",
          responses: {
            "200": {
              description: "Frictionless Data Package",
              content: { "application/json": { schema: { type: "object" } } },
            },
            ...errors,
          },
        },
      },
    },
  };
}

const idPath = (what: string) => [
  { name: "id", in: "path", required: true, description: what, schema: { type: "integer", minimum: 1 } },
];

/** The bench endpoints (issue 19 item 8, issue 20 item 6). */
function benchPaths(): Json {
  return {
    "/api/v1/bench-runs": {
      get: {
        summary: "Accepted bench runs, a page at a time",
        description:
          "Each run with its series and trials. Ordered by (accepted_at, id); follow `next_cursor` (or the Link rel=next header) until it is null, as for reports.",
        parameters: [
          slugQ("model", "runs of the tool model"),
          q("rig", "Only runs measured on this rig (see /api/v1/rigs).", { type: "integer", minimum: 1 }),
          slugQ("protocol", "runs under any version of the protocol"),
          q("limit", `Runs per page (default ${DEFAULT_LIMIT}).`, {
            type: "integer",
            minimum: 1,
            maximum: MAX_LIMIT,
            default: DEFAULT_LIMIT,
          }),
          q("cursor", "The next_cursor of the previous page; keep the other parameters the same."),
        ],
        responses: withLink(cached("bench-run-page", "A page of bench runs")),
      },
    },
    "/api/v1/bench-runs/{id}": {
      get: {
        summary: "One accepted bench run",
        parameters: idPath("The bench run's number."),
        responses: {
          ...cached("bench-run", "The bench run"),
          "404": json("error", "No accepted bench run has this number."),
        },
      },
    },
    "/api/v1/bench-runs.ndjson": {
      get: {
        summary: "Every accepted bench run, one JSON object per line (API key needed)",
        security: [{ apiKey: [] }],
        responses: {
          "200": { description: "The file", content: { "application/x-ndjson": { schema: ref("bench-run") } } },
          ...errors,
        },
      },
    },
    "/api/v1/bench-runs.csv": {
      get: {
        summary: "Every trial of every accepted bench run as CSV, RFC 4180, with its run and series (API key needed)",
        security: [{ apiKey: [] }],
        responses: {
          "200": {
            description: "The file; one row per trial, columns as in the datapackage descriptor (bench-trial-row)",
            content: { "text/csv": { schema: { type: "string" } } },
          },
          ...errors,
        },
      },
    },
    "/api/v1/bench-traces/{id}": {
      get: {
        summary: "The raw trace of a trial of an accepted bench run (redirects to it)",
        parameters: idPath("The trial's number, as in its trace_url."),
        responses: {
          "302": { description: "To a short-lived link to the CSV (time in s, then force in N or torque in N·m)" },
          "404": json("error", "No traced trial of an accepted run has this number."),
          ...errors,
        },
      },
    },
    "/api/v1/rigs": {
      get: { summary: "Rigs, with their calibration and check standard", responses: cached("rig-list", "Rigs") },
    },
    "/api/v1/bench-protocols": {
      get: {
        summary: "Bench protocol versions, with their series",
        responses: cached("bench-protocol-list", "Bench protocol versions"),
      },
    },
    "/api/v1/bench-figures": {
      get: {
        summary: "Bench figures across rigs, per tool model and protocol series",
        parameters: [
          slugQ("model", "figures of the tool model"),
          slugQ("protocol", "figures under any version of the protocol"),
          q("series", "Only figures of this protocol series (an id from /api/v1/bench-protocols).", {
            type: "integer",
            minimum: 1,
          }),
        ],
        responses: cached("bench-figure-list", "Bench figures"),
      },
    },
  };
}

const tableType: Record<Field["type"], string> = {
  integer: "integer",
  number: "number",
  string: "string",
  boolean: "boolean",
  datetime: "datetime",
  date: "date",
  "string-array": "array",
  "number-array": "array",
  object: "object",
  "object-array": "array",
};

/** A Table Schema field; `unit` is our own property beside the standard ones. */
export function tableField(f: Field): Json {
  const constraints: Json = {};
  if (!f.nullable) constraints.required = true;
  if (f.enum) constraints.enum = [...f.enum];
  if (f.minimum !== undefined) constraints.minimum = f.minimum;
  if (f.maximum !== undefined) constraints.maximum = f.maximum;
  if (f.pattern) constraints.pattern = f.pattern;
  if (f.name === "id") constraints.unique = true;
  return {
    name: f.name,
    type: tableType[f.type],
    description: f.description,
    ...(f.type === "datetime" ? { format: "any" } : {}),
    ...(f.unit ? { unit: f.unit } : {}),
    ...(Object.keys(constraints).length ? { constraints } : {}),
  };
}

const CSV_DIALECT = { delimiter: ",", lineTerminator: "\r\n", quoteChar: '"', doubleQuote: true, header: true };

/** Data Package resources for the snapshot's files: the fixed URL of this snapshot, size and hash. */
function snapshotResources(origin: string, snapshot: SnapshotInfo, schema: Json): Json[] {
  return snapshot.files.map((f) => ({
    profile: f.format === "csv" ? "tabular-data-resource" : "data-resource",
    name: `reports-${f.format}-snapshot`,
    title: `Daily snapshot of ${snapshot.reportCount} accepted reports, ${f.format.toUpperCase()}, gzipped`,
    path: `${origin}${f.path}`,
    format: f.format,
    compression: "gz",
    mediatype: f.format === "csv" ? "text/csv" : "application/x-ndjson",
    encoding: "utf-8",
    bytes: f.bytes,
    hash: `sha256:${f.sha256}`,
    created: snapshot.createdAt,
    ...(f.format === "csv" ? { dialect: CSV_DIALECT } : {}),
    schema,
  }));
}

export function dataPackage(origin: string, day: string, snapshot: SnapshotInfo | null = null): Json {
  const schema = { fields: REPORT_FIELDS.map(tableField), primaryKey: ["id"], missingValues: [""] };
  const benchSchema = {
    fields: BENCH_TRIAL_ROW_FIELDS.map(tableField),
    primaryKey: ["run", "series", "trial"],
    missingValues: [""],
  };
  return {
    profile: "tabular-data-package",
    name: "bayproof-reports",
    title: "Bayproof: accepted air-tool job reports and bench runs",
    description:
      "Every report a moderator accepted: the tool, the job, the air supply at the tool (SI units), the outcome and the time it took. Bench runs (peak force or torque on calibrated rigs) come as a file of trials and a file of nested runs. Reporters and rig owners appear under stable pseudonyms. The daily snapshot files (gzipped, with size and SHA-256) are open to anyone; the live files need an API key (free, from an account page) sent as Authorization: Bearer <key>.",
    version: FEED_VERSION,
    homepage: `${origin}/data`,
    created: `${day}T00:00:00Z`,
    licenses: [LICENCE],
    citation: citation(origin, day),
    resources: [
      ...(snapshot ? snapshotResources(origin, snapshot, schema) : []),
      {
        profile: "tabular-data-resource",
        name: "reports-csv",
        path: `${origin}/api/v1/reports.csv`,
        format: "csv",
        mediatype: "text/csv",
        encoding: "utf-8",
        dialect: CSV_DIALECT,
        schema,
      },
      {
        profile: "data-resource",
        name: "reports-ndjson",
        path: `${origin}/api/v1/reports.ndjson`,
        format: "ndjson",
        mediatype: "application/x-ndjson",
        encoding: "utf-8",
        schema,
      },
      {
        profile: "tabular-data-resource",
        name: "bench-runs-csv",
        title: "Every trial of every accepted bench run, with its run's and series' columns repeated",
        path: `${origin}/api/v1/bench-runs.csv`,
        format: "csv",
        mediatype: "text/csv",
        encoding: "utf-8",
        dialect: CSV_DIALECT,
        schema: benchSchema,
      },
      {
        profile: "data-resource",
        name: "bench-runs-ndjson",
        title: "Every accepted bench run, one JSON object a line, with its series and trials nested",
        description: `Each line is a bench-run record; its JSON Schema is ${origin}/api/v1/schema/bench-run.json.`,
        path: `${origin}/api/v1/bench-runs.ndjson`,
        format: "ndjson",
        mediatype: "application/x-ndjson",
        encoding: "utf-8",
      },
    ],
  };
}
