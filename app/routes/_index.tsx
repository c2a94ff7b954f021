import { Link } from "react-router";
import { groupBy } from "~/utils/group";
import { unitsFor } from "~/auth/units.server";
import { readDb } from "~/db.server";
import { ReportList } from "~/components/report-table";
import { Audiences } from "~/components/home/audiences";
import { Card } from "~/components/ui";
import { acceptedReports, countAccepted, listJobs } from "~/catalogue/queries.server";
import type { Route } from "./+types/_index";

export async function loader({ request }: Route.LoaderArgs) {
  const [recent, jobs, accepted, units] = await Promise.all([
    acceptedReports(readDb, { limit: 8 }),
    listJobs(readDb),
    countAccepted(readDb),
    unitsFor(request),
  ]);
  return { recent, jobs, accepted, units };
}

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

      <Audiences />

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
