// The buyer's shortlist for one job: which tools pass the shopper's constraints (and why each other
// one does not), the trade-off front, the chance each is the best pick, and a day's exposure for the
// shopper's number of jobs. Pure: the loader (shortlist.server.ts) hands it the job's stored cells.
import { atSupply, type Supply } from "~/stats/which-tool";
import { type PooledCellFit } from "~/stats/pressure";
import { runningAir, type RunningAirSource } from "~/air/line";
import { formatChance, formatFlow, formatLength, formatPrice, formatShare, formatWeight, type Units } from "~/domain";
import { bestPickChances, type BestPick, type Criterion, type Draw } from "./best-pick";
import { dayExposure, type DayExposure } from "./day";
import { inUseValue } from "./in-use";
import { CRITERION_BETTER, SHORTLIST_CRITERIA, type ShortlistAsk, type ShortlistCriterion } from "./shortlist-form";
import { nonDominated } from "./trade-offs";

export interface ShortlistTool {
  slug: string;
  label: string;
  fitting: string;
  weightKg: number;
  lengthMm: number;
  priceCents: number | null;
  air: {
    ratedLps: number;
    runningLps: number | null;
    runningSource: RunningAirSource | null;
    runningFactor: number | null;
  };
  fit: PooledCellFit | null;
  adjReason: string | null;
  /** The cell's counts and its clustered rate. */
  n: number;
  successes: number;
  designEffect: number;
  rate: { estimate: number; lower: number; upper: number };
  /** Kaplan–Meier median time to free it (give-ups censored), seconds. */
  km: { median: number | null; lower: number | null; upper: number | null };
  /** Declared vibration total value a_hv (m/s²) and A-weighted sound pressure level L_pA (dB), when the catalogue has them. */
  ahv: number | null;
  /** The declared uncertainties K of a_hv (m/s²) and L_pA (dB). */
  ahvK: number | null;
  lpa: number | null;
  lpaK: number | null;
}

export interface Candidate {
  slug: string;
  label: string;
  weightKg: number;
  lengthMm: number;
  priceCents: number | null;
  inletKpa: number | null;
  demandLps: number;
  chance: { estimate: number; lower: number; upper: number; basis: "at-your-air" | "rate"; extrapolating: boolean };
  chanceNote: string | null;
  time: { median: number; lower: number | null; upper: number | null } | null;
  /** The a_hv used (declared, or the in-use estimate) and the declared K, scaled alike. */
  ahv: number | null;
  ahvK: number | null;
  lpa: number | null;
  lpaK: number | null;
  day: DayExposure | null;
  needs: string[];
}

export interface Shortlist {
  passing: Candidate[];
  excluded: { slug: string; label: string; reasons: string[] }[];
  /** Slugs of the passing tools no other passing tool beats on every weighted criterion. */
  front: string[];
  criteria: ShortlistCriterion[];
  best: (BestPick & { leftOut: string[]; notes: string[] }) | null;
  vibrationFactor: { factor: number; source: string };
}

const fits = (tool: ShortlistTool, bits: ShortlistAsk["bits"]) =>
  !bits || !tool.fitting.startsWith("shank-") || tool.fitting === bits;

