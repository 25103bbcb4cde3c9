// @ts-check
// The seeded generators the synthetic deliveries (synth.js) and the demo (demo/) draw from; the
// tests' helper (test/helpers/prng.ts) is the same mulberry32.

/**
 * mulberry32: small, fast, seedable 32-bit PRNG returning floats in [0, 1).
 * @param {number} seed
 * @returns {() => number}
 */
export function mulberry32(seed) {
  let a = seed >>> 0;
  return function rand() {
    a = (a + 0x6d2b79f5) | 0;
    let t = Math.imul(a ^ (a >>> 15), a | 1);
    t = (t + Math.imul(t ^ (t >>> 7), t | 61)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/**
 * Box–Muller standard normal generator on top of a uniform PRNG (caches the spare).
 * @param {() => number} rand
 * @returns {() => number}
 */
export function normalGen(rand) {
  let spare = 0;
  let has = false;
  return function normal() {
    if (has) {
      has = false;
      return spare;
    }
    let u = rand();
    while (u <= 1e-300) u = rand();
    const v = rand();
    const r = Math.sqrt(-2 * Math.log(u));
    const th = 2 * Math.PI * v;
    spare = r * Math.sin(th);
    has = true;
    return r * Math.cos(th);
  };
}
