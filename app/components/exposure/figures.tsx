// Small shared pieces of the exposure views: a figure with its carried interval, and the declared values.
import { formatDecibels, formatDose, formatHours, formatVibration, iso28927Label, SPEC_SOURCE_LABELS } from "~/domain";
import type { CarriedInterval, DayExposure } from "~/exposure";
import type { DeclaredFigures } from "~/exposure/pages.server";
import { DoseBar } from "./dose-bar";

/** "2.5 m/s² (1.8–3.5)", or the estimate alone where a bound is missing. */
export function withInterval(v: CarriedInterval, format: (x: number) => string): string {
  if (v.lower == null || v.upper == null) return `${format(v.estimate)} (no interval)`;
  return `${format(v.estimate)} (${format(v.lower)} to ${format(v.upper)})`;
}

export const shareText = (share: number) => formatDose(share * 100);

/** The declared values with their K, test code and source. */
export function DeclaredValues({ d }: { d: Omit<DeclaredFigures, "id"> }) {
  const src = (s: string | null) => (s ? (SPEC_SOURCE_LABELS[s] ?? s) : "");
  const pm = (k: number | null, f: (x: number) => string) => (k == null ? "" : ` ± ${f(k)}`);
  return (
    <dl className="grid gap-x-6 gap-y-1 text-sm sm:grid-cols-2">
      <div className="flex justify-between gap-3 border-b border-stone-100 py-1">
        <dt className="text-stone-600">Vibration total value a_hv</dt>
        <dd className="text-right">
          {d.vibration_ahv_ms2 == null ? (
            "not declared yet"
          ) : (
            <>
              {formatVibration(d.vibration_ahv_ms2)}
              {pm(d.vibration_k_ms2, (k) => k.toFixed(1))}{" "}
              <span className="text-xs text-stone-600">
                ({d.vibration_iso28927_part ? `${iso28927Label(d.vibration_iso28927_part)}, ` : ""}
                {src(d.vibration_source)})
              </span>
            </>
          )}
        </dd>
      </div>
      <div className="flex justify-between gap-3 border-b border-stone-100 py-1">
        <dt className="text-stone-600">Sound pressure L_pA</dt>
        <dd className="text-right">
          {d.sound_pressure_db == null ? (
            "not declared yet"
          ) : (
            <>
              {formatDecibels(d.sound_pressure_db)}
              {pm(d.sound_pressure_k_db, (k) => `${k} dB`)}{" "}
              <span className="text-xs text-stone-600">(ISO 15744, {src(d.sound_pressure_source)})</span>
            </>
          )}
        </dd>
      </div>
      <div className="flex justify-between gap-3 border-b border-stone-100 py-1">
        <dt className="text-stone-600">Sound power L_WA</dt>
        <dd className="text-right">
          {d.sound_power_db == null ? (
            "not declared"
          ) : (
            <>
              {formatDecibels(d.sound_power_db)}
              {pm(d.sound_power_k_db, (k) => `${k} dB`)}{" "}
              <span className="text-xs text-stone-600">(ISO 15744, {src(d.sound_power_source)})</span>
            </>
          )}
        </dd>
      </div>
    </dl>
  );
}

/** A day's figures as a list, with the two pictures: vibration against the action and limit values, noise dose. */
export function DayFigures({ day }: { day: DayExposure }) {
  return (
    <div className="space-y-3">
      <dl className="grid gap-x-6 gap-y-1 text-sm sm:grid-cols-2">
        {[
          ["Time on the trigger", withInterval(day.triggerHours, formatHours)],
          ["Vibration A(8)", withInterval(day.a8, formatVibration)],
          ["Share of the daily action dose", withInterval(day.shareOfActionValue, shareText)],
          ["Noise L_EX,8h", withInterval(day.lex8h, formatDecibels)],
          ["OSHA noise dose", withInterval(day.oshaDosePercent, formatDose)],
          ["NIOSH noise dose", withInterval(day.nioshDosePercent, formatDose)],
        ].map(([label, value]) => (
          <div key={label} className="flex justify-between gap-3 border-b border-stone-100 py-1">
            <dt className="text-stone-600">{label}</dt>
            <dd className="text-right tabular-nums">{value}</dd>
          </div>
        ))}
      </dl>
      <DoseBar
        title="Vibration dose, as a share of the daily action dose (A(8)² against 2.5²)"
        estimate={day.shareOfActionValue.estimate}
        lower={day.shareOfActionValue.lower}
        upper={day.shareOfActionValue.upper}
        marks={[
          { at: 1, label: "action value" },
          { at: 4, label: "limit value" },
        ]}
        unit={shareText}
      />
      <DoseBar
        title="Noise dose (NIOSH: 85 dBA, 3 dB exchange)"
        estimate={day.nioshDosePercent.estimate / 100}
        lower={day.nioshDosePercent.lower == null ? null : day.nioshDosePercent.lower / 100}
        upper={day.nioshDosePercent.upper == null ? null : day.nioshDosePercent.upper / 100}
        marks={[{ at: 1, label: "100 % of the day's dose" }]}
        unit={shareText}
      />
      <p className="text-xs text-stone-600">
        The share of the action dose is A(8)² / 2.5²: it adds across tools and doubles with time (100 % at the action
        value, 400 % at the limit value). OSHA's dose uses 90 dBA and a 5 dB exchange (29 CFR 1910.95); NIOSH's 85 dBA
        and 3 dB (DHHS/NIOSH 98-126). L_EX,8h by ISO 9612, A(8) by ISO 5349-1.
      </p>
    </div>
  );
}

/** Where a time per job came from, in words. */
export const TIME_FROM = {
  km: "median time to free it, give-ups counted",
  freed: "median of the jobs freed only (most gave up, so the day is understated)",
  typed: "your figure",
} as const;
