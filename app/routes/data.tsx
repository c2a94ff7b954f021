import { Link } from "react-router";
import { config } from "~/config.server";
import { db } from "~/db.server";
import { latestSnapshot } from "~/feed/snapshot.server";
import { citation, LICENCE } from "~/feed/documents";
import { type Field, RECORD_TYPES, type RecordType } from "~/feed/fields";
import { DEFAULT_LIMIT, LIMITS, MAX_LIMIT } from "~/feed/params";
import type { Route } from "./+types/data";

export async function loader() {
  const day = new Date().toISOString().slice(0, 10);
  return { origin: config.appOrigin, citation: citation(config.appOrigin, day), snapshot: await latestSnapshot(db) };
}

const TYPE_LABEL: Record<Field["type"], string> = {
  integer: "integer", number: "number", string: "text", boolean: "true/false", datetime: "date-time (UTC)", "string-array": "list of text", object: "object",
};

const ENDPOINTS = [
  ["/api/v1/reports", "report-page", "Accepted reports, a page at a time (filters model, job, category, accepted_since, accepted_until; limit, cursor)"],
  ["/api/v1/reports/{id}", "report", "One accepted report"],
  ["/api/v1/snapshots/latest/reports.ndjson.gz", "report", "Daily snapshot: every accepted report, one JSON object per line, gzipped (open to anyone)"],
  ["/api/v1/snapshots/latest/reports.csv.gz", "report", "Daily snapshot: every accepted report as CSV, gzipped (open to anyone)"],
  ["/api/v1/reports.ndjson", "report", "Every accepted report, one JSON object per line (API key)"],
  ["/api/v1/reports.csv", "report", "Every accepted report as CSV, RFC 4180 (API key)"],
  ["/api/v1/models", "model-list", "Tool models and their specs (filter category)"],
  ["/api/v1/job-types", "job-type-list", "Job types (filter category)"],
  ["/api/v1/stats", "stat-list", "Stats cells per tool model and job type (filters model, job, category)"],
] as const;

