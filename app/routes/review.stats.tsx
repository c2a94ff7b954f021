import { requireRole } from "~/auth/session.server";
import { ErrorPage } from "~/components/error-page";
import { WorkloadWeeks } from "~/components/review/workload-weeks";
import { DataTable } from "~/components/ui";
import { db } from "~/db.server";
import { reviewStats } from "~/moderation/queue.server";
import type { Route } from "./+types/review.stats";

export async function loader({ request }: Route.LoaderArgs) {
  await requireRole(request, "moderator");
  return reviewStats(db);
}

export default function ReviewStats({ loaderData }: Route.ComponentProps) {
  const { weeks, medianHours, perModerator } = loaderData;
  const moderators = [...new Set(perModerator.map((r) => r.moderator))];
  const modWeeks = [...new Set(perModerator.map((r) => r.week))];
  return (
    <div className="space-y-6">
      <h1 className="text-2xl font-bold">Review workload</h1>
      <p>
        Median time from submission to decision, last 90 days:{" "}
        <strong>{medianHours.hours == null ? "—" : `${medianHours.hours.toFixed(1)} hours`}</strong> ({medianHours.n}{" "}
        decisions).
      </p>
      <section aria-labelledby="weeks-heading">
        <h2 id="weeks-heading" className="mb-2 text-lg font-semibold">
          Queue by week (last 12 weeks)
        </h2>
        <WorkloadWeeks weeks={weeks} />
      </section>
      <section aria-labelledby="mods-heading">
        <h2 id="mods-heading" className="mb-2 text-lg font-semibold">
          Decisions per moderator per week
        </h2>
        <DataTable
          label="Decisions per moderator per week"
          scrollHint
          head={
            <tr>
              <th className="px-3 py-2 text-left">Moderator</th>
              {modWeeks.map((w) => (
                <th key={w} className="px-3 py-2 text-right">
                  {w}
                </th>
              ))}
            </tr>
          }
        >
          {moderators.map((m) => (
            <tr key={m}>
              <td className="px-3 py-1.5 font-semibold">{m}</td>
              {modWeeks.map((w) => (
                <td key={w} className="px-3 py-1.5 text-right">
                  {perModerator.find((r) => r.moderator === m && r.week === w)?.decisions ?? 0}
                </td>
              ))}
            </tr>
          ))}
        </DataTable>
      </section>
    </div>
  );
}

export function meta() {
  return [{ title: "Review workload — Bayproof" }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
