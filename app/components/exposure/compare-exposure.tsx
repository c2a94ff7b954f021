// The compare page's exposure columns: each tool's declared vibration and noise beside the share of the
// day's action dose and the noise doses it would use for N of the compared job.
import { formatDecibels, formatDose, formatDuration, formatVibration } from "~/domain";
import type { CompareExposure } from "~/exposure/pages.server";
import { ExposureSettings } from "./basis-fields";
import { ExposureCautions } from "./cautions";
import { shareText, withInterval } from "./figures";

export function CompareExposurePanel({
  exposure,
  job,
  psi,
}: {
  exposure: CompareExposure;
  job: { slug: string; name: string };
  psi: number;
}) {
  const { perDay, basis, tools } = exposure;
  // The compare page's own query, kept when the exposure settings change.
  const keep = [["job", job.slug], ["psi", String(psi)], ...tools.map((t) => ["models", t.slug] as const)] as const;
  const pm = (v: number | null, k: number | null, f: (x: number) => string, kText: (x: number) => string) =>
    v == null ? "not declared" : `${f(v)}${k == null ? "" : ` ± ${kText(k)}`}`;
  return (
    <section aria-labelledby="exposure-heading" className="space-y-3">
      <h2 id="exposure-heading" className="text-lg font-semibold">
        {`Hands and ears: ${perDay} × ${job.name} a day`}
      </h2>
      <ExposureSettings perDay={perDay} basis={basis} id="compare-perday" keep={keep} />
      <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Exposure table, scrolls sideways">
        <table className="w-full text-left text-sm">
          <caption className="sr-only">
            Declared vibration and noise of each tool, and the day's exposure for {perDay} jobs
          </caption>
          <thead>
            <tr className="border-b border-stone-300">
              <th scope="col" className="py-1 pr-3">
                Tool
              </th>
              <th scope="col" className="py-1 pr-3">
                a_hv (declared)
              </th>
              <th scope="col" className="py-1 pr-3">
                L_pA
              </th>
              <th scope="col" className="py-1 pr-3">
                Time per job
              </th>
              <th scope="col" className="py-1 pr-3">
                Share of action dose
              </th>
              <th scope="col" className="py-1 pr-3">
                OSHA / NIOSH noise dose
              </th>
            </tr>
          </thead>
          <tbody>
            {tools.map((t) => (
              <tr key={t.slug} className="border-b border-stone-100 align-top">
                <th scope="row" className="py-1 pr-3 font-medium">
                  {t.label}
                </th>
                <td className="py-1 pr-3 tabular-nums">
                  {pm(t.declared.vibration_ahv_ms2, t.declared.vibration_k_ms2, formatVibration, (k) => k.toFixed(1))}
                </td>
                <td className="py-1 pr-3 tabular-nums">
                  {pm(t.declared.sound_pressure_db, t.declared.sound_pressure_k_db, formatDecibels, (k) => `${k} dB`)}
                </td>
                <td className="py-1 pr-3 tabular-nums">
                  {t.minutes
                    ? `${withInterval(t.minutes, (m) => formatDuration(m * 60))}${t.minutes.from === "freed" ? " (jobs freed only)" : ""}`
                    : "no time yet"}
                </td>
                <td className="py-1 pr-3 tabular-nums">
                  {t.day ? withInterval(t.day.shareOfActionValue, shareText) : "—"}
                </td>
                <td className="py-1 pr-3 tabular-nums">
                  {t.day
                    ? `${formatDose(t.day.oshaDosePercent.estimate)} / ${formatDose(t.day.nioshDosePercent.estimate)}`
                    : "—"}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <ExposureCautions />
    </section>
  );
}