function candidateOf(tool: ShortlistTool, ask: ShortlistAsk, supply: Supply | null): Candidate {
  const at = supply
    ? atSupply(
        { slug: tool.slug, fitting: tool.fitting, ...tool.air, fit: tool.fit },
        { ...supply, bits: null }, // the shortlist filters on bits itself
      )
    : null;
  const predicted = at?.predicted ?? null;
  const minutes = (s: number | null) => (s == null ? null : s / 60);
  const time = tool.km.median == null ? null : { median: tool.km.median, lower: tool.km.lower, upper: tool.km.upper };
  const factor = inUseValue(1, ask.basis).factor;
  const ahv = tool.ahv == null ? null : tool.ahv * factor;
  const day =
    time && ahv != null && tool.lpa != null
      ? dayExposure([
          {
            ahv,
            lpa: tool.lpa,
            minutesPerJob: { estimate: time.median / 60, lower: minutes(time.lower), upper: minutes(time.upper) },
            jobsPerDay: ask.jobsPerDay,
          },
        ])
      : null;
  return {
    slug: tool.slug,
    label: tool.label,
    weightKg: tool.weightKg,
    lengthMm: tool.lengthMm,
    priceCents: tool.priceCents,
    inletKpa: at?.inletKpa ?? null,
    demandLps: at?.demandLps ?? runningAir(tool.air).lps,
    chance: predicted ? { ...predicted, basis: "at-your-air" } : { ...tool.rate, basis: "rate", extrapolating: false },
    chanceNote: supply && !predicted ? tool.adjReason : null,
    time,
    ahv,
    ahvK: tool.ahvK == null ? null : tool.ahvK * factor,
    lpa: tool.lpa,
    lpaK: tool.lpaK,
    day,
    needs: at?.needs ?? [],
  };
}

/** Why a candidate fails the shopper's constraints (empty: it passes). */
function reasonsAgainst(tool: ShortlistTool, c: Candidate, ask: ShortlistAsk, units: Units): string[] {
  const out: string[] = [];
  if (!fits(tool, ask.bits))
    out.push(
      `takes ${tool.fitting === "shank-0.498" ? "0.498" : "0.401"} in shank bits (yours will not fit; never use a shank adapter)`,
    );
  if (ask.maxWeightKg != null && tool.weightKg > ask.maxWeightKg + 1e-9)
    out.push(`weighs ${formatWeight(tool.weightKg, units.length)}`);
  if (ask.maxLengthMm != null && tool.lengthMm > ask.maxLengthMm + 1e-9)
    out.push(`${formatLength(tool.lengthMm, units.length)} long`);
  if (ask.maxPriceCents != null && (tool.priceCents == null || tool.priceCents > ask.maxPriceCents))
    out.push(tool.priceCents == null ? "no street price known" : `costs ${formatPrice(tool.priceCents)}`);
  if (ask.compressorLps != null && c.demandLps > ask.compressorLps)
    out.push(`draws ${formatFlow(c.demandLps, units.length)} running, more than your compressor delivers`);
  if (ask.minChance != null && c.chance.estimate < ask.minChance)
    out.push(
      `chance ${formatChance(c.chance.estimate)}${c.chance.basis === "rate" ? " (reports' rate)" : " at your air"}`,
    );
  if (ask.maxVibrationShare != null) {
    if (tool.ahv == null) out.push("no declared vibration value to check");
    else if (!c.time)
      out.push("no median time to free it yet (fewer than half its reports freed it), so no day's share");
    else if (c.day && c.day.shareOfActionValue.estimate > ask.maxVibrationShare)
      out.push(
        `${formatShare(c.day.shareOfActionValue.estimate)} of the vibration action value for ${ask.jobsPerDay} a day`,
      );
  }
  return out;
}

/** A criterion's value for the front and the picture (point estimates), null when unknown. */
function criterionValue(c: Candidate, k: ShortlistCriterion): number | null {
  switch (k) {
    case "chance":
      return c.chance.estimate;
    case "time":
      return c.time?.median ?? null;
    case "weight":
      return c.weightKg;
    case "price":
      return c.priceCents;
    case "vibration":
      return c.day?.shareOfActionValue.estimate ?? null;
  }
}

