// Quickselect on scratch arrays: order statistics in linear expected time. No imports, so the browser's
// trace preview can use it without pulling in a statistics library.

/** k-th smallest of a[0..len) by Hoare's quickselect, in place, O(len) expected. */
export function select(a: Float64Array, len: number, k: number): number {
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
