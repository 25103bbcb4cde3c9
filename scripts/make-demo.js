#!/usr/bin/env node
// Generate the invented "community repair workshops" demo fixtures.
//
//   node scripts/make-demo.js [--out fixtures/demo] [--quiet]
//
// Writes (deterministically — re-running reproduces the same bytes):
//   repairs-clean.csv            ~3,000 repair jobs nested in 60 workshops
//   repairs-clean.roles.yaml     role map for it
//   repairs-delivery.csv         the same data with planted defects
//   repairs-delivery.roles.yaml  role map (same roles)
//   repairs-delivery.defects.json machine-readable list of the planted defects
//   README.md                    scenario, columns, planted-defect table
//
// Everything here is invented: no real places, people or organisations.
// Uses only node built-ins; the PRNG is shared with scripts/synth.js.

import { mkdirSync, writeFileSync } from 'node:fs';
import { dirname, resolve, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import { mulberry32, normalGen } from './synth.js';

const SEED = 20240611;
const HERE = dirname(fileURLToPath(import.meta.url));
const ROOT = resolve(HERE, '..');

// ---------------------------------------------------------------------------
// design constants
// ---------------------------------------------------------------------------
const N_WORKSHOPS = 60;
const N_RECORDS = 3000;
const SIZE_MIN = 15;
const SIZE_MAX = 90;
const NETWORKS = ['amber', 'birch', 'cobalt', 'dune', 'ember', 'fern'];
const NETWORK_WORKSHOPS = [14, 12, 10, 9, 8, 7]; // sums to 60 (unbalanced on purpose)
const FORMATS = ['weekly', 'monthly', 'pop-up'];
const FORMAT_CUM = [0.45, 0.8, 1];
const KINDS = ['toaster', 'lamp', 'bicycle', 'laptop', 'clothing', 'other'];
const KIND_CUM = [0.14, 0.32, 0.52, 0.68, 0.88, 1];
// log-scale effects on repair_minutes, logit effects on fixed, log-scale age shift
const KIND_MIN = { toaster: 0.0, lamp: -0.25, bicycle: 0.1, laptop: 0.3, clothing: -0.15, other: 0.0 };
const KIND_FIX = { toaster: 0.1, lamp: 0.6, bicycle: 0.5, laptop: -0.7, clothing: 0.8, other: -0.2 };
const KIND_AGE = { toaster: 0.3, lamp: 0.4, bicycle: 0.5, laptop: -0.3, clothing: 0.0, other: 0.2 };
const HELPERS_CUM = [0.42, 0.74, 0.92, 1];

const COLUMNS = [
  'job_id', 'workshop', 'network', 'repair_minutes', 'fixed', 'item_kind',
  'item_age_years', 'helpers', 'workshop_format', 'benches', 'opened_year',
];

// ---------------------------------------------------------------------------
// helpers
// ---------------------------------------------------------------------------
const pad = (n, w) => String(n).padStart(w, '0');
const wsId = (k) => `W-${pad(k, 3)}`; // k is 1-based
const jobId = (k) => `J${pad(k, 6)}`;
const pickCum = (u, cum) => {
  let i = 0;
  while (u >= cum[i]) i++;
  return i;
};
const round1 = (x) => (Math.round(x * 10) / 10).toFixed(1);

function shuffleInPlace(arr, rand) {
  for (let i = arr.length - 1; i > 0; i--) {
    const j = Math.floor(rand() * (i + 1));
    [arr[i], arr[j]] = [arr[j], arr[i]];
  }
  return arr;
}

function sample(arr, k, rand) {
  return shuffleInPlace([...arr], rand).slice(0, k);
}

function csvField(v) {
  const s = String(v);
  return /[",\n\r]|^\s|\s$/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

function toCsv(rows) {
  const lines = [COLUMNS.join(',')];
  for (const r of rows) lines.push(COLUMNS.map((c) => csvField(r[c])).join(','));
  return lines.join('\n') + '\n';
}

/** One-way ANOVA ICC(1) estimate for unbalanced groups. */
function anovaIcc(rows, g, y) {
  const groups = new Map();
  let sum = 0;
  for (const r of rows) {
    const v = Number(r[y]);
    sum += v;
    const e = groups.get(r[g]) ?? { n: 0, s: 0, ss: 0 };
    e.n++;
    e.s += v;
    e.ss += v * v;
    groups.set(r[g], e);
  }
  const N = rows.length;
  const J = groups.size;
  const gm = sum / N;
  let ssb = 0;
  let ssw = 0;
  let sn2 = 0;
  for (const e of groups.values()) {
    const m = e.s / e.n;
    ssb += e.n * (m - gm) ** 2;
    ssw += e.ss - e.n * m * m;
    sn2 += e.n * e.n;
  }
  const msb = ssb / (J - 1);
  const msw = ssw / (N - J);
  const n0 = (N - sn2 / N) / (J - 1);
  const s2b = (msb - msw) / n0;
  return s2b / (s2b + msw);
}

// ---------------------------------------------------------------------------
// 1. clean data
// ---------------------------------------------------------------------------
function makeClean() {
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
  records.forEach((r, i) => {
    r.job_id = jobId(i + 1);
  });
  return { records: records.map(orderRow), workshops, rand, normal, netEff };
}

function makeWorkshop(id, network, size, rand, normal, netEff) {
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
    // log-scale workshop effect on repair_minutes (network + format + own)
    u: netEff[network] + fmtEff - 0.01 * (benches - 7) + 0.15 * normal(),
    v: 0.6 * normal(), // logit-scale effect on fixed
    a: 0.22 * normal(), // log-scale shift of item_age_years
  };
}

function makeRecord(w, rand, normal) {
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

const orderRow = (r) => Object.fromEntries(COLUMNS.map((c) => [c, r[c]]));

// ---------------------------------------------------------------------------
// 2. delivery with planted defects
// ---------------------------------------------------------------------------
function makeDelivery(clean, workshops) {
  const rand = mulberry32(SEED + 1);
  const normal = normalGen(rand);
  const rows = clean.map((r) => ({ ...r }));
  const byWs = new Map();
  rows.forEach((r, i) => {
    if (!byWs.has(r.workshop)) byWs.set(r.workshop, []);
    byWs.get(r.workshop).push(i);
  });
  const used = new Set(); // clean row indices already carrying a defect

  // (e) id variants of W-014
  const TARGET = 'W-014';
  const special = new Set([TARGET]);
  const e14 = sample(byWs.get(TARGET), 7, rand);
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
  const pool = (pred) => workshops.filter((w) => !special.has(w.id) && pred(w)).map((w) => w.id);
  const fmtA = sample(pool((w) => w.format === 'weekly'), 1, rand)[0];
  special.add(fmtA);
  const fmtB = sample(pool((w) => w.format === 'monthly'), 1, rand)[0];
  special.add(fmtB);
  const bnC = sample(pool((w) => w.benches === 8), 1, rand)[0];
  if (!bnC) throw new Error('make-demo: no workshop with benches = 8 (change SEED)');
  special.add(bnC);
  const level2 = [
    { workshop: fmtA, column: 'workshop_format', expected: 'weekly', planted: 'monthly', k: 3 },
    { workshop: fmtB, column: 'workshop_format', expected: 'monthly', planted: 'weekly', k: 2 },
    { workshop: bnC, column: 'benches', expected: 8, planted: 6, k: 3 },
  ];
  for (const d of level2) {
    d.idx = sample(byWs.get(d.workshop), d.k, rand).sort((a, b) => a - b);
    for (const i of d.idx) {
      rows[i][d.column] = d.planted;
      used.add(i);
    }
  }

  // single-row defects come from ordinary workshops only
  const ordinary = rows.map((_, i) => i).filter((i) => !special.has(clean[i].workshop));
  const take = (k) => {
    const free = ordinary.filter((i) => !used.has(i));
    const got = sample(free, k, rand).sort((a, b) => a - b);
    got.forEach((i) => used.add(i));
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
  const tagged = rows.map((r, i) => ({ r, src: i }));
  const extras = [
    ...dupIdx.map((i) => ({ r: { ...clean[i] }, dupOf: i })),
    ...singletons.map((r) => ({ r, singleton: true })),
  ];
  for (const x of extras) {
    for (;;) {
      const pos = Math.floor(rand() * (tagged.length + 1));
      if (x.dupOf !== undefined) {
        const orig = tagged.findIndex((t) => t.src === x.dupOf);
        if (Math.abs(orig - pos) < 200) continue; // keep the copy well away from the original
      }
      tagged.splice(pos, 0, x);
      break;
    }
  }

  // 1-based data record numbers in the final file
  const rowOfSrc = new Map();
  const rowOfDup = new Map();
  const rowOfJobSingleton = new Map();
  tagged.forEach((t, k) => {
    if (t.src !== undefined) rowOfSrc.set(t.src, k + 1);
    else if (t.dupOf !== undefined) rowOfDup.set(t.dupOf, k + 1);
    else rowOfJobSingleton.set(t.r.job_id, k + 1);
  });
  const ref = (i, extra = {}) => ({ row: rowOfSrc.get(i), job_id: clean[i].job_id, ...extra });

  const defects = {
    file: 'repairs-delivery.csv',
    rowNumbering: '1-based data record number, header excluded',
    dataRows: tagged.length,
    cleanRows: clean.length,
    missingGroup: {
      count: blankIdx.length + naIdx.length,
      blank: blankIdx.map((i) => ref(i, { originalWorkshop: clean[i].workshop })),
      NA: naIdx.map((i) => ref(i, { originalWorkshop: clean[i].workshop })),
    },
    inconsistentLevel2: level2.map((d) => ({
      workshop: d.workshop,
      column: d.column,
      expected: d.expected,
      planted: d.planted,
      workshopRows: byWs.get(d.workshop).length,
      rows: d.idx.map((i) => ref(i)),
    })),
    singletonGroups: singletons.map((r) => ({
      workshop: r.workshop,
      network: r.network,
      row: rowOfJobSingleton.get(r.job_id),
      job_id: r.job_id,
    })),
    outcome: {
      column: 'repair_minutes',
      missingCode: { value: '-999', rows: m999Idx.map((i) => ref(i, { workshop: clean[i].workshop })) },
      nonNumeric: { value: 'n/a', rows: naTokIdx.map((i) => ref(i, { workshop: clean[i].workshop })) },
    },
    groupIdVariants: variants.map((v) => ({
      variant: v.variant,
      canonical: v.canonical,
      note: v.note,
      rows: v.idx.map((i) => ref(i)),
    })),
    duplicateUnitIds: dupIdx.map((i) => ({
      job_id: clean[i].job_id,
      workshop: clean[i].workshop,
      rows: [rowOfSrc.get(i), rowOfDup.get(i)].sort((a, b) => a - b),
      exactCopy: true,
    })),
  };

  // derived expectations
  const wsCounts = new Map();
  for (const t of tagged) wsCounts.set(t.r.workshop, (wsCounts.get(t.r.workshop) ?? 0) + 1);
  const nonMissing = [...wsCounts.keys()].filter((w) => w !== '' && w !== 'NA');
  const sizes = nonMissing.map((w) => wsCounts.get(w));
  defects.expected = {
    dataRows: tagged.length,
    rowsMissingGroup: blankIdx.length + naIdx.length,
    distinctWorkshopValues: nonMissing.length,
    distinctWorkshopsAfterTrimAndUpper: new Set(nonMissing.map((w) => w.trim().toUpperCase())).size,
    singletonGroups: sizes.filter((s) => s === 1).length,
    smallestNonSingletonGroup: Math.min(...sizes.filter((s) => s > 1)),
    groupSizes: Object.fromEntries(
      [TARGET, 'W-014 ', 'w-014', fmtA, fmtB, bnC].map((w) => [w, wsCounts.get(w)]),
    ),
    distinctJobIds: new Set(tagged.map((t) => t.r.job_id)).size,
    duplicatedJobIdValues: dupIdx.length,
    repairMinutesMissingCode: m999Idx.length,
    repairMinutesNonNumeric: naTokIdx.length,
    workshopsWithInconsistentLevel2: level2.length,
  };
  return { rows: tagged.map((t) => t.r), defects };
}

// ---------------------------------------------------------------------------
// 3. role maps and README
// ---------------------------------------------------------------------------
function rolesYaml(file) {
  return `# nestready role map — repair jobs nested in workshops
# (${file}; generated by scripts/make-demo.js)
# group: the level-2 cluster id (each record belongs to one workshop)
group: workshop
# unit: the level-1 record id (one repair job; should be unique)
unit: job_id
# parent: higher-level id above the group (each workshop is run by one network)
parent: network
# outcomes: response variable(s) for the multilevel model
outcomes: [repair_minutes]
# level1: predictors that vary between jobs within a workshop
level1: [item_kind, item_age_years, helpers]
# level2: workshop-level predictors (should be constant within a workshop)
level2: [workshop_format, benches, opened_year]
# missing: tokens to read as missing values in any column
missing: ["", "NA", "-999"]
# types: explicit column type overrides (fixed is a 0/1 outcome kept for later use)
types: { fixed: binary }
`;
}

function readme(clean, workshops, d, stats) {
  const rowsList = (xs) => xs.map((x) => `${x.job_id} (row ${x.row})`).join(', ');
  const m = d.missingGroup;
  const o = d.outcome;
  const sizes = workshops.map((w) => w.size);
  const netCounts = NETWORKS.map((n) => `${n} ${workshops.filter((w) => w.network === n).length}`).join(', ');
  const l2 = d.inconsistentLevel2;
  const lines = [];
  lines.push(`# Demo fixtures: community repair workshops

_Generated by \`scripts/make-demo.js\` (seed ${SEED}); do not edit by hand — re-run
\`node scripts/make-demo.js\` instead. Re-running reproduces the same bytes._

## Scenario (invented)

Volunteer-run **repair workshops** invite people to bring broken household items
and fix them together. Each **record is one repair job** at a workshop. Workshops
are grouped into six **regional networks** (\`amber\`, \`birch\`, \`cobalt\`, \`dune\`,
\`ember\`, \`fern\`); every workshop belongs to exactly one network, and each network
sends its jobs log to a central coordinator as a **delivery**. The coordinator
wants to model repair time with a two-level model (jobs within workshops) and
runs nestready on the delivery first.

All names, codes and numbers are invented; no real places, organisations or
people are represented.

## Files

| file | what |
| --- | --- |
| \`repairs-clean.csv\` | ${clean.length} jobs in ${workshops.length} workshops, no defects |
| \`repairs-clean.roles.yaml\` | role map for the clean file |
| \`repairs-delivery.csv\` | the same jobs as delivered, with planted defects (${d.dataRows} data rows) |
| \`repairs-delivery.roles.yaml\` | role map for the delivery (same roles) |
| \`repairs-delivery.defects.json\` | the planted defects below, machine-readable |

## Columns

| column | level / role | description |
| --- | --- | --- |
| \`job_id\` | unit id | repair job id, \`J000001\`…; unique in the clean file |
| \`workshop\` | group id | workshop id, \`W-001\`…\`W-060\` |
| \`network\` | parent | regional network running the workshop (6 values) |
| \`repair_minutes\` | outcome | time spent on the job, minutes, positive, 1 decimal; lognormal with a workshop random effect |
| \`fixed\` | binary (0/1) | was the item fixed; has a workshop effect (logit scale); declared in \`types\` only |
| \`item_kind\` | level 1 | one of toaster, lamp, bicycle, laptop, clothing, other |
| \`item_age_years\` | level 1 | age of the item in years, 1 decimal; modest between-workshop share |
| \`helpers\` | level 1 | volunteers on the job, integer 1–4 |
| \`workshop_format\` | level 2 | weekly, monthly or pop-up; constant within workshop |
| \`benches\` | level 2 | number of work benches, integer 2–12; constant within workshop |
| \`opened_year\` | level 2 | year the workshop opened, 2008–2023; constant within workshop |

## Clean file facts

- ${clean.length} records, ${workshops.length} workshops, sizes ${Math.min(...sizes)}–${Math.max(...sizes)}
  (median ${stats.medianSize}); no singleton groups; rows are shuffled (not sorted by workshop).
  Job ids run \`J000001\`…\`J${pad(clean.length, 6)}\` in file order.
- Workshops per network: ${netCounts}.
- One-way ANOVA ICC(1) by workshop: repair_minutes ${stats.iccMinutes.toFixed(3)},
  log(repair_minutes) ${stats.iccLogMinutes.toFixed(3)}, fixed ${stats.iccFixed.toFixed(3)},
  item_age_years ${stats.iccAge.toFixed(3)}.
- No missing values of any kind; level-2 columns and \`network\` are constant within workshop.

## Planted defects in \`repairs-delivery.csv\`

Row number = 1-based data record number (header excluded), i.e. row N is line
N + 1 of the file (\`sed -n "$((N+1))p"\`). The delivery holds the
${d.cleanRows} clean records (some altered, in the same relative order) plus 7 inserted
records: the 4 singleton-workshop jobs and 3 exact re-sent copies.

| # | defect | count | where (job_id and row) |
| --- | --- | --- | --- |
| a | missing group id: \`workshop\` blank | ${m.blank.length} | ${rowsList(m.blank)} |
| a | missing group id: \`workshop\` = \`NA\` | ${m.NA.length} | ${rowsList(m.NA)} |
| b | \`workshop_format\` differs within ${l2[0].workshop} (${l2[0].expected} → ${l2[0].planted}) | ${l2[0].rows.length} | ${rowsList(l2[0].rows)} |
| b | \`workshop_format\` differs within ${l2[1].workshop} (${l2[1].expected} → ${l2[1].planted}) | ${l2[1].rows.length} | ${rowsList(l2[1].rows)} |
| b | \`benches\` differs within ${l2[2].workshop} (${l2[2].expected} → ${l2[2].planted}) | ${l2[2].rows.length} | ${rowsList(l2[2].rows)} |
| c | singleton workshops (one record each) | ${d.singletonGroups.length} | ${d.singletonGroups.map((s) => `${s.workshop}: ${s.job_id} (row ${s.row})`).join(', ')} |
| d | \`repair_minutes\` = \`-999\` (declared missing code) | ${o.missingCode.rows.length} | ${rowsList(o.missingCode.rows)} |
| d | \`repair_minutes\` = \`n/a\` (non-numeric token, not a declared missing code) | ${o.nonNumeric.rows.length} | ${rowsList(o.nonNumeric.rows)} |
| e | workshop id variant \`"W-014 "\` (trailing space, written quoted) of W-014 | ${d.groupIdVariants[0].rows.length} | ${rowsList(d.groupIdVariants[0].rows)} |
| e | workshop id variant \`w-014\` (lower case) of W-014 | ${d.groupIdVariants[1].rows.length} | ${rowsList(d.groupIdVariants[1].rows)} |
| f | duplicated \`job_id\` (second row is an exact copy) | ${d.duplicateUnitIds.length} ids / ${d.duplicateUnitIds.length * 2} rows | ${d.duplicateUnitIds.map((x) => `${x.job_id} (rows ${x.rows.join(' and ')})`).join(', ')} |

Notes:

- (a) The 10 rows keep their other values; their original workshops were
  ${[...m.blank, ...m.NA].map((x) => `${x.job_id}→${x.originalWorkshop}`).join(', ')}.
  Both \`""\` and \`NA\` are declared \`missing\` tokens in the role map. A reader that
  does not honour them would instead see a 3-row pseudo-group \`NA\` spanning several
  networks with conflicting level-2 values (DuckDB's \`read_csv\` turns the blanks into
  NULL but keeps \`NA\` as a string).
- (b) ${l2[0].workshop} has ${l2[0].workshopRows} records, ${l2[1].workshop} has ${l2[1].workshopRows}, ${l2[2].workshop} has ${l2[2].workshopRows}; all other
  rows of those workshops keep the expected value. \`opened_year\` and \`network\` are never altered.
- (c) The singleton workshops are new ids (not in the clean file) with new job ids
  ${d.singletonGroups.map((s) => s.job_id).join(', ')}; their values are complete and valid.
- (d) All other ${d.dataRows - o.missingCode.rows.length - o.nonNumeric.rows.length} \`repair_minutes\` values are positive numbers with 1 decimal.
- (e) W-014 keeps ${d.expected.groupSizes['W-014']} rows under its canonical id; \`"W-014 "\` has ${d.expected.groupSizes['W-014 ']} and \`w-014\` has ${d.expected.groupSizes['w-014']}
  (so neither variant is a singleton). The trailing-space value is written as a quoted
  CSV field so that parsers which trim unquoted fields still see it.
- (f) The copies are inserted at least 200 rows away from the originals;
  ${d.duplicateUnitIds.map((x) => `${x.workshop}`).join(', ')} each hold one extra (duplicate) row compared with the clean file.
- Single-row defects (a, d, f) are drawn from different rows and never from the
  workshops used in (b) and (e); the same row never carries two defects.

### Expected totals for the delivery

| quantity | value |
| --- | --- |
| data rows | ${d.expected.dataRows} |
| rows with missing workshop (blank or NA) | ${d.expected.rowsMissingGroup} |
| distinct non-missing \`workshop\` strings (as written) | ${d.expected.distinctWorkshopValues} |
| distinct workshops after trim + upper-case | ${d.expected.distinctWorkshopsAfterTrimAndUpper} |
| singleton groups (as written) | ${d.expected.singletonGroups} |
| distinct \`job_id\` values | ${d.expected.distinctJobIds} |
| duplicated \`job_id\` values | ${d.expected.duplicatedJobIdValues} |
| \`repair_minutes\` = -999 | ${d.expected.repairMinutesMissingCode} |
| \`repair_minutes\` = n/a | ${d.expected.repairMinutesNonNumeric} |
| workshops with inconsistent level-2 values | ${d.expected.workshopsWithInconsistentLevel2} (${l2.map((x) => `${x.workshop} ${x.column}`).join('; ')}) |

Group sizes as written: ${Object.entries(d.expected.groupSizes).map(([k, v]) => `\`${JSON.stringify(k)}\` ${v}`).join(', ')}.
`);
  return lines.join('\n');
}

// ---------------------------------------------------------------------------
// main
// ---------------------------------------------------------------------------
function main() {
  const args = process.argv.slice(2);
  const outArg = args.includes('--out') ? args[args.indexOf('--out') + 1] : 'fixtures/demo';
  const quiet = args.includes('--quiet');
  const out = resolve(ROOT, outArg);
  mkdirSync(out, { recursive: true });

  const { records: clean, workshops } = makeClean();
  const { rows: delivery, defects } = makeDelivery(clean, workshops);

  // sanity checks on the clean file
  const ids = new Set(clean.map((r) => r.job_id));
  if (ids.size !== clean.length) throw new Error('clean: job_id not unique');
  for (const w of workshops) {
    if (w.size < 2) throw new Error(`clean: ${w.id} has size ${w.size}`);
  }

  const sorted = workshops.map((w) => w.size).sort((a, b) => a - b);
  const stats = {
    medianSize: (sorted[29] + sorted[30]) / 2,
    iccMinutes: anovaIcc(clean, 'workshop', 'repair_minutes'),
    iccLogMinutes: anovaIcc(
      clean.map((r) => ({ ...r, lm: Math.log(Number(r.repair_minutes)) })),
      'workshop',
      'lm',
    ),
    iccFixed: anovaIcc(clean, 'workshop', 'fixed'),
    iccAge: anovaIcc(clean, 'workshop', 'item_age_years'),
  };

  const files = {
    'repairs-clean.csv': toCsv(clean),
    'repairs-clean.roles.yaml': rolesYaml('repairs-clean.csv'),
    'repairs-delivery.csv': toCsv(delivery),
    'repairs-delivery.roles.yaml': rolesYaml('repairs-delivery.csv'),
    'repairs-delivery.defects.json': JSON.stringify(defects, null, 2) + '\n',
    'README.md': readme(clean, workshops, defects, stats),
  };
  for (const [name, text] of Object.entries(files)) writeFileSync(resolve(out, name), text);

  if (!quiet) {
    console.log(
      JSON.stringify({
        out: relative(process.cwd(), out) || '.',
        files: Object.keys(files),
        cleanRows: clean.length,
        deliveryRows: delivery.length,
        workshopSizes: [sorted[0], sorted[sorted.length - 1]],
        icc: Object.fromEntries(Object.entries(stats).filter(([k]) => k.startsWith('icc')).map(([k, v]) => [k, +v.toFixed(3)])),
        fixedRate: +(clean.reduce((s, r) => s + r.fixed, 0) / clean.length).toFixed(3),
      }),
    );
  }
}

main();
