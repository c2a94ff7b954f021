// The buyer's shortlist on a job page: the constraints and priorities a shopper sets in the address
// (a GET form, so a shortlist is a link). Each field is read on its own: what parses is used, what does
// not gets its own message and is left out, and the typed text is kept for the form. Values in SI.
import { z } from "zod";
import {
  inRange,
  KG_PER_LB,
  parseMeasure,
  RANGES,
  rangeShort,
  SHANKS,
  type Shank,
  SYSTEM_UNITS,
  toSi,
  UNIT_SYSTEMS,
  type UnitSystem,
} from "~/domain";
import { VIBRATION_BASES, type VibrationBasis } from "./in-use";

/** The criteria a shopper can weigh, in the order the form lists them. */
export const SHORTLIST_CRITERIA = ["chance", "time", "weight", "price", "vibration"] as const;
export type ShortlistCriterion = (typeof SHORTLIST_CRITERIA)[number];

export const CRITERION_LABELS: Record<ShortlistCriterion, string> = {
  chance: "Chance it frees the job at your air",
  time: "Time to free it",
  weight: "Weight",
  price: "Price",
  vibration: "Share of the daily vibration action value",
};

/** Which way is better on each criterion. */
export const CRITERION_BETTER: Record<ShortlistCriterion, "higher" | "lower"> = {
  chance: "higher",
  time: "lower",
  weight: "lower",
  price: "lower",
  vibration: "lower",
};

/** How much each criterion counts in the best-pick draw, as the form offers it. */
export const WEIGHT_CHOICES = [
  { value: 0, label: "not at all" },
  { value: 1, label: "a little" },
  { value: 2, label: "a lot" },
  { value: 3, label: "most" },
] as const;
export const DEFAULT_WEIGHTS: Record<ShortlistCriterion, number> = {
  chance: 3,
  time: 2,
  weight: 1,
  price: 1,
  vibration: 1,
};
export const weightParam = (c: ShortlistCriterion) => `w_${c}`;

export interface ShortlistAsk {
  system: UnitSystem;
  bits: Shank | null;
  maxWeightKg: number | null;
  maxLengthMm: number | null;
  maxPriceCents: number | null;
  /** The compressor's free-air delivery, l/s: the air the shopper's supply can feed while the tool runs. */
  compressorLps: number | null;
  /** 0–1. */
  minChance: number | null;
  jobsPerDay: number;
  /** 0–10 (share of the daily action value; 1 = all of it). */
  maxVibrationShare: number | null;
  basis: VibrationBasis;
  weights: Record<ShortlistCriterion, number>;
  seed: number;
}

const MAX_JOBS_PER_DAY = 100;
const MAX_SEED = 2 ** 31 - 1;

const positive = (max: number, message: string) =>
  z.preprocess(parseMeasure, z.number({ error: message }).positive(message).max(max, message));

/** One schema per field, so one bad field costs only itself. */
function fieldSchemas(system: UnitSystem) {
  const lu = system === "us" ? "in" : "mm";
  const flowUnit = SYSTEM_UNITS[lu].flow;
  return {
    bits: z.enum(SHANKS, { error: "Bits: 0.401 or 0.498 in shank" }),
    maxw: positive(
      system === "us" ? 100 : 45,
      `Maximum weight: more than 0, at most ${system === "us" ? "100 lb" : "45 kg"}`,
    ).transform((w) => (system === "us" ? w * KG_PER_LB : w)),
    maxl: positive(
      system === "us" ? 60 : 1500,
      `Maximum length: more than 0, at most ${system === "us" ? "60 in" : "1,500 mm"}`,
    ).transform((l) => toSi("length", l, lu)),
    maxp: positive(100000, "Maximum price: more than $0, at most $100,000").transform((d) => Math.round(d * 100)),
    comp: z
      .preprocess(parseMeasure, z.number({ error: `Compressor: a number of ${flowUnit}` }))
      .transform((v) => toSi("flow", v, lu))
      .refine(
        (lps) => inRange(RANGES.compressorDelivery, lps),
        `Compressor: ${rangeShort(RANGES.compressorDelivery, flowUnit)}`,
      ),
    minc: z
      .preprocess(
        parseMeasure,
        z
          .number({ error: "Least chance: a percent, 0–100" })
          .min(0, "Least chance: 0–100 %")
          .max(100, "Least chance: 0–100 %"),
      )
      .transform((p) => p / 100),
    jobs: z.preprocess(
      parseMeasure,
      z
        .number({ error: "Jobs a day: a whole number" })
        .int("Jobs a day: a whole number")
        .min(1, `Jobs a day: 1–${MAX_JOBS_PER_DAY}`)
        .max(MAX_JOBS_PER_DAY, `Jobs a day: 1–${MAX_JOBS_PER_DAY}`),
    ),
    maxv: positive(1000, "Most vibration: more than 0, at most 1,000 % of the action value").transform((p) => p / 100),
    vb: z.enum(VIBRATION_BASES, { error: "Vibration value: declared or in-use" }),
    seed: z.preprocess(
      parseMeasure,
      z
        .number({ error: "Seed: a whole number" })
        .int("Seed: a whole number")
        .min(1, "Seed: 1 or more")
        .max(MAX_SEED, "Seed: too large"),
    ),
    weight: z.preprocess(parseMeasure, z.number().int().min(0).max(3)),
  };
}

/** The units the form's figures are typed in (the `u` field keeps a shared link's meaning). */
export function shortlistUnits(system: UnitSystem) {
  const lu = system === "us" ? "in" : "mm";
  return { weight: system === "us" ? "lb" : "kg", length: lu, flow: SYSTEM_UNITS[lu].flow } as const;
}

/**
 * The shortlist the address asks for, in SI, and a message per field that could not be used.
 * `viewer` is the reader's own system, used when the link does not say which it was typed in.
 */
export function readShortlist(
  search: Record<string, string>,
  viewer: UnitSystem,
): { ask: ShortlistAsk; errors: Record<string, string> } {
  const system = (UNIT_SYSTEMS as readonly string[]).includes(search.u ?? "") ? (search.u as UnitSystem) : viewer;
  const f = fieldSchemas(system);
  const errors: Record<string, string> = {};
  if (search.u && search.u !== system) errors.u = "Units: us or metric";
  function read<T>(name: string, schema: z.ZodType<T>): T | null {
    const raw = search[name];
    if (raw === undefined || raw.trim() === "") return null;
    const r = schema.safeParse(raw);
    if (r.success) return r.data;
    errors[name] = r.error.issues[0]?.message ?? `${name}: cannot be read`;
    return null;
  }
  const weights = Object.fromEntries(
    SHORTLIST_CRITERIA.map((c) => {
      const w = read(weightParam(c), f.weight);
      if (errors[weightParam(c)])
        errors[weightParam(c)] = `How much ${CRITERION_LABELS[c].toLowerCase()} counts: pick one`;
      return [c, w ?? DEFAULT_WEIGHTS[c]];
    }),
  ) as Record<ShortlistCriterion, number>;
  return {
    ask: {
      system,
      bits: read("bits", f.bits),
      maxWeightKg: read("maxw", f.maxw),
      maxLengthMm: read("maxl", f.maxl),
      maxPriceCents: read("maxp", f.maxp),
      compressorLps: read("comp", f.comp),
      minChance: read("minc", f.minc),
      jobsPerDay: read("jobs", f.jobs) ?? 1,
      maxVibrationShare: read("maxv", f.maxv),
      basis: read("vb", f.vb) ?? "declared",
      weights,
      seed: read("seed", f.seed) ?? 1,
    },
    errors,
  };
}
