#!/usr/bin/env node
// @ts-check
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
// Uses only node built-ins; the PRNG is shared with scripts/synth.js. The scenario's parts live
// in scripts/demo/: design (constants), clean, delivery and defects (the planted defects),
// files (CSV, role maps, ICC) and readme.

import { mkdirSync, writeFileSync } from 'node:fs';
import { dirname, relative, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { makeClean } from './demo/clean.js';
import { makeDelivery } from './demo/delivery.js';
import { anovaIcc, rolesYaml, toCsv } from './demo/files.js';
import { readme } from './demo/readme.js';

const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '..');

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
    'repairs-delivery.defects.json': `${JSON.stringify(defects, null, 2)}\n`,
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
        icc: Object.fromEntries(
          Object.entries(stats)
            .filter(([k]) => k.startsWith('icc'))
            .map(([k, v]) => [k, +v.toFixed(3)]),
        ),
        fixedRate: +(clean.reduce((s, r) => s + Number(r.fixed), 0) / clean.length).toFixed(3),
      }),
    );
  }
}

main();
