// A day on each candidate: trigger time = the job's median time to free it with that tool (Kaplan–Meier,
// give-ups counted) × jobs a day, and what that time does to the hands and ears, with intervals carried
// from the time's interval. The cautions say what the figures mean and defer to local rules.
import { formatDose, formatDuration, formatShare } from "~/domain";
import type { CarriedInterval } from "~/exposure/day";
import type { Shortlist } from "~/exposure/shortlist";

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
  basis: "declared" | "in-use";
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
      <ExposureCautions />
    </section>
  );
}

/** What the exposure figures mean and do not: cautions beside every day's figures. */
export function ExposureCautions() {
  return (
    <aside
      aria-labelledby="exposure-cautions-heading"
      className="rounded-lg border-l-4 border-signal-500 bg-signal-100 p-3 text-sm text-stone-800"
    >
      <h4 id="exposure-cautions-heading" className="mb-1 font-semibold">
        Reading these figures
      </h4>
      <ul className="list-disc space-y-1 pl-5">
        <li>
          The action value is where an employer must start reducing exposure; the limit value must not be exceeded
          (Directive 2002/44/EC, in the EU; other places set their own values and duties).
        </li>
        <li>
          Declared values come from a standard test task. A seized ball joint, a worn bit or an awkward angle often
          vibrates more, so a declared figure can understate the real day — try the in-use estimate.
        </li>
        <li>
          Anti-vibration gloves are no substitute for less time on the trigger: a tool that frees the job sooner, or
          fewer jobs a day on it, cuts the dose.
        </li>
        <li>
          Wear hearing protection with percussive tools; the doses here count only this tool, not the rest of the shop's
          noise.
        </li>
        <li>
          Tingling, numbness or white fingers after work are reasons to see occupational health; people regularly
          exposed should be under health surveillance.
        </li>
      </ul>
      <p className="mt-1 text-stone-700">
        These are estimates for planning. Local regulations, your occupational-health service and the maker's
        instructions come first.
      </p>
    </aside>
  );
}
