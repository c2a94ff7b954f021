import { Link } from "react-router";
import { groupBy } from "~/utils/group";
import { unitsFor } from "~/auth/units.server";
import { db } from "~/db.server";
import { ReportList } from "~/components/report-table";
import { buttonClass, Card } from "~/components/ui";
import { acceptedReports, countAccepted, listJobs } from "~/catalogue/queries.server";
import type { Route } from "./+types/_index";

export async function loader({ request }: Route.LoaderArgs) {
  const [recent, jobs, accepted, units] = await Promise.all([
    acceptedReports(db, { limit: 8 }),
    listJobs(db),
    countAccepted(db),
    unitsFor(request),
  ]);
  return { recent, jobs, accepted, units };
}

// The four people Bayproof is for, each with the page where their work starts.
const AUDIENCES = [
  {
    id: "choosing",
    title: "Choosing a tool for a job",
    body: "Pick the job, then see which tools freed it, how often and how fast — and whether your compressor, hose and couplers can feed them.",
    links: [
      { to: "/jobs", label: "Start from the job" },
      { to: "/air", label: "Check your air" },
    ],
  },
  {
    id: "filing",
    title: "Working in the bay",
    body: "Finished a stubborn job? File what happened: the tool, the pressure at its inlet, the hose, the outcome and a short video of the gauge. A few minutes on your phone.",
    links: [
      { to: "/reports/new", label: "File a report" },
      { to: "/me/reports", label: "Your reports" },
    ],
  },
  {
    id: "moderating",
    title: "Checking reports",
    body: "Moderators watch the evidence, check each claim against it and record why a report was accepted or turned down. Every decision is kept in the report's history.",
    links: [{ to: "/review", label: "Review queue" }],
  },
  {
    id: "research",
    title: "Studying the numbers",
    body: "Every accepted report is open data under CC BY 4.0: download the whole set, or ask the API for reports, tools, jobs and the summary figures.",
    links: [
      { to: "/data", label: "Open data" },
      { to: "/api/v1", label: "The API", reload: true },
    ],
  },
] as const;

export default function Home({ loaderData }: Route.ComponentProps) {
  const { recent, jobs, accepted } = loaderData;
  const byCategory = groupBy(jobs, (j) => j.category_name);
  return (
    <div className="space-y-8">
      <section className="rounded-xl bg-bay-900 p-6 text-white">
        <h1 className="text-2xl font-bold sm:text-3xl">Will this tool free that joint on the air you have?</h1>
        <p className="mt-3 max-w-2xl text-bay-100">
          Bayproof collects reports of real jobs from the bay — the tool, the job, the pressure that reached the tool,
          the hose, the outcome and the time, with video or photo evidence checked by moderators. Tool pages show what
          happened on {accepted.toLocaleString("en-US")} accepted jobs, not a catalogue figure.
        </p>
        <div className="mt-4 flex flex-wrap gap-3">
          <Link to="/jobs" className="rounded bg-signal-500 px-4 py-3 font-semibold text-stone-900">
            Start from the job
          </Link>
          <Link to="/models" className="rounded border border-bay-100 px-4 py-3 font-semibold">
            Browse tools
          </Link>
        </div>
      </section>

      <section aria-labelledby="who-heading">
        <h2 id="who-heading" className="mb-3 text-xl font-bold">
          What brings you here
        </h2>
        <div className="grid gap-4 sm:grid-cols-2">
          {AUDIENCES.map((a) => (
            <Card as="article" key={a.id} className="flex flex-col" aria-labelledby={`who-${a.id}`}>
              <h3 id={`who-${a.id}`} className="font-semibold text-bay-700">
                {a.title}
              </h3>
              <p className="mt-1 flex-1 text-sm text-stone-700">{a.body}</p>
              <p className="mt-3 flex flex-wrap gap-2">
                {a.links.map((l) => (
                  <Link
                    key={l.to}
                    to={l.to}
                    reloadDocument={"reload" in l}
                    className={buttonClass("secondary", "sm", "inline-flex min-h-11 items-center")}
                  >
                    {l.label}
                  </Link>
                ))}
              </p>
            </Card>
          ))}
        </div>
      </section>

      <section aria-labelledby="jobs-heading">
        <h2 id="jobs-heading" className="mb-3 text-xl font-bold">
          Jobs
        </h2>
        <div className="grid gap-4 sm:grid-cols-3">
          {[...byCategory].map(([category, list]) => (
            <Card key={category}>
              <h3 className="mb-2 font-semibold text-bay-700">{category}</h3>
              <ul>
                {list.map((j) => (
                  <li key={j.slug}>
                    <Link
                      to={`/jobs/${j.slug}`}
                      className="flex min-h-11 items-center justify-between gap-2 hover:underline"
                    >
                      <span>{j.name}</span>
                      <span className="text-sm text-stone-600">
                        {j.accepted_reports} <span className="sr-only">reports</span>
                      </span>
                    </Link>
                  </li>
                ))}
              </ul>
            </Card>
          ))}
        </div>
      </section>

      <section aria-labelledby="recent-heading">
        <h2 id="recent-heading" className="mb-3 text-xl font-bold">
          Recently accepted reports
        </h2>
        <ReportList reports={recent} units={loaderData.units} />
      </section>
    </div>
  );
}

export function meta() {
  return [
    { title: "Bayproof — air tools on real repair jobs" },
    {
      name: "description",
      content: "Moderated reports of how air hammers, impact wrenches and ratchets do on real repair jobs.",
    },
  ];
}
