// @ts-check
// The demo scenario's design: sizes, categories and effects of the invented repair workshops,
// and the small helpers every generator shares. Changing a value here changes the fixtures.

export const SEED = 20240611;

export const N_WORKSHOPS = 60;
export const N_RECORDS = 3000;
export const SIZE_MIN = 15;
export const SIZE_MAX = 90;
export const NETWORKS = ['amber', 'birch', 'cobalt', 'dune', 'ember', 'fern'];
export const NETWORK_WORKSHOPS = [14, 12, 10, 9, 8, 7]; // sums to 60 (unbalanced on purpose)
export const FORMATS = ['weekly', 'monthly', 'pop-up'];
export const FORMAT_CUM = [0.45, 0.8, 1];
export const KINDS = ['toaster', 'lamp', 'bicycle', 'laptop', 'clothing', 'other'];
export const KIND_CUM = [0.14, 0.32, 0.52, 0.68, 0.88, 1];
// log-scale effects on repair_minutes, logit effects on fixed, log-scale age shift
/** @type {Record<string, number>} */
export const KIND_MIN = { toaster: 0.0, lamp: -0.25, bicycle: 0.1, laptop: 0.3, clothing: -0.15, other: 0.0 };
/** @type {Record<string, number>} */
export const KIND_FIX = { toaster: 0.1, lamp: 0.6, bicycle: 0.5, laptop: -0.7, clothing: 0.8, other: -0.2 };
/** @type {Record<string, number>} */
export const KIND_AGE = { toaster: 0.3, lamp: 0.4, bicycle: 0.5, laptop: -0.3, clothing: 0.0, other: 0.2 };
export const HELPERS_CUM = [0.42, 0.74, 0.92, 1];

export const COLUMNS = [
  'job_id',
  'workshop',
  'network',
  'repair_minutes',
  'fixed',
  'item_kind',
  'item_age_years',
  'helpers',
  'workshop_format',
  'benches',
  'opened_year',
];

/**
 * One repair job: a CSV row keyed by COLUMNS (values as they are written; defects plant text in numeric columns).
 * @typedef {Record<string, string | number>} Row
 */
/**
 * @typedef {object} Workshop
 * @property {string} id
 * @property {string} network
 * @property {number} size
 * @property {string} format
 * @property {number} benches
 * @property {number} opened
 * @property {number} u log-scale workshop effect on repair_minutes (network + format + own)
 * @property {number} v logit-scale effect on fixed
 * @property {number} a log-scale shift of item_age_years
 */
/** @typedef {() => number} Rand */

/** @param {number} n @param {number} w */
export const pad = (n, w) => String(n).padStart(w, '0');
/** @param {number} k 1-based */
export const wsId = (k) => `W-${pad(k, 3)}`;
/** @param {number} k 1-based */
export const jobId = (k) => `J${pad(k, 6)}`;
/** Index of the first cumulative share above `u`. @param {number} u @param {number[]} cum */
export const pickCum = (u, cum) => {
  let i = 0;
  while (u >= cum[i]) i++;
  return i;
};
/** @param {number} x */
export const round1 = (x) => (Math.round(x * 10) / 10).toFixed(1);

/**
 * @template T
 * @param {T[]} arr
 * @param {Rand} rand
 */
export function shuffleInPlace(arr, rand) {
  for (let i = arr.length - 1; i > 0; i--) {
    const j = Math.floor(rand() * (i + 1));
    [arr[i], arr[j]] = [arr[j], arr[i]];
  }
  return arr;
}

/**
 * `k` elements drawn without replacement.
 * @template T
 * @param {T[]} arr
 * @param {number} k
 * @param {Rand} rand
 */
export function sample(arr, k, rand) {
  return shuffleInPlace([...arr], rand).slice(0, k);
}

/** @param {Row} r */
export const orderRow = (r) => Object.fromEntries(COLUMNS.map((c) => [c, r[c]]));
