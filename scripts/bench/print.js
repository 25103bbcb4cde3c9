// @ts-check
// The bench's console report: the results table, where the audit's time went, and the targets
// missed.
import { cpus } from 'node:os';
import { fmtInt, JUDGED_AT_GROUPS, RATIO_AT_ROWS, TARGET_RATIO, TARGET_RSS_MB, TARGET_WALL_MS } from './config.js';

/** @typedef {import('./summarise.js').Result} Result */

/**
 * Right-aligned columns, the last one left as it is.
 * @param {string[]} head
 * @param {(string | number)[][]} body
 */
function table(head, body) {
  const w = head.map((h, i) => Math.max(h.length, ...body.map((r) => String(r[i]).length)));
  /** @param {(string | number)[]} r */
  const line = (r) => r.map((c, i) => (i === r.length - 1 ? String(c) : String(c).padStart(w[i]))).join('  ');
  return [line(head), w.map((n) => '-'.repeat(n)).join('  '), ...body.map(line)].join('\n');
}
/** @param {number | null | undefined} ms */
const s = (ms) => (ms == null ? '-' : (ms / 1000).toFixed(2));
/** @param {number | null | undefined} x */
const mb = (x) => (x == null ? '-' : x.toFixed(1));
/** @param {Result} r */
const verdict = (r) => {
  const t =
    r.targets.time === 'n/a'
      ? `time n/a (judged at ${fmtInt(RATIO_AT_ROWS)} x ${fmtInt(JUDGED_AT_GROUPS)})`
      : `time<=${TARGET_RATIO[r.ruleSet]}x ${r.targets.time}`;
  const f = r.audit.failure;
  const w = r.targets.wall === 'n/a' ? '' : `; wall<=${TARGET_WALL_MS / 1000}s ${r.targets.wall}`;
  return `${t}${w}; rss<=${TARGET_RSS_MB}MB ${r.targets.rss}${f ? `; audit FAILED ${f.runs}/${f.of} runs` : ''}`;
};

/**
 * @typedef {object} RunInfo
 * @property {number} repeat
 * @property {number} seed
 * @property {string} [memoryLimit]
 * @property {{ commit: string | null, dirty: number | null }} code the commit measured, and its uncommitted files in src/ rules/
 * @property {string} distBuiltAt
 */

/**
 * @param {Result[]} results
 * @param {RunInfo} run
 */
export function printResults(results, { repeat, seed, memoryLimit, code, distBuiltAt }) {
  const dirty = code.dirty ? ` + ${code.dirty} uncommitted file(s) in src/ rules/` : '';
  console.log(
    `\nnestready bench — node ${process.version}, ${cpus().length} CPU(s), repeat ${repeat}, seed ${seed}` +
      `, audit memory limit ${memoryLimit ?? 'CLI default'}; wall = whole spawned process` +
      `\ncode: ${code.commit ?? 'unknown'}${dirty}, dist built ${distBuiltAt}\n`,
  );
  console.log(
    table(
      ['rows', 'groups', 'rules', 'baseline s', 'audit s', 'ratio', 'base RSS MB', 'audit RSS MB', 'targets'],
      results.map((r) => [
        fmtInt(r.rows),
        fmtInt(r.groups),
        r.ruleSet,
        s(r.baseline.medianWallMs),
        r.audit.medianWallMs == null && r.audit.failure ? 'FAILED' : s(r.audit.medianWallMs),
        r.ratio == null ? '-' : `${r.ratio.toFixed(2)}x`,
        mb(r.baseline.peakRssMB),
        r.audit.peakRssMB == null && r.audit.failure ? `(${mb(r.audit.failure.maxRssMB)} at failure)` : mb(r.audit.peakRssMB),
        verdict(r),
      ]),
    ),
  );
}

