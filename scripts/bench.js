#!/usr/bin/env node
// `npm run bench`: how does `nestready audit` compare with a bare DuckDB group-by over the
// same CSV, in wall time and peak memory? Run with the foundation's rules and with the whole
// catalogue (the two have targets of their own).
//
//   node scripts/bench.js [--rows 1000000] [--groups 5000] [--seed 1] [--repeat 3]
//                         [--sizes 1e6,1e7] [--groups-list 1000,100000,1000000]
//                         [--rule-sets core,full] [--memory-limit 100MB] [--keep]
//
//   --sizes        several row counts (each at --groups)
//   --groups-list  several group counts (each at --rows); with --sizes too, every pair runs
//   --cases        explicit ROWSxGROUPS pairs, e.g. 1e6x5000,1e7x5000,1e6x1000000 (instead of the above);
//                  `npm run bench` runs the issue's set: 1M and 10M rows at 5,000 groups, and
//                  1M rows at 1k, 100k and 1M groups (memory grows with the groups, not the rows)
//   --rule-sets    which audits to run (default both): core = the foundation's rules (CORE_RULES
//                  below; the role map turns the rest off), full = the whole catalogue
//   --memory-limit passed to `nestready audit --memory-limit` (default: the CLI's own, 100MB)
//   --keep         keep the generated CSVs and the audit reports
//   --batch        DELIVERIESxROWS, e.g. 20x50000: also audit a folder of that many synthetic deliveries
//                  (--batch-groups groups each, default 500) as one batch with a report folder per
//                  delivery, beside one DuckDB group-by over all its files (`--cases none` runs it alone);
//                  peak RSS is the batch process's, which holds every audit (bench/batch.js)
//   --compare      ROWS, e.g. 1000000: also time `nestready compare` of two synthetic deliveries of that
//                  many rows (seeds s and s+1, 5,000 groups) beside a JSON audit of one, alternating
//                  (bench/compare.js)
//   --draft        ROWS, e.g. 1000000: also time `nestready draft` of a synthetic delivery of that many rows
//                  (5,000 groups, 10 columns) beside a JSON audit of it, alternating (bench/draft.js)
//
// For every (rows, groups) case it generates a synthetic delivery (scripts/synth.js) under
// os.tmpdir()/nestready-bench — reusing synth-r<rows>-g<groups>-s<seed>.csv if an earlier
// run kept it — writes the matching role maps, then runs, alternately and --repeat times:
//   baseline  node scripts/bench-groupby.js FILE site_code   (threads=2, memory_limit=200MB)
//   audit     node scripts/bench-child.js FILE ROLES OUT      (main() of dist/bundle/cli.js, --format json),
//             once per rule set
// All are timed the same way: wall clock around the spawned process, from spawn to exit,
// Node start-up included. Peak RSS is each process's own process.resourceUsage().maxRSS.
//
// Targets: audit median wall <= 2x baseline median wall with the core rules, <= 2.5x with the
// whole catalogue (both judged at 1M rows x 5,000 groups, the issues' case), and audit peak RSS
// <= 300 MB (judged at 5,000 groups: 1M and 10M rows). The other group counts show how memory
// grows with the groups; they have no target.
// The script reports; it does not gate: it exits 0 when
// targets are MISSED or an audit run FAILS (exit 2/3, e.g. DuckDB out of memory), and 1 only
// when the bench itself broke (the baseline failed, or bench-child.js gave no result).
// Results also go to bench-output/bench.json.

// @ts-check
// The parts: bench/options.js (command line), bench/runs.js (one run of each side),
// bench/spawn.js (timing a process), bench/summarise.js (medians and verdicts), bench/print.js.

