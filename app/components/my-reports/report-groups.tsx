import { Form, Link } from "react-router";
import { formatDate, formatDateTime, toolName } from "~/domain";
import { cx } from "~/components/ui";
import { OpenDataFiles } from "~/components/my-reports/open-data-files";
import { OutcomeBadge } from "~/components/report-table";
import { FLAG_EXPLANATIONS, type FlagCode } from "~/moderation/flags";
import type { publishableFiles } from "~/reports/evidence.server";
import type { listOwnReports } from "~/reports/reports.server";
import { EDITABLE, WITHDRAWABLE } from "~/reports/status";
import { groupBy } from "~/utils/group";

type OwnReport = Awaited<ReturnType<typeof listOwnReports>>[number];
type File = Awaited<ReturnType<typeof publishableFiles>>[number];

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

/** The reporter's reports, one section per status. */
export function ReportGroups({ reports, files }: { reports: OwnReport[]; files: File[] }) {
  const filesByReport = groupBy(files, (f) => f.report_id);
  const byStatus = groupBy(reports, (r) => r.status);
  return STATUS_ORDER.filter((s) => byStatus.has(s)).map((status) => (
    <section key={status} aria-labelledby={`st-${status}`}>
      <h2 id={`st-${status}`} className="mb-2 text-lg font-semibold">
        {STATUS_LABELS[status]} <span className="text-stone-500">({byStatus.get(status)!.length})</span>
      </h2>
      <ul className="space-y-2">
        {byStatus.get(status)!.map((r) => (
          <ReportRow key={r.id} r={r} files={filesByReport.get(r.id)} />
        ))}
      </ul>
    </section>
  ));
}

function ReportRow({ r, files }: { r: OwnReport; files: File[] | undefined }) {
  return (
    <li className="rounded-lg border border-stone-200 bg-white p-3" data-testid={`report-${r.id}`}>
      <div className="flex flex-wrap items-center gap-2">
        <span className="font-semibold">#{r.id}</span>
        <span>{toolName(r.maker_name, r.model_code)}</span>
        <span className="text-stone-600">· {r.job_name}</span>
        <OutcomeBadge outcome={r.outcome} />
        <span className="ml-auto text-xs text-stone-500">
          {r.submitted_at ? `submitted ${formatDate(r.submitted_at)}` : `started ${formatDate(r.created_at)}`} · v
          {r.version} · {r.evidence} files
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
              {formatDateTime(d.created_at)}: <span className="font-semibold">{ACTION_LABELS[d.action]}</span> (
              {d.reason_code.replaceAll("_", " ")}){d.note ? ` — ${d.note}` : ""}
            </li>
          ))}
        </ul>
      )}
      {!EDITABLE.includes(r.status) && files && <OpenDataFiles files={files} />}
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
  );
}
