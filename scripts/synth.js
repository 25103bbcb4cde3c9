#!/usr/bin/env node
// @ts-check
// Synthetic two-level dataset generator (records nested in sites, sites in regions).
//
//   import { writeSynthetic } from './synth.js';
//   await writeSynthetic({ path: '/tmp/x.csv', rows: 1e6, groups: 5000, seed: 1 });
//
//   node scripts/synth.js --rows 1000000 --groups 5000 --seed 1 --out /tmp/x.csv
//        [--columns record_id,site_code,wait_minutes]
//
// Output is deterministic for (rows, groups, seed); `columns` only selects /
// orders the written columns, it never changes the generated values.
//
// Model (site j, region r(j), record i):
//   wait_minutes = 40 + a_r + u_j + 0.6*visits + ageShift + e_ij
//     var(a_r + u_j) = 15 (site level), level-1 variance = 85  => ICC ~= 0.15
//   distance_km  = max(0.05, m_j + N(0, 3^2)),  m_j = 9 + 3*N(0,1) (between-site component)
//   site sizes   : each row's site is drawn independently from lognormal(0, 1)
//                  weights (alias method), so sizes are unbalanced and rows are
//                  not sorted by site.
// Level-2 columns (site_type, staff, opened_year) are constant within site and
// region_code is constant within site (each site belongs to exactly one region).

import { open } from 'node:fs/promises';
import { fileURLToPath } from 'node:url';
import { resolve } from 'node:path';
import { mulberry32, normalGen } from './prng.js';

export const ALL_COLUMNS = [
  'record_id', 'site_code', 'region_code', 'wait_minutes', 'age_band',
  'visits', 'distance_km', 'site_type', 'staff', 'opened_year',
];

const AGE_BANDS = ['18-29', '30-44', '45-59', '60-74', '75+'];
const AGE_CUM = [0.22, 0.5, 0.76, 0.93, 1];
const AGE_SHIFT = [-1.5, -0.5, 0, 1, 2.5];
const SITE_TYPES = ['mobile', 'fixed', 'pop-up'];
const N_REGIONS = 20;
const CHUNK_CHARS = 1 << 20; // flush at ~1 MB

/** Vose alias table for O(1) weighted sampling. */
function aliasTable(weights) {
  const n = weights.length;
  const sum = weights.reduce((s, w) => s + w, 0);
  const prob = new Float64Array(n);
  const alias = new Int32Array(n);
  const scaled = weights.map((w) => (w * n) / sum);
  const small = [];
  const large = [];
  scaled.forEach((p, i) => (p < 1 ? small : large).push(i));
  while (small.length && large.length) {
    const s = small.pop();
    const l = large.pop();
    prob[s] = scaled[s];
    alias[s] = l;
    scaled[l] = scaled[l] + scaled[s] - 1;
    (scaled[l] < 1 ? small : large).push(l);
  }
  for (const i of large) prob[i] = 1;
  for (const i of small) prob[i] = 1;
  return { prob, alias, n };
}

function pad(n, width) {
  return String(n).padStart(width, '0');
}

/** Round to 1 decimal and format (faster than toFixed for the hot loop). */
function fmt1(x) {
  const v = Math.round(x * 10);
  const a = v < 0 ? -v : v;
  const s = (v < 0 ? '-' : '') + ((a / 10) | 0) + '.' + (a % 10);
  return s === '-0.0' ? '0.0' : s;
}

function fmt2(x) {
  const v = Math.round(x * 100);
  const a = v < 0 ? -v : v;
  const f = a % 100;
  const s = (v < 0 ? '-' : '') + ((a / 100) | 0) + '.' + (f < 10 ? '0' + f : f);
  return s === '-0.00' ? '0.00' : s;
}

/**
 * Stream a synthetic CSV to `path`.
 * @param {{path: string, rows?: number, groups?: number, seed?: number, columns?: string[]}} opts
 * @returns {Promise<{path: string, rows: number, groups: number, seed: number, columns: string[], bytes: number, ms: number}>}
 */
