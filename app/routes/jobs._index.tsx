import { Link } from "react-router";
import { readDb } from "~/db.server";
import { listJobs } from "~/catalogue/queries.server";
import { cardClass } from "~/components/ui";
import { groupBy } from "~/utils/group";
import type { Route } from "./+types/jobs._index";

export async function loader() {
  return { jobs: await listJobs(readDb) };
}

export default function Jobs({ loaderData }: Route.ComponentProps) {
  const byCategory = groupBy(loaderData.jobs, (j) => j.category_name);
  return (
    <div className="space-y-6">
      <header>
        <h1 className="text-2xl font-bold">Jobs</h1>
        <p className="text-stone-700">
          Start from the job you need done; each page shows the tools technicians used on it and how it went.
        </p>
      </header>
      {[...byCategory].map(([category, jobs]) => (
        <section key={category}>
          <h2 className="mb-2 text-lg font-semibold text-bay-700">{category}</h2>
          <ul className="grid gap-3 sm:grid-cols-2">
            {jobs.map((j) => (
              <li key={j.slug}>
                <Link to={`/jobs/${j.slug}`} className={cardClass("md", "block h-full hover:border-bay-600")}>
                  <span className="flex justify-between gap-2 font-semibold">
                    {j.name}
                    <span className="text-sm font-normal text-stone-500">{j.accepted_reports} reports</span>
                  </span>
                  <span className="mt-1 block text-sm text-stone-600">{j.description}</span>
                </Link>
              </li>
            ))}
          </ul>
        </section>
      ))}
    </div>
  );
}

export function meta() {
  return [{ title: "Jobs — Bayproof" }];
}
