// A day on each candidate: trigger time = the job's median time to free it with that tool (Kaplan–Meier,
// give-ups counted) × jobs a day, and what that time does to the hands and ears, with intervals carried
// from the time's interval. The cautions say what the figures mean and defer to local rules.
import { formatDose, formatDuration, formatShare } from "~/domain";
import type { CarriedInterval } from "~/exposure/day";
import type { VibrationBasis } from "~/exposure/in-use";
import type { Shortlist } from "~/exposure/shortlist";
import { ExposureCautions } from "../exposure/cautions";

const band = (x: CarriedInterval, f: (v: number) => string) =>
  x.lower != null && x.upper != null
    ? `${f(x.estimate)} (${f(x.lower)}–${f(x.upper)})`
    : `${f(x.estimate)} (no interval)`;

export function DayExposure({
  shortlist,
  jobsPerDay,
  basis,
}: {
  shortlist: Shortlist;
  jobsPerDay: number;
  basis: VibrationBasis;
}) {
  return (
    <section aria-labelledby="day-heading" className="space-y-2">
      <h3 id="day-heading" className="font-semibold">
        A day of {jobsPerDay} {jobsPerDay === 1 ? "job" : "jobs"}: hands and ears
      </h3>
      <div className="which-tool-stack sm:overflow-x-auto">
        <table className="w-full text-left text-sm sm:min-w-[40rem]" data-testid="day-exposure">
          <thead className="bg-stone-100 text-xs uppercase text-stone-600">
            <tr>
              <th className="px-3 py-2">Tool</th>
              <th className="px-3 py-2">Time on the trigger per job</th>
              <th className="px-3 py-2">Share of the daily vibration action value</th>
              <th className="px-3 py-2">Noise dose (NIOSH · OSHA)</th>
            </tr>
          </thead>
          <tbody className="divide-y divide-stone-100 align-top">
            {shortlist.passing.map((c) => (
              <tr key={c.slug}>
                <td className="px-3 py-2 font-semibold">{c.label}</td>
                <td className="px-3 py-2">
                  {c.time
                    ? `${formatDuration(c.time.median)}${c.time.lower != null && c.time.upper != null ? ` (${formatDuration(c.time.lower)}–${formatDuration(c.time.upper)})` : ""}`
                    : "no median yet: fewer than half its reports freed it"}
                </td>
                <td className="px-3 py-2">
                  {c.day ? band(c.day.shareOfActionValue, formatShare) : "—"}
                  {c.ahv != null && (
                    <div className="text-xs text-stone-600">
                      a_hv {c.ahv.toFixed(1)}
                      {c.ahvK != null && ` ± ${c.ahvK.toFixed(1)}`} m/s² (
                      {basis === "in-use" ? "in-use estimate" : "declared"})
                    </div>
                  )}
                </td>
                <td className="px-3 py-2">
                  {c.day
                    ? `${band(c.day.nioshDosePercent, formatDose)} · ${band(c.day.oshaDosePercent, formatDose)}`
                    : "—"}
                  {c.lpa != null && (
                    <div className="text-xs text-stone-600">
                      L_pA {c.lpa.toFixed(0)}
                      {c.lpaK != null && ` ± ${c.lpaK.toFixed(0)}`} dB (declared)
                    </div>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p className="text-xs text-stone-600">
        Vibration: A(8) = a_hv·√(T / 8 h) (ISO 5349-1), shown as the share of the dose at the exposure action value of
        2.5 m/s² A(8), so 100 % is the action value and 400 % the limit value of 5 m/s² (Directive 2002/44/EC). Noise:
        the share of the day's allowance at 85 dBA with a 3 dB exchange rate (NIOSH 98-126) and at 90 dBA with 5 dB
        (OSHA 29 CFR 1910.95), from the declared L_pA for the trigger time only. Intervals carry only the time's
        interval, not the declared values' own uncertainty K.{" "}
        {basis === "in-use"
          ? `In-use estimate: declared × ${shortlist.vibrationFactor.factor} (${shortlist.vibrationFactor.source}).`
          : "Declared values (ISO 28927, ISO 15744) as the maker measured them on a standard task."}
      </p>
      <ExposureCautions headingLevel={4} />
    </section>
  );
}
