import { Link } from "react-router";
import { DataDictionary, SnapshotSection } from "~/components/open-data";
import { DataTable } from "~/components/ui";
import { config } from "~/config.server";
import { db } from "~/db.server";
import { latestSnapshot } from "~/feed/snapshot.server";
import { citation, LICENCE } from "~/feed/documents";
import { DEFAULT_LIMIT, LIMITS, MAX_LIMIT } from "~/feed/params";
import type { Route } from "./+types/data";

export async function loader() {
  const day = new Date().toISOString().slice(0, 10);
  return { origin: config.appOrigin, citation: citation(config.appOrigin, day), snapshot: await latestSnapshot(db) };
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
] as const;

export default function Data({ loaderData }: Route.ComponentProps) {
  const { origin } = loaderData;
  return (
    <article className="space-y-8">
      <header className="space-y-2">
        <h1 className="text-2xl font-bold">Open data</h1>
        <p className="max-w-prose text-stone-700">
          Every report a moderator has accepted, the tool models and job types, and the stats computed from them — as
          JSON pages, bulk files and documented schemas. <strong>All quantities are in SI units</strong>: pressures in
          kPa (gauge), lengths in mm or m, air flow in L/s of free air, volumes in L, times in s.
        </p>
      </header>

      <section aria-labelledby="licence" className="rounded-lg border border-bay-200 bg-white p-4">
        <h2 id="licence" className="text-lg font-semibold">
          Licence and citation
        </h2>
        <p className="mt-1 text-sm">
          The data are published under{" "}
          <a className="underline" href={LICENCE.path}>
            {LICENCE.title}
          </a>{" "}
          ({LICENCE.name}): use them for anything, including commercially, and credit Bayproof's contributors. Cite it
          as:
        </p>
        <blockquote className="mt-2 rounded bg-bay-50 p-3 font-mono text-xs">{loaderData.citation}</blockquote>
        <p className="mt-2 text-sm text-stone-600">
          Give the date you retrieved it, and the <code>as_of</code> of your walk when you page through reports, so
          others can find the same rows.
        </p>
      </section>

      <SnapshotSection snapshot={loaderData.snapshot} origin={origin} />

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
              <td className="py-1 pr-3 font-mono text-xs">{path}</td>
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
          of the bulk files, and a JSON Schema (2020-12) for every record and response under{" "}
          <code>/api/v1/schema/</code>.
        </p>
      </section>

      <section aria-labelledby="use" className="space-y-2">
        <h2 id="use" className="text-lg font-semibold">
          Using it
        </h2>
        <ul className="list-disc space-y-1 pl-5 text-sm">
          <li>
            Pages hold {DEFAULT_LIMIT} reports by default, at most {MAX_LIMIT} (<code>limit</code>). Follow{" "}
            <code>next_cursor</code> (or the <code>Link: rel="next"</code> header) until it is <code>null</code>. Keep
            the other parameters the same while you walk; a walk covers the reports accepted up to its{" "}
            <code>as_of</code>, so it returns each one exactly once even while new reports are accepted.
          </li>
          <li>
            Anonymous clients may make {LIMITS.anonymous.points} requests a minute; with an API key, {LIMITS.key.points}
            . Every answer carries <code>RateLimit-Policy</code> and <code>RateLimit</code>; beyond the limit you get{" "}
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
            JSON answers carry an <code>ETag</code>; send it back in <code>If-None-Match</code> and an unchanged answer
            is a bodiless <code>304</code>. CORS is open for GET.
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

      <section aria-labelledby="privacy" className="space-y-1">
        <h2 id="privacy" className="text-lg font-semibold">
          Privacy
        </h2>
        <p className="max-w-prose text-sm">
          The feed carries no e-mail addresses, names, handles, sessions or account data. Each reporter appears as a
          random, stable pseudonym (<code>rp_…</code>), the same on all their reports and unrelated to their account.
          Evidence appears as a count; a file is linked only where its reporter chose to publish it. Notes are published
          as the moderator accepted them.
        </p>
      </section>

      <DataDictionary />
    </article>
  );
}

export function meta() {
  return [
    { title: "Open data — Bayproof" },
    { name: "description", content: "Bayproof's accepted reports, stats and catalogue as open data under CC BY 4.0." },
  ];
}
