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

import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, renameSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { cpus, loadavg, tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { parseArgs } from 'node:util';
import { writeSynthetic } from './synth.js';

const here = dirname(fileURLToPath(import.meta.url));
const root = join(here, '..');
const BASELINE = join(here, 'bench-groupby.js');
const CHILD = join(here, 'bench-child.js');
const CLI = join(root, 'dist/bundle/cli.js');
const WORK = join(tmpdir(), 'nestready-bench');
const OUT_DIR = join(root, 'bench-output');

// the foundation's rules: the five it asked for, and the report of unreadable lines it came with
const CORE_RULES = ['missing-group-id', 'level2-varies', 'few-groups', 'singleton-groups', 'low-icc', 'unreadable-lines'];
const TARGET_RATIO = { core: 2, full: 2.5 };
const TARGET_RSS_MB = 300;
const RATIO_AT_ROWS = 1_000_000;
const JUDGED_AT_GROUPS = 5_000;
// and the scaling issue's: ten million rows audited within ten seconds
const WALL_AT_ROWS = 10_000_000;
const TARGET_WALL_MS = 10_000;

// ---- options --------------------------------------------------------------------------
const { values: opt } = parseArgs({
  options: {
    rows: { type: 'string', default: '1000000' },
    groups: { type: 'string', default: '5000' },
    seed: { type: 'string', default: '1' },
    repeat: { type: 'string', default: '3' },
    sizes: { type: 'string' },
    'groups-list': { type: 'string' },
    cases: { type: 'string' },
    'memory-limit': { type: 'string' },
    'rule-sets': { type: 'string', default: 'core,full' },
    keep: { type: 'boolean', default: false },
    help: { type: 'boolean', short: 'h', default: false },
  },
  strict: true,
});
if (opt.help) {
  const lines = readFileSync(fileURLToPath(import.meta.url), 'utf8').split('\n').slice(1);
  const head = lines.slice(0, lines.findIndex((l) => !l.startsWith('//')));
  process.stdout.write(head.map((l) => l.replace(/^\/\/ ?/, '')).join('\n') + '\n');
  process.exit(0);
}

function count(name, s, min = 1) {
  const n = Number(String(s).replace(/_/g, ''));
  if (!Number.isFinite(n) || !Number.isInteger(n) || n < min) {
    process.stderr.write(`bench: --${name} must be an integer >= ${min} (got "${s}")\n`);
    process.exit(2);
  }
  return n;
}
const list = (name, s) => String(s).split(',').map((x) => x.trim()).filter(Boolean).map((x) => count(name, x));

const seed = count('seed', opt.seed, 0);
const repeat = count('repeat', opt.repeat);
const rowsList = opt.sizes ? list('sizes', opt.sizes) : [count('rows', opt.rows, 0)];
const groupsList = opt['groups-list'] ? list('groups-list', opt['groups-list']) : [count('groups', opt.groups)];
const cases = opt.cases
  ? String(opt.cases)
      .split(',')
      .map((x) => x.trim())
      .filter(Boolean)
      .map((x) => {
        const [r, g] = x.split('x');
        return { rows: count('cases', r, 0), groups: count('cases', g ?? '') };
      })
  : rowsList.flatMap((rows) => groupsList.map((groups) => ({ rows, groups })));

const ruleSets = String(opt['rule-sets']).split(',').map((x) => x.trim()).filter(Boolean);
if (!ruleSets.length || ruleSets.some((x) => !(x in TARGET_RATIO))) {
  process.stderr.write(`bench: --rule-sets takes ${Object.keys(TARGET_RATIO).join(', ')} (got "${opt['rule-sets']}")\n`);
  process.exit(2);
}

if (!existsSync(CLI)) {
  process.stderr.write(`bench: ${CLI} not found; run \`npm run build\` first (npm run bench does)\n`);
  process.exit(2);
}
mkdirSync(WORK, { recursive: true });
mkdirSync(OUT_DIR, { recursive: true });

// the code being measured: src/ may change between runs, so every result names its commit
function codeVersion() {
  const git = (...a) => spawnSync('git', a, { cwd: root, encoding: 'utf8' });
  const head = git('rev-parse', '--short', 'HEAD');
  if (head.status !== 0) return { commit: null, dirty: null };
  const st = git('status', '--porcelain', '--', 'src', 'rules');
  return { commit: head.stdout.trim(), dirty: st.stdout.trim() ? st.stdout.trim().split('\n').length : 0 };
}
const code = codeVersion();
const distBuiltAt = statSync(CLI).mtime.toISOString();

// ---- helpers --------------------------------------------------------------------------
const median = (xs) => {
  const s = xs.filter((x) => Number.isFinite(x)).sort((a, b) => a - b);
  if (!s.length) return null;
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
};
const max = (xs) => (xs.filter(Number.isFinite).length ? Math.max(...xs.filter(Number.isFinite)) : null);
const r1 = (x) => (x == null ? null : Math.round(x * 10) / 10);
const r2 = (x) => (x == null ? null : Math.round(x * 100) / 100);
const fmtInt = (n) => n.toLocaleString('en-US');

// CPU seconds (user+sys) of a spawned process, via GNU time when the system has it: less
// sensitive than wall time to other load on the machine, and taken the same way for both sides
const GNU_TIME = existsSync('/usr/bin/time') ? '/usr/bin/time' : null;
const TIME_TAG = 'NRBENCH_TIME';

/** Spawn `node args…`, time it from spawn to exit, collect its output (and CPU time if we can). */
function timed(args, env = {}) {
  return new Promise((resolvePromise) => {
    const load1 = loadavg()[0];
    const [cmd, argv] = GNU_TIME
      ? [GNU_TIME, ['-f', `${TIME_TAG} %U %S`, process.execPath, ...args]]
      : [process.execPath, args];
    const t0 = performance.now();
    const child = spawn(cmd, argv, { cwd: root, env: { ...process.env, ...env }, stdio: ['ignore', 'pipe', 'pipe'] });
    let stdout = '';
    let stderr = '';
    child.stdout.on('data', (d) => (stdout += d));
    child.stderr.on('data', (d) => (stderr += d));
    child.on('error', (e) => resolvePromise({ wallMs: performance.now() - t0, code: null, stdout, stderr: String(e), load1 }));
    child.on('close', (code, signal) => {
      const wallMs = performance.now() - t0;
      let cpuMs = null;
      const m = new RegExp(`^${TIME_TAG} ([\\d.]+) ([\\d.]+)$`, 'm').exec(stderr);
      if (m) {
        cpuMs = (Number(m[1]) + Number(m[2])) * 1000;
        stderr = stderr.replace(m[0], '').replace(/^Command exited with non-zero status \d+$/m, '').trim();
      }
      resolvePromise({ wallMs, cpuMs, code, signal, stdout, stderr, load1 });
    });
  });
}

const ROLES_YAML = `# nestready role map for scripts/synth.js deliveries (written by scripts/bench.js)
group: site_code
unit: record_id
parent: region_code
outcomes: [wait_minutes]
level1: [age_band, visits, distance_km]
level2: [site_type, staff, opened_year]
`;

/** The synthetic delivery for (rows, groups, seed): reused if present, else generated. */
async function delivery(rows, groups) {
  const path = join(WORK, `synth-r${rows}-g${groups}-s${seed}.csv`);
  if (existsSync(path)) return { path, generated: false, bytes: statSync(path).size, genMs: 0 };
  const part = `${path}.${process.pid}.part`; // renamed only once complete, so a present file is whole
  process.stderr.write(`bench: generating ${fmtInt(rows)} rows x ${fmtInt(groups)} groups -> ${path}\n`);
  try {
    const res = await writeSynthetic({ path: part, rows, groups, seed });
    renameSync(part, path);
    return { path, generated: true, bytes: res.bytes, genMs: res.ms };
  } catch (e) {
    rmSync(part, { force: true });
    throw e;
  }
}

async function runBaseline(file) {
  const p = await timed([BASELINE, file, 'site_code']);
  let inner = null;
  try {
    inner = JSON.parse(p.stdout.trim().split('\n').pop());
  } catch {
    // reported as an error below
  }
  if (p.code !== 0 || !inner) return { ok: false, wallMs: p.wallMs, load1: p.load1, error: `exit ${p.code ?? p.signal}: ${p.stderr.trim().slice(0, 500)}` };
  return { ok: true, wallMs: p.wallMs, cpuMs: p.cpuMs, load1: p.load1, maxRssMB: inner.maxRssMB, innerWallMs: inner.wallMs, groups: inner.groups };
}

async function runAudit(file, roles, tag) {
  const out = join(WORK, `report-${tag}.json`);
  const resultFile = join(WORK, `child-${tag}.json`);
  rmSync(resultFile, { force: true });
  const args = [CHILD, file, roles, out];
  if (opt['memory-limit']) args.push(opt['memory-limit']);
  const p = await timed(args, { NESTREADY_BENCH_RESULT: resultFile });
  let res = null;
  try {
    res = JSON.parse(readFileSync(resultFile, 'utf8'));
  } catch {
    // reported below
  }
  rmSync(resultFile, { force: true });
  if (!res) {
    // no result line at all: the harness itself broke (bench-child.js did not get past main)
    return { ok: false, harness: true, wallMs: p.wallMs, load1: p.load1, error: `no result from bench-child.js (exit ${p.code ?? p.signal}): ${p.stderr.trim().slice(0, 500)}` };
  }
  // 0 and 1 are gate results (1 = a blocker finding); 2/3 mean the audit did not run through
  if (res.exitCode !== 0 && res.exitCode !== 1) {
    if (!opt.keep) rmSync(out, { force: true });
    const msg = (p.stderr.trim().split('\n')[0] || '').replace(/^nestready: /, '');
    return {
      ok: false,
      wallMs: p.wallMs,
      cpuMs: p.cpuMs,
      load1: p.load1,
      maxRssMB: res.maxRssMB,
      exitCode: res.exitCode,
      failedQuery: res.failedQuery,
      timings: res.timings,
      queries: res.queries,
      error: `exit ${res.exitCode}: ${msg}`,
    };
  }
  let report = null;
  try {
    const r = JSON.parse(readFileSync(out, 'utf8'));
    report = { rows: r.input?.rows, groups: r.groups?.count, grade: r.grade ?? null, verdict: r.verdict ?? null, findings: (r.findings ?? []).map((f) => f.rule ?? f.id) };
  } catch {
    // a report is not needed for the figures
  }
  if (!opt.keep) rmSync(out, { force: true });
  return { ok: true, wallMs: p.wallMs, cpuMs: p.cpuMs, load1: p.load1, maxRssMB: res.maxRssMB, exitCode: res.exitCode, timings: res.timings, queries: res.queries, report };
}

// ---- run --------------------------------------------------------------------------------
// the role maps: the whole catalogue, and the core rules with every other rule turned off
const { catalogue } = await import(join(root, 'dist/rules/index.js'));
const rolesPaths = { full: join(WORK, 'roles.yaml'), core: join(WORK, 'roles-core.yaml') };
writeFileSync(rolesPaths.full, ROLES_YAML);
const off = catalogue.map((r) => r.meta.id).filter((id) => !CORE_RULES.includes(id));
writeFileSync(rolesPaths.core, `${ROLES_YAML}rules:\n${off.map((id) => `  ${id}: off\n`).join('')}`);
const generated = [];
const results = [];
let failures = 0;

for (const { rows, groups } of cases) {
  const d = await delivery(rows, groups);
  if (d.generated) generated.push(d.path);
  const base = [];
  const aud = Object.fromEntries(ruleSets.map((set) => [set, []]));
  for (let i = 0; i < repeat; i++) {
    process.stderr.write(`bench: ${fmtInt(rows)} x ${fmtInt(groups)}  run ${i + 1}/${repeat}: baseline`);
    const b = await runBaseline(d.path);
    base.push(b);
    process.stderr.write(` ${(b.wallMs / 1000).toFixed(2)}s`);
    if (!b.ok) {
      failures++;
      process.stderr.write(`\nbench: baseline run failed (${b.error.split('\n')[0]})\n`);
    }
    for (const set of ruleSets) {
      process.stderr.write(`, audit ${set}`);
      const a = await runAudit(d.path, rolesPaths[set], `r${rows}-g${groups}-s${seed}-${set}-${i + 1}`);
      aud[set].push(a);
      process.stderr.write(` ${(a.wallMs / 1000).toFixed(2)}s${a.ok ? '' : ' (FAILED)'}`);
      if (a.ok) continue;
      if (a.harness) failures++;
      process.stderr.write(`\nbench: audit ${set} run failed (${a.error.split('\n')[0]})\n`);
    }
    process.stderr.write('\n');
  }
  for (const set of ruleSets) results.push(summarise(rows, groups, d, base, aud[set], set));
}

/** One (case, rule set) row of the results: medians, peaks, ratio and target verdicts. */
function summarise(rows, groups, d, base, aud, ruleSet) {
  const okB = base.filter((x) => x.ok);
  const okA = aud.filter((x) => x.ok);
  const baseWall = median(okB.map((x) => x.wallMs));
  const auditWall = median(okA.map((x) => x.wallMs));
  const ratio = baseWall && auditWall ? auditWall / baseWall : null;
  const auditRss = max(okA.map((x) => x.maxRssMB));
  const timeJudged = rows === RATIO_AT_ROWS && groups === JUDGED_AT_GROUPS;
  const rssJudged = groups === JUDGED_AT_GROUPS;
  const auditFailed = aud.filter((x) => !x.ok && !x.harness);
  const phaseKeys = okA.length ? Object.keys(okA[0].timings) : [];
  const phases = Object.fromEntries(phaseKeys.map((k) => [k, r1(median(okA.map((x) => x.timings[k])))]));
  const failure = auditFailed.length
    ? {
        runs: auditFailed.length,
        of: repeat,
        error: auditFailed[0].error.split('\n')[0],
        failedQuery: auditFailed[0].failedQuery ?? null,
        maxRssMB: r1(max(auditFailed.map((x) => x.maxRssMB))),
        medianWallMs: r1(median(auditFailed.map((x) => x.wallMs))),
        queries: auditFailed[0].queries ?? [],
      }
    : null;
  // a case where every audit run failed misses both targets: the audit did not complete
  const verdictOf = (ok) => (okA.length ? (ok ? 'ok' : 'MISSED') : auditFailed.length ? 'FAILED' : 'ERROR');
  return {
    rows,
    groups,
    ruleSet,
    seed,
    file: d.path,
    fileMB: r1(d.bytes / 2 ** 20),
    generated: d.generated,
    generateMs: d.genMs,
    baseline: {
      medianWallMs: r1(baseWall),
      medianInnerWallMs: r1(median(okB.map((x) => x.innerWallMs))),
      medianCpuMs: r1(median(okB.map((x) => x.cpuMs))),
      peakRssMB: r1(max(okB.map((x) => x.maxRssMB))),
      medianRssMB: r1(median(okB.map((x) => x.maxRssMB))),
      groupsSeen: okB[0]?.groups ?? null,
      runs: base.map(({ ok, wallMs, cpuMs, load1, maxRssMB, innerWallMs, error }) => ({ ok, wallMs: r1(wallMs), cpuMs: r1(cpuMs), load1, maxRssMB, innerWallMs, error })),
    },
    audit: {
      medianWallMs: r1(auditWall),
      peakRssMB: r1(auditRss),
      medianRssMB: r1(median(okA.map((x) => x.maxRssMB))),
      medianCpuMs: r1(median(okA.map((x) => x.cpuMs))),
      exitCode: okA[0]?.exitCode ?? null,
      report: okA[0]?.report ?? null,
      medianPhasesMs: phases,
      queriesOfMedianRun: okA.length ? [...okA].sort((x, y) => x.wallMs - y.wallMs)[okA.length >> 1].queries : [],
      failure,
      runs: aud.map(({ ok, wallMs, cpuMs, load1, maxRssMB, exitCode, error }) => ({ ok, wallMs: r1(wallMs), cpuMs: r1(cpuMs), load1, maxRssMB, exitCode, error })),
    },
    ratio: r2(ratio),
    cpuRatio: (() => {
      const b = median(okB.map((x) => x.cpuMs));
      const a = median(okA.map((x) => x.cpuMs));
      return b && a ? r2(a / b) : null;
    })(),
    load1: { min: Math.min(...[...base, ...aud].map((x) => x.load1)), max: Math.max(...[...base, ...aud].map((x) => x.load1)) },
    targets: {
      time: timeJudged ? (ratio == null ? verdictOf(false) : verdictOf(ratio <= TARGET_RATIO[ruleSet])) : 'n/a',
      wall: rows === WALL_AT_ROWS && groups === JUDGED_AT_GROUPS ? verdictOf(auditWall != null && auditWall <= TARGET_WALL_MS) : 'n/a',
      rss: rssJudged ? verdictOf(auditRss != null && auditRss <= TARGET_RSS_MB) : okA.length ? 'n/a' : verdictOf(false),
    },
  };
}

if (!opt.keep) for (const p of generated) rmSync(p, { force: true });

// ---- report -----------------------------------------------------------------------------
function table(head, body) {
  const w = head.map((h, i) => Math.max(h.length, ...body.map((r) => String(r[i]).length)));
  const line = (r) => r.map((c, i) => (i === r.length - 1 ? String(c) : String(c).padStart(w[i]))).join('  ');
  return [line(head), w.map((n) => '-'.repeat(n)).join('  '), ...body.map(line)].join('\n');
}
const s = (ms) => (ms == null ? '-' : (ms / 1000).toFixed(2));
const mb = (x) => (x == null ? '-' : x.toFixed(1));
const verdict = (r) => {
  const t =
    r.targets.time === 'n/a'
      ? `time n/a (judged at ${fmtInt(RATIO_AT_ROWS)} x ${fmtInt(JUDGED_AT_GROUPS)})`
      : `time<=${TARGET_RATIO[r.ruleSet]}x ${r.targets.time}`;
  const f = r.audit.failure;
  const w = r.targets.wall === 'n/a' ? '' : `; wall<=${TARGET_WALL_MS / 1000}s ${r.targets.wall}`;
  return `${t}${w}; rss<=${TARGET_RSS_MB}MB ${r.targets.rss}` + (f ? `; audit FAILED ${f.runs}/${f.of} runs` : '');
};

console.log(
  `\nnestready bench — node ${process.version}, ${cpus().length} CPU(s), repeat ${repeat}, seed ${seed}` +
    `, audit memory limit ${opt['memory-limit'] ?? 'CLI default'}; wall = whole spawned process` +
    `\ncode: ${code.commit ?? 'unknown'}${code.dirty ? ` + ${code.dirty} uncommitted file(s) in src/ rules/` : ''}, dist built ${distBuiltAt}\n`,
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

console.log('\nwhere the audit process spends its time (medians, seconds; from scripts/bench-child.js):\n');
console.log(
  table(
    ['rows', 'groups', 'rules', 'node start', 'import duckdb', 'import cli', 'main', 'to profile q', 'profile q', 'after profile', 'lookups n/s', 'exit', 'total', 'base inner', 'cpu s base/audit'],
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
        p.profileQueries > 1 ? `${s(p.profileQueryMs)} (${p.profileQueries} passes)` : s(p.profileQueryMs),
        s(p.afterProfileMs),
        p.lookupQueries == null ? '-' : `${p.lookupQueries} / ${s(p.lookupMs)}`,
        r.audit.medianWallMs == null || p.totalInProcessMs == null ? '-' : s(Math.max(0, r.audit.medianWallMs - p.totalInProcessMs)),
        s(r.audit.medianWallMs),
        s(r.baseline.medianInnerWallMs),
        r.baseline.medianCpuMs == null ? '-' : `${s(r.baseline.medianCpuMs)} / ${s(r.audit.medianCpuMs)}` + (r.cpuRatio ? ` (${r.cpuRatio.toFixed(2)}x)` : ''),
      ];
    }),
  ),
);
console.log(
  '\n  node start    = process start -> bench-child.js body runs; import cli = the bundled dist/bundle/cli.js (commander, yaml, the rules; the engine loads in main)' +
    '\n  main          = the audit itself: to profile q + profile q + after profile' +
    '\n  to profile q  = main() start -> profiling GROUP BY issued (role map, DuckDB instance, views, dialect/type sniff)' +
    '\n  profile q     = the one profiling GROUP BY incl. fetching its result into JS' +
    '\n  after profile = result -> arquero, stats, rules and their lookups, grade, render, write' +
    '\n  lookups n/s   = number of rule lookup queries / the seconds during which one ran (they run at once; part of after profile)' +
    '\n  exit          = parent wall minus the child\'s in-process time: DuckDB/Node teardown and spawn overhead (approx.)' +
    '\n  base inner    = baseline group-by from DuckDB instance creation to fetched result (its own wallMs)' +
    '\n  cpu s         = user+sys CPU seconds of each whole process (GNU time), less sensitive than wall to other load',
);

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
for (const r of errored) console.log(`ERROR   ${fmtInt(r.rows)} rows x ${fmtInt(r.groups)} groups, ${r.ruleSet} rules: the bench could not measure this case, see stderr`);
if (!missed.length && !errored.length) console.log('all targets met');