export async function writeSynthetic({ path, rows = 100000, groups = 500, seed = 1, columns } = {}) {
  if (!path) throw new Error('writeSynthetic: path is required');
  rows = Math.floor(Number(rows));
  groups = Math.floor(Number(groups));
  if (!(rows >= 0)) throw new Error('writeSynthetic: rows must be >= 0');
  if (!(groups >= 1)) throw new Error('writeSynthetic: groups must be >= 1');
  const cols = columns && columns.length ? [...columns] : [...ALL_COLUMNS];
  for (const c of cols) {
    if (!ALL_COLUMNS.includes(c)) throw new Error(`writeSynthetic: unknown column "${c}"`);
  }
  const full = cols.length === ALL_COLUMNS.length && cols.every((c, i) => c === ALL_COLUMNS[i]);
  const idx = cols.map((c) => ALL_COLUMNS.indexOf(c));

  const t0 = performance.now();
  const rand = mulberry32(seed);
  const normal = normalGen(rand);

  // ---- level 3 / level 2 draws -------------------------------------------
  const regionEff = new Float64Array(N_REGIONS);
  const sdRegion = 1.5; // var 2.25
  for (let r = 0; r < N_REGIONS; r++) regionEff[r] = sdRegion * normal();
  const sdSite = Math.sqrt(15 - sdRegion * sdRegion); // total level-2 variance 15
  const siteWidth = Math.max(5, String(groups).length);

  const siteMean = new Float64Array(groups); // 40 + a_r + u_j
  const siteDist = new Float64Array(groups); // m_j
  const siteCode = new Array(groups);
  const siteRegion = new Array(groups);
  const siteL2 = new Array(groups); // ",site_type,staff,opened_year"
  const siteType = new Array(groups);
  const siteStaff = new Array(groups);
  const siteYear = new Array(groups);
  const weights = new Array(groups);
  for (let j = 0; j < groups; j++) {
    const r = Math.floor(rand() * N_REGIONS);
    siteCode[j] = 'S' + pad(j + 1, siteWidth);
    siteRegion[j] = 'R' + pad(r + 1, 2);
    siteMean[j] = 40 + regionEff[r] + sdSite * normal();
    siteDist[j] = 9 + 3 * normal();
    const tp = rand();
    siteType[j] = tp < 0.2 ? SITE_TYPES[0] : tp < 0.8 ? SITE_TYPES[1] : SITE_TYPES[2];
    siteStaff[j] = String(2 + Math.floor(rand() * 24));
    siteYear[j] = String(1985 + Math.floor(rand() * 39));
    siteL2[j] = ',' + siteType[j] + ',' + siteStaff[j] + ',' + siteYear[j];
    weights[j] = Math.exp(normal()); // lognormal(0,1) -> skewed, unbalanced sizes
  }
  const { prob, alias } = aliasTable(weights);
  const sitePrefix = siteCode.map((s, j) => ',' + s + ',' + siteRegion[j] + ',');

  // Level-1 residual sd so that total level-1 variance ~= 85:
  // var(0.6*visits) ~= 0.36*var(visits) (~6.25 -> 2.25), var(ageShift) ~= 1.4
  const sdE = Math.sqrt(85 - 2.25 - 1.4);

  // ---- stream rows -------------------------------------------------------
  const fh = await open(path, 'w');
  let bytes = 0;
  let buf = cols.join(',') + '\n';
  const flush = async () => {
    const b = Buffer.from(buf, 'utf8');
    bytes += b.length;
    buf = '';
    await fh.write(b, 0, b.length);
  };
  const vals = new Array(ALL_COLUMNS.length);
  try {
    for (let i = 0; i < rows; i++) {
      // site: alias sampling
      const x = rand() * groups;
      let j = x | 0;
      if (j >= groups) j = groups - 1;
      if (x - j >= prob[j]) j = alias[j];
      // age band
      const ua = rand();
      let a = 0;
      while (ua >= AGE_CUM[a]) a++;
      // visits: truncated exponential-ish count 0..12 (mean ~2.4)
      let visits = Math.floor(-Math.log(1 - rand()) * 2.5);
      if (visits > 12) visits = 12;
      const wait = siteMean[j] + 0.6 * visits + AGE_SHIFT[a] + sdE * normal();
      let dist = siteDist[j] + 3 * normal();
      if (dist < 0.05) dist = 0.05;
      if (full) {
        buf += (i + 1) + sitePrefix[j] + fmt1(wait) + ',' + AGE_BANDS[a] + ',' + visits + ',' +
          fmt2(dist) + siteL2[j] + '\n';
      } else {
        vals[0] = i + 1;
        vals[1] = siteCode[j];
        vals[2] = siteRegion[j];
        vals[3] = fmt1(wait);
        vals[4] = AGE_BANDS[a];
        vals[5] = visits;
        vals[6] = fmt2(dist);
        vals[7] = siteType[j];
        vals[8] = siteStaff[j];
        vals[9] = siteYear[j];
        let line = '';
        for (let k = 0; k < idx.length; k++) line += (k ? ',' : '') + vals[idx[k]];
        buf += line + '\n';
      }
      if (buf.length >= CHUNK_CHARS) await flush();
    }
    if (buf.length) await flush();
  } finally {
    await fh.close();
  }
  return { path, rows, groups, seed, columns: cols, bytes, ms: Math.round(performance.now() - t0) };
}

function parseArgs(argv) {
  const out = {};
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (a === '-h' || a === '--help') {
      out.help = true;
      continue;
    }
    const m = /^--([^=]+)(?:=(.*))?$/.exec(a);
    if (!m) throw new Error(`unexpected argument: ${a}`);
    out[m[1]] = m[2] !== undefined ? m[2] : argv[++i];
  }
  return out;
}

async function main() {
  const args = parseArgs(process.argv.slice(2));
  if (args.help || !args.out) {
    console.error(
      'usage: node scripts/synth.js --rows N --groups G --seed S --out FILE.csv [--columns a,b,c]\n' +
        `columns: ${ALL_COLUMNS.join(',')}`,
    );
    process.exit(args.help ? 0 : 2);
  }
  const res = await writeSynthetic({
    path: resolve(args.out),
    rows: args.rows !== undefined ? Number(args.rows) : 1000000,
    groups: args.groups !== undefined ? Number(args.groups) : 5000,
    seed: args.seed !== undefined ? Number(args.seed) : 1,
    columns: args.columns ? String(args.columns).split(',').map((s) => s.trim()).filter(Boolean) : undefined,
  });
  console.log(JSON.stringify(res));
}

if (process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  main().catch((err) => {
    console.error(err instanceof Error ? err.message : err);
    process.exit(1);
  });
}
