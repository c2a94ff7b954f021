// One model's bench figure across rigs: each rig's run mean with its within-run variance, combined
// by a random-effects model so the spread between rigs is shown, not averaged away. Pure.
import { checkConfidence, tCritical, zCritical } from "~/stats/distributions";

/** One rig's (or run's) mean and the variance of that mean (its squared standard error). */
export interface Study {
  mean: number;
  variance: number;
}

export interface RandomEffects {
  /** Pooled mean μ̂ (inverse-variance weights 1/(vᵢ + τ²)). */
  estimate: number;
  /** The headline interval: HKSJ when 2 ≤ k < HKSJ_BELOW, else the DerSimonian–Laird (Wald) one. */
  lower: number;
  upper: number;
  /** Standard error of μ̂ under DerSimonian–Laird, √(1 / Σ 1/(vᵢ + τ²)). */
  standardError: number;
  /** Between-rig variance τ² (DerSimonian–Laird) and its root τ, in the unit of the means. */
  tau2: number;
  tau: number;
  /** Share of the spread that is between rigs, I² = max(0, (Q − (k − 1)) / Q), a fraction in [0, 1]. */
  i2: number;
  /** Cochran's Q with the fixed-effect weights 1/vᵢ. */
  q: number;
  k: number;
  /** DerSimonian–Laird interval μ̂ ± z·SE. */
  waldLower: number;
  waldUpper: number;
  /** Hartung–Knapp–Sidik–Jonkman interval (null for one study). */
  hksjLower: number | null;
  hksjUpper: number | null;
  /** Where the next rig's mean is expected to fall (null when k < 3). */
  predictionLower: number | null;
  predictionUpper: number | null;
  method: "DerSimonian-Laird" | "DerSimonian-Laird with Hartung-Knapp-Sidik-Jonkman";
}

/** Below this many studies the headline interval is the HKSJ one (the Wald interval is too narrow there). */
export const HKSJ_BELOW = 10;

function checkStudies(studies: readonly Study[]) {
  if (studies.length === 0) throw new RangeError("need at least one study");
  for (const s of studies) {
    if (!Number.isFinite(s.mean) || !(s.variance > 0) || !Number.isFinite(s.variance)) {
      throw new RangeError("each study needs a finite mean and a finite variance > 0");
    }
  }
}

/** Inverse-variance weighted mean and the sum of weights for weights 1/(vᵢ + τ²). */
function weighted(studies: readonly Study[], tau2: number) {
  let sw = 0;
  let swy = 0;
  for (const s of studies) {
    const w = 1 / (s.variance + tau2);
    sw += w;
    swy += w * s.mean;
  }
  return { mean: swy / sw, sumWeights: sw };
}

/**
 * Hartung–Knapp–Sidik–Jonkman interval for the pooled mean at a given τ² (Hartung & Knapp 2001,
 * Statistics in Medicine 20:3875–3889; Sidik & Jonkman 2002, Statistics in Medicine 21:3153–3159):
 * SE² = Σ wᵢ(yᵢ − μ̂)² / ((k − 1)·Σ wᵢ) with wᵢ = 1/(vᵢ + τ²), and μ̂ ± t(k − 1)·SE.
 * With `floor`, the ad hoc variant of Knapp & Hartung (2003) / Röver, Knapp & Friede (2015, BMC
 * Medical Research Methodology 15:99): the scale factor is kept ≥ 1, so the interval is never narrower
 * than the Wald one with t in place of z — with three or four rigs that agree by chance, the plain
 * version can be very narrow. Returns null for a single study.
 */
export function hksjInterval(studies: readonly Study[], tau2: number, confidence = 0.95, { floor = false } = {}) {
  checkStudies(studies);
  checkConfidence(confidence);
  if (!(tau2 >= 0)) throw new RangeError("tau2 must be ≥ 0");
  const k = studies.length;
  if (k < 2) return null;
  const { mean, sumWeights } = weighted(studies, tau2);
  let scale = 0;
  for (const s of studies) scale += (s.mean - mean) ** 2 / (s.variance + tau2);
  scale /= k - 1;
  if (floor) scale = Math.max(1, scale);
  const standardError = Math.sqrt(scale / sumWeights);
  const t = tCritical(confidence, k - 1);
  return { estimate: mean, standardError, lower: mean - t * standardError, upper: mean + t * standardError };
}

/**
 * Random-effects combination of rig means (DerSimonian & Laird 1986, Controlled Clinical Trials
 * 7:177–188): Q = Σ wᵢ(yᵢ − ȳ_w)² with wᵢ = 1/vᵢ, τ² = max(0, (Q − (k − 1)) / (Σwᵢ − Σwᵢ²/Σwᵢ)), then
 * μ̂ with weights 1/(vᵢ + τ²) and SE = √(1/Σ 1/(vᵢ + τ²)); I² as Higgins & Thompson (2002).
 *
 * Headline interval: with 2 ≤ k < 10 rigs, the HKSJ interval with t(k − 1) (the Wald interval
 * undercovers with few studies; IntHout, Ioannidis & Borm 2014, BMC Med Res Methodol 14:25), in its
 * floored variant (see `hksjInterval`); from 10 rigs on, the DerSimonian–Laird interval μ̂ ± z·SE. Both
 * are returned either way.
 *
 * Prediction interval for a new rig (Higgins, Thompson & Spiegelhalter 2009, JRSS A 172:137–159):
 * μ̂ ± t(k − 2)·√(τ² + SE²), null when k < 3. One study: its own mean and z interval, τ² = 0.
 */
export function randomEffects(studies: readonly Study[], confidence = 0.95): RandomEffects {
  checkStudies(studies);
  checkConfidence(confidence);
  const k = studies.length;
  const z = zCritical(confidence);

  const fixed = weighted(studies, 0);
  let q = 0;
  let sw2 = 0;
  for (const s of studies) {
    q += (s.mean - fixed.mean) ** 2 / s.variance;
    sw2 += 1 / s.variance ** 2;
  }
  const c = fixed.sumWeights - sw2 / fixed.sumWeights;
  const tau2 = k > 1 && c > 0 ? Math.max(0, (q - (k - 1)) / c) : 0;
  // One study has no heterogeneity to measure (Q has 0 degrees of freedom; its rounding residue is not one).
  const i2 = k > 1 && q > 0 ? Math.max(0, (q - (k - 1)) / q) : 0;

  const pooled = weighted(studies, tau2);
  const estimate = pooled.mean;
  const standardError = Math.sqrt(1 / pooled.sumWeights);
  const waldLower = estimate - z * standardError;
  const waldUpper = estimate + z * standardError;

  const hksj = hksjInterval(studies, tau2, confidence, { floor: true });
  const headlineHksj = hksj !== null && k < HKSJ_BELOW;

  let predictionLower: number | null = null;
  let predictionUpper: number | null = null;
  if (k >= 3) {
    const half = tCritical(confidence, k - 2) * Math.sqrt(tau2 + standardError ** 2);
    predictionLower = estimate - half;
    predictionUpper = estimate + half;
  }

  return {
    estimate,
    lower: headlineHksj ? hksj.lower : waldLower,
    upper: headlineHksj ? hksj.upper : waldUpper,
    standardError,
    tau2,
    tau: Math.sqrt(tau2),
    i2,
    q,
    k,
    waldLower,
    waldUpper,
    hksjLower: hksj?.lower ?? null,
    hksjUpper: hksj?.upper ?? null,
    predictionLower,
    predictionUpper,
    method: headlineHksj ? "DerSimonian-Laird with Hartung-Knapp-Sidik-Jonkman" : "DerSimonian-Laird",
  };
}
