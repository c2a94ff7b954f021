// Medians of scratch arrays in linear time, for the trace analysis's quiet-sample statistics.
import { select } from "~/utils/quickselect";

/** Median of the first `len` values of a scratch array (reordered in place); NaN when len is 0. */
export function medianOf(a: Float64Array, len: number): number {
  if (len === 0) return NaN;
  const mid = len >> 1;
  const upper = select(a, len, mid);
  if (len % 2) return upper;
  let lower = -Infinity;
  for (let i = 0; i < mid; i++) if (a[i]! > lower) lower = a[i]!;
  return (lower + upper) / 2;
}
