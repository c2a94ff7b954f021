// Display helpers shared by server and browser. Values arrive in SI and leave in the reader's unit.
import { kpaTo, mmTo, type LengthUnit, type PressureUnit } from "~/air/units";

export const FITTING_LABELS: Record<string, string> = {
  "shank-0.401": "0.401 in shank",
  "shank-0.498": "0.498 in shank",
  "drive-1/4": "1/4 in drive",
  "drive-3/8": "3/8 in drive",
  "drive-1/2": "1/2 in drive",
  "drive-3/4": "3/4 in drive",
  "drive-1": "1 in drive",
};

export const OUTCOME_LABELS: Record<string, string> = {
  freed: "Freed",
  freed_with_help: "Freed with help",
  not_freed: "Not freed",
};

export const VEHICLE_LABELS: Record<string, string> = {
  passenger_car: "Passenger car",
  light_truck: "Light truck",
  heavy_truck: "Heavy truck",
  bus: "Bus",
  trailer: "Trailer",
  agricultural: "Agricultural",
  construction: "Construction equipment",
};

export const INLET_SOURCE_LABELS: Record<string, string> = {
  measured_at_inlet: "measured at the tool inlet",
  read_at_regulator: "read at the regulator",
  estimated: "estimated",
};

const decimals: Record<PressureUnit, number> = { psi: 0, bar: 1, kPa: 0 };

export function formatPressure(kpa: number | null | undefined, unit: PressureUnit = "psi"): string {
  if (kpa == null) return "—";
  return `${kpaTo(kpa, unit).toFixed(decimals[unit])} ${unit}`;
}

export function formatHoseId(mm: number | null | undefined, unit: LengthUnit = "in"): string {
  if (mm == null) return "—";
  return unit === "in" ? `${formatInchFraction(mmTo(mm, "in"))} in` : `${mm.toFixed(1)} mm`;
}

/** Hose bores are sold in sixteenths of an inch; show them that way. */
function formatInchFraction(inches: number): string {
  const sixteenths = Math.round(inches * 16);
  if (Math.abs(sixteenths / 16 - inches) > 0.01) return inches.toFixed(2);
  let n = sixteenths, d = 16;
  while (n % 2 === 0 && d > 1) { n /= 2; d /= 2; }
  return d === 1 ? String(n) : `${n}/${d}`;
}

export function formatDuration(seconds: number | null | undefined): string {
  if (seconds == null) return "—";
  if (seconds < 90) return `${Math.round(seconds)} s`;
  if (seconds < 5400) return `${Math.round(seconds / 60)} min`;
  return `${(seconds / 3600).toFixed(1)} h`;
}

export function formatPrice(cents: number | null | undefined): string {
  if (cents == null) return "—";
  return `$${(cents / 100).toFixed(0)}`;
}

export function formatDate(value: Date | string | null | undefined): string {
  if (!value) return "—";
  return new Date(value).toISOString().slice(0, 10);
}
