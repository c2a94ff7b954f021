// The chance that each candidate tool is the best pick for one shopper, drawn from the uncertainty of
// its figures. Pure; seeded, so the same question always gets the same answer.
//
// Each draw samples every candidate's criteria from its uncertainty:
// - rates: the Jeffreys posterior Beta(s + ½, f + ½) (the counts may be effective counts, n / deff);
// - times, forces and fitted chances: a normal on the scale of the interval — log for times, logit
//   for fitted chances — centred on the estimate, each side's spread from its own half of the 95 %
//   interval (a two-piece normal, so a skewed interval stays skewed);
// - fixed values (weight, price): constants.
// Then it ranks the candidates by the shopper's order: with no weights, lexicographically (the first
// criterion decides, the next breaks exact ties); with weights, by the weighted sum of each
// criterion's rank in that draw (1 = best, ties share the mean rank; missing weights count 1), the
// lowest sum first. Ranks, not raw values, so no criterion's unit outweighs another's. It counts how
// often each comes first; candidates tied for first share the draw.
import { mulberry32 } from "~/utils/random";

export { mulberry32 };

export type Draw =
  | { kind: "beta"; successes: number; trials: number }
  | {
      kind: "interval";
      estimate: number;
      lower: number;
      upper: number;
      /** Times and other positive quantities: the interval is symmetric on the log scale. */
      log?: boolean;
      /** Probabilities from a logistic fit: the interval is symmetric on the logit scale. */
      logit?: boolean;
    }
  | { kind: "fixed"; value: number };

export interface Criterion {
  key: string;
  better: "higher" | "lower";
  weight?: number;
}

export interface BestPickCandidate {
  id: string;
  criteria: Record<string, Draw>;
}

export interface BestPick {
  chances: { id: string; chance: number; standardError: number }[];
  draws: number;
  seed: number;
  /** "lexicographic" when no criterion carries a weight, otherwise "weighted ranks". */
  rule: "lexicographic" | "weighted ranks";
}

/** z for a two-sided 95 % interval (published normal quantile). */
const Z95 = 1.959963984540054;

/** A standard normal by Box–Muller (one of the pair). */
function normal(rand: () => number): number {
  const u = 1 - rand(); // (0, 1]
  const v = rand();
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
}

/** Gamma(shape, 1) by Marsaglia & Tsang (2000); shape < 1 through Gamma(shape + 1)·U^(1/shape). */
function gamma(shape: number, rand: () => number): number {
  if (shape < 1) return gamma(shape + 1, rand) * Math.pow(1 - rand(), 1 / shape);
  const d = shape - 1 / 3;
  const c = 1 / Math.sqrt(9 * d);
  for (;;) {
    let x: number;
    let v: number;
    do {
      x = normal(rand);
      v = 1 + c * x;
    } while (v <= 0);
    v = v * v * v;
    const u = 1 - rand();
    if (Math.log(u) < 0.5 * x * x + d - d * v + d * Math.log(v)) return d * v;
  }
}

function beta(a: number, b: number, rand: () => number): number {
  const x = gamma(a, rand);
  const y = gamma(b, rand);
  return x / (x + y);
}

const logit = (p: number) => Math.log(p / (1 - p));
const expit = (x: number) => 1 / (1 + Math.exp(-x));
const clampP = (p: number) => Math.min(1 - 1e-9, Math.max(1e-9, p));

/** One value drawn from a criterion's uncertainty. */
export function sampleDraw(draw: Draw, rand: () => number): number {
  switch (draw.kind) {
    case "fixed":
      return draw.value;
    case "beta": {
      const failures = draw.trials - draw.successes;
      if (!(draw.successes >= 0) || !(failures >= 0)) throw new RangeError("beta draw needs 0 ≤ successes ≤ trials");
      return beta(draw.successes + 0.5, failures + 0.5, rand);
    }
    case "interval": {
      if (!(draw.lower <= draw.estimate && draw.estimate <= draw.upper))
        throw new RangeError("interval draw needs lower ≤ estimate ≤ upper");
      const [to, from] = draw.logit
        ? [(p: number) => logit(clampP(p)), expit]
        : draw.log
          ? [(x: number) => Math.log(Math.max(x, 1e-12)), Math.exp]
          : [(x: number) => x, (x: number) => x];
      const centre = to(draw.estimate);
      const z = normal(rand);
      const spread = (z < 0 ? centre - to(draw.lower) : to(draw.upper) - centre) / Z95;
      return from(centre + z * spread);
    }
  }
}

