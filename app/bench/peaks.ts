// The blow-to-blow spread of peaks. Kept apart from figures.ts, which reaches the stats module
// (jStat), so the trace preview in the browser ships no statistics library.

export interface PeakSummary {
  median: number;
  p10: number;
  p90: number;
  n: number;
}

/**
 * Linear-interpolation quantiles (Hyndman & Fan 1996 type 7, the common default) of the values:
 * median, 10th and 90th percentiles. NaN for all three when there are no values.
 */
export function peakSummary(values: ArrayLike<number>): PeakSummary {
  const sorted = Float64Array.from(values).sort();
  const n = sorted.length;
  const q = (p: number) => {
    if (n === 0) return NaN;
    const h = (n - 1) * p;
    const lo = Math.floor(h);
    const hi = Math.min(lo + 1, n - 1);
    return sorted[lo]! + (h - lo) * (sorted[hi]! - sorted[lo]!);
  };
  return { median: q(0.5), p10: q(0.1), p90: q(0.9), n };
}
