// Noise: the daily exposure level L_EX,8h and the OSHA and NIOSH daily doses from each tool's A-weighted
// sound pressure level and its time. Pure functions; no framework, no database.

/** OSHA criterion level, exchange rate and threshold (29 CFR 1910.95, Table G-16/G-16a — published). */
export const OSHA_NOISE = { criterionDb: 90, exchangeDb: 5, thresholdDb: 80 } as const;
/** NIOSH recommended exposure limit: 85 dBA as an 8-h TWA, 3 dB exchange rate (DHHS/NIOSH 98-126 — published). */
export const NIOSH_NOISE = { criterionDb: 85, exchangeDb: 3, thresholdDb: 80 } as const;

export interface NoiseExposure {
  /** A-weighted emission sound pressure level at the operator, L_pA in dB (declared under ISO 15744). */
  lpa: number;
  /** Time exposed at that level, in hours per day. */
  hours: number;
}

export interface NoiseDay {
  /** Daily noise exposure level L_EX,8h in dB(A); −Infinity when there is no time at all. */
  lex8h: number;
  /** OSHA 29 CFR 1910.95 Appendix A daily dose, percent (100 = the permissible exposure). */
  oshaDosePercent: number;
  /** Dose against the NIOSH recommended exposure limit, percent (100 = the REL). */
  nioshDosePercent: number;
}

function check(exposures: readonly NoiseExposure[]) {
  for (const { lpa, hours } of exposures) {
    if (!Number.isFinite(lpa)) throw new RangeError("lpa must be a finite number (dB)");
    if (!Number.isFinite(hours) || hours < 0) throw new RangeError("hours must be a finite number ≥ 0");
  }
}

/**
 * Permissible hours at a level under OSHA: T = 8 / 2^((L − 90)/5) (29 CFR 1910.95 Appendix A, the
 * footnote formula of Table G-16a — published; 90 dBA → 8 h, 95 → 4 h, 100 → 2 h, 115 → 0.25 h).
 */
export function oshaPermissibleHours(lpa: number): number {
  return 8 / 2 ** ((lpa - OSHA_NOISE.criterionDb) / OSHA_NOISE.exchangeDb);
}

/** Hours to the NIOSH REL at a level: T = 8 / 2^((L − 85)/3) (NIOSH 98-126 — published; 88 → 4 h, 94 → 1 h). */
export function nioshPermissibleHours(lpa: number): number {
  return 8 / 2 ** ((lpa - NIOSH_NOISE.criterionDb) / NIOSH_NOISE.exchangeDb);
}

/**
 * L_EX,8h = 10 · log10(Σ (T_i / 8 h) · 10^(L_i/10)) (ISO 9612:2009 — published formula).
 * OSHA dose D = 100 · Σ C_i / T_i (29 CFR 1910.95 Appendix A — published). Levels below 80 dBA are not
 * counted: Table G-16a begins at 80 dBA (published) and 1910.95(d)(2)(i) integrates sound levels from
 * 80 to 130 dB (from memory). The NIOSH dose is the same sum with NIOSH's permissible times; its
 * Table 1-1 also begins at 80 dBA (NIOSH 98-126; its 80 dBA → 25 h 24 min is published in CDC's
 * summary), and we count from 80 dBA likewise (the threshold itself from memory). Air tools declare
 * levels far above 80 dBA, so the threshold matters only for a quiet entry.
 */
export function noiseDose(exposures: readonly NoiseExposure[]): NoiseDay {
  check(exposures);
  let energy = 0; // Σ T/8 · 10^(L/10)
  let osha = 0;
  let niosh = 0;
  for (const { lpa, hours } of exposures) {
    if (hours === 0) continue;
    energy += (hours / 8) * 10 ** (lpa / 10);
    if (lpa >= OSHA_NOISE.thresholdDb) osha += hours / oshaPermissibleHours(lpa);
    if (lpa >= NIOSH_NOISE.thresholdDb) niosh += hours / nioshPermissibleHours(lpa);
  }
  return {
    lex8h: energy > 0 ? 10 * Math.log10(energy) : Number.NEGATIVE_INFINITY,
    oshaDosePercent: 100 * osha,
    nioshDosePercent: 100 * niosh,
  };
}
