// A small seeded generator for synthetic traces, the demo and simulated draws: the same seed gives the same
// numbers in the browser, on the server and in a test. No imports, so the browser's trace preview stays light.

/**
 * mulberry32: a 32-bit generator by Tommy Ettinger (public domain, widely copied; from memory).
 * Good enough for noise and jitter in synthetic data; not for anything that must be unpredictable.
 * Returns a function giving numbers in [0, 1).
 */
export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Standard normal draws from a uniform generator by the Box–Muller transform (both values used). */
export function normalSource(uniform: () => number): () => number {
  let spare: number | null = null;
  return () => {
    if (spare !== null) {
      const z = spare;
      spare = null;
      return z;
    }
    const u = 1 - uniform(); // (0, 1]: log stays finite
    const v = uniform();
    const r = Math.sqrt(-2 * Math.log(u));
    spare = r * Math.sin(2 * Math.PI * v);
    return r * Math.cos(2 * Math.PI * v);
  };
}
