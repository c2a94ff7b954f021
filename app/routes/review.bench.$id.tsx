import { Link, redirect } from "react-router";
import { requireRole } from "~/auth/session.server";
import { unitsFor } from "~/auth/units.server";
import { decideBenchRun, openBenchReview } from "~/bench/moderation.server";
import { benchDecisionSchema, BENCH_CHECKLIST } from "~/bench/review";
import { BenchDecisionForm, BenchLog } from "~/components/bench/bench-review";
import { RunSeries } from "~/components/bench/run-view";
import { ErrorPage } from "~/components/error-page";
import { Card } from "~/components/ui";
import { db } from "~/db.server";
import { AppError, failureAnswer } from "~/utils/errors";
import { invalid, parseForm, readForm } from "~/utils/forms";
import { parseIdParam } from "~/utils/params";
import type { Route } from "./+types/review.bench.$id";

export async function loader({ request, params }: Route.LoaderArgs) {
  const moderator = await requireRole(request, "moderator");
  const id = parseIdParam(params.id, "No such bench run in review");
  try {
    const [review, units] = await Promise.all([openBenchReview(db, id, moderator.id), unitsFor(request)]);
    return { ...review, units };
  } catch (error) {
    throw failureAnswer(error, "page");
  }
}

export async function action({ request, params }: Route.ActionArgs) {
  const moderator = await requireRole(request, "moderator");
  const runId = parseIdParam(params.id, "No such bench run in review");
  const parsed = parseForm(benchDecisionSchema, await readForm(request));
  if (!parsed.ok) return invalid(parsed.errors, parsed.values);
  const d = parsed.data;
  try {
    await decideBenchRun(db, {
      runId,
      moderatorId: moderator.id,
      action: d.action,
      reason: d.reason,
      note: d.note?.trim() || null,
      checklist: Object.fromEntries(Object.keys(BENCH_CHECKLIST).map((k) => [k, d[k as keyof typeof d] === "on"])),
      version: d.version,
    });
  } catch (error) {
    if (error instanceof AppError && error.status === 409) return invalid({}, parsed.values, error.message);
    throw failureAnswer(error, "page");
  }
  return redirect("/review");
}

export default function BenchReview({ loaderData, actionData }: Route.ComponentProps) {
  const { detail, figures, traces, facts, log, own, units } = loaderData;
  const { run } = detail;
  return (
    <div className="space-y-6">
      <header>
        <p className="text-sm">
          <Link to="/review" className="inline-flex min-h-11 items-center text-bay-700 underline">
            Review queue
          </Link>
        </p>
        <h1 className="text-2xl font-bold">
          Bench run {run.id}: {run.tool}
        </h1>
        <p className="text-stone-700">
          {run.rig_name} · {run.protocol_title}, version {run.protocol_version} · {run.status} · version {run.version}
        </p>
      </header>
      {actionData?.formError && (
        <p role="alert" className="rounded border border-red-700 bg-red-50 p-3 text-red-900">
          {actionData.formError}
        </p>
      )}
      <RunSeries detail={detail} figures={figures} traces={traces} units={units} />
      <Card as="section" aria-label="Decision">
        {own ? (
          <p>This is your own run: another moderator decides on it.</p>
        ) : run.status !== "submitted" ? (
          <p>This run is {run.status}; nothing is waiting for a decision.</p>
        ) : (
          <BenchDecisionForm
            facts={facts}
            version={run.version}
            errors={actionData?.errors ?? {}}
            values={textValues(actionData?.values ?? {})}
          />
        )}
      </Card>
      <BenchLog log={log} />
    </div>
  );
}

const textValues = (values: Record<string, unknown>) =>
  Object.fromEntries(Object.entries(values).map(([k, v]) => [k, typeof v === "string" ? v : ""]));

export function meta() {
  return [{ title: "Bench run review — Bayproof" }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