export default function Data({ loaderData }: Route.ComponentProps) {
  const { origin } = loaderData;
  return (
    <article className="space-y-8">
      <header className="space-y-2">
        <h1 className="text-2xl font-bold">Open data</h1>
        <p className="max-w-prose text-stone-700">
          Every report a moderator has accepted, the tool models and job types, and the stats computed from them — as
          JSON pages, bulk files and documented schemas. <strong>All quantities are in SI units</strong>: pressures in kPa
          (gauge), lengths in mm or m, air flow in L/s of free air, volumes in L, times in s.
        </p>
      </header>

      <section aria-labelledby="licence" className="rounded-lg border border-bay-200 bg-white p-4">
        <h2 id="licence" className="text-lg font-semibold">Licence and citation</h2>
        <p className="mt-1 text-sm">
          The data are published under <a className="underline" href={LICENCE.path}>{LICENCE.title}</a> ({LICENCE.name}): use
          them for anything, including commercially, and credit Bayproof's contributors. Cite it as:
        </p>
        <blockquote className="mt-2 rounded bg-bay-50 p-3 font-mono text-xs">{loaderData.citation}</blockquote>
        <p className="mt-2 text-sm text-stone-600">Give the date you retrieved it, and the <code>as_of</code> of your walk when you page through reports, so others can find the same rows.</p>
      </section>

      <Snapshot snapshot={loaderData.snapshot} origin={origin} />

      <section aria-labelledby="endpoints" className="space-y-2">
        <h2 id="endpoints" className="text-lg font-semibold">Endpoints</h2>
        <div className="overflow-x-auto">
          <table className="w-full text-left text-sm">
            <thead><tr className="border-b"><th className="py-1 pr-3">Path</th><th className="py-1 pr-3">Schema</th><th className="py-1">What</th></tr></thead>
            <tbody>
              {ENDPOINTS.map(([path, schema, what]) => (
                <tr key={path} className="border-b border-stone-100 align-top">
                  <td className="py-1 pr-3 font-mono text-xs">{path}</td>
                  <td className="py-1 pr-3"><a className="underline" href={`/api/v1/schema/${schema}.json`}>{schema}.json</a></td>
                  <td className="py-1">{what}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        <p className="text-sm">
          Machine-readable: <a className="underline" href="/api/v1/openapi.json">OpenAPI 3.1 document</a>,{" "}
          <a className="underline" href="/api/v1/datapackage.json">Data Package descriptor</a> of the bulk files, and a JSON Schema (2020-12) for every
          record and response under <code>/api/v1/schema/</code>.
        </p>
      </section>

      <section aria-labelledby="use" className="space-y-2">
        <h2 id="use" className="text-lg font-semibold">Using it</h2>
        <ul className="list-disc space-y-1 pl-5 text-sm">
          <li>Pages hold {DEFAULT_LIMIT} reports by default, at most {MAX_LIMIT} (<code>limit</code>). Follow <code>next_cursor</code> (or the <code>Link: rel="next"</code> header) until it is <code>null</code>. Keep the other parameters the same while you walk; a walk covers the reports accepted up to its <code>as_of</code>, so it returns each one exactly once even while new reports are accepted.</li>
          <li>Anonymous clients may make {LIMITS.anonymous.points} requests a minute; with an API key, {LIMITS.key.points}. Every answer carries <code>RateLimit-Policy</code> and <code>RateLimit</code>; beyond the limit you get <code>429</code> with <code>Retry-After</code>.</li>
          <li>The daily snapshot files need nothing: download them, check the SHA-256, and resume a broken download with <code>Range</code>. The live bulk files (up to the minute) need an API key: sign in, create one on <Link className="underline" to="/account">your account page</Link> (it is shown once), and send it as <code>Authorization: Bearer &lt;key&gt;</code>. A revoked key gets <code>401</code>.</li>
          <li>JSON answers carry an <code>ETag</code>; send it back in <code>If-None-Match</code> and an unchanged answer is a bodiless <code>304</code>. CORS is open for GET.</li>
          <li>A parameter the feed cannot read is a <code>400</code> with <code>{"{ error: { code, message, parameter } }"}</code> — nothing is silently ignored.</li>
        </ul>
        <pre className="overflow-x-auto rounded bg-stone-900 p-3 text-xs text-stone-100">{[
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
        ].join("\n")}</pre>
      </section>

      <section aria-labelledby="privacy" className="space-y-1">
        <h2 id="privacy" className="text-lg font-semibold">Privacy</h2>
        <p className="max-w-prose text-sm">
          The feed carries no e-mail addresses, names, handles, sessions or account data. Each reporter appears as a random, stable
          pseudonym (<code>rp_…</code>), the same on all their reports and unrelated to their account. Evidence appears as a count; a
          file is linked only where its reporter chose to publish it. Notes are published as the moderator accepted them.
        </p>
      </section>

      <section aria-labelledby="dictionary" className="space-y-6">
        <h2 id="dictionary" className="text-lg font-semibold">Data dictionary</h2>
        {(Object.keys(RECORD_TYPES) as RecordType[]).map((type) => <Dictionary key={type} type={type} />)}
      </section>
    </article>
  );
}

function Snapshot({ snapshot, origin }: { snapshot: Route.ComponentProps["loaderData"]["snapshot"]; origin: string }) {
  return (
    <section aria-labelledby="snapshot" className="space-y-2">
      <h2 id="snapshot" className="text-lg font-semibold">Daily snapshot</h2>
      {!snapshot ? (
        <p className="text-sm text-stone-600">The first snapshot has not been written yet. One is written every day at 03:15 UTC.</p>
      ) : (
        <>
          <p className="max-w-prose text-sm">
            Every report accepted as of <strong>{snapshot.createdAt.replace("T", " ").slice(0, 19)} UTC</strong> ({snapshot.reportCount} reports),
            gzipped, open to anyone — no account or key. A new snapshot is written every day at 03:15 UTC; these links name this one, so the
            SHA-256 below always matches what you download.
          </p>
          <div className="overflow-x-auto">
            <table className="w-full text-left text-sm">
              <thead><tr className="border-b"><th className="py-1 pr-3">File</th><th className="py-1 pr-3">Size</th><th className="py-1">SHA-256</th></tr></thead>
              <tbody>
                {snapshot.files.map((f) => (
                  <tr key={f.format} className="border-b border-stone-100 align-top">
                    <td className="py-1 pr-3"><a className="underline" href={f.path} download>{f.path.split("/").pop()}</a> <span className="text-stone-500">({f.format.toUpperCase()})</span></td>
                    <td className="py-1 pr-3 whitespace-nowrap">{formatBytes(f.bytes)}</td>
                    <td className="py-1 break-all font-mono text-xs">{f.sha256}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <pre className="overflow-x-auto rounded bg-stone-900 p-3 text-xs text-stone-100">{[
            `curl -s -O '${origin}${snapshot.files[0]!.path}'`,
            `echo '${snapshot.files[0]!.sha256}  reports.${snapshot.files[0]!.format}.gz' | sha256sum -c`,
          ].join("\n")}</pre>
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

function Dictionary({ type }: { type: RecordType }) {
  const t = RECORD_TYPES[type];
  const rows = t.fields.flatMap((f) => [f, ...(f.fields ?? []).map((g) => ({ ...g, name: `${f.name}.${g.name}` }))]);
  return (
    <div>
      <h3 className="font-semibold">{t.title} <a className="text-sm font-normal underline" href={`/api/v1/schema/${type}.json`}>{type}.json</a></h3>
      <div className="overflow-x-auto">
        <table className="mt-1 w-full text-left text-sm">
          <thead><tr className="border-b"><th className="py-1 pr-3">Field</th><th className="py-1 pr-3">Type</th><th className="py-1 pr-3">Unit (SI)</th><th className="py-1">Meaning</th></tr></thead>
          <tbody>
            {rows.map((f) => (
              <tr key={f.name} className="border-b border-stone-100 align-top">
                <td className="py-1 pr-3 font-mono text-xs">{f.name}</td>
                <td className="py-1 pr-3">{TYPE_LABEL[f.type]}{f.nullable ? ", may be empty" : ""}</td>
                <td className="py-1 pr-3">{f.unit ?? "—"}</td>
                <td className="py-1">
                  {f.description}
                  {f.enum && <span className="block text-xs text-stone-600">One of: {f.enum.join(", ")}</span>}
                  {(f.minimum !== undefined || f.maximum !== undefined) && (
                    <span className="block text-xs text-stone-600">Range: {f.minimum ?? "…"} to {f.maximum ?? "…"}</span>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}

export function meta() {
  return [{ title: "Open data — Bayproof" }, { name: "description", content: "Bayproof's accepted reports, stats and catalogue as open data under CC BY 4.0." }];
}
