#!/usr/bin/env node
// @ts-check
// One audit run for scripts/bench.js, as its own process: the real CLI entry
// (`main` from the bundled dist/bundle/cli.js) called in-process, report written with --out.
//
//   NESTREADY_BENCH_RESULT=/tmp/r.json node scripts/bench-child.js FILE ROLES.yaml OUT.json [MEMORY_LIMIT]
//
// When main() returns it writes one JSON object to $NESTREADY_BENCH_RESULT (or, without
// that variable, one JSON line to stderr):
//   { maxRssMB, exitCode, timings: {...}, queries: [...] }
//   maxRssMB = process.resourceUsage().maxRSS / 1024  (peak RSS of this whole process)
//   exitCode = process.exitCode set by main (0/1 = gate result, 2 = input error, 3 = bug)
// The parent times the whole process (Node start-up included); the timings here only
// split that time up. They come from this script alone: it wraps DuckDBConnection.run and
// .runAndReadAll (prototype methods of @duckdb/node-api) to timestamp every query that
// nestready issues; nothing in src/ is touched. Times are ms since process start
// (performance.timeOrigin), so they line up with the parent's wall time.

import { writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';

const scriptStartMs = performance.now(); // Node bootstrap + loading this module

const [file, roles, out, memoryLimit] = process.argv.slice(2);
if (!file || !roles || !out) {
  process.stderr.write('usage: node scripts/bench-child.js FILE ROLES.yaml OUT.json [MEMORY_LIMIT]\n');
  process.exit(2);
}

const rssMB = () => process.resourceUsage().maxRSS / 1024;
/** @param {number} x */
const r1 = (x) => Math.round(x * 10) / 10;
/** @param {unknown} e */
const firstLine = (e) => String(/** @type {{ message?: unknown }} */ (e)?.message ?? e).split('\n')[0];

/**
 * One query nestready issued, timed from the call to its end (for a stream: its last chunk).
 * @typedef {{ kind: string, sql: string, startMs: number, endMs: number, maxRssMB: number, error?: string }} Query
 */
/** @param {string} sql */
const started = (sql) => ({ kind: label(sql), sql: String(sql).slice(0, 120), startMs: performance.now(), endMs: 0, maxRssMB: 0 });

// ---- load the DuckDB binding first (so its cost is visible), then instrument it ------
const t0 = performance.now();
// required as the CLI requires it (src/source/duck.ts), so the same module object is patched
const duck = createRequire(import.meta.url)('@duckdb/node-api');
const duckImportedMs = performance.now();

/** @type {Query[]} */
const queries = [];
// connections inside runAndReadAll (which calls run): per connection, since look-ups run at once
const inReadAll = new WeakSet();
const proto = duck.DuckDBConnection.prototype;
const origRun = proto.run;
const origReadAll = proto.runAndReadAll;
const origStream = proto.stream;
// Query kinds, from the SQL text alone (so this keeps working as src/ changes):
//   profile      the profiling GROUP BY (its select list starts with count(*)::DOUBLE AS n)
//   create-view  CREATE [OR REPLACE] VIEW ... (lazy: no scan)
//   sniff        DESCRIBE ... read_csv(...)  (dialect/type sniff of a sample)
//   describe     other DESCRIBE
//   rejects      reads of the rejects table
//   lookup       anything else (rule lookups: bounded output, but may scan the delivery)
/** @param {string} sql */
function label(sql) {
  const s = String(sql).replace(/\s+/g, ' ').trim();
  if (/count\(\*\)::DOUBLE AS n\b/.test(s) && /GROUP BY/i.test(s)) return 'profile';
  if (/^CREATE (OR REPLACE )?(TEMP |TEMPORARY )?VIEW/i.test(s)) return 'create-view';
  if (/^DESCRIBE/i.test(s)) return /read_csv\(/i.test(s) ? 'sniff' : 'describe';
  if (/\bnr_rejects\b/.test(s)) return 'rejects';
  return 'lookup';
}
/** @param {string} sql @param {unknown[]} rest */
proto.run = async function run(sql, ...rest) {
  if (inReadAll.has(this)) return origRun.call(this, sql, ...rest); // timed by runAndReadAll below
  /** @type {Query} */
  const q = started(sql);
  try {
    return await origRun.call(this, sql, ...rest);
  } catch (e) {
    q.error = firstLine(e);
    throw e;
  } finally {
    q.endMs = performance.now();
    q.maxRssMB = rssMB();
    queries.push(q);
  }
};
// the profiling query is streamed (read chunk by chunk): timed from the call to the last
// chunk, so the result's conversion is in its time
/** @param {string} sql @param {unknown[]} rest */
proto.stream = async function stream(sql, ...rest) {
  /** @type {Query} */
  const q = started(sql);
  let result;
  try {
    result = await origStream.call(this, sql, ...rest);
  } catch (e) {
    q.error = firstLine(e);
    q.endMs = performance.now();
    q.maxRssMB = rssMB();
    queries.push(q);
    throw e;
  }
  const fetchChunk = result.fetchChunk.bind(result);
  let done = false;
  result.fetchChunk = async () => {
    try {
      const chunk = await fetchChunk();
      if (!done && (!chunk || chunk.rowCount === 0)) {
        done = true;
        q.endMs = performance.now();
        q.maxRssMB = rssMB();
        queries.push(q);
      }
      return chunk;
    } catch (e) {
      if (!done) {
        done = true;
        q.error = firstLine(e);
        q.endMs = performance.now();
        q.maxRssMB = rssMB();
        queries.push(q);
      }
      throw e;
    }
  };
  return result;
};
/** @param {string} sql @param {unknown[]} rest */
proto.runAndReadAll = async function runAndReadAll(sql, ...rest) {
  /** @type {Query} */
  const q = started(sql);
  inReadAll.add(this);
  try {
    return await origReadAll.call(this, sql, ...rest);
  } catch (e) {
    q.error = firstLine(e);
    throw e;
  } finally {
    inReadAll.delete(this);
    q.endMs = performance.now();
    q.maxRssMB = rssMB();
    queries.push(q);
  }
};

// the bundle has no declarations; its main is src/cli.ts's
/** @type {typeof import('../dist/src/cli.js')} */
const { main } = await import(new URL('../dist/bundle/cli.js', import.meta.url).href);
const cliImportedMs = performance.now();
const rssAfterImportMB = rssMB();

// ---- the audit itself ----------------------------------------------------------------
const argv = ['node', 'nestready', 'audit', file, '--roles', roles, '--format', 'json', '--out', out];
if (memoryLimit) argv.push('--memory-limit', memoryLimit);
// more options from the caller (the batch case: --reports-dir)
if (process.env.NESTREADY_BENCH_EXTRA) argv.push(...JSON.parse(process.env.NESTREADY_BENCH_EXTRA));
const mainStartMs = performance.now();
await main(argv);
const mainEndMs = performance.now();

// ---- summarise -----------------------------------------------------------------------
queries.sort((a, b) => a.startMs - b.startMs);
// wall time during which a query of this kind ran: look-ups run at once, so overlapping
// intervals count once
/** @param {string} kind */
const sumKind = (kind) => {
  let total = 0;
  let reach = -Infinity;
  for (const q of queries.filter((x) => x.kind === kind).sort((a, b) => a.startMs - b.startMs)) {
    total += Math.max(0, q.endMs - Math.max(q.startMs, reach));
    reach = Math.max(reach, q.endMs);
  }
  return total;
};
// the profiling pass may run more than once (a typed read re-run as text after rejects):
// "to profile" is up to the first one, "profile" spans first start .. last end
const profiles = queries.filter((q) => q.kind === 'profile');
const profile = profiles.length
  ? { startMs: profiles[0].startMs, endMs: profiles[profiles.length - 1].endMs, maxRssMB: profiles[profiles.length - 1].maxRssMB }
  : null;
const after = profile ? queries.filter((q) => q.startMs >= profile.endMs) : [];
const firstAfter = after[0];
const timings = {
  nodeStartupMs: r1(scriptStartMs), // process start -> this script's body runs
  importDuckdbMs: r1(duckImportedMs - t0),
  importCliMs: r1(cliImportedMs - duckImportedMs),
  mainMs: r1(mainEndMs - mainStartMs),
  // inside main: before the profiling query (role map load, DuckDB instance, views, sniff)
  toProfileQueryMs: profile ? r1(profile.startMs - mainStartMs) : null,
  sniffMs: r1(sumKind('sniff')),
  profileQueries: profiles.length,
  profileQueryMs: profile ? r1(profile.endMs - profile.startMs) : null,
  profileQueryOnlyMs: r1(sumKind('profile')), // the profiling queries alone (without what ran between retries)
  // after the profiling query: arquero tables, stats, rules (lookups), grade, render, write
  afterProfileMs: profile ? r1(mainEndMs - profile.endMs) : null,
  // JS work between the profiling query and the next query (result -> arquero, column profiles)
  profileToNextQueryMs: profile && firstAfter ? r1(firstAfter.startMs - profile.endMs) : null,
  lookupQueries: queries.filter((q) => q.kind === 'lookup').length,
  lookupMs: r1(sumKind('lookup')),
  rejectsMs: r1(sumKind('rejects')),
  lastQueryToEndMs: queries.length ? r1(mainEndMs - queries[queries.length - 1].endMs) : null,
  totalInProcessMs: r1(mainEndMs), // process start -> main returned
  maxRssAfterImportMB: r1(rssAfterImportMB),
  maxRssAfterProfileMB: profile ? r1(profile.maxRssMB) : null,
};

// the fatal query: the last one that threw, when main ended in an error (a caught throw,
// e.g. the rejects table not existing, is not a failure)
const failed = Number(process.exitCode ?? 0) >= 2 ? [...queries].reverse().find((q) => q.error) : null;
const result = {
  maxRssMB: r1(rssMB()),
  exitCode: process.exitCode ?? 0,
  // the first query that threw, if any (main turns that into exit 2 or 3)
  failedQuery: failed ? { kind: failed.kind, atMs: r1(failed.endMs), error: failed.error } : null,
  timings,
  queries: queries.map((q) => ({
    kind: q.kind,
    startMs: r1(q.startMs),
    ms: r1(q.endMs - q.startMs),
    maxRssMB: r1(q.maxRssMB),
    sql: q.sql,
    ...(q.error ? { error: q.error } : {}),
  })),
};
const line = JSON.stringify(result);
if (process.env.NESTREADY_BENCH_RESULT) writeFileSync(process.env.NESTREADY_BENCH_RESULT, `${line}\n`);
else process.stderr.write(`${line}\n`);
// exit code stays whatever main set (process.exitCode)
