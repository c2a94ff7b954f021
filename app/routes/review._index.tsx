import { Form, Link } from "react-router";
import { z } from "zod";
import { requireRole } from "~/auth/session.server";
import { formatDate, slugField, toolName } from "~/domain";
import { ErrorPage } from "~/components/error-page";
import { buttonClass, Card, cardClass } from "~/components/ui";
import { db } from "~/db.server";
import { FLAG_EXPLANATIONS } from "~/moderation/flags";
import { queueCounts, reviewQueue } from "~/moderation/queue.server";
import { TRUST_LABELS, TRUST_LEVELS } from "~/moderation/trust";
import { jobTypesByCategory } from "~/reports/reports.server";
import type { Route } from "./+types/review._index";
import { refuse } from "~/utils/http";

const filterSchema = z.object({
  flag: z.enum(Object.keys(FLAG_EXPLANATIONS) as [string, ...string[]]).optional().or(z.literal("")),
  category: slugField().optional().or(z.literal("")),
  job: slugField().optional().or(z.literal("")),
  trust: z.enum(TRUST_LEVELS).optional().or(z.literal("")),
  age: z.coerce.number().int().min(0).max(365).optional().or(z.literal("")),
});

export async function loader({ request }: Route.LoaderArgs) {
  const moderator = await requireRole(request, "moderator");
  const parsed = filterSchema.safeParse(Object.fromEntries(new URL(request.url).searchParams));
  if (!parsed.success) refuse("Those filters are not valid");
  const f = parsed.data;
  const [rows, counts, jobs] = await Promise.all([
    reviewQueue(db, moderator.id, {
      flag: f.flag || undefined, category: f.category || undefined, job: f.job || undefined,
      trust: f.trust || undefined, olderThanDays: typeof f.age === "number" ? f.age : undefined,
    }),
    queueCounts(db),
    jobTypesByCategory(db),
  ]);
  // Counted here, once, so the page says the same on the server and in the browser.
  const waitDays = counts.oldest ? Math.floor((Date.now() - new Date(counts.oldest).getTime()) / 86_400_000) : 0;
  return { rows, counts, jobs, filters: f, waitDays };
}

export default function ReviewQueue({ loaderData }: Route.ComponentProps) {
  const { rows, counts, jobs, filters, waitDays } = loaderData;
  const categories = [...new Map(jobs.map((j) => [j.category_slug, j.category_name])).entries()];
  const select = "rounded border border-stone-300 px-2 py-2 text-sm";
  return (
    <div className="space-y-4">
      <header className="flex flex-wrap items-baseline justify-between gap-2">
        <h1 className="text-2xl font-bold">Review queue</h1>
        <Link to="/review/stats" className="text-sm text-bay-700 underline">Workload figures</Link>
      </header>
      <dl className="grid grid-cols-3 gap-3">
        <Count label="Waiting" value={counts.waiting} />
        <Count label="Flagged" value={counts.flagged} />
        <Count label="Oldest wait" value={`${waitDays} days`} />
      </dl>
      <Form method="get" className={cardClass("sm", "flex flex-wrap gap-2")}>
        <select name="flag" defaultValue={filters.flag ?? ""} className={select} aria-label="Flag">
          <option value="">Any flags</option>
          {Object.keys(FLAG_EXPLANATIONS).map((f) => <option key={f} value={f}>{f.replaceAll("_", " ")}</option>)}
        </select>
        <select name="category" defaultValue={filters.category ?? ""} className={select} aria-label="Category">
          <option value="">Any category</option>
          {categories.map(([slug, name]) => <option key={slug} value={slug}>{name}</option>)}
        </select>
        <select name="job" defaultValue={filters.job ?? ""} className={select} aria-label="Job">
          <option value="">Any job</option>
          {jobs.map((j) => <option key={j.slug} value={j.slug}>{j.name}</option>)}
        </select>
        <select name="trust" defaultValue={filters.trust ?? ""} className={select} aria-label="Reporter trust">
          <option value="">Any reporter</option>
          {Object.entries(TRUST_LABELS).map(([k, v]) => <option key={k} value={k}>{v}</option>)}
        </select>
        <select name="age" defaultValue={String(filters.age ?? "")} className={select} aria-label="Age">
          <option value="">Any age</option>
          <option value="1">Older than a day</option>
          <option value="7">Older than a week</option>
          <option value="30">Older than a month</option>
        </select>
        <button type="submit" className={buttonClass("primary", "sm")}>Filter</button>
      </Form>
      <p className="text-sm text-stone-600">Oldest first. Your own reports are not listed: nobody decides on their own report.</p>
      <Card as="ul" padding="none" className="divide-y divide-stone-100">
        {rows.map((r) => (
          <li key={r.id}>
            <Link to={`/review/${r.id}`} className="flex flex-wrap items-center gap-x-3 gap-y-1 px-3 py-3 hover:bg-bay-50" data-testid="queue-row">
              <span className="font-semibold">#{r.id}</span>
              <span>{toolName(r.maker, r.model_code)}</span>
              <span className="text-stone-600">{r.job}</span>
              {r.flags.map((f) => <span key={f} className="rounded bg-amber-100 px-2 text-xs">⚑ {f.replaceAll("_", " ")}</span>)}
              {r.accepts > 0 && <span className="rounded bg-bay-100 px-2 text-xs">needs second look</span>}
              <span className="ml-auto text-xs text-stone-500">
                {r.reporter} ({r.trust}) · submitted {formatDate(r.submitted_at)}{r.claimed_by ? ` · open by ${r.claimed_by}` : ""}
              </span>
            </Link>
          </li>
        ))}
        {rows.length === 0 && <li className="px-3 py-3 text-stone-600">Nothing waiting with these filters.</li>}
      </Card>
    </div>
  );
}

function Count({ label, value }: { label: string; value: number | string }) {
  return (
    <Card padding="sm">
      <dt className="text-xs text-stone-600">{label}</dt>
      <dd className="text-2xl font-bold">{value}</dd>
    </Card>
  );
}

export function meta() {
  return [{ title: "Review queue — Bayproof" }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
