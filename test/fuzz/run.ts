import { existsSync, mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import fc from 'fast-check';
import { PENDING, PENDING_CHECKS } from './classes.js';
import type { RunResult } from './contract.js';
import { breaches, digests, leftovers, runCli, runInProcess } from './contract.js';
import type { FuzzCase } from './gen/case.js';
import { classesOf, fuzzCase } from './gen/case.js';
import type { Written } from './write-case.js';
import { writeCase } from './write-case.js';

export interface FuzzOptions {
  runs: number;
  seed: number;
  /** run the cases i with i % parts === part only (the suite is split over test files that run in parallel) */
  part?: number;
  parts?: number;
  /** every n-th case runs through the CLI process, the rest in-process */
  cliEvery: number;
  /** called after each case (progress) */
  onCase?: (index: number) => void;
}

export interface Failure {
  index: number;
  /** `FUZZ_SEED=<seed> FUZZ_ONLY=<index>` reproduces the case */
  seed: number;
  classes: string[];
  breaches: string[];
  yaml: string;
  sample: string;
}

export interface FuzzSummary {
  cases: number;
  viaCli: number;
  /** cases whose delivery the test's own writer could not produce (not the tool's failure) */
  unwritable: number;
  byClass: Record<string, number>;
  /** cases by exit code */
  byExit: Record<string, number>;
  /** input errors (exit 2) by kind */
  inputErrors: Record<string, number>;
  failures: Failure[];
  /** milliseconds spent writing cases, running them, and running a share a second time */
  timing?: { write: number; run: number; second: number };
}

/** Damage that entitles the tool to refuse a delivery (exit 2); without any, it must read it. */
// a header name with a line break inside its quotes is refused, naming the column (src/source/formats/csv.ts)
const REFUSABLE = [
  'empty-file',
  'header-only',
  'ragged-rows',
  'nul-byte',
  'invalid-utf8',
  'json-duplicate-key',
  'duplicate-header',
  'line-break-in-header',
];

/** A case the tool must audit: a valid role map and none of the damage above (hostile values are data). */
function wellFormed(classes: readonly string[]): boolean {
  return !classes.some((k) => REFUSABLE.includes(k) || k.startsWith('roles:'));
}

/** Whether a case is of a pending class: `a+b` in PENDING names the cases of both classes a and b. */
function isPending(classes: readonly string[]): boolean {
  return Object.keys(PENDING).some((key) => key.split('+').every((k) => classes.includes(k)));
}

/** A case of an enabled class: a pending class is not generated. */
const enabled = fuzzCase.filter((c) => !isPending(classesOf(c)));

/** The case of a seed and index: the same on every machine, so a failure can be rerun alone. */
export function caseAt(seed: number, index: number): FuzzCase {
  return fc.sample(enabled, { numRuns: 1, seed: (seed + index * 7919) | 0 })[0];
}

function sameOutputs(a: RunResult, b: RunResult): string[] {
  if (a.code !== b.code || a.error !== b.error) return [`second run differs: exit ${a.code} then ${b.code}`];
  return Object.keys(a.outputs)
    .filter((k) => a.outputs[k] !== b.outputs[k])
    .map((k) => `second run gives a different ${k} output`);
}

/**
 * Generate and run `runs` cases, checking the contract on each (contract.ts). Temp files go to a
 * private TMPDIR, which must be empty after every case; inputs must be byte-identical afterwards.
 */
// biome-ignore lint/complexity/noExcessiveCognitiveComplexity: the case loop with its bookkeeping; the checks themselves are in contract.ts
export async function fuzz(options: FuzzOptions): Promise<FuzzSummary> {
  const root = mkdtempSync(join(tmpdir(), 'nestready-fuzz-'));
  const tmp = join(root, 'tmp');
  mkdirSync(tmp);
  const savedTmp = process.env.TMPDIR;
  // os.tmpdir() reads TMPDIR on every call: the engine's spill directories land in `tmp`
  process.env.TMPDIR = tmp;
  const summary: FuzzSummary = { cases: 0, viaCli: 0, unwritable: 0, byClass: {}, byExit: {}, inputErrors: {}, failures: [] };
  let seenXlsx = false;
  const waivedXlsx = PENDING_CHECKS.some((p) => p.class === 'xlsx' && p.breach === 'temp files left');
  const timing = { write: 0, run: 0, second: 0 };
  const only = process.env.FUZZ_ONLY === undefined ? null : Number(process.env.FUZZ_ONLY);
  try {
    const [part, parts] = only === null ? [options.part ?? 0, options.parts ?? 1] : [only, 1];
    for (let i = part; i < (only === null ? options.runs : only + 1); i += parts) {
      const c = caseAt(options.seed, i);
      const classes = classesOf(c);
      const dir = mkdtempSync(join(root, `case-${i}-`));
      let written: Written;
      let t0 = performance.now();
      try {
        written = await writeCase(c, dir, options.seed + i);
        timing.write += performance.now() - t0;
        t0 = performance.now();
      } catch {
        summary.unwritable++;
        rmSync(dir, { recursive: true, force: true });
        continue;
      }
      summary.cases++;
      for (const k of classes) summary.byClass[k] = (summary.byClass[k] ?? 0) + 1;
      const before = digests(written);
      // a delivery on standard input is the CLI's alone to read
      const viaCli = c.stdin || i % options.cliEvery === options.cliEvery - 1;
      // the costly parts on a share of the cases, and always where their check has something to find
      const wants = {
        html: classes.includes('markup') || i % 20 === 0,
        plots: i % 40 === 0,
        problems: classes.includes('problem-rows'),
      };
      const run: RunResult = viaCli ? await runCli(written, dir, tmp) : await runInProcess(written, wants);
      if (viaCli) summary.viaCli++;
      summary.byExit[String(run.code)] = (summary.byExit[String(run.code)] ?? 0) + 1;
      if (run.code === 2 && run.error) {
        // the kind of input error: the line without the case's paths, positions and details
        const kind = run.error
          .replace(/^nestready: /, '')
          .replace(/\S*(delivery\.[a-z.]+|roles\.yaml)(:\d+:\d+)?/g, '$1')
          .replace(/\s*\(.*$|".*$/, '')
          .slice(0, 70);
        summary.inputErrors[kind] = (summary.inputErrors[kind] ?? 0) + 1;
        if (process.env.FUZZ_VERBOSE) console.log(`fuzz: case ${i} [${classes.join(' ')}]: ${run.error.slice(0, 300)}`);
      }
      timing.run += performance.now() - t0;
      t0 = performance.now();
      const records = (c.format === 'csv' || c.format === 'tsv') && !c.empty ? c.table.rows.length : null;
      let found = breaches(run, written, records);
      if (run.code === 2 && wellFormed(classes)) found.push(`a well-formed delivery refused: ${run.error}`);
      if (digests(written).join() !== before.join()) found.push('an input file changed');
      // exceljs's spooled worksheets (tmp-*) may appear after the read returned, during a later case:
      // waived for all cases once an xlsx case ran (PENDING_CHECKS); the engine's own files are not
      seenXlsx ||= c.format === 'xlsx' && waivedXlsx;
      const left = leftovers(tmp).filter((f) => !(seenXlsx && f.startsWith('tmp-')));
      if (left.length) found.push(`temp files left: ${left.join(', ')}`);
      // DuckDB's default spill directory, had the engine not been given one of its own
      if (existsSync('.tmp')) found.push('temp files left: .tmp in the working directory');
      if (!viaCli && i % 16 === 0 && run.code !== 3) found.push(...sameOutputs(run, await runInProcess(written, wants)));
      timing.second += performance.now() - t0;
      const waived = PENDING_CHECKS.filter((p) => classes.includes(p.class)).map((p) => p.breach);
      found = found.filter((b) => !waived.some((w) => b.startsWith(w)));
      if (found.length) {
        summary.failures.push({
          index: i,
          seed: options.seed,
          classes,
          breaches: found,
          yaml: c.roles.yaml,
          sample: JSON.stringify({ header: c.table.header, rows: c.table.rows.slice(0, 3), text: c.text, json: c.json }).slice(0, 600),
        });
      }
      for (const f of left) rmSync(join(tmp, f), { recursive: true, force: true });
      rmSync(dir, { recursive: true, force: true });
      options.onCase?.(i);
    }
    summary.timing = timing;
  } finally {
    if (savedTmp === undefined) delete process.env.TMPDIR;
    else process.env.TMPDIR = savedTmp;
    rmSync(root, { recursive: true, force: true });
  }
  return summary;
}

/** Failures counted by breach kind (the message up to its first colon) and by case class. */
export function failureTable(failures: readonly Failure[]): { byBreach: Record<string, number>; byClass: Record<string, number> } {
  const byBreach: Record<string, number> = {};
  const byClass: Record<string, number> = {};
  for (const f of failures) {
    for (const b of new Set(f.breaches.map((m) => m.split(':')[0]))) byBreach[b] = (byBreach[b] ?? 0) + 1;
    for (const k of f.classes) byClass[k] = (byClass[k] ?? 0) + 1;
  }
  return { byBreach, byClass };
}
