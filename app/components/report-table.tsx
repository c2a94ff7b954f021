import { Link } from "react-router";
import {
  formatDate,
  formatDuration,
  formatHoseId,
  formatHoseLength,
  formatPressure,
  type Labels,
  type Outcome,
  OUTCOME_LABELS,
  toolName,
  type Units,
  VEHICLE_LABELS,
} from "~/domain";
import type { AcceptedReportRow } from "~/catalogue/queries.server";
import { Card } from "./ui";

export { EvidenceGallery } from "./evidence-gallery";

const OUTCOME_STYLES: Labels<Outcome> = {
  freed: "bg-bay-100 text-bay-900",
  freed_with_help: "bg-amber-100 text-amber-900",
  not_freed: "bg-stone-200 text-stone-800",
};

export function OutcomeBadge({ outcome }: { outcome: string | null }) {
  if (!outcome) return null;
  return (
    <span className={`inline-block rounded px-2 py-0.5 text-xs font-semibold ${OUTCOME_STYLES[outcome] ?? ""}`}>
      {OUTCOME_LABELS[outcome] ?? outcome}
    </span>
  );
}

/** Accepted reports as cards on a phone and a table on wider screens. */
export function ReportList({
  reports,
  units,
  show = ["tool", "job"],
}: {
  reports: AcceptedReportRow[];
  units: Units;
  show?: ("tool" | "job")[];
}) {
  if (reports.length === 0) return <p className="text-stone-600">No accepted reports yet.</p>;
  return (
    <Card as="ul" padding="none" className="divide-y divide-stone-200">
      {reports.map((r) => (
        <li key={r.id} id={`report-${r.id}`} className="flex flex-col gap-1 p-3 sm:flex-row sm:items-center sm:gap-4">
          <div className="flex min-w-0 flex-1 flex-col">
            <div className="flex flex-wrap items-center gap-2">
              <OutcomeBadge outcome={r.outcome} />
              {show.includes("tool") && (
                <Link
                  to={`/models/${r.model_slug}`}
                  className="font-semibold text-bay-700 underline-offset-2 hover:underline"
                >
                  {toolName(r.maker_name, r.model_code)}
                </Link>
              )}
              {show.includes("job") && (
                <Link to={`/jobs/${r.job_slug}`} className="text-stone-800 underline-offset-2 hover:underline">
                  {r.job_name}
                </Link>
              )}
            </div>
            <p className="text-sm text-stone-600">
              {VEHICLE_LABELS[r.vehicle_class ?? ""] ?? "—"} · {r.corrosion_level} corrosion · by {r.reporter_handle} ·{" "}
              {formatDate(r.accepted_at)} ·{" "}
              <Link to={`/reports/${r.id}`} className="text-bay-700 underline">
                report {r.id}
              </Link>
            </p>
          </div>
          <dl className="grid grid-cols-3 gap-3 text-sm sm:w-80">
            <div>
              <dt className="text-xs text-stone-500">Inlet</dt>
              <dd>{formatPressure(r.inlet_kpa, units)}</dd>
            </div>
            <div>
              <dt className="text-xs text-stone-500">Hose</dt>
              <dd>
                {formatHoseId(r.hose_id_mm, units)} × {formatHoseLength(r.hose_length_m, units)}
              </dd>
            </div>
            <div>
              <dt className="text-xs text-stone-500">Time</dt>
              <dd>{formatDuration(r.time_to_result_s)}</dd>
            </div>
          </dl>
        </li>
      ))}
    </Card>
  );
}
