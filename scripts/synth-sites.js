// @ts-check
// The level-2 side of a synthetic delivery (scripts/synth.js): each site's region, mean, distance
// component and constant columns, and the alias table its records are drawn from.

const SITE_TYPES = ['mobile', 'fixed', 'pop-up'];
const N_REGIONS = 20;

/**
 * @typedef {object} Sites
 * @property {Float64Array} mean 40 + a_r + u_j
 * @property {Float64Array} dist m_j, the between-site component of distance_km
 * @property {string[]} code
 * @property {string[]} region
 * @property {string[]} type
 * @property {string[]} staff
 * @property {string[]} year
 * @property {string[]} level2 ",site_type,staff,opened_year", ready to append
 * @property {string[]} prefix ",site_code,region_code,", ready to append
 * @property {Float64Array} prob alias-table probabilities
 * @property {Int32Array} alias alias-table targets
 */

/**
 * Vose alias table for O(1) weighted sampling.
 * @param {number[]} weights
 */
function aliasTable(weights) {
  const n = weights.length;
  const sum = weights.reduce((s, w) => s + w, 0);
  const prob = new Float64Array(n);
  const alias = new Int32Array(n);
  const scaled = weights.map((w) => (w * n) / sum);
  /** @type {number[]} */
  const small = [];
  /** @type {number[]} */
  const large = [];
  for (const [i, p] of scaled.entries()) (p < 1 ? small : large).push(i);
  while (small.length && large.length) {
    const s = /** @type {number} */ (small.pop());
    const l = /** @type {number} */ (large.pop());
    prob[s] = scaled[s];
    alias[s] = l;
    scaled[l] = scaled[l] + scaled[s] - 1;
    (scaled[l] < 1 ? small : large).push(l);
  }
  for (const i of large) prob[i] = 1;
  for (const i of small) prob[i] = 1;
  return { prob, alias, n };
}

/** @param {number} n @param {number} width */
function pad(n, width) {
  return String(n).padStart(width, '0');
}

/**
 * Draw `groups` sites (the region effects first, then each site in turn).
 * @param {number} groups
 * @param {() => number} rand
 * @param {() => number} normal
 * @returns {Sites}
 */
export function drawSites(groups, rand, normal) {
  const regionEff = new Float64Array(N_REGIONS);
  const sdRegion = 1.5; // var 2.25
  for (let r = 0; r < N_REGIONS; r++) regionEff[r] = sdRegion * normal();
  const sdSite = Math.sqrt(15 - sdRegion * sdRegion); // total level-2 variance 15
  const siteWidth = Math.max(5, String(groups).length);

  const mean = new Float64Array(groups);
  const dist = new Float64Array(groups);
  const code = new Array(groups);
  const region = new Array(groups);
  const level2 = new Array(groups);
  const type = new Array(groups);
  const staff = new Array(groups);
  const year = new Array(groups);
  const weights = new Array(groups);
  for (let j = 0; j < groups; j++) {
    const r = Math.floor(rand() * N_REGIONS);
    code[j] = `S${pad(j + 1, siteWidth)}`;
    region[j] = `R${pad(r + 1, 2)}`;
    mean[j] = 40 + regionEff[r] + sdSite * normal();
    dist[j] = 9 + 3 * normal();
    const tp = rand();
    type[j] = tp < 0.2 ? SITE_TYPES[0] : tp < 0.8 ? SITE_TYPES[1] : SITE_TYPES[2];
    staff[j] = String(2 + Math.floor(rand() * 24));
    year[j] = String(1985 + Math.floor(rand() * 39));
    level2[j] = `,${type[j]},${staff[j]},${year[j]}`;
    weights[j] = Math.exp(normal()); // lognormal(0,1) -> skewed, unbalanced sizes
  }
  const { prob, alias } = aliasTable(weights);
  const prefix = code.map((s, j) => `,${s},${region[j]},`);
  return { mean, dist, code, region, type, staff, year, level2, prefix, prob, alias };
}
