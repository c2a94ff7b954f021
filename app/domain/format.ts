// Display formatters shared by server and browser: one rule per quantity. Values arrive in SI and
// leave in the reader's unit.
import {
  kpaTo,
  lpsToScfm,
  lToGal,
  mmToIn,
  mToFt,
  KG_PER_LB,
  N_PER_LBF,
  NM_PER_FT_LBF,
  unitsOf,
  type LengthUnit,
  type PressureUnit,
  type Units,
} from "./units";

/** What a formatter is told about the reader: their `Units`, or (older callers) one unit of the system. */
type PressureIn = PressureUnit | Units;
type SystemIn = LengthUnit | Units;
const pressureOf = (u: PressureIn) => (typeof u === "string" ? u : u.pressure);
const metric = (u: SystemIn) => (typeof u === "string" ? u === "mm" : u.system === "metric");
/** The default reader, for callers that name no units: US customary. */
export const US_UNITS: Units = unitsOf("us");
export const METRIC_UNITS: Units = unitsOf("metric");

/** Decimals a pressure is shown with: a gauge reads to about 1 psi, 0.1 bar or 1 kPa. */
const PRESSURE_DECIMALS: Record<PressureUnit, number> = { psi: 0, bar: 1, kPa: 0 };

export function formatPressure(kpa: number | null | undefined, unit: PressureIn = "psi"): string {
  if (kpa == null) return "—";
  const u = pressureOf(unit);
  return `${kpaTo(kpa, u).toFixed(PRESSURE_DECIMALS[u])} ${u}`;
}

/** A hose's bore: trade fractions of an inch ("3/8 in"), or millimetres to a tenth. */
export function formatHoseId(mm: number | null | undefined, unit: SystemIn = "in"): string {
  if (mm == null) return "—";
  return metric(unit) ? `${mm.toFixed(1)} mm` : `${formatInchFraction(mmToIn(mm))} in`;
}

/**
 * Inches as hose is sold: to the nearest sixteenth when it lies within 0.005 in ("1/4", "3/8",
 * "1 1/2"; a bore stored to 0.01 mm is well inside), else to two decimals.
 */
export function formatInchFraction(inches: number): string {
  const n16 = Math.round(inches * 16);
  if (Math.abs(n16 / 16 - inches) > 0.005) return inches.toFixed(2);
  const whole = Math.floor(n16 / 16);
  let n = n16 - whole * 16;
  let d = 16;
  while (n > 0 && n % 2 === 0) {
    n /= 2;
    d /= 2;
  }
  if (n === 0) return String(whole);
  return whole > 0 ? `${whole} ${n}/${d}` : `${n}/${d}`;
}

/** A bit's or a tool's length, a bore or a stroke: inches (two decimals under 2 in, else one), or whole millimetres. */
export function formatLength(mm: number | null | undefined, unit: SystemIn = "in"): string {
  if (mm == null) return "—";
  if (metric(unit)) return `${trim(mm, mm < 10 ? 1 : 0)} mm`;
  const inches = mmToIn(mm);
  return `${inches.toFixed(inches < 2 ? 2 : 1)} in`;
}

/** A tool's weight: pounds or kilograms, to a tenth. */
export function formatWeight(kg: number | null | undefined, unit: SystemIn = "in"): string {
  if (kg == null) return "—";
  return metric(unit) ? `${trim(kg, 1)} kg` : `${trim(kg / KG_PER_LB, 1)} lb`;
}

/** A torque: foot-pound-force or newton-metres, whole. */
export function formatTorque(nm: number | null | undefined, unit: SystemIn = "in"): string {
  if (nm == null) return "—";
  return metric(unit) ? `${Math.round(nm)} N·m` : `${Math.round(nm / NM_PER_FT_LBF)} ft·lbf`;
}

/** A hose's length: whole feet, or metres to a tenth. */
export function formatHoseLength(m: number | null | undefined, unit: SystemIn = "in"): string {
  if (m == null) return "—";
  return metric(unit) ? `${trim(m, 1)} m` : `${Math.round(mToFt(m))} ft`;
}

/** Free-air flow in the reader's system: l/s, or SCFM. */
export function formatFlow(lps: number | null | undefined, unit: SystemIn = "in"): string {
  if (lps == null) return "—";
  return metric(unit) ? `${lps.toFixed(2)} l/s` : `${lpsToScfm(lps).toFixed(1)} SCFM`;
}

/** A tank's volume: whole US gallons, or whole litres. */
export function formatVolume(l: number | null | undefined, unit: SystemIn = "in"): string {
  if (l == null) return "—";
  return metric(unit) ? `${Math.round(l)} l` : `${Math.round(lToGal(l))} gal`;
}

/** A force (bench figures): pound-force or newtons, whole. */
export function formatForce(n: number | null | undefined, unit: SystemIn = "in"): string {
  if (n == null) return "—";
  return metric(unit) ? `${Math.round(n)} N` : `${Math.round(n / N_PER_LBF)} lbf`;
}

/** A number to at most `digits` decimals, without trailing zeros. */
const trim = (x: number, digits: number) => String(Number(x.toFixed(digits)));

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

// One date and time format across the site (DEVELOPERS.md): "2 Dec 2026" and "2 Dec 2026, 14:05 UTC".
// Always UTC, and said so: the server and the browser then print the same text (no hydration
// mismatch), and a moderator and a reporter in different zones read the same time.
const MONTHS = ["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"];
const pad = (n: number) => String(n).padStart(2, "0");
const toDate = (value: Date | string | number) => (value instanceof Date ? value : new Date(value));

/** A day: "2 Dec 2026" (UTC). */
export function formatDate(value: Date | string | number | null | undefined): string {
  if (value == null || value === "") return "—";
  const d = toDate(value);
  if (Number.isNaN(d.getTime())) return "—";
  return `${d.getUTCDate()} ${MONTHS[d.getUTCMonth()]} ${d.getUTCFullYear()}`;
}

/** A moment: "2 Dec 2026, 14:05 UTC". */
export function formatDateTime(value: Date | string | number | null | undefined): string {
  if (value == null || value === "") return "—";
  const d = toDate(value);
  if (Number.isNaN(d.getTime())) return "—";
  return `${formatDate(d)}, ${formatTime(d)}`;
}

/** A time of day on a day the page already names: "14:05 UTC". */
export function formatTime(value: Date | string | number): string {
  const d = toDate(value);
  if (Number.isNaN(d.getTime())) return "—";
  return `${pad(d.getUTCHours())}:${pad(d.getUTCMinutes())} UTC`;
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

// Exposure figures (issue 21): the same in every unit system.
/** A vibration value or A(8): m/s² to a tenth ("8.1 m/s²"). */
export const formatVibration = (ms2: number | null | undefined) => (ms2 == null ? "—" : `${ms2.toFixed(1)} m/s²`);
/** A sound level: whole decibels ("98 dB"); no exposure at all has no level. */
export const formatDecibels = (db: number | null | undefined) =>
  db == null || !Number.isFinite(db) ? "—" : `${Math.round(db)} dB`;
/** A dose or a share of an exposure value, in percent of it: whole percent, "<1 %" for a trace. */
export const formatDose = (percent: number | null | undefined) =>
  percent == null ? "—" : percent > 0 && percent < 0.5 ? "<1 %" : `${Math.round(percent).toLocaleString("en-US")} %`;
/** Hours on the tools: through formatDuration ("45 min", "2.5 h"). */
export const formatHours = (hours: number | null | undefined) => formatDuration(hours == null ? null : hours * 3600);
