import { expect, it } from 'vitest';
import { PENDING, PENDING_CHECKS } from './classes.js';
import type { FuzzSummary } from './run.js';
import { failureTable, fuzz } from './run.js';

// `npm test` runs a seeded 200; `npm run fuzz` 10,000 (FUZZ_RUNS, FUZZ_SEED, FUZZ_ONLY=<index> to rerun one case)
const runs = Number(process.env.FUZZ_RUNS ?? 200);
const seed = Number(process.env.FUZZ_SEED ?? 20261202);

function printPending(): void {
  const pending = Object.entries(PENDING);
  const list = pending.map(([k, why]) => `  ${k}: ${why}`).join('\n');
  if (pending.length) console.log(`fuzz: ${pending.length} class(es) not generated until fixed:\n${list}`);
  for (const p of PENDING_CHECKS) console.log(`fuzz: check "${p.breach}" waived for class ${p.class}: ${p.reason}`);
}

function printSummary(label: string, summary: FuzzSummary, seconds: number): void {
  const { byBreach, byClass } = failureTable(summary.failures);
  const ms = JSON.stringify(summary.timing, (_, v) => (typeof v === 'number' ? Math.round(v) : v));
  console.log(
    [
      `fuzz (${label}): ${summary.cases} cases (${summary.viaCli} through the CLI, ${summary.unwritable} not writable ` +
        `by the generator) in ${seconds.toFixed(1)} s, ${summary.failures.length} failing`,
      `  exit codes: ${JSON.stringify(summary.byExit)}`,
      `  input errors: ${JSON.stringify(summary.inputErrors, null, 1)}`,
      `  classes: ${JSON.stringify(summary.byClass)}`,
      `  ms: ${ms}`,
      ...(summary.failures.length
        ? [`  failures by breach: ${JSON.stringify(byBreach)}`, `  failures by class: ${JSON.stringify(byClass)}`]
        : []),
    ].join('\n'),
  );
}

/**
 * The fuzz test for the cases i with i % parts === part: each part is a test file of its own,
 * so that the test runner's workers run the parts at once.
 */
export function fuzzTest(part: number, parts: number): void {
  const label = `part ${part + 1} of ${parts}, ${runs} cases in all, seed ${seed}`;
  it(`keeps the contract on generated deliveries and role maps (${label})`, { timeout: Math.max(120_000, runs * 2_000) }, async () => {
    if (part === 0) printPending();
    const started = Date.now();
    const elapsed = () => (Date.now() - started) / 1000;
    const summary = await fuzz({
      runs,
      seed,
      part,
      parts,
      cliEvery: 50,
      onCase: (i) => {
        if (runs > 500 && i % 1000 < parts) console.log(`fuzz: case ${i} reached after ${elapsed().toFixed(0)} s`);
      },
    });
    printSummary(label, summary, elapsed());
    expect(summary.failures.slice(0, 20)).toEqual([]);
  });
}
