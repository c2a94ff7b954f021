// Medians of scratch arrays in linear time, for the trace analysis's quiet-sample statistics.

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

/** k-th smallest of a[0..len) by Hoare's quickselect, in place, O(len) expected. */
function select(a: Float64Array, len: number, k: number): number {
  let lo = 0;
  let hi = len - 1;
  while (lo < hi) {
    const pivot = a[(lo + hi) >> 1]!;
    let i = lo;
    let j = hi;
    while (i <= j) {
      while (a[i]! < pivot) i++;
      while (a[j]! > pivot) j--;
      if (i <= j) {
        const t = a[i]!;
        a[i] = a[j]!;
        a[j] = t;
        i++;
        j--;
      }
    }
    if (k <= j) hi = j;
    else if (k >= i) lo = i;
    else return a[k]!;
  }
  return a[k]!;
}