/** A criterion's uncertainty for the best-pick draw, null when unknown. */
function criterionDraw(
  tool: ShortlistTool,
  c: Candidate,
  k: ShortlistCriterion,
): { draw: Draw; fixedOnly?: boolean } | null {
  switch (k) {
    case "chance":
      return c.chance.basis === "at-your-air"
        ? { draw: { kind: "interval", ...c.chance, logit: true } }
        : // Jeffreys posterior at the effective counts (n / deff: reports from one reporter are not independent).
          { draw: { kind: "beta", successes: tool.successes / tool.designEffect, trials: tool.n / tool.designEffect } };
    case "time":
      if (!c.time) return null;
      return c.time.lower != null && c.time.upper != null
        ? { draw: { kind: "interval", estimate: c.time.median, lower: c.time.lower, upper: c.time.upper, log: true } }
        : { draw: { kind: "fixed", value: c.time.median }, fixedOnly: true };
    case "weight":
      return { draw: { kind: "fixed", value: c.weightKg } };
    case "price":
      return c.priceCents == null ? null : { draw: { kind: "fixed", value: c.priceCents } };
    case "vibration": {
      const s = c.day?.shareOfActionValue;
      if (!s) return null;
      return s.lower != null && s.upper != null && s.lower > 0
        ? { draw: { kind: "interval", estimate: s.estimate, lower: s.lower, upper: s.upper, log: true } }
        : { draw: { kind: "fixed", value: s.estimate }, fixedOnly: true };
    }
  }
}

const BEST_PICK_DRAWS = 4000;

export function buildShortlist(
  tools: readonly ShortlistTool[],
  ask: ShortlistAsk,
  supply: Supply | null,
  units: Units,
): Shortlist {
  const passing: Candidate[] = [];
  const excluded: Shortlist["excluded"] = [];
  const bySlug = new Map(tools.map((t) => [t.slug, t]));
  for (const tool of tools) {
    const c = candidateOf(tool, ask, supply);
    const reasons = reasonsAgainst(tool, c, ask, units);
    if (reasons.length) excluded.push({ slug: tool.slug, label: tool.label, reasons });
    else passing.push(c);
  }
  passing.sort((a, b) => b.chance.lower - a.chance.lower || a.slug.localeCompare(b.slug));
  const criteria = SHORTLIST_CRITERIA.filter((k) => ask.weights[k] > 0);
  const front = nonDominated(
    passing.map((c) => ({ id: c.slug, values: Object.fromEntries(criteria.map((k) => [k, criterionValue(c, k)])) })),
    criteria.map((k) => ({ key: k, better: CRITERION_BETTER[k] })),
  );
  return {
    passing,
    excluded,
    front,
    criteria,
    best: bestPick(passing, bySlug, criteria, ask),
    vibrationFactor: inUseValue(1, ask.basis),
  };
}

function bestPick(
  passing: readonly Candidate[],
  bySlug: Map<string, ShortlistTool>,
  criteria: readonly ShortlistCriterion[],
  ask: ShortlistAsk,
): Shortlist["best"] {
  if (criteria.length === 0 || passing.length === 0) return null;
  const leftOut: string[] = [];
  const fixedOnly = new Set<string>();
  const candidates = passing.flatMap((c) => {
    const tool = bySlug.get(c.slug)!;
    const draws = criteria.map((k) => [k, criterionDraw(tool, c, k)] as const);
    if (draws.some(([, d]) => d == null)) {
      leftOut.push(c.label);
      return [];
    }
    for (const [k, d] of draws) if (d?.fixedOnly) fixedOnly.add(k);
    return [{ id: c.slug, criteria: Object.fromEntries(draws.map(([k, d]) => [k, d!.draw])) }];
  });
  if (candidates.length === 0) return null;
  const order: Criterion[] = criteria.map((k) => ({ key: k, better: CRITERION_BETTER[k], weight: ask.weights[k] }));
  const notes = [...fixedOnly].map(
    (k) =>
      `Some tools' ${k === "time" ? "times" : "vibration shares"} have no interval yet and are drawn at their estimate.`,
  );
  return { ...bestPickChances(candidates, order, { draws: BEST_PICK_DRAWS, seed: ask.seed }), leftOut, notes };
}
