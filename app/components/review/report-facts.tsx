import {
  COUPLER_LABELS,
  FITTING_LABELS,
  formatDuration,
  formatFlow,
  formatHoseId,
  formatHoseLength,
  formatLength,
  formatPressure,
  formatTorque,
  formatVolume,
  formatWeight,
  INLET_SOURCE_LABELS,
  OUTCOME_LABELS,
  toolName,
  type Units,
  VEHICLE_LABELS,
} from "~/domain";
import type { ReviewData } from "~/moderation/review.server";

/** What was reported, the tool's specifications, the usual figures for the job and what changed since the last version. */
export function ReportFacts({
  review,
  units,
}: {
  review: Pick<ReviewData, "report" | "usual" | "changes">;
  units: Units;
}) {
  const { report: r, usual, changes } = review;
  const p = (kpa: number | null) => formatPressure(kpa, units);
  const rows: [string, string][] = [
    ["Tool", `${toolName(r.maker, r.model_code)} (${r.category})`],
    ["Job", r.job],
    ["Vehicle", VEHICLE_LABELS[r.vehicle_class ?? ""] ?? "—"],
    ["Part age", r.component_age_years == null ? "—" : `${r.component_age_years} years`],
    ["Corrosion", r.corrosion_level ?? "—"],
    [
      "Bit or socket",
      `${r.attachment ?? "—"}${r.attachment_length_mm ? `, ${formatLength(r.attachment_length_mm, units)}` : ""}`,
    ],
    ["Regulator", p(r.regulator_kpa)],
    ["At the tool inlet", `${p(r.inlet_kpa)} (${INLET_SOURCE_LABELS[r.inlet_source ?? ""] ?? "—"})`],
    ["Hose", `${formatHoseId(r.hose_id_mm, units)} × ${formatHoseLength(r.hose_length_m, units)}`],
    ["Couplers", `${r.coupler_count ?? "—"} × ${r.coupler_profile ? COUPLER_LABELS[r.coupler_profile] : "unknown"}`],
    ["Compressor", formatFlow(r.compressor_lps, units)],
    ["Tank", formatVolume(r.tank_l, units)],
    ["Outcome", OUTCOME_LABELS[r.outcome ?? ""] ?? "—"],
    ["Time to result", formatDuration(r.time_to_result_s)],
    ["Attempts", String(r.attempts ?? "—")],
    ["Trigger control", r.trigger_control ? `${r.trigger_control} of 5` : "—"],
  ];
  return (
    <section aria-labelledby="fields-heading">
      <h2 id="fields-heading" className="text-lg font-semibold">
        What was reported
      </h2>
      <dl className="mt-2 divide-y divide-stone-100 rounded-lg border border-stone-200 bg-white text-sm">
        {rows.map(([k, v]) => (
          <div key={k} className="flex justify-between gap-3 px-3 py-1.5">
            <dt className="text-stone-600">{k}</dt>
            <dd className="text-right">{v}</dd>
          </div>
        ))}
      </dl>
      {r.notes && <p className="mt-2 whitespace-pre-wrap rounded bg-white p-3 text-sm">{r.notes}</p>}
      <h3 className="mt-4 font-semibold">The tool's specifications</h3>
      <p className="text-sm text-stone-700">
        {FITTING_LABELS[r.fitting]} · {formatWeight(r.weight_kg, units)} · rated air{" "}
        {formatFlow(r.rated_air_lps, units)} · max inlet {p(r.max_inlet_kpa)}
        {r.blows_per_minute ? ` · ${r.blows_per_minute} bpm` : ""}
        {r.max_torque_nm ? ` · ${formatTorque(r.max_torque_nm, units)}` : ""}
      </p>
      <h3 className="mt-3 font-semibold">Usual for this job ({usual.n} accepted reports)</h3>
      <p className="text-sm text-stone-700">
        Time: {formatDuration(usual.time_q1)}–{formatDuration(usual.time_q3)} (middle half; median{" "}
        {formatDuration(usual.time_median)}) · inlet {p(usual.inlet_q1)}–{p(usual.inlet_q3)}
      </p>
      {changes.length > 0 && (
        <>
          <h3 className="mt-3 font-semibold">Changed since the previous version</h3>
          <ul className="text-sm">
            {changes.map((c) => (
              <li key={c.field}>
                <span className="font-semibold">{c.field.replaceAll("_", " ")}</span>: {shown(c.before)} →{" "}
                {shown(c.after)}
              </li>
            ))}
          </ul>
        </>
      )}
    </section>
  );
}

/** A stored value as the moderator reads it. */
const shown = (v: unknown) => (v == null || v === "" ? "—" : typeof v === "string" ? v : JSON.stringify(v));
