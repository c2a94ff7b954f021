// The parts of the open-data page (/data) that describe the feed itself: the daily snapshot's files
// and the data dictionary, both made from the feed's own descriptions (app/feed).
import { Link } from "react-router";
import type { SnapshotInfo } from "~/feed/documents";
import type { Field } from "~/feed/fields";
import { DataTable } from "./ui";

const TYPE_LABEL: Record<Field["type"], string> = {
  integer: "integer",
  number: "number",
  string: "text",
  boolean: "true/false",
  datetime: "date-time (UTC)",
  date: "date",
  "string-array": "list of text",
  "number-array": "list of numbers",
  object: "object",
  "object-array": "list of objects",
};

export function SnapshotSection({ snapshot, origin }: { snapshot: SnapshotInfo | null; origin: string }) {
  return (
    <section aria-labelledby="snapshot" className="space-y-2">
      <h2 id="snapshot" className="text-lg font-semibold">
        Daily snapshot
      </h2>
      {!snapshot ? (
        <p className="text-sm text-stone-600">
          The first snapshot has not been written yet. One is written every day at 03:15 UTC.
        </p>
      ) : (
        <>
          <p className="max-w-prose text-sm">
            Every report accepted as of <strong>{snapshot.createdAt.replace("T", " ").slice(0, 19)} UTC</strong> (
            {snapshot.reportCount} reports), gzipped, open to anyone — no account or key. A new snapshot is written
            every day at 03:15 UTC; these links name this one, so the SHA-256 below always matches what you download.
          </p>
          <DataTable
            label="Snapshot files"
            framed={false}
            head={
              <tr className="border-b">
                <th className="py-1 pr-3">File</th>
                <th className="py-1 pr-3">Size</th>
                <th className="py-1">SHA-256</th>
              </tr>
            }
          >
            {snapshot.files.map((f) => (
              <tr key={f.format} className="border-b border-stone-100 align-top">
                <td className="py-1 pr-3">
                  <a className="underline" href={f.path} download>
                    {f.path.split("/").pop()}
                  </a>{" "}
                  <span className="text-stone-500">({f.format.toUpperCase()})</span>
                </td>
                <td className="py-1 pr-3 whitespace-nowrap">{formatBytes(f.bytes)}</td>
                <td className="py-1 break-all font-mono text-xs">{f.sha256}</td>
              </tr>
            ))}
          </DataTable>
          <pre
            tabIndex={0}
            aria-label="Checking a snapshot"
            className="overflow-x-auto rounded bg-stone-900 p-3 text-xs text-stone-100"
          >
            {[
              `curl -s -O '${origin}${snapshot.files[0]!.path}'`,
              `echo '${snapshot.files[0]!.sha256}  reports.${snapshot.files[0]!.format}.gz' | sha256sum -c`,
            ].join("\n")}
          </pre>
        </>
      )}
    </section>
  );
}

/** A file size in the unit a person reads (powers of 1024, as `ls -h` shows them). */
function formatBytes(bytes: number) {
  const units = ["bytes", "KiB", "MiB", "GiB"];
  let value = bytes;
  let unit = 0;
  while (value >= 1024 && unit < units.length - 1) {
    value /= 1024;
    unit++;
  }
  return unit === 0 ? `${bytes} bytes` : `${value.toFixed(1)} ${units[unit]}`;
}

/** One record type as the dictionary lists it (the loader sends them: the field lists stay on the server). */
export interface DictionaryType {
  type: string;
  title: string;
  fields: Field[];
}

/** The feed's page sizes and anonymous rate, as the loader reads them from the feed's parameters. */
export interface FeedLimits {
  defaultLimit: number;
  maxLimit: number;
  anonymousPerMinute: number;
}

/** Every record type's fields: name, type, SI unit, meaning, allowed values and range. */
export function DataDictionary({ types }: { types: DictionaryType[] }) {
  return (
    <section aria-labelledby="dictionary" className="space-y-6">
      <h2 id="dictionary" className="text-lg font-semibold">
        Data dictionary
      </h2>
      {types.map((t) => (
        <RecordFields key={t.type} t={t} />
      ))}
    </section>
  );
}