/**
 * Indices of the candidates first in one draw: `sampled[c][k]` is candidate c's value on criterion k,
 * already signed so that larger is better. Weighted: the rank of c on k is 1 + (how many are better)
 * + ½·(how many others tie), so ties share the mean of their ranks; the lowest weighted sum wins.
 */
function winners(sampled: Float64Array[], weights: readonly number[] | null, out: number[]): number[] {
  out.length = 0;
  const n = sampled.length;
  const K = sampled[0]!.length;
  if (weights) {
    let best = Infinity;
    for (let i = 0; i < n; i++) {
      let score = 0;
      for (let k = 0; k < K; k++) {
        const v = sampled[i]![k]!;
        let rank = 1;
        for (let j = 0; j < n; j++) {
          if (j === i) continue;
          const w = sampled[j]![k]!;
          if (w > v) rank += 1;
          else if (w === v) rank += 0.5;
        }
        score += weights[k]! * rank;
      }
      if (score < best) {
        best = score;
        out.length = 0;
      }
      if (score === best) out.push(i);
    }
    return out;
  }
  for (let i = 0; i < n; i++) out.push(i);
  for (let k = 0; k < K && out.length > 1; k++) {
    let best = -Infinity;
    for (const i of out) best = Math.max(best, sampled[i]![k]!);
    let m = 0;
    for (const i of out) if (sampled[i]![k] === best) out[m++] = i;
    out.length = m;
  }
  return out;
}

/**
 * How often each candidate comes out first over `draws` draws from its figures' uncertainty, with the
 * Monte Carlo standard error of that share, √(p(1 − p) / draws). The chances sum to 1.
 */
export function bestPickChances(
  candidates: readonly BestPickCandidate[],
  order: readonly Criterion[],
  { draws = 4000, seed = 1 }: { draws?: number; seed?: number } = {},
): BestPick {
  if (!Number.isInteger(draws) || draws < 1) throw new RangeError("draws must be a whole number of at least 1");
  if (order.length === 0) throw new RangeError("name at least one criterion");
  for (const c of order) if (c.weight != null && !(c.weight >= 0)) throw new RangeError("weights are 0 or more");
  for (const cand of candidates)
    for (const c of order)
      if (!cand.criteria[c.key]) throw new RangeError(`candidate ${cand.id} has no value for ${c.key}`);
  const weighted = order.some((c) => c.weight != null);
  const rule = weighted ? "weighted ranks" : "lexicographic";
  if (candidates.length === 0) return { chances: [], draws, seed, rule };
  const rand = mulberry32(seed);
  const wins = new Array<number>(candidates.length).fill(0);
  const plan = candidates.map((cand) => order.map((c) => cand.criteria[c.key]!));
  const sign = order.map((c) => (c.better === "higher" ? 1 : -1));
  const weights = weighted ? order.map((c) => c.weight ?? 1) : null;
  const sampled = candidates.map(() => new Float64Array(order.length));
  const first: number[] = [];
  for (let d = 0; d < draws; d++) {
    for (let i = 0; i < plan.length; i++)
      for (let k = 0; k < order.length; k++) sampled[i]![k] = sign[k]! * sampleDraw(plan[i]![k]!, rand);
    winners(sampled, weights, first);
    for (const i of first) wins[i]! += 1 / first.length;
  }
  return {
    chances: candidates.map((cand, i) => {
      const chance = wins[i]! / draws;
      return { id: cand.id, chance, standardError: Math.sqrt((chance * (1 - chance)) / draws) };
    }),
    draws,
    seed,
    rule,
  };
}
