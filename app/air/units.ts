// Unit conversions. Everything is stored in SI (kPa gauge, mm, m, l/s of free air, N, kg);
// users enter and read the trade's units. Constants and their sources:
//   1 psi = 6.894757 kPa        (NIST SP 811, Appendix B: 6.894 757 E+00 kPa)
//   1 in = 25.4 mm exactly      (international inch, 1959)
//   1 ft = 0.3048 m exactly     → 1 ft³/min = 0.3048³ m³ / 60 s = 0.4719474 l/s
//   1 lbf = 4.448222 N          (NIST SP 811, Appendix B)
//   1 lb = 0.45359237 kg exactly
//   standard atmosphere for gauge ↔ absolute: 101.325 kPa; ISO 8778's reference
//   atmosphere for free air is 100 kPa (from memory), used where free-air volumes are scaled.

export const KPA_PER_PSI = 6.894757;
export const KPA_PER_BAR = 100;
export const MM_PER_IN = 25.4;
export const M_PER_FT = 0.3048;
export const LPS_PER_SCFM = (M_PER_FT ** 3 * 1000) / 60;
export const N_PER_LBF = 4.448222;
export const KG_PER_LB = 0.45359237;
export const ATMOSPHERE_KPA = 101.325;

export type PressureUnit = "psi" | "bar" | "kPa";
export type LengthUnit = "in" | "mm";
export type ForceUnit = "lbf" | "N";

const perKpa: Record<PressureUnit, number> = { psi: KPA_PER_PSI, bar: KPA_PER_BAR, kPa: 1 };

export const pressureToKpa = (value: number, unit: PressureUnit) => value * perKpa[unit];
export const kpaTo = (kpa: number, unit: PressureUnit) => kpa / perKpa[unit];
export const psiToKpa = (psi: number) => psi * KPA_PER_PSI;
export const kpaToPsi = (kpa: number) => kpa / KPA_PER_PSI;
export const barToKpa = (bar: number) => bar * KPA_PER_BAR;
export const kpaToBar = (kpa: number) => kpa / KPA_PER_BAR;
export const gaugeToAbsoluteKpa = (gaugeKpa: number, atmosphereKpa = ATMOSPHERE_KPA) => gaugeKpa + atmosphereKpa;
export const absoluteToGaugeKpa = (absKpa: number, atmosphereKpa = ATMOSPHERE_KPA) => absKpa - atmosphereKpa;

export const inToMm = (inches: number) => inches * MM_PER_IN;
export const mmToIn = (mm: number) => mm / MM_PER_IN;
export const ftToM = (ft: number) => ft * M_PER_FT;
export const mToFt = (m: number) => m / M_PER_FT;
export const lengthToMm = (value: number, unit: LengthUnit) => (unit === "in" ? inToMm(value) : value);
export const mmTo = (mm: number, unit: LengthUnit) => (unit === "in" ? mmToIn(mm) : mm);

export const scfmToLps = (scfm: number) => scfm * LPS_PER_SCFM;
export const lpsToScfm = (lps: number) => lps / LPS_PER_SCFM;

export const lbfToN = (lbf: number) => lbf * N_PER_LBF;
export const nToLbf = (n: number) => n / N_PER_LBF;
export const forceToN = (value: number, unit: ForceUnit) => (unit === "lbf" ? lbfToN(value) : value);
export const nTo = (n: number, unit: ForceUnit) => (unit === "lbf" ? nToLbf(n) : n);

export const lbToKg = (lb: number) => lb * KG_PER_LB;
export const kgToLb = (kg: number) => kg / KG_PER_LB;

/** The trade's rating point: 90 psi (6.2 bar) gauge at the tool inlet while running (common practice). */
export const RATED_INLET_KPA = psiToKpa(90);

/** 1 US gallon = 231 in³ = 3.785411784 l exactly. */
export const L_PER_US_GAL = 3.785411784;
export const galToL = (gal: number) => gal * L_PER_US_GAL;
export const lToGal = (l: number) => l / L_PER_US_GAL;