/** Fields with those of their objects (and of each item of their lists of objects) as `outer.inner`. */
const flatten = (fields: Field[], prefix = ""): Field[] =>
  fields.flatMap((f) => {
    const named = { ...f, name: `${prefix}${f.name}` };
    return [named, ...(f.fields ? flatten(f.fields, `${named.name}.`) : [])];
  });

function RecordFields({ t }: { t: DictionaryType }) {
  const { type } = t;
  const rows = flatten(t.fields);
  return (
    <div>
      <h3 className="font-semibold">
        {t.title}{" "}
        <a className="text-sm font-normal underline" href={`/api/v1/schema/${type}.json`}>
          {type}.json
        </a>
      </h3>
      <DataTable
        label={`${t.title}: fields`}
        framed={false}
        className="mt-1"
        head={
          <tr className="border-b">
            <th className="py-1 pr-3">Field</th>
            <th className="py-1 pr-3">Type</th>
            <th className="py-1 pr-3">Unit (SI)</th>
            <th className="py-1">Meaning</th>
          </tr>
        }
      >
        {rows.map((f) => (
          <tr key={f.name} className="border-b border-stone-100 align-top">
            {/* Long dotted names break anywhere, so the table fits a phone without scrolling sideways. */}
            <td className="py-1 pr-3 font-mono text-xs [overflow-wrap:anywhere]">{f.name}</td>
            <td className="py-1 pr-3">
              {TYPE_LABEL[f.type]}
              {f.nullable ? ", may be empty" : ""}
            </td>
            <td className="py-1 pr-3">{f.unit ?? "—"}</td>
            <td className="py-1">
              {f.description}
              {f.enum && <span className="block text-xs text-stone-600">One of: {f.enum.join(", ")}</span>}
              {(f.minimum !== undefined || f.maximum !== undefined) && (
                <span className="block text-xs text-stone-600">
                  Range: {f.minimum ?? "…"} to {f.maximum ?? "…"}
                </span>
              )}
            </td>
          </tr>
        ))}
      </DataTable>
    </div>
  );
}

const ENDPOINTS = [
  [
    "/api/v1/reports",
    "report-page",
    "Accepted reports, a page at a time (filters model, job, category, accepted_since, accepted_until; limit, cursor)",
  ],
  ["/api/v1/reports/{id}", "report", "One accepted report"],
  [
    "/api/v1/snapshots/latest/reports.ndjson.gz",
    "report",
    "Daily snapshot: every accepted report, one JSON object per line, gzipped (open to anyone)",
  ],
  [
    "/api/v1/snapshots/latest/reports.csv.gz",
    "report",
    "Daily snapshot: every accepted report as CSV, gzipped (open to anyone)",
  ],
  ["/api/v1/reports.ndjson", "report", "Every accepted report, one JSON object per line (API key)"],
  ["/api/v1/reports.csv", "report", "Every accepted report as CSV, RFC 4180 (API key)"],
  ["/api/v1/models", "model-list", "Tool models and their specs (filter category)"],
  ["/api/v1/job-types", "job-type-list", "Job types (filter category)"],
  ["/api/v1/stats", "stat-list", "Stats cells per tool model and job type (filters model, job, category)"],
  [
    "/api/v1/bench-runs",
    "bench-run-page",
    "Accepted bench runs with their series and trials, a page at a time (filters model, rig, protocol; limit, cursor)",
  ],
  ["/api/v1/bench-runs/{id}", "bench-run", "One accepted bench run"],
  ["/api/v1/bench-runs.ndjson", "bench-run", "Every accepted bench run, one JSON object per line (API key)"],
  [
    "/api/v1/bench-runs.csv",
    "bench-trial-row",
    "Every trial of every accepted bench run as CSV, a row per trial with its run and series (API key)",
  ],
  ["/api/v1/rigs", "rig-list", "Rigs: sensor, calibration and its standing today, check standard"],
  ["/api/v1/bench-protocols", "bench-protocol-list", "Bench protocol versions and their series"],
  [
    "/api/v1/bench-figures",
    "bench-figure-list",
    "Bench figures across rigs per tool model and series, with the pressure line (filters model, protocol, series)",
  ],
] as const;

