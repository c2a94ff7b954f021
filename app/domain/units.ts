// Unit conversions. Everything is stored in SI (kPa gauge, mm, m, l/s of free air, N, kg);
// users enter and read the trade's units. Constants and their sources:
//   1 psi = 6.894757 kPa        (NIST SP 811, Appendix B: 6.894 757 E+00 kPa)
//   1 in = 25.4 mm exactly      (international inch, 1959)
//   1 ft = 0.3048 m exactly     → 1 ft³/min = 0.3048³ m³ / 60 s = 0.4719474 l/s
//   1 lbf = 4.448222 N          (NIST SP 811, Appendix B)
//   1 US gallon = 231 in³ = 3.785411784 l exactly
//   1 lb = 0.45359237 kg exactly (international pound, 1959)
//   1 ft·lbf = 1.355818 N·m      (NIST SP 811, Appendix B)
//   standard atmosphere for gauge ↔ absolute: 101.325 kPa; ISO 8778's reference
//   atmosphere for free air is 100 kPa (from memory), used where free-air volumes are scaled.

export const KPA_PER_PSI = 6.894757;
export const KPA_PER_BAR = 100;
export const MM_PER_IN = 25.4;
export const M_PER_FT = 0.3048;
export const LPS_PER_SCFM = (M_PER_FT ** 3 * 1000) / 60;
export const N_PER_LBF = 4.448222;
export const L_PER_US_GAL = 3.785411784;
export const KG_PER_LB = 0.45359237;
export const NM_PER_FT_LBF = 1.355818;
export const ATMOSPHERE_KPA = 101.325;

/** The pressure units a user may pick (the users table's CHECK holds the same three). */
export const PRESSURE_UNITS = ["psi", "bar", "kPa"] as const;
export type PressureUnit = (typeof PRESSURE_UNITS)[number];
/**
 * The length unit a user picks names a whole system: "in" reads in · ft · SCFM · gal,
 * "mm" reads mm · m · l/s · l.
 */
export const LENGTH_UNITS = ["in", "mm"] as const;
export type LengthUnit = (typeof LENGTH_UNITS)[number];

/** The force units a user may pick, for bench figures. */
export const FORCE_UNITS = ["lbf", "N"] as const;
export type ForceUnit = (typeof FORCE_UNITS)[number];

/** Each system's units, by quantity: what a label or a message names. */
export const SYSTEM_UNITS = {
  in: { bore: "in", length: "in", hose: "ft", flow: "SCFM", volume: "gal" },
  mm: { bore: "mm", length: "mm", hose: "m", flow: "l/s", volume: "l" },
} as const satisfies Record<LengthUnit, Record<string, string>>;

const perKpa: Record<PressureUnit, number> = { psi: KPA_PER_PSI, bar: KPA_PER_BAR, kPa: 1 };

export const pressureToKpa = (value: number, unit: PressureUnit) => value * perKpa[unit];
export const kpaTo = (kpa: number, unit: PressureUnit) => kpa / perKpa[unit];
export const psiToKpa = (psi: number) => psi * KPA_PER_PSI;
export const kpaToPsi = (kpa: number) => kpa / KPA_PER_PSI;
export const barToKpa = (bar: number) => bar * KPA_PER_BAR;
export const gaugeToAbsoluteKpa = (gaugeKpa: number, atmosphereKpa = ATMOSPHERE_KPA) => gaugeKpa + atmosphereKpa;
export const absoluteToGaugeKpa = (absKpa: number, atmosphereKpa = ATMOSPHERE_KPA) => absKpa - atmosphereKpa;

export const inToMm = (inches: number) => inches * MM_PER_IN;
export const mmToIn = (mm: number) => mm / MM_PER_IN;
export const ftToM = (ft: number) => ft * M_PER_FT;
export const mToFt = (m: number) => m / M_PER_FT;

export const scfmToLps = (scfm: number) => scfm * LPS_PER_SCFM;
export const lpsToScfm = (lps: number) => lps / LPS_PER_SCFM;

export const galToL = (gal: number) => gal * L_PER_US_GAL;
export const lToGal = (l: number) => l / L_PER_US_GAL;

export const lbfToN = (lbf: number) => lbf * N_PER_LBF;

/** A value typed in a system's unit for a quantity, as SI (mm, m, l/s, l). */
export function toSi(quantity: keyof (typeof SYSTEM_UNITS)["in"], value: number, system: LengthUnit): number {
  if (system === "mm") return value;
  return { bore: inToMm, length: inToMm, hose: ftToM, flow: scfmToLps, volume: galToL }[quantity](value);
}

/** An SI value (mm, m, l/s, l) in a system's unit for a quantity. */
export function fromSi(quantity: keyof (typeof SYSTEM_UNITS)["in"], value: number, system: LengthUnit): number {
  if (system === "mm") return value;
  return { bore: mmToIn, length: mmToIn, hose: mToFt, flow: lpsToScfm, volume: lToGal }[quantity](value);
}

/** The trade's rating point: 90 psi (6.2 bar) gauge at the tool inlet while running (common practice). */
export const RATED_INLET_KPA = psiToKpa(90);

/**
 * A viewer reads every figure in one system (issue 18): US customary (psi · in · ft · SCFM · gal ·
 * lbf) or metric (kPa · mm · m · l/s · l · N). Metric readers may keep bar for pressure.
 */
export const UNIT_SYSTEMS = ["us", "metric"] as const;
export type UnitSystem = (typeof UNIT_SYSTEMS)[number];
export const UNIT_SYSTEM_LABELS: Record<UnitSystem, string> = { us: "US customary", metric: "Metric" };

/** The units one viewer reads and types figures in; every loader reaches it through `unitsFor(request)`. */
export interface Units {
  system: UnitSystem;
  pressure: PressureUnit;
  length: LengthUnit;
  force: ForceUnit;
}

/** A system's units; `pressure` keeps a metric reader's bar, and is psi in US units whatever is asked. */
export function unitsOf(system: UnitSystem, pressure?: PressureUnit): Units {
  if (system === "us") return { system, pressure: "psi", length: "in", force: "lbf" };
  return { system, pressure: pressure === "bar" ? "bar" : "kPa", length: "mm", force: "N" };
}

/** Units as part of a cache key: two viewers with the same key see the same figures. */
export const unitsKey = (units: Units) => `${units.system}/${units.pressure}/${units.length}/${units.force}`;

export const systemOfLength = (length: LengthUnit): UnitSystem => (length === "in" ? "us" : "metric");

/**
 * The system a visitor's browser suggests: the first language tag of Accept-Language (the order the
 * browser sends, weights ignored except q=0) whose region reads US customary — the United States and
 * its territories, Liberia and Myanmar (common practice) — else metric. A bare "en" reads US units,
 * as the trade's catalogues it is written against do; no header at all reads US units too.
 */
export function systemForLocale(acceptLanguage: string | null | undefined): UnitSystem {
  const first = (acceptLanguage ?? "")
    .split(",")
    .map((part) => part.trim().split(";"))
    .find(([tag, ...params]) => tag && tag !== "*" && !params.some((p) => /^\s*q\s*=\s*0(\.0*)?\s*$/.test(p)))?.[0];
  if (!first) return "us";
  const [language, ...rest] = first.toLowerCase().split(/[-_]/);
  const region = rest.find((s) => /^[a-z]{2}$|^\d{3}$/.test(s));
  if (!region) return language === "en" ? "us" : "metric";
  return ["us", "pr", "gu", "vi", "as", "mp", "um", "lr", "mm"].includes(region) ? "us" : "metric";
}