/** @param {Result[]} results */
export function printPhases(results) {
  console.log('\nwhere the audit process spends its time (medians, seconds; from scripts/bench-child.js):\n');
  console.log(
    table(
      [
        'rows',
        'groups',
        'rules',
        'node start',
        'import duckdb',
        'import cli',
        'main',
        'to profile q',
        'profile q',
        'after profile',
        'lookups n/s',
        'exit',
        'total',
        'base inner',
        'cpu s base/audit',
      ],
      results.map((r) => {
        const p = r.audit.medianPhasesMs;
        return [
          fmtInt(r.rows),
          fmtInt(r.groups),
          r.ruleSet,
          s(p.nodeStartupMs),
          s(p.importDuckdbMs),
          s(p.importCliMs),
          s(p.mainMs),
          s(p.toProfileQueryMs),
          (p.profileQueries ?? 0) > 1 ? `${s(p.profileQueryMs)} (${p.profileQueries} passes)` : s(p.profileQueryMs),
          s(p.afterProfileMs),
          p.lookupQueries == null ? '-' : `${p.lookupQueries} / ${s(p.lookupMs)}`,
          r.audit.medianWallMs == null || p.totalInProcessMs == null ? '-' : s(Math.max(0, r.audit.medianWallMs - p.totalInProcessMs)),
          s(r.audit.medianWallMs),
          s(r.baseline.medianInnerWallMs),
          r.baseline.medianCpuMs == null
            ? '-'
            : `${s(r.baseline.medianCpuMs)} / ${s(r.audit.medianCpuMs)}${r.cpuRatio ? ` (${r.cpuRatio.toFixed(2)}x)` : ''}`,
        ];
      }),
    ),
  );
  console.log(
    '\n  node start    = process start -> bench-child.js body runs; import cli = the bundled dist/bundle/cli.js' +
      ' (commander, yaml, the rules; the engine loads in main)' +
      '\n  main          = the audit itself: to profile q + profile q + after profile' +
      '\n  to profile q  = main() start -> profiling GROUP BY issued (role map, DuckDB instance, views, dialect/type sniff)' +
      '\n  profile q     = the one profiling GROUP BY incl. fetching its result into JS' +
      '\n  after profile = result -> arquero, stats, rules and their lookups, grade, render, write' +
      '\n  lookups n/s   = number of rule lookup queries / the seconds during which one ran (they run at once; part of after profile)' +
      "\n  exit          = parent wall minus the child's in-process time: DuckDB/Node teardown and spawn overhead (approx.)" +
      '\n  base inner    = baseline group-by from DuckDB instance creation to fetched result (its own wallMs)' +
      '\n  cpu s         = user+sys CPU seconds of each whole process (GNU time), less sensitive than wall to other load',
  );
}

/** @param {Result[]} results */
export function printVerdicts(results) {
  /** @param {string} v */
  const bad = (v) => v === 'MISSED' || v === 'FAILED';
  const missed = results.filter((r) => bad(r.targets.time) || bad(r.targets.wall) || bad(r.targets.rss) || r.audit.failure);
  const errored = results.filter((r) => r.targets.rss === 'ERROR' || r.baseline.medianWallMs == null);
  console.log('');
  for (const r of missed) {
    const what = [];
    const f = r.audit.failure;
    if (f) {
      const where = f.failedQuery ? ` in the ${f.failedQuery.kind} query at ${s(f.failedQuery.atMs)}s` : '';
      what.push(`audit FAILED in ${f.runs}/${f.of} runs (${f.error}${where}; peak RSS ${mb(f.maxRssMB)} MB)`);
    }
    if (r.targets.time === 'MISSED') what.push(`audit ${r.ratio}x baseline > ${TARGET_RATIO[r.ruleSet]}x`);
    if (r.targets.wall === 'MISSED') what.push(`audit ${s(r.audit.medianWallMs)} s > ${TARGET_WALL_MS / 1000} s`);
    if (r.targets.rss === 'MISSED') what.push(`audit peak RSS ${r.audit.peakRssMB} MB > ${TARGET_RSS_MB} MB`);
    console.log(`MISSED  ${fmtInt(r.rows)} rows x ${fmtInt(r.groups)} groups, ${r.ruleSet} rules: ${what.join('; ')}`);
  }
  for (const r of errored)
    console.log(
      `ERROR   ${fmtInt(r.rows)} rows x ${fmtInt(r.groups)} groups, ${r.ruleSet} rules: the bench could not measure this case, see stderr`,
    );
  if (!missed.length && !errored.length) console.log('all targets met');

  const loads = results.flatMap((r) => [r.load1.min, r.load1.max]).filter(Number.isFinite);
  const [low, high] = [Math.min(...loads).toFixed(2), Math.max(...loads).toFixed(2)];
  if (loads.length) console.log(`system load (1-min avg) at run starts: ${low}..${high} on ${cpus().length} CPU(s)`);
  if (loads.length && Math.max(...loads) > cpus().length)
    console.log('WARNING the machine was busy during the runs: wall times are inflated and noisy; compare the cpu s columns too');
}
