// Distribution quantiles from jStat (a well-known reference library), not hand-rolled formulas.
import jStatModule from "jstat";

// jstat is CommonJS: its default export is the jStat object itself under every loader.
const jStat = jStatModule.jStat ?? jStatModule;

/** Two-sided critical value of the standard normal: z with P(|Z| < z) = confidence. */
export const zCritical = (confidence: number) => jStat.normal.inv(1 - (1 - confidence) / 2, 0, 1);
export const tCritical = (confidence: number, df: number) => jStat.studentt.inv(1 - (1 - confidence) / 2, df);
export const betaQuantile = (p: number, a: number, b: number) => jStat.beta.inv(p, a, b);
export const logBeta = (a: number, b: number) => jStat.betaln(a, b);

export function checkConfidence(confidence: number) {
  if (!(confidence > 0 && confidence < 1)) throw new RangeError("confidence must be between 0 and 1");
}
