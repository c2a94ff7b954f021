import { DataDictionary, EndpointsSection, SnapshotSection, UsingItSection } from "~/components/open-data";
import { config } from "~/config.server";
import { readDb } from "~/db.server";
import { latestSnapshot } from "~/feed/snapshot.server";
import { citation, LICENCE } from "~/feed/documents";
import { RECORD_TYPES } from "~/feed/fields";
import { ANONYMOUS_LIMIT, DEFAULT_LIMIT, MAX_LIMIT } from "~/feed/params";
import type { Route } from "./+types/data";

export async function loader() {
  const day = new Date().toISOString().slice(0, 10);
  return {
    origin: config.appOrigin,
    keyLimit: config.feed.keyLimit,
    citation: citation(config.appOrigin, day),
    snapshot: await latestSnapshot(readDb),
    licence: LICENCE,
    // The dictionary and the limits come from the feed's own modules, sent as data: those modules
    // (and zod with them) stay out of the page's JavaScript.
    types: Object.entries(RECORD_TYPES).map(([type, t]) => ({ type, title: t.title, fields: t.fields })),
    limits: { defaultLimit: DEFAULT_LIMIT, maxLimit: MAX_LIMIT, anonymousPerMinute: ANONYMOUS_LIMIT.points },
  };
}

export default function Data({ loaderData }: Route.ComponentProps) {
  const { origin, licence } = loaderData;
  return (
    <article className="space-y-8">
      <header className="space-y-2">
        <h1 className="text-2xl font-bold">Open data</h1>
        <p className="max-w-prose text-stone-700">
          Every report a moderator has accepted, the tool models and job types, and the stats computed from them; every
          accepted bench run, the rigs, the protocols and the bench figures across rigs — as JSON pages, bulk files and
          documented schemas. <strong>All quantities are in SI units</strong>: pressures in kPa (gauge), lengths in mm
          or m, air flow in L/s of free air, volumes in L, times in s, forces in N and torques in N·m.
        </p>
      </header>

      <section aria-labelledby="licence" className="rounded-lg border border-bay-200 bg-white p-4">
        <h2 id="licence" className="text-lg font-semibold">
          Licence and citation
        </h2>
        <p className="mt-1 text-sm">
          The data are published under{" "}
          <a className="underline" href={licence.path}>
            {licence.title}
          </a>{" "}
          ({licence.name}): use them for anything, including commercially, and credit Bayproof's contributors. Cite it
          as:
        </p>
        <blockquote className="mt-2 rounded bg-bay-50 p-3 font-mono text-xs">{loaderData.citation}</blockquote>
        <p className="mt-2 text-sm text-stone-600">
          Give the date you retrieved it, and the <code>as_of</code> of your walk when you page through reports, so
          others can find the same rows.
        </p>
      </section>

      <SnapshotSection snapshot={loaderData.snapshot} origin={origin} />

      <EndpointsSection />

      <UsingItSection origin={origin} keyLimit={loaderData.keyLimit} limits={loaderData.limits} />

      <section aria-labelledby="privacy" className="space-y-1">
        <h2 id="privacy" className="text-lg font-semibold">
          Privacy
        </h2>
        <p className="max-w-prose text-sm">
          The feed carries no e-mail addresses, people's names, handles, sessions or account data. Each reporter appears
          as a random, stable pseudonym (<code>rp_…</code>), the same on all their reports and unrelated to their
          account; the filer of a bench run and the owner of a rig appear the same way. Evidence appears as a count; a
          file is linked only where its reporter chose to publish it. Notes are published as the moderator accepted
          them.
        </p>
      </section>

      <DataDictionary types={loaderData.types} />
    </article>
  );
}

export function meta() {
  return [
    { title: "Open data — Bayproof" },
    { name: "description", content: "Bayproof's accepted reports, stats and catalogue as open data under CC BY 4.0." },
  ];
}
