/**
 * A seeded uniform generator on [0, 1) (mulberry32, 32-bit state): permutation tests are then
 * the same on every run and every machine, which the report's determinism requires.
 * Source: Tommy Ettinger's mulberry32 (public domain, 2017), as used by scripts/synth.js.
 *
 * @param seed any 32-bit integer
 * @returns the next draw on each call
 */
export function seededUniform(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
