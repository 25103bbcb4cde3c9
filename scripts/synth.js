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
import { resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { mulberry32, normalGen } from './prng.js';
import { drawSites } from './synth-sites.js';

export const ALL_COLUMNS = [
  'record_id',
  'site_code',
  'region_code',
  'wait_minutes',
  'age_band',
  'visits',
  'distance_km',
  'site_type',
  'staff',
  'opened_year',
];

const AGE_BANDS = ['18-29', '30-44', '45-59', '60-74', '75+'];
const AGE_CUM = [0.22, 0.5, 0.76, 0.93, 1];
const AGE_SHIFT = [-1.5, -0.5, 0, 1, 2.5];
const CHUNK_CHARS = 1 << 20; // flush at ~1 MB

/**
 * Round to 1 decimal and format (faster than toFixed for the hot loop).
 * @param {number} x
 */
function fmt1(x) {
  const v = Math.round(x * 10);
  const a = v < 0 ? -v : v;
  const s = `${v < 0 ? '-' : ''}${(a / 10) | 0}.${a % 10}`;
  return s === '-0.0' ? '0.0' : s;
}

/** @param {number} x */
function fmt2(x) {
  const v = Math.round(x * 100);
  const a = v < 0 ? -v : v;
  const f = a % 100;
  const s = `${v < 0 ? '-' : ''}${(a / 100) | 0}.${f < 10 ? `0${f}` : f}`;
  return s === '-0.00' ? '0.00' : s;
}

/**
 * The written columns, checked against ALL_COLUMNS.
 * @param {string[] | undefined} columns
 */
function columnsOf(columns) {
  const cols = columns?.length ? [...columns] : [...ALL_COLUMNS];
  for (const c of cols) {
    if (!ALL_COLUMNS.includes(c)) throw new Error(`writeSynthetic: unknown column "${c}"`);
  }
  const full = cols.length === ALL_COLUMNS.length && cols.every((c, i) => c === ALL_COLUMNS[i]);
  return { cols, full, idx: cols.map((c) => ALL_COLUMNS.indexOf(c)) };
}

/**
 * One record's level-1 draws, in the generator's fixed order: site, age band, visits, wait, distance.
 * @param {import('./synth-sites.js').Sites} sites
 * @param {number} groups
 * @param {() => number} rand
 * @param {() => number} normal
 * @param {number} sdE level-1 residual sd
 */
function drawRecord(sites, groups, rand, normal, sdE) {
  // site: alias sampling
  const x = rand() * groups;
  let j = x | 0;
  if (j >= groups) j = groups - 1;
  if (x - j >= sites.prob[j]) j = sites.alias[j];
  // age band
  const ua = rand();
  let a = 0;
  while (ua >= AGE_CUM[a]) a++;
  // visits: truncated exponential-ish count 0..12 (mean ~2.4)
  let visits = Math.floor(-Math.log(1 - rand()) * 2.5);
  if (visits > 12) visits = 12;
  const wait = sites.mean[j] + 0.6 * visits + AGE_SHIFT[a] + sdE * normal();
  let dist = sites.dist[j] + 3 * normal();
  if (dist < 0.05) dist = 0.05;
  return { j, a, visits, wait, dist };
}

/**
 * Stream a synthetic CSV to `path`.
 * @param {{path: string, rows?: number, groups?: number, seed?: number, columns?: string[]}} opts
 * @returns {Promise<{path: string, rows: number, groups: number, seed: number, columns: string[], bytes: number, ms: number}>}
 */
export async function writeSynthetic({ path, rows = 100000, groups = 500, seed = 1, columns }) {
  if (!path) throw new Error('writeSynthetic: path is required');
  rows = Math.floor(Number(rows));
  groups = Math.floor(Number(groups));
  if (!(rows >= 0)) throw new Error('writeSynthetic: rows must be >= 0');
  if (!(groups >= 1)) throw new Error('writeSynthetic: groups must be >= 1');
  const { cols, full, idx } = columnsOf(columns);

  const t0 = performance.now();
  const rand = mulberry32(seed);
  const normal = normalGen(rand);
  const sites = drawSites(groups, rand, normal);

  // Level-1 residual sd so that total level-1 variance ~= 85:
  // var(0.6*visits) ~= 0.36*var(visits) (~6.25 -> 2.25), var(ageShift) ~= 1.4
  const sdE = Math.sqrt(85 - 2.25 - 1.4);

  const fh = await open(path, 'w');
  let bytes = 0;
  let buf = `${cols.join(',')}\n`;
  const flush = async () => {
    const b = Buffer.from(buf, 'utf8');
    bytes += b.length;
    buf = '';
    await fh.write(b, 0, b.length);
  };
  /** @type {(string | number)[]} */
  const vals = new Array(ALL_COLUMNS.length);
  try {
    for (let i = 0; i < rows; i++) {
      const { j, a, visits, wait, dist } = drawRecord(sites, groups, rand, normal, sdE);
      if (full) {
        buf += `${i + 1}${sites.prefix[j]}${fmt1(wait)},${AGE_BANDS[a]},${visits},${fmt2(dist)}${sites.level2[j]}\n`;
      } else {
        vals[0] = i + 1;
        vals[1] = sites.code[j];
        vals[2] = sites.region[j];
        vals[3] = fmt1(wait);
        vals[4] = AGE_BANDS[a];
        vals[5] = visits;
        vals[6] = fmt2(dist);
        vals[7] = sites.type[j];
        vals[8] = sites.staff[j];
        vals[9] = sites.year[j];
        buf += `${idx.map((k) => vals[k]).join(',')}\n`;
      }
      if (buf.length >= CHUNK_CHARS) await flush();
    }
    if (buf.length) await flush();
  } finally {
    await fh.close();
  }
  return { path, rows, groups, seed, columns: cols, bytes, ms: Math.round(performance.now() - t0) };
}

/** @param {string[]} argv */
function parseArgs(argv) {
  /** @type {Record<string, string | boolean | undefined>} */
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
      `usage: node scripts/synth.js --rows N --groups G --seed S --out FILE.csv [--columns a,b,c]\ncolumns: ${ALL_COLUMNS.join(',')}`,
    );
    process.exit(args.help ? 0 : 2);
  }
  const res = await writeSynthetic({
    path: resolve(String(args.out)),
    rows: args.rows !== undefined ? Number(args.rows) : 1000000,
    groups: args.groups !== undefined ? Number(args.groups) : 5000,
    seed: args.seed !== undefined ? Number(args.seed) : 1,
    columns: args.columns
      ? String(args.columns)
          .split(',')
          .map((s) => s.trim())
          .filter(Boolean)
      : undefined,
  });
  console.log(JSON.stringify(res));
}

if (process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  main().catch((err) => {
    console.error(err instanceof Error ? err.message : err);
    process.exit(1);
  });
}
