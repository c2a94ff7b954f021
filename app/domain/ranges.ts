// The range of every quantity a form takes, in SI: the forms check against these, the feed
// publishes them, and the reports table's CHECK constraints (migrations/) hold the same bounds.
// Each range also carries its bounds as the trade would state them in other units, rounded for a
// message ("at most 330 ft" for 100 m): the SI comparison decides, the words only explain.

export interface Range {
  /** SI unit symbol of min and max (as the feed publishes it); none for counts and ratings. */
  unit?: string;
  min: number;
  max: number;
  /** The value must be more than `min` (a hose of no length, a tank of no volume). */
  aboveMin?: boolean;
  /** The bounds as written in messages, by the unit the reader typed in. */
  stated: Record<string, readonly [string, string]>;
}

export const RANGES = {
  /** Any gauge pressure: regulator, tool inlet, tank cut-out. 2,000 kPa ≈ 290 psi. */
  gaugePressure: {
    unit: "kPa",
    min: 0,
    max: 2000,
    stated: { kPa: ["0", "2,000"], psi: ["0", "290"], bar: ["0", "20"] },
  },
  /** Hose inside diameter. 4 mm ≈ 5/32 in. */
  hoseBore: { unit: "mm", min: 4, max: 25, stated: { mm: ["4", "25"], in: ["5/32", "1"] } },
  hoseLength: { unit: "m", min: 0, aboveMin: true, max: 100, stated: { m: ["0", "100"], ft: ["0", "330"] } },
  attachmentLength: { unit: "mm", min: 0, aboveMin: true, max: 1000, stated: { mm: ["0", "1,000"], in: ["0", "39"] } },
  /** Compressor free-air delivery. */
  compressorDelivery: {
    unit: "L/s",
    min: 0,
    aboveMin: true,
    max: 500,
    stated: { "l/s": ["0", "500"], SCFM: ["0", "1,000"] },
  },
  tankVolume: { unit: "L", min: 0, aboveMin: true, max: 5000, stated: { l: ["0", "5,000"], gal: ["0", "1,300"] } },
  /** A tool's rated air use (free air at 90 psi), as typed into the calculator. */
  toolAirUse: { unit: "L/s", min: 0.1, max: 50, stated: { "l/s": ["0.1", "50"], SCFM: ["0.2", "100"] } },
  couplerCount: { min: 0, max: 10, stated: {} },
  componentAge: { unit: "a", min: 0, max: 80, stated: {} },
  timeToResult: { unit: "s", min: 1, max: 28800, stated: {} },
  attempts: { min: 1, max: 50, stated: {} },
  triggerControl: { min: 1, max: 5, stated: {} },
  /** Catalogue (tool_models, migration 2026-12-02T19.00): declared vibration total value a_hv and its K. */
  vibrationTotal: { unit: "m/s²", min: 0, aboveMin: true, max: 100, stated: { "m/s²": ["0", "100"] } },
  vibrationK: { unit: "m/s²", min: 0, max: 50, stated: { "m/s²": ["0", "50"] } },
  iso28927Part: { min: 1, max: 13, stated: {} },
  /** Declared A-weighted emission sound pressure level L_pA, sound power level L_WA, and their K. */
  soundPressure: { unit: "dB", min: 40, max: 140, stated: { dB: ["40", "140"] } },
  soundPower: { unit: "dB", min: 50, max: 160, stated: { dB: ["50", "160"] } },
  soundK: { unit: "dB", min: 0, max: 10, stated: { dB: ["0", "10"] } },
  /** A tool's weight with its hose whip fitted (never below its own weight). 50 kg ≈ 110 lb. */
  weightWithWhip: { unit: "kg", min: 0, aboveMin: true, max: 50, stated: { kg: ["0", "50"], lb: ["0", "110"] } },
} as const satisfies Record<string, Range>;

/** Whether an SI value lies within the range. */
export const inRange = (range: Range, si: number) =>
  (range.aboveMin ? si > range.min : si >= range.min) && si <= range.max;

function stated(range: Range, unit: string): readonly [string, string] {
  const bounds = range.stated[unit];
  if (!bounds) throw new Error(`no stated bounds in ${unit}`);
  return bounds;
}

/** The form's message: "Between 4 and 25 mm", "More than 0, at most 330 ft". */
export function rangeMessage(range: Range, unit: string): string {
  const [lo, hi] = stated(range, unit);
  return range.aboveMin ? `More than ${lo}, at most ${hi} ${unit}` : `Between ${lo} and ${hi} ${unit}`;
}

/** The short form for a compact panel: "5/32–1 in", "up to 330 ft". */
export function rangeShort(range: Range, unit: string): string {
  const [lo, hi] = stated(range, unit);
  return range.aboveMin && range.min === 0 ? `up to ${hi} ${unit}` : `${lo}–${hi} ${unit}`;
}

/** Pressures are checked in kPa whatever the unit typed, and say so: "Between 0 and 2,000 kPa (290 psi)". */
export const PRESSURE_RANGE_MESSAGE = `${rangeMessage(RANGES.gaugePressure, "kPa")} (${RANGES.gaugePressure.stated.psi[1]} psi)`;

/**
 * Decimal places a report's SI value is stored with: the precision it is entered at, so the open feed
 * publishes 661.9, not 661.9000000000001. Bores keep 0.001 mm so a trade fraction stays exact
 * (3/8 in = 9.525 mm); times are whole seconds.
 */
export const STORED_DECIMALS = {
  regulator_kpa: 1,
  inlet_kpa: 1,
  hose_id_mm: 3,
  attachment_length_mm: 1,
  hose_length_m: 2,
  compressor_lps: 2,
  tank_l: 1,
  time_to_result_s: 0,
} as const;

/** Rounds half away from zero at `decimals` places on the decimal digits (9.525 → 9.53), not on the binary value. */
export function roundDecimals(value: number, decimals: number): number {
  const sign = value < 0 ? -1 : 1;
  return sign * Number(`${Math.round(Number(`${Math.abs(value)}e${decimals}`))}e-${decimals}`);
}
