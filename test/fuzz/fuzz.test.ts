import { expect, it } from 'vitest';
import { PENDING, PENDING_CHECKS } from './classes.js';
import { failureTable, fuzz } from './run.js';

// `npm test` runs a seeded 500; `npm run fuzz` 10,000 (FUZZ_RUNS, FUZZ_SEED, FUZZ_ONLY=<index> to rerun one case)
const runs = Number(process.env.FUZZ_RUNS ?? 500);
const seed = Number(process.env.FUZZ_SEED ?? 20261202);

it(`keeps the contract on ${runs} generated deliveries and role maps (seed ${seed})`, { timeout: Math.max(120_000, runs * 2_000) }, async () => {
  const pending = Object.entries(PENDING);
  if (pending.length) console.log(`fuzz: ${pending.length} class(es) not generated until fixed:\n${pending.map(([k, why]) => `  ${k}: ${why}`).join('\n')}`);
  for (const p of PENDING_CHECKS) console.log(`fuzz: check "${p.breach}" waived for class ${p.class}: ${p.reason}`);
  const started = Date.now();
  const summary = await fuzz({
    runs,
    seed,
    cliEvery: 50,
    onCase: (i) => {
      if (runs > 500 && i % 500 === 499) console.log(`fuzz: ${i + 1} cases, ${((Date.now() - started) / 1000).toFixed(0)} s`);
    },
  });
  const { byBreach, byClass } = failureTable(summary.failures);
  console.log(
    `fuzz: ${summary.cases} cases (${summary.viaCli} through the CLI, ${summary.unwritable} not writable by the generator) in ` +
      `${((Date.now() - started) / 1000).toFixed(1)} s, ${summary.failures.length} failing\n` +
      `  exit codes: ${JSON.stringify(summary.byExit)}\n  input errors: ${JSON.stringify(summary.inputErrors, null, 1)}\n  classes: ${JSON.stringify(summary.byClass)}\n  ms: ${JSON.stringify(summary.timing, (_, v) => (typeof v === 'number' ? Math.round(v) : v))}` +
      (summary.failures.length ? `\n  failures by breach: ${JSON.stringify(byBreach)}\n  failures by class: ${JSON.stringify(byClass)}` : ''),
  );
  expect(summary.failures.slice(0, 20)).toEqual([]);
});