const loads = results.flatMap((r) => [r.load1.min, r.load1.max]).filter(Number.isFinite);
if (loads.length) console.log(`system load (1-min avg) at run starts: ${Math.min(...loads).toFixed(2)}..${Math.max(...loads).toFixed(2)} on ${cpus().length} CPU(s)`);
if (loads.length && Math.max(...loads) > cpus().length) console.log('WARNING the machine was busy during the runs: wall times are inflated and noisy; compare the cpu s columns too');
const distChanged = statSync(CLI).mtime.toISOString() !== distBuiltAt;
if (distChanged) console.log(`WARNING dist/ was rebuilt while the bench ran (now ${statSync(CLI).mtime.toISOString()}): runs may mix code versions`);

const jsonPath = join(OUT_DIR, 'bench.json');
writeFileSync(
  jsonPath,
  JSON.stringify(
    {
      date: new Date().toISOString(),
      node: process.version,
      cpus: cpus().length,
      cpuModel: cpus()[0]?.model ?? null,
      repeat,
      seed,
      auditMemoryLimit: opt['memory-limit'] ?? null,
      code: { ...code, distBuiltAt, distChangedDuringRun: distChanged },
      failedRuns: failures,
      ruleSets,
      coreRules: CORE_RULES,
      targets: { ratioMax: TARGET_RATIO, ratioJudgedAtRows: RATIO_AT_ROWS, judgedAtGroups: JUDGED_AT_GROUPS, wallMaxMsAt10M: TARGET_WALL_MS, auditPeakRssMaxMB: TARGET_RSS_MB },
      results,
    },
    null,
    2,
  ) + '\n',
);
console.log(`\nresults: ${jsonPath}${opt.keep ? `; files kept in ${WORK}` : ''}`);
// missed targets and audit failures (exit 2/3, e.g. DuckDB out of memory) are results and
// exit 0; exit 1 only when the bench itself broke (baseline failed, or no result from the child)
process.exitCode = failures ? 1 : 0;
