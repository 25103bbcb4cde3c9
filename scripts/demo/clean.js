// @ts-check
// The clean file: 3,000 repair jobs in 60 workshops drawn from the design, without defects.
import { mulberry32, normalGen } from '../prng.js';
import {
  FORMAT_CUM,
  FORMATS,
  HELPERS_CUM,
  jobId,
  KIND_AGE,
  KIND_CUM,
  KIND_FIX,
  KIND_MIN,
  KINDS,
  N_RECORDS,
  N_WORKSHOPS,
  NETWORK_WORKSHOPS,
  NETWORKS,
  orderRow,
  pickCum,
  round1,
  SEED,
  SIZE_MAX,
  SIZE_MIN,
  shuffleInPlace,
  wsId,
} from './design.js';

/** @typedef {import('./design.js').Row} Row */
/** @typedef {import('./design.js').Workshop} Workshop */
/** @typedef {import('./design.js').Rand} Rand */

export function makeClean() {
  const rand = mulberry32(SEED);
  const normal = normalGen(rand);

  // workshop sizes: lognormal around 50, clamped to [15, 90], then nudged so
  // that they sum to exactly N_RECORDS.
  const sizes = [];
  for (let k = 0; k < N_WORKSHOPS; k++) {
    const s = Math.round(Math.exp(Math.log(46) + 0.5 * normal()));
    sizes.push(Math.min(SIZE_MAX, Math.max(SIZE_MIN, s)));
  }
  let total = sizes.reduce((a, b) => a + b, 0);
  while (total !== N_RECORDS) {
    const k = Math.floor(rand() * N_WORKSHOPS);
    if (total < N_RECORDS && sizes[k] < SIZE_MAX) {
      sizes[k]++;
      total++;
    } else if (total > N_RECORDS && sizes[k] > SIZE_MIN) {
      sizes[k]--;
      total--;
    }
  }
  // W-014 is the target of the id-variant defect: give it a roomy size.
  const k14 = 13;
  if (sizes[k14] < 45) {
    const kBig = sizes.findIndex((s) => s >= 45);
    [sizes[k14], sizes[kBig]] = [sizes[kBig], sizes[k14]];
  }

  // networks: each workshop in exactly one network
  const netOf = shuffleInPlace(
    NETWORK_WORKSHOPS.flatMap((n, i) => Array(n).fill(NETWORKS[i])),
    rand,
  );
  const netEff = Object.fromEntries(NETWORKS.map((n) => [n, 0.07 * normal()]));

  const workshops = [];
  for (let k = 0; k < N_WORKSHOPS; k++) {
    workshops.push(makeWorkshop(wsId(k + 1), netOf[k], sizes[k], rand, normal, netEff));
  }

  const records = [];
  for (const w of workshops) {
    for (let i = 0; i < w.size; i++) records.push(makeRecord(w, rand, normal));
  }
  shuffleInPlace(records, rand);
  for (const [i, r] of records.entries()) r.job_id = jobId(i + 1);
  return { records: records.map(orderRow), workshops, rand, normal, netEff };
}

/**
 * @param {string} id
 * @param {string} network
 * @param {number} size
 * @param {Rand} rand
 * @param {Rand} normal
 * @param {Record<string, number>} netEff
 * @returns {Workshop}
 */
export function makeWorkshop(id, network, size, rand, normal, netEff) {
  const format = FORMATS[pickCum(rand(), FORMAT_CUM)];
  const benches = 2 + Math.floor(rand() * 11); // 2..12
  const opened = 2008 + Math.floor(rand() * 16); // 2008..2023
  const fmtEff = format === 'pop-up' ? -0.06 : format === 'monthly' ? 0.04 : 0;
  return {
    id,
    network,
    size,
    format,
    benches,
    opened,
    u: netEff[network] + fmtEff - 0.01 * (benches - 7) + 0.15 * normal(),
    v: 0.6 * normal(),
    a: 0.22 * normal(),
  };
}

/**
 * @param {Workshop} w
 * @param {Rand} rand
 * @param {Rand} normal
 * @returns {Row}
 */
export function makeRecord(w, rand, normal) {
  const kind = KINDS[pickCum(rand(), KIND_CUM)];
  const helpers = 1 + pickCum(rand(), HELPERS_CUM);
  const age = Math.max(0.1, Math.exp(1.5 + w.a + KIND_AGE[kind] + 0.6 * normal()));
  const logMin = Math.log(42) + w.u + KIND_MIN[kind] + 0.05 * (helpers - 1) + 0.012 * age + 0.36 * normal();
  const eta = 0.5 + w.v + KIND_FIX[kind] - 0.04 * age + 0.1 * (helpers - 1);
  const fixed = rand() < 1 / (1 + Math.exp(-eta)) ? 1 : 0;
  return {
    job_id: '',
    workshop: w.id,
    network: w.network,
    repair_minutes: round1(Math.max(1, Math.exp(logMin))),
    fixed,
    item_kind: kind,
    item_age_years: round1(age),
    helpers,
    workshop_format: w.format,
    benches: w.benches,
    opened_year: w.opened,
  };
}
