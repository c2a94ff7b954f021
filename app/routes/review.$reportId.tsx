import { data, Form, Link, useNavigation } from "react-router";
import { requireRole } from "~/auth/session.server";
import { formatDate, formatTime, systemOfLength, toolName, unitsOf } from "~/domain";
import { unitsFor } from "~/auth/units.server";
import { LogList } from "~/components/decision-log";
import { ErrorPage } from "~/components/error-page";
import { DecisionForm } from "~/components/review/decision-form";
import { EvidenceMedia } from "~/components/review/evidence-media";
import { ReportFacts } from "~/components/review/report-facts";
import { SafetyCautions } from "~/components/safety-cautions";
import { db } from "~/db.server";
import { DecisionError } from "~/moderation/decision-error";
import { FLAG_EXPLANATIONS, type FlagCode } from "~/moderation/flags";
import { readQueueFilter } from "~/moderation/queue-filter";
import { placeInQueue } from "~/moderation/queue-page.server";
import { openReview, reviewAction, reviewFormSchema } from "~/moderation/review.server";
import { reporterRecord } from "~/moderation/trust";
import { buttonClass } from "~/components/ui";
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
  const { report: r, media, history, own, claim, log, seenDecisions, units, queue, duplicateOf } = loaderData;
  const busy = useNavigation().state !== "idle";
  const fieldError = (name: string) =>
    actionData && !actionData.ok && "field" in actionData && actionData.field === name ? actionData.message : undefined;
  const waiting = r.status === "submitted";
  const free = claim != null && !claim.mine && !claim.holder && !claim.alreadyAccepted;
  // A free report can be decided at once: the decision takes the claim in its own transaction.
  const canDecide = waiting && !own && (claim?.mine || free);
  const accepts = log.filter((d) => d.action === "accept" && d.report_version === r.version).length;
  const until = (at: Date | string | null) => (at ? formatTime(at) : "");
  return (
    <div className="space-y-5">
      <header>
        <QueueNav queue={queue} />
        <h1 className="break-words text-2xl font-bold">
          Report #{r.id} · {toolName(r.maker, r.model_code)} · {r.job}
        </h1>
        <p className="text-sm text-stone-600">
          By {r.reporter} ({reporterRecord(history)}) · submitted {formatDate(r.submitted_at)} · version {r.version} ·
          status {r.status}
          {accepts > 0 && waiting ? ` · accepted once, waiting for a second look` : ""}
        </p>
        {own && (
          <p role="alert" className="mt-2 rounded bg-amber-100 px-3 py-2">
            This is your own report: you cannot decide on it.
          </p>
        )}
        {claim?.holder && (
          <p role="alert" className="mt-2 rounded bg-amber-100 px-3 py-2">
            {claim.holder} has this report open until {until(claim.expiresAt)}. You can read it; deciding waits.
          </p>
        )}
        {claim?.mine && <p className="mt-2 text-sm text-stone-600">Held for you until {until(claim.expiresAt)}.</p>}
        {claim?.alreadyAccepted && waiting && (
          <p className="mt-2 text-sm text-stone-600">
            You accepted this version; the second look is another moderator's.
          </p>
        )}
        {canDecide && (
          <a href="#decide" className="mt-2 inline-flex min-h-11 items-center text-sm text-bay-700 underline lg:hidden">
            Go to the decision ↓
          </a>
        )}
        {waiting && free && (
          <Form method="post" className="mt-2 flex flex-wrap items-center gap-3">
            <button
              type="submit"
              name="intent"
              value="claim"
              disabled={busy}
              className={buttonClass("secondary", "md", "min-h-11")}
            >
              Start this review
            </button>
            <span className="text-sm text-stone-600">
              Holds the report for you for 15 minutes, so nobody else checks it at the same time.
            </span>
          </Form>
        )}
      </header>

      {actionData && (
        <div
          role={actionData.ok ? "status" : "alert"}
          className={`flex flex-wrap items-center justify-between gap-3 rounded px-3 py-2 ${actionData.ok ? "bg-bay-100" : "bg-red-100 text-red-900"}`}
        >
          <p>{actionData.message}</p>
          {actionData.ok && !canDecide && <NextReport queue={queue} />}
        </div>
      )}

      {r.flags.length > 0 && (
        <section className="rounded-lg border border-amber-300 bg-amber-50 p-3">
          <h2 className="font-semibold">Flags</h2>
          <ul className="mt-1 space-y-1 text-sm">
            {r.flags.map((f) => (
              <li key={f}>
                <span className="font-semibold">⚑ {f.replaceAll("_", " ")}</span> —{" "}
                {FLAG_EXPLANATIONS[f as FlagCode] ?? ""}
              </li>
            ))}
          </ul>
          {r.flags.includes("above_rated_inlet") && (
            <div className="mt-2">
              <SafetyCautions action={r.category_action} />
            </div>
          )}
        </section>
      )}

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

type Queue = Route.ComponentProps["loaderData"]["queue"];

/** Back to the queue it came from, where it stands there, and the next report. */
function QueueNav({ queue }: { queue: Queue }) {
  return (
    <nav aria-label="Queue" className="flex flex-wrap items-center gap-x-4 text-sm">
      <Link to={queue.back} className="inline-flex min-h-11 items-center text-bay-700 underline">
        ← Queue
      </Link>
      {queue.position && (
        <span className="text-stone-600">
          {queue.position} of {queue.total} in this queue
        </span>
      )}
      {queue.next && (
        <Link to={queue.next} className="inline-flex min-h-11 items-center text-bay-700 underline sm:ml-auto">
          Skip to the next report →
        </Link>
      )}
    </nav>
  );
}

function NextReport({ queue }: { queue: Queue }) {
  if (!queue.next)
    return (
      <Link to={queue.back} className={buttonClass("primary", "md", "min-h-11")}>
        Nothing further in this queue: back to it
      </Link>
    );
  return (
    <Link to={queue.next} className={buttonClass("primary", "md", "min-h-11")}>
      Next report →
    </Link>
  );
}

export function meta({ data }: Route.MetaArgs) {
  return [{ title: data ? `Review #${data.report.id} — Bayproof` : "Review — Bayproof" }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
