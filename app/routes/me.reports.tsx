import { useEffect } from "react";
import { data, Form, Link } from "react-router";
import { z } from "zod";
import { requireUser } from "~/auth/session.server";
import { formatDate, formatDateTime, toolName } from "~/domain";
import { ErrorPage } from "~/components/error-page";
import { cx } from "~/components/ui";
import { OpenDataFiles } from "~/components/my-reports/open-data-files";
import { OutcomeBadge } from "~/components/report-table";
import { db } from "~/db.server";
import { FLAG_EXPLANATIONS, type FlagCode } from "~/moderation/flags";
import { EvidenceError, publishableFiles, setEvidencePublic } from "~/reports/evidence.server";
import { markNoticesRead, recentNotices } from "~/reports/notices.server";
import { offlineDraftKey } from "~/reports/offline-draft";
import { listOwnReports } from "~/reports/reports.server";
import { EDITABLE, WITHDRAWABLE } from "~/reports/status";
import { formValues, readForm } from "~/utils/forms";
import { groupBy } from "~/utils/group";
import { idField, parseIdSearchParam } from "~/utils/params";
import type { Route } from "./+types/me.reports";

export async function loader({ request }: Route.LoaderArgs) {
  const user = await requireUser(request);
  const url = new URL(request.url);
  const submitted = parseIdSearchParam(request, "submitted");
  const [reports, notices, files] = await Promise.all([
    listOwnReports(db, user.id),
    recentNotices(db, user.id),
    publishableFiles(db, user.id),
  ]);
  return { reports, notices, files, submitted, withdrawn: url.searchParams.has("withdrawn") };
}

const myReportsForm = z.discriminatedUnion("intent", [
  z.object({ intent: z.literal("publish-evidence"), evidenceId: idField(), publish: z.enum(["yes", "no"]) }),
  z.object({ intent: z.literal("read-notices") }),
]);

export async function action({ request }: Route.ActionArgs) {
  const user = await requireUser(request);
  const parsed = myReportsForm.safeParse(formValues(await readForm(request)));
  if (!parsed.success) {
    throw data(
      parsed.error.issues[0]?.path[0] === "intent" ? "Unknown request" : "Say which file, and whether to publish it",
      { status: 400 },
    );
  }
  const input = parsed.data;
  if (input.intent === "read-notices") {
    await markNoticesRead(db, user.id);
    return { ok: true };
  }
  try {
    await setEvidencePublic(db, user.id, input.evidenceId, input.publish === "yes");
  } catch (error) {
    if (error instanceof EvidenceError) throw data(error.message, { status: error.status });
    throw error;
  }
  return { ok: true };
}

const STATUS_ORDER = ["returned", "draft", "submitted", "accepted", "rejected", "withdrawn"] as const;
const STATUS_LABELS: Record<string, string> = {
  returned: "Returned to you for changes",
  draft: "Drafts",
  submitted: "Waiting for a moderator",
  accepted: "Accepted",
  rejected: "Rejected",
  withdrawn: "Withdrawn",
};
// At least 44 px tall: these are hit with a thumb between jobs.
const ROW_ACTION_BASE = "inline-flex min-h-11 items-center rounded border px-4 py-2 text-sm font-semibold";
const ROW_ACTION = cx(ROW_ACTION_BASE, "border-stone-300");
const ACTION_LABELS: Record<string, string> = { accept: "Accepted", return: "Returned", reject: "Rejected" };

