import { data, Link, redirect } from "react-router";
import { requireRole } from "~/auth/session.server";
import { ErrorPage } from "~/components/error-page";
import { JumpToReport, QueueFilters } from "~/components/review/queue-filters";
import { QueueList, QueuePager } from "~/components/review/queue-list";
import { Card } from "~/components/ui";
import { BenchQueue } from "~/components/bench/bench-review";
import { benchQueue } from "~/bench/moderation.server";
import { db } from "~/db.server";
import { QUEUE_SORTS, readQueueFilter } from "~/moderation/queue-filter";
import { queuePage } from "~/moderation/queue-page.server";
import { jobTypesByCategory } from "~/reports/reports.server";
import { refuse } from "~/utils/http";
import type { Route } from "./+types/review._index";

export async function loader({ request }: Route.LoaderArgs) {
  const moderator = await requireRole(request, "moderator");
  const search = new URL(request.url).searchParams;
  const read = readQueueFilter(search);
  if (!read.ok) refuse(read.message);
  const [page, jobs, bench] = await Promise.all([
    queuePage(db, moderator.id, read.filter, search.get("report")),
    jobTypesByCategory(db),
    benchQueue(db, moderator.id),
  ]);
  if (page.redirectTo) throw redirect(page.redirectTo);
  return data({ ...page, jobs, bench, filter: read.filter }, { status: page.jumpError ? 400 : 200 });
}

export default function ReviewQueue({ loaderData }: Route.ComponentProps) {
  const { queue, counts, jobs, bench, filter, waitDays, jump, jumpError } = loaderData;
  return (
    <div className="space-y-4">
      <header className="flex flex-wrap items-baseline justify-between gap-2">
        <h1 className="text-2xl font-bold">Review queue</h1>
        <Link to="/review/stats" className="inline-flex min-h-11 items-center text-sm text-bay-700 underline">
          Workload figures
        </Link>
      </header>
      <dl className="grid grid-cols-3 gap-2 sm:gap-3">
        <Count label="Waiting" value={counts.waiting} />
        <Count label="Flagged" value={counts.flagged} />
        <Count label="Oldest wait" value={`${waitDays} days`} />
      </dl>
      <JumpToReport filter={filter} value={jump} error={jumpError} />
      <QueueFilters filter={filter} jobs={jobs} />
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <QueuePager paging={queue} filter={filter} position="top" />
        <p className="text-sm text-stone-600">
          {QUEUE_SORTS[filter.sort ?? "oldest"]}. Your own reports are not listed: nobody decides on their own report.
        </p>
      </div>
      <QueueList rows={queue.rows} filter={{ ...filter, page: queue.page }} />
      <QueuePager paging={queue} filter={filter} position="bottom" />
      <BenchQueue rows={bench} />
    </div>
  );
}

function Count({ label, value }: { label: string; value: number | string }) {
  return (
    <Card padding="sm">
      <dt className="text-xs text-stone-600">{label}</dt>
      <dd className="text-xl font-bold sm:text-2xl">{value}</dd>
    </Card>
  );
}

export function meta() {
  return [{ title: "Review queue — Bayproof" }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