import { existsSync, mkdirSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { cpus } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { printBatch, runBatchCase } from './bench/batch.js';
import { printCompare, runCompareCase } from './bench/compare.js';
import {
  CLI,
  CORE_RULES,
  fmtInt,
  JUDGED_AT_GROUPS,
  OUT_DIR,
  RATIO_AT_ROWS,
  ROLES_YAML,
  ROOT,
  TARGET_RATIO,
  TARGET_RSS_MB,
  TARGET_WALL_MS,
  WORK,
} from './bench/config.js';
import { printDraft, runDraftCase } from './bench/draft.js';
import { benchOptions } from './bench/options.js';
import { printPhases, printResults, printVerdicts } from './bench/print.js';
import { delivery, runAudit, runBaseline } from './bench/runs.js';
import { codeVersion } from './bench/spawn.js';
import { summarise } from './bench/summarise.js';

/** @typedef {import('./bench/runs.js').AuditRun} AuditRun */

const opt = benchOptions(process.argv.slice(2));
if (opt.help) {
  const lines = readFileSync(fileURLToPath(import.meta.url), 'utf8')
    .split('\n')
    .slice(1);
  const head = lines.slice(
    0,
    lines.findIndex((l) => !l.startsWith('//')),
  );
  process.stdout.write(`${head.map((l) => l.replace(/^\/\/ ?/, '')).join('\n')}\n`);
  process.exit(0);
}
const { seed, repeat, cases, ruleSets } = opt;

if (!existsSync(CLI)) {
  process.stderr.write(`bench: ${CLI} not found; run \`npm run build\` first (npm run bench does)\n`);
  process.exit(2);
}
mkdirSync(WORK, { recursive: true });
mkdirSync(OUT_DIR, { recursive: true });
const code = codeVersion();
const distBuiltAt = statSync(CLI).mtime.toISOString();

// the role maps: the whole catalogue, and the core rules with every other rule turned off
/** @type {typeof import('../dist/rules/index.js')} */
const { catalogue } = await import(join(ROOT, 'dist/rules/index.js'));
/** @type {Record<string, string>} */
const rolesPaths = { full: join(WORK, 'roles.yaml'), core: join(WORK, 'roles-core.yaml') };
writeFileSync(rolesPaths.full, ROLES_YAML);
const off = catalogue.map((r) => r.meta.id).filter((id) => !CORE_RULES.includes(id));
writeFileSync(rolesPaths.core, `${ROLES_YAML}rules:\n${off.map((id) => `  ${id}: off\n`).join('')}`);
/** @type {string[]} */
const generated = [];
/** @type {import('./bench/summarise.js').Result[]} */
const results = [];
let failures = 0;

for (const { rows, groups } of cases) {
  const d = await delivery(rows, groups, seed);
  if (d.generated) generated.push(d.path);
  const base = [];
  /** @type {Record<string, AuditRun[]>} */
  const aud = Object.fromEntries(ruleSets.map((set) => [set, []]));
  for (let i = 0; i < repeat; i++) {
    process.stderr.write(`bench: ${fmtInt(rows)} x ${fmtInt(groups)}  run ${i + 1}/${repeat}: baseline`);
    const b = await runBaseline(d.path);
    base.push(b);
    process.stderr.write(` ${(b.wallMs / 1000).toFixed(2)}s`);
    if (!b.ok) {
      failures++;
      process.stderr.write(`\nbench: baseline run failed (${String(b.error).split('\n')[0]})\n`);
    }
    for (const set of ruleSets) {
      process.stderr.write(`, audit ${set}`);
      const a = await runAudit(d.path, rolesPaths[set], `r${rows}-g${groups}-s${seed}-${set}-${i + 1}`, opt);
      aud[set].push(a);
      process.stderr.write(` ${(a.wallMs / 1000).toFixed(2)}s${a.ok ? '' : ' (FAILED)'}`);
      if (a.ok) continue;
      if (a.harness) failures++;
      process.stderr.write(`\nbench: audit ${set} run failed (${String(a.error).split('\n')[0]})\n`);
    }
    process.stderr.write('\n');
  }
  for (const set of ruleSets) results.push(summarise(rows, groups, d, base, aud[set], set, { seed, repeat }));
}

if (!opt.keep) for (const p of generated) rmSync(p, { force: true });

const batch = opt.batch
  ? await runBatchCase({ ...opt.batch, seed, memoryLimit: opt.memoryLimit, rolesPath: rolesPaths.full, keep: opt.keep })
  : null;
// a failed batch is a result; no summary at all means the harness broke
if (batch && batch.counts === null) failures++;
const compared = opt.compare
  ? await runCompareCase({ rows: opt.compare, groups: 5000, seed, repeat, rolesPath: rolesPaths.full, memoryLimit: opt.memoryLimit })
  : null;
if (compared?.runs.some((r) => !r.ok)) failures++;
const drafted = opt.draft
  ? await runDraftCase({ rows: opt.draft, groups: 5000, seed, repeat, rolesPath: rolesPaths.full, memoryLimit: opt.memoryLimit })
  : null;
if (drafted?.runs.some((r) => !r.ok)) failures++;

printResults(results, { repeat, seed, memoryLimit: opt.memoryLimit, code, distBuiltAt });
printPhases(results);
printVerdicts(results);
if (batch) printBatch(batch);
if (compared) printCompare(compared);
if (drafted) printDraft(drafted);
const distChanged = statSync(CLI).mtime.toISOString() !== distBuiltAt;
if (distChanged)
  console.log(`WARNING dist/ was rebuilt while the bench ran (now ${statSync(CLI).mtime.toISOString()}): runs may mix code versions`);

const jsonPath = join(OUT_DIR, 'bench.json');
const targets = {
  ratioMax: TARGET_RATIO,
  ratioJudgedAtRows: RATIO_AT_ROWS,
  judgedAtGroups: JUDGED_AT_GROUPS,
  wallMaxMsAt10M: TARGET_WALL_MS,
  auditPeakRssMaxMB: TARGET_RSS_MB,
};
const summary = {
  date: new Date().toISOString(),
  node: process.version,
  cpus: cpus().length,
  cpuModel: cpus()[0]?.model ?? null,
  repeat,
  seed,
  auditMemoryLimit: opt.memoryLimit ?? null,
  code: { ...code, distBuiltAt, distChangedDuringRun: distChanged },
  failedRuns: failures,
  ruleSets,
  coreRules: CORE_RULES,
  targets,
  results,
  batch,
  compare: compared,
  draft: drafted,
};
writeFileSync(jsonPath, `${JSON.stringify(summary, null, 2)}\n`);
console.log(`\nresults: ${jsonPath}${opt.keep ? `; files kept in ${WORK}` : ''}`);
// missed targets and audit failures (exit 2/3, e.g. DuckDB out of memory) are results and
// exit 0; exit 1 only when the bench itself broke (baseline failed, or no result from the child)
process.exitCode = failures ? 1 : 0;