export function EndpointsSection() {
  return (
    <section aria-labelledby="endpoints" className="space-y-2">
      <h2 id="endpoints" className="text-lg font-semibold">
        Endpoints
      </h2>
      <DataTable
        label="Endpoints"
        framed={false}
        head={
          <tr className="border-b">
            <th className="py-1 pr-3">Path</th>
            <th className="py-1 pr-3">Schema</th>
            <th className="py-1">What</th>
          </tr>
        }
      >
        {ENDPOINTS.map(([path, schema, what]) => (
          <tr key={path} className="border-b border-stone-100 align-top">
            <td className="py-1 pr-3 font-mono text-xs [overflow-wrap:anywhere]">{path}</td>
            <td className="py-1 pr-3">
              <a className="underline" href={`/api/v1/schema/${schema}.json`}>
                {schema}.json
              </a>
            </td>
            <td className="py-1">{what}</td>
          </tr>
        ))}
      </DataTable>
      <p className="text-sm">
        Machine-readable:{" "}
        <a className="underline" href="/api/v1/openapi.json">
          OpenAPI 3.1 document
        </a>
        ,{" "}
        <a className="underline" href="/api/v1/datapackage.json">
          Data Package descriptor
        </a>{" "}
        of the bulk files, and a JSON Schema (2020-12) for every record and response under <code>/api/v1/schema/</code>.
      </p>
    </section>
  );
}

export function UsingItSection({ origin, keyLimit, limits }: { origin: string; keyLimit: number; limits: FeedLimits }) {
  return (
    <section aria-labelledby="use" className="space-y-2">
      <h2 id="use" className="text-lg font-semibold">
        Using it
      </h2>
      <ul className="list-disc space-y-1 pl-5 text-sm">
        <li>
          Pages hold {limits.defaultLimit} reports by default, at most {limits.maxLimit} (<code>limit</code>). Follow{" "}
          <code>next_cursor</code> (or the <code>Link: rel="next"</code> header) until it is <code>null</code>. Keep the
          other parameters the same while you walk; a walk covers the reports accepted up to its <code>as_of</code>, so
          it returns each one exactly once even while new reports are accepted.
        </li>
        <li>
          Anonymous clients may make {limits.anonymousPerMinute} requests a minute; with an API key, {keyLimit}. Every
          answer carries <code>RateLimit-Policy</code> and <code>RateLimit</code>; beyond the limit you get{" "}
          <code>429</code> with <code>Retry-After</code>.
        </li>
        <li>
          The daily snapshot files need nothing: download them, check the SHA-256, and resume a broken download with{" "}
          <code>Range</code>. The live bulk files (up to the minute) need an API key: sign in, create one on{" "}
          <Link className="underline" to="/account">
            your account page
          </Link>{" "}
          (it is shown once), and send it as <code>Authorization: Bearer &lt;key&gt;</code>. A revoked key gets{" "}
          <code>401</code>.
        </li>
        <li>
          JSON answers carry an <code>ETag</code>; send it back in <code>If-None-Match</code> and an unchanged answer is
          a bodiless <code>304</code>. CORS is open for GET.
        </li>
        <li>
          A parameter the feed cannot read is a <code>400</code> with{" "}
          <code>{"{ error: { code, message, parameter } }"}</code> — nothing is silently ignored.
        </li>
      </ul>
      <pre
        tabIndex={0}
        aria-label="Example requests"
        className="overflow-x-auto rounded bg-stone-900 p-3 text-xs text-stone-100"
      >
        {[
          `# The first page of ball joint reports, then the next one`,
          `curl -s '${origin}/api/v1/reports?job=ball-joint-separation&limit=50'`,
          `curl -s '${origin}/api/v1/reports?job=ball-joint-separation&limit=50&cursor=<next_cursor>'`,
          ``,
          `# Every accepted report as of today's snapshot, as CSV, no key needed`,
          `curl -s -o reports.csv.gz '${origin}/api/v1/snapshots/latest/reports.csv.gz' && gunzip reports.csv.gz`,
          ``,
          `# Every accepted report up to the minute, as CSV, with an API key`,
          `curl -s -H 'Authorization: Bearer <your key>' -o reports.csv '${origin}/api/v1/reports.csv'`,
          ``,
          `# The stats of one tool model, only if they changed since last time`,
          `curl -s -H 'If-None-Match: "<etag>"' '${origin}/api/v1/stats?model=<model slug>'`,
        ].join("\n")}
      </pre>
    </section>
  );
}
