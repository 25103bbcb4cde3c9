/**
 * mulberry32, the seeded generator scripts/synth.js uses too: tests that simulate deliveries
 * are fixed by their seed. The same generator the permutation tests use (src/stats/seeded-uniform.ts).
 */
export { seededUniform as mulberry32 } from '../../src/stats/seeded-uniform.js';
