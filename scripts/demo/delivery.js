// @ts-check
// The delivery: the clean jobs with planted defects (a)–(f) and seven inserted records. Each
// defect draws its rows from a PRNG of its own seed, in a fixed order, so the file is the same
// on every run; the record of what was planted is built in defects.js.
import { mulberry32, normalGen } from '../prng.js';
import { makeRecord, makeWorkshop } from './clean.js';
import { describeDefects } from './defects.js';
import { jobId, N_RECORDS, N_WORKSHOPS, NETWORKS, orderRow, SEED, sample, wsId } from './design.js';

/** @typedef {import('./design.js').Row} Row */
/** @typedef {import('./design.js').Workshop} Workshop */
/** @typedef {import('./defects.js').Plan} Plan */
/** @typedef {import('./defects.js').Tagged} Tagged */

const TARGET = 'W-014';

/**
 * @param {Row[]} clean
 * @param {Workshop[]} workshops
 */
export function makeDelivery(clean, workshops) {
  const rand = mulberry32(SEED + 1);
  const normal = normalGen(rand);
  const rows = clean.map((r) => ({ ...r }));
  /** @type {Map<string, number[]>} */
  const byWs = new Map();
  for (const [i, r] of rows.entries()) {
    const ws = String(r.workshop);
    const list = byWs.get(ws) ?? [];
    if (!byWs.has(ws)) byWs.set(ws, list);
    list.push(i);
  }
  /** @param {string} ws */
  const rowsOf = (ws) => byWs.get(ws) ?? [];
  /** @type {Set<number>} */
  const used = new Set(); // clean row indices already carrying a defect

  // (e) id variants of W-014
  const special = new Set([TARGET]);
  const e14 = sample(rowsOf(TARGET), 7, rand);
  const variants = [
    { variant: 'W-014 ', canonical: TARGET, idx: e14.slice(0, 4).sort((a, b) => a - b), note: 'trailing space' },
    { variant: 'w-014', canonical: TARGET, idx: e14.slice(4).sort((a, b) => a - b), note: 'lower case' },
  ];
  for (const v of variants) {
    for (const i of v.idx) {
      rows[i].workshop = v.variant;
      used.add(i);
    }
  }

  // (b) level-2 values that differ within a workshop
  const level2 = plantLevel2(rows, workshops, special, rowsOf, used, rand);

  // single-row defects come from ordinary workshops only
  const ordinary = rows.map((_, i) => i).filter((i) => !special.has(String(clean[i].workshop)));
  /** @param {number} k */
  const take = (k) => {
    const free = ordinary.filter((i) => !used.has(i));
    const got = sample(free, k, rand).sort((a, b) => a - b);
    for (const i of got) used.add(i);
    return got;
  };

  // (a) missing group id
  const blankIdx = take(7);
  const naIdx = take(3);
  for (const i of blankIdx) rows[i].workshop = '';
  for (const i of naIdx) rows[i].workshop = 'NA';

  // (d) outcome: missing code and non-numeric token
  const m999Idx = take(4);
  const naTokIdx = take(5);
  for (const i of m999Idx) rows[i].repair_minutes = '-999';
  for (const i of naTokIdx) rows[i].repair_minutes = 'n/a';

  // (f) duplicated job_id: 3 records re-sent verbatim (exact copies)
  const dupIdx = take(3);

  // (c) 4 extra singleton workshops W-061..W-064, one new job each
  const netEff = Object.fromEntries(NETWORKS.map((n) => [n, 0]));
  const singletons = [];
  for (let s = 0; s < 4; s++) {
    const net = NETWORKS[Math.floor(rand() * NETWORKS.length)];
    const w = makeWorkshop(wsId(N_WORKSHOPS + 1 + s), net, 1, rand, normal, netEff);
    const rec = makeRecord(w, rand, normal);
    rec.job_id = jobId(N_RECORDS + 1 + s);
    singletons.push(orderRow(rec));
  }

  // assemble: tag rows, then insert the 7 extra rows at random positions
  /** @type {Tagged[]} */
  const tagged = rows.map((r, i) => ({ r, src: i }));
  /** @type {Tagged[]} */
  const extras = [...dupIdx.map((i) => ({ r: { ...clean[i] }, dupOf: i })), ...singletons.map((r) => ({ r, singleton: true }))];
  insertApart(tagged, extras, rand);

  const plan = { target: TARGET, byWs, variants, level2, blankIdx, naIdx, m999Idx, naTokIdx, dupIdx, singletons };
  return { rows: tagged.map((t) => t.r), defects: describeDefects(clean, tagged, plan) };
}

/**
 * (b) level-2 values that differ within a workshop: two workshops get another format on a few
 * records, one another bench count.
 * @param {Row[]} rows
 * @param {Workshop[]} workshops
 * @param {Set<string>} special workshops already carrying a defect (extended here)
 * @param {(ws: string) => number[]} rowsOf
 * @param {Set<number>} used rows already carrying a defect (extended here)
 * @param {() => number} rand
 */
function plantLevel2(rows, workshops, special, rowsOf, used, rand) {
  /** @param {(w: Workshop) => boolean} pred */
  const pool = (pred) => workshops.filter((w) => !special.has(w.id) && pred(w)).map((w) => w.id);
  const fmtA = sample(
    pool((w) => w.format === 'weekly'),
    1,
    rand,
  )[0];
  special.add(fmtA);
  const fmtB = sample(
    pool((w) => w.format === 'monthly'),
    1,
    rand,
  )[0];
  special.add(fmtB);
  const bnC = sample(
    pool((w) => w.benches === 8),
    1,
    rand,
  )[0];
  if (!bnC) throw new Error('make-demo: no workshop with benches = 8 (change SEED)');
  special.add(bnC);
  /** @type {Plan['level2']} */
  const level2 = [
    { workshop: fmtA, column: 'workshop_format', expected: 'weekly', planted: 'monthly', k: 3, idx: [] },
    { workshop: fmtB, column: 'workshop_format', expected: 'monthly', planted: 'weekly', k: 2, idx: [] },
    { workshop: bnC, column: 'benches', expected: 8, planted: 6, k: 3, idx: [] },
  ];
  for (const d of level2) {
    d.idx = sample(rowsOf(d.workshop), d.k, rand).sort((a, b) => a - b);
    for (const i of d.idx) {
      rows[i][d.column] = d.planted;
      used.add(i);
    }
  }
  return level2;
}

/**
 * Insert the extra records at random positions, a re-sent copy at least 200 records away from
 * its original.
 * @param {Tagged[]} tagged
 * @param {Tagged[]} extras
 * @param {() => number} rand
 */
function insertApart(tagged, extras, rand) {
  for (const x of extras) {
    while (true) {
      const pos = Math.floor(rand() * (tagged.length + 1));
      if (x.dupOf !== undefined) {
        const orig = tagged.findIndex((t) => t.src === x.dupOf);
        if (Math.abs(orig - pos) < 200) continue; // keep the copy well away from the original
      }
      tagged.splice(pos, 0, x);
      break;
    }
  }
}