export default function MyReports({ loaderData }: Route.ComponentProps) {
  const { reports, notices, files, submitted, withdrawn } = loaderData;
  const filesByReport = groupBy(files, (f) => f.report_id);
  const unread = notices.filter((n) => !n.read_at);
  const byStatus = groupBy(reports, (r) => r.status);
  useEffect(() => {
    if (!submitted) return;
    localStorage.removeItem(offlineDraftKey(null));
    localStorage.removeItem(offlineDraftKey(submitted));
  }, [submitted]);
  return (
    <div className="space-y-6">
      <header className="flex flex-wrap items-center justify-between gap-3">
        <h1 className="text-2xl font-bold">Your reports</h1>
        <Link to="/reports/new" className="rounded bg-bay-700 px-4 py-3 font-semibold text-white">
          File a new report
        </Link>
      </header>
      {submitted && (
        <p role="status" className="rounded bg-bay-100 px-3 py-2">
          Report #{submitted} is submitted. A moderator will check the evidence.
        </p>
      )}
      {withdrawn && (
        <p role="status" className="rounded bg-bay-100 px-3 py-2">
          The report is withdrawn.
        </p>
      )}
      {unread.length > 0 && (
        <section aria-labelledby="notices-heading" className="rounded-lg border border-signal-500 bg-signal-100 p-3">
          <h2 id="notices-heading" className="font-semibold">
            News on your reports
          </h2>
          <ul className="mt-1 space-y-1 text-sm">
            {unread.map((n) => (
              <li key={n.id}>
                {formatDateTime(n.created_at)}: {n.message}
              </li>
            ))}
          </ul>
          <Form method="post" className="mt-2">
            <button
              type="submit"
              name="intent"
              value="read-notices"
              className="rounded border border-stone-400 px-3 py-1 text-sm"
            >
              Mark as read
            </button>
          </Form>
        </section>
      )}
      {reports.length === 0 && <p className="text-stone-600">No reports yet.</p>}
      {STATUS_ORDER.filter((s) => byStatus.has(s)).map((status) => (
        <section key={status} aria-labelledby={`st-${status}`}>
          <h2 id={`st-${status}`} className="mb-2 text-lg font-semibold">
            {STATUS_LABELS[status]} <span className="text-stone-500">({byStatus.get(status)!.length})</span>
          </h2>
          <ul className="space-y-2">
            {byStatus.get(status)!.map((r) => (
              <li key={r.id} className="rounded-lg border border-stone-200 bg-white p-3" data-testid={`report-${r.id}`}>
                <div className="flex flex-wrap items-center gap-2">
                  <span className="font-semibold">#{r.id}</span>
                  <span>{toolName(r.maker_name, r.model_code)}</span>
                  <span className="text-stone-600">· {r.job_name}</span>
                  <OutcomeBadge outcome={r.outcome} />
                  <span className="ml-auto text-xs text-stone-500">
                    {r.submitted_at ? `submitted ${formatDate(r.submitted_at)}` : `started ${formatDate(r.created_at)}`}{" "}
                    · v{r.version} · {r.evidence} files
                  </span>
                </div>
                {r.flags.length > 0 && (
                  <ul className="mt-2 space-y-1 text-sm" aria-label="Flags">
                    {r.flags.map((f) => (
                      <li key={f} className="rounded bg-amber-50 px-2 py-1">
                        <span className="font-semibold">⚑ {f.replaceAll("_", " ")}</span> —{" "}
                        {FLAG_EXPLANATIONS[f as FlagCode] ?? ""}
                      </li>
                    ))}
                  </ul>
                )}
                {r.decisions.length > 0 && (
                  <ul className="mt-2 space-y-1 text-sm">
                    {r.decisions.map((d, i) => (
                      <li key={i}>
                        {formatDateTime(d.created_at)}: <span className="font-semibold">{ACTION_LABELS[d.action]}</span>{" "}
                        ({d.reason_code.replaceAll("_", " ")}){d.note ? ` — ${d.note}` : ""}
                      </li>
                    ))}
                  </ul>
                )}
                {!EDITABLE.includes(r.status) && filesByReport.has(r.id) && (
                  <OpenDataFiles files={filesByReport.get(r.id)!} />
                )}
                <div className="mt-2 flex flex-wrap gap-2">
                  {r.status !== "draft" && (
                    <Link to={`/reports/${r.id}/history`} className={ROW_ACTION}>
                      History
                    </Link>
                  )}
                  {EDITABLE.includes(r.status) && (
                    <Link to={`/reports/${r.id}/edit`} className={cx(ROW_ACTION_BASE, "border-bay-700 text-bay-700")}>
                      {r.status === "returned" ? "Fix and resubmit" : "Continue"}
                    </Link>
                  )}
                  {WITHDRAWABLE.includes(r.status) && (
                    <Form method="post" action={`/reports/${r.id}/edit`}>
                      <input type="hidden" name="reportId" value={r.id} />
                      <button type="submit" name="intent" value="withdraw" className={ROW_ACTION}>
                        Withdraw
                      </button>
                    </Form>
                  )}
                </div>
              </li>
            ))}
          </ul>
        </section>
      ))}
    </div>
  );
}

export function meta() {
  return [{ title: "Your reports — Bayproof" }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
