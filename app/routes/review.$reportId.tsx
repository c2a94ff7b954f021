import { data, useNavigation } from "react-router";
import { requireRole } from "~/auth/session.server";
import { systemOfLength, unitsOf } from "~/domain";
import { unitsFor } from "~/auth/units.server";
import { LogList } from "~/components/decision-log";
import { ErrorPage } from "~/components/error-page";
import { DecisionForm } from "~/components/review/decision-form";
import { EvidenceMedia } from "~/components/review/evidence-media";
import { ReportFacts } from "~/components/review/report-facts";
import { NextReport } from "~/components/review/queue-nav";
import { ReviewFlags } from "~/components/review/review-flags";
import { ReviewHeader } from "~/components/review/review-header";
import { db } from "~/db.server";
import { DecisionError } from "~/moderation/decision-error";
import { readQueueFilter } from "~/moderation/queue-filter";
import { placeInQueue } from "~/moderation/queue-page.server";
import { openReview, reviewAction, reviewFormSchema } from "~/moderation/review.server";
import { formValues, readForm } from "~/utils/forms";
import { invariantResponse } from "~/utils/http";
import { parseIdParam } from "~/utils/params";
import type { Route } from "./+types/review.$reportId";

export async function loader({ request, params }: Route.LoaderArgs) {
  const moderator = await requireRole(request, "moderator");
  const id = parseIdParam(params.reportId, "No such report");
  const review = await openReview(db, moderator.id, id);
  invariantResponse(review, "No such report", 404);
  // Figures read as the reporter typed them ("3/8 in" for a bore entered in inches), else in the moderator's units.
  const r = review.report;
  const units = r.entered_length_unit
    ? unitsOf(systemOfLength(r.entered_length_unit), r.entered_pressure_unit ?? undefined)
    : await unitsFor(request);
  // The queue this report was opened from (its filters ride in the address); a stale or mangled one
  // falls back to the whole queue rather than hiding the report.
  const read = readQueueFilter(new URL(request.url).searchParams);
  const queue = await placeInQueue(db, moderator.id, read.ok ? read.filter : {}, review.report);
  return { ...review, queue, units };
}

export async function action({ request, params }: Route.ActionArgs) {
  const moderator = await requireRole(request, "moderator");
  const id = parseIdParam(params.reportId, "No such report");
  const values = formValues(await readForm(request));
  const parsed = (await reviewFormSchema(db, id)).safeParse(values);
  if (!parsed.success) {
    const issue = parsed.error.issues[0]!;
    return data(
      {
        ok: false as const,
        message: issue.message,
        field: String(issue.path[0] ?? ""),
        note: typeof values.note === "string" ? values.note : "",
      },
      { status: 400 },
    );
  }
  try {
    return { ok: true as const, message: await reviewAction(db, moderator.id, id, parsed.data) };
  } catch (error) {
    if (error instanceof DecisionError)
      return data({ ok: false as const, message: error.message }, { status: error.status });
    throw error;
  }
}

export default function ReviewReport({ loaderData, actionData }: Route.ComponentProps) {
  const { report: r, media, own, claim, log, seenDecisions, units, queue, duplicateOf } = loaderData;
  const busy = useNavigation().state !== "idle";
  const fieldError = (name: string) =>
    actionData && !actionData.ok && "field" in actionData && actionData.field === name ? actionData.message : undefined;
  const waiting = r.status === "submitted";
  const free = claim != null && !claim.mine && !claim.holder && !claim.alreadyAccepted;
  // A free report can be decided at once: the decision takes the claim in its own transaction.
  const canDecide = waiting && !own && (claim?.mine || free);
  const accepts = log.filter((d) => d.action === "accept" && d.report_version === r.version).length;
  return (
    <div className="space-y-5">
      <ReviewHeader review={loaderData} queue={queue} accepts={accepts} canDecide={canDecide} free={free} busy={busy} />

      {actionData && (
        <div
          role={actionData.ok ? "status" : "alert"}
          className={`flex flex-wrap items-center justify-between gap-3 rounded px-3 py-2 ${actionData.ok ? "bg-bay-100" : "bg-red-100 text-red-900"}`}
        >
          <p>{actionData.message}</p>
          {actionData.ok && !canDecide && <NextReport queue={queue} />}
        </div>
      )}

      {r.flags.length > 0 && <ReviewFlags report={r} />}

      <div className="grid gap-5 lg:grid-cols-2">
        <EvidenceMedia media={media} />
        <ReportFacts review={loaderData} units={units} />
      </div>

      {canDecide && (
        <DecisionForm
          version={r.version}
          seenDecisions={seenDecisions}
          media={media}
          busy={busy}
          noteError={fieldError("note")}
          note={actionData && "note" in actionData ? String(actionData.note) : undefined}
          duplicate={
            r.flags.includes("duplicate_evidence")
              ? { reports: duplicateOf, error: fieldError("ack_duplicate") }
              : undefined
          }
        />
      )}

      <section aria-labelledby="log-heading">
        <h2 id="log-heading" className="text-lg font-semibold">
          History
        </h2>
        <LogList log={log} />
      </section>
    </div>
  );
}

export function meta({ data }: Route.MetaArgs) {
  return [{ title: data ? `Review #${data.report.id} — Bayproof` : "Review — Bayproof" }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
