// An accepted report's structured fields as its public page lists them, in the reader's units.
import {
  COUPLER_LABELS,
  formatDuration,
  formatFlow,
  formatHoseId,
  formatHoseLength,
  formatLength,
  formatPressure,
  formatVolume,
  INLET_SOURCE_LABELS,
  OUTCOME_LABELS,
  type Units,
  VEHICLE_LABELS,
} from "~/domain";
import type { PublicReport } from "~/reports/public.server";
import { Card } from "./ui";

export function ReportFacts({ report: r, units }: { report: PublicReport["report"]; units: Units }) {
  const rows: [string, string | null][] = [
    ["Vehicle", r.vehicle_class ? (VEHICLE_LABELS[r.vehicle_class] ?? r.vehicle_class) : null],
    ["Component age", r.component_age_years == null ? null : `${r.component_age_years} years`],
    ["Corrosion", r.corrosion_level],
    [
      "Bit or socket",
      r.attachment
        ? `${r.attachment}${r.attachment_length_mm != null ? `, ${formatLength(r.attachment_length_mm, units)}` : ""}`
        : null,
    ],
    ["Regulator", r.regulator_kpa == null ? null : formatPressure(r.regulator_kpa, units)],
    [
      "Pressure at the tool",
      r.inlet_kpa == null
        ? null
        : `${formatPressure(r.inlet_kpa, units)}${r.inlet_source ? ` (${INLET_SOURCE_LABELS[r.inlet_source]})` : ""}`,
    ],
    [
      "Hose",
      r.hose_id_mm == null
        ? null
        : `${formatHoseId(r.hose_id_mm, units)} × ${formatHoseLength(r.hose_length_m, units)}`,
    ],
    [
      "Couplers",
      r.coupler_count == null
        ? null
        : `${r.coupler_count}${r.coupler_profile ? ` × ${COUPLER_LABELS[r.coupler_profile]}` : ""}`,
    ],
    ["Compressor delivers", r.compressor_lps == null ? null : formatFlow(r.compressor_lps, units)],
    ["Tank", r.tank_l == null ? null : formatVolume(r.tank_l, units)],
    ["Outcome", r.outcome ? OUTCOME_LABELS[r.outcome] : null],
    ["Time to result", r.time_to_result_s == null ? null : formatDuration(r.time_to_result_s)],
    ["Attempts", r.attempts == null ? null : String(r.attempts)],
    ["Trigger control", r.trigger_control == null ? null : `${r.trigger_control} of 5 (1 = hard to feather, 5 = easy)`],
  ];
  return (
    <Card as="section" aria-labelledby="facts-heading">
      <h2 id="facts-heading" className="mb-2 font-semibold">
        What the reporter recorded
      </h2>
      <dl className="grid gap-x-6 gap-y-1 sm:grid-cols-2">
        {rows
          .filter(([, v]) => v != null)
          .map(([label, value]) => (
            <div key={label} className="flex justify-between gap-3 border-b border-stone-100 py-1 text-sm">
              <dt className="text-stone-600">{label}</dt>
              <dd className="text-right">{value}</dd>
            </div>
          ))}
      </dl>
      {r.notes && (
        <div className="mt-3 text-sm">
          <h3 className="font-semibold">Notes</h3>
          <p className="whitespace-pre-line text-stone-800">{r.notes}</p>
        </div>
      )}
    </Card>
  );
}
