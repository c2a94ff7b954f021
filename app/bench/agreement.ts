// How well rigs agree when several measured the same reference tool (a round-robin): the one-way
// layout of an interlaboratory study, with each rig's bias against the consensus. Pure.
import { checkConfidence, tCritical } from "~/stats/distributions";

/** One reading of the reference tool on one rig (e.g. a trial mean, in N). */
export interface RigReading {
  rig: string;
  value: number;
}

export interface RigBias {
  rig: string;
  n: number;
  mean: number;
  /** The rig's mean minus the consensus (grand mean). */
  bias: number;
  lower: number;
  upper: number;
}

export interface RigAgreement {
  /** s_r: the spread of repeat readings on one rig. */
  repeatabilitySD: number;
  /** s_R = √(s_r² + s_L²): the spread of single readings taken on different rigs. */
  reproducibilitySD: number;
  /** s_L: the spread of the rigs' own levels (floored at 0). */
  betweenRigSD: number;
  /** The consensus: Σ nᵢ·ȳᵢ / Σ nᵢ. */
  grandMean: number;
  /** p rigs, N readings, and the n̄ that divides the between-rig mean square. */
  p: number;
  total: number;
  nBar: number;
  rigs: RigBias[];
}

/**
 * Repeatability and reproducibility from a round-robin, as ISO 5725-2:1994 defines them for the
 * basic method at one level (clause 7.4; the clause number from memory), for p laboratories with nᵢ results each:
 *   s_r² = Σ (nᵢ − 1)·sᵢ² / (N − p)                       (pooled within-rig variance)
 *   s_d² = Σ nᵢ·(ȳᵢ − ȳ)² / (p − 1)                        (between-rig mean square)
 *   n̄ = (N − Σ nᵢ²/N) / (p − 1)                           (= n when the design is balanced)
 *   s_L² = max(0, (s_d² − s_r²) / n̄),   s_R² = s_r² + s_L²
 * with ȳ = Σ nᵢȳᵢ / N. These are the one-way random-effects ANOVA (method-of-moments) estimates.
 *
 * Each rig's bias ȳᵢ − ȳ comes with a t interval. Its variance treats the rig's own level as fixed
 * (it is what the bias describes) and the other rigs, which make up the consensus, as random: with
 * wⱼ = nⱼ/N, Var = (1 − wᵢ)²·s_r²/nᵢ + Σ_{j≠i} wⱼ²·(s_L² + s_r²/nⱼ). The t quantile has p − 1 degrees
 * of freedom, because the consensus rests on p rigs; that is conservative when the within-rig
 * spread dominates. (Our method; ISO 5725-4 judges a laboratory's bias against an accepted
 * reference value, which a bench round-robin does not have.)
 *
 * Throws with fewer than 2 rigs, or when no rig has two readings (s_r is then unknown).
 */
export function rigAgreement(readings: readonly RigReading[], confidence = 0.95): RigAgreement {
  checkConfidence(confidence);
  const groups = new Map<string, number[]>();
  for (const r of readings) {
    if (!Number.isFinite(r.value)) throw new RangeError(`a reading on rig ${r.rig} is not a finite number`);
    const list = groups.get(r.rig) ?? [];
    list.push(r.value);
    groups.set(r.rig, list);
  }
  const p = groups.size;
  if (p < 2) throw new RangeError("need readings from at least 2 rigs");
  const total = readings.length;
  if (total - p < 1) throw new RangeError("need at least one rig with two readings to estimate repeatability");

  const cells = [...groups].map(([rig, values]) => {
    const n = values.length;
    const mean = values.reduce((a, v) => a + v, 0) / n;
    const ss = values.reduce((a, v) => a + (v - mean) ** 2, 0);
    return { rig, n, mean, ss };
  });
  const grandMean = cells.reduce((a, c) => a + c.n * c.mean, 0) / total;
  const sr2 = cells.reduce((a, c) => a + c.ss, 0) / (total - p);
  const sd2 = cells.reduce((a, c) => a + c.n * (c.mean - grandMean) ** 2, 0) / (p - 1);
  const nBar = (total - cells.reduce((a, c) => a + c.n * c.n, 0) / total) / (p - 1);
  const sL2 = Math.max(0, (sd2 - sr2) / nBar);

  const t = tCritical(confidence, p - 1);
  // Σⱼ wⱼ²·(s_L² + s_r²/nⱼ) over all rigs; each rig then takes its own term out.
  const spreadAll = cells.reduce((a, c) => a + (c.n / total) ** 2 * (sL2 + sr2 / c.n), 0);
  const rigs = cells.map((c) => {
    const w = c.n / total;
    const others = spreadAll - w * w * (sL2 + sr2 / c.n);
    const se = Math.sqrt((1 - w) ** 2 * (sr2 / c.n) + others);
    const bias = c.mean - grandMean;
    return { rig: c.rig, n: c.n, mean: c.mean, bias, lower: bias - t * se, upper: bias + t * se };
  });

  return {
    repeatabilitySD: Math.sqrt(sr2),
    reproducibilitySD: Math.sqrt(sr2 + sL2),
    betweenRigSD: Math.sqrt(sL2),
    grandMean,
    p,
    total,
    nBar,
    rigs,
  };
}
