// Display formatters shared by server and browser: one rule per quantity. Values arrive in SI and
// leave in the reader's unit.
import { kpaTo, lpsToScfm, mmToIn, type LengthUnit, type PressureUnit } from "./units";

/** Decimals a pressure is shown with: a gauge reads to about 1 psi, 0.1 bar or 1 kPa. */
const PRESSURE_DECIMALS: Record<PressureUnit, number> = { psi: 0, bar: 1, kPa: 0 };

export function formatPressure(kpa: number | null | undefined, unit: PressureUnit = "psi"): string {
  if (kpa == null) return "—";
  return `${kpaTo(kpa, unit).toFixed(PRESSURE_DECIMALS[unit])} ${unit}`;
}

export function formatHoseId(mm: number | null | undefined, unit: LengthUnit = "in"): string {
  if (mm == null) return "—";
  return unit === "in" ? `${formatInchFraction(mmToIn(mm))} in` : `${mm.toFixed(1)} mm`;
}

/** Hose bores are sold in sixteenths of an inch; show them that way. */
function formatInchFraction(inches: number): string {
  const sixteenths = Math.round(inches * 16);
  if (Math.abs(sixteenths / 16 - inches) > 0.01) return inches.toFixed(2);
  let n = sixteenths, d = 16;
  while (n % 2 === 0 && d > 1) { n /= 2; d /= 2; }
  return d === 1 ? String(n) : `${n}/${d}`;
}

/** Free-air flow in the reader's system: l/s, or SCFM. */
export function formatFlow(lps: number, unit: LengthUnit = "in"): string {
  return unit === "mm" ? `${lps.toFixed(2)} l/s` : `${lpsToScfm(lps).toFixed(1)} SCFM`;
}

/** A time to result: seconds, minutes or hours, as a long-tailed time reads best. */
export function formatDuration(seconds: number | null | undefined): string {
  if (seconds == null) return "—";
  if (seconds < 90) return `${Math.round(seconds)} s`;
  if (seconds < 5400) return `${Math.round(seconds / 60)} min`;
  return `${(seconds / 3600).toFixed(1)} h`;
}

/** How long a tank holds a tool: seconds up to two minutes, then minutes to a tenth. */
export const formatRunTime = (s: number) => (s < 120 ? `${Math.round(s)} s` : `${(s / 60).toFixed(1)} min`);

export function formatPrice(cents: number | null | undefined): string {
  if (cents == null) return "—";
  return `$${(cents / 100).toFixed(0)}`;
}

export function formatDate(value: Date | string | null | undefined): string {
  if (!value) return "—";
  return new Date(value).toISOString().slice(0, 10);
}

/**
 * A share or chance as a whole percent. A chance is never printed as 100 % or 0 % when it is not
 * exactly that: ">99 %" and "<1 %" (issue 16, item 8). Differences keep their sign.
 */
export const formatShare = (x: number) => {
  const a = Math.abs(x);
  if (a > 0 && a < 0.005) return x < 0 ? "−<1 %" : "<1 %";
  if (a >= 0.995 && a < 1) return x < 0 ? "−>99 %" : ">99 %";
  return `${x < 0 ? "−" : ""}${Math.round(a * 100)} %`;
};

/** A modelled probability (a chance, a prediction): never 100 % or 0 %, even when it rounds there. */
export const formatChance = (x: number) => (x >= 0.995 ? ">99 %" : x < 0.005 ? "<1 %" : `${Math.round(x * 100)} %`);
