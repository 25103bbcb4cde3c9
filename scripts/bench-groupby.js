#!/usr/bin/env node

// @ts-check
// Baseline for the profiling pass: how long does a bare DuckDB group-by over the
// CSV take, and how much memory does the process peak at?
//
//   node scripts/bench-groupby.js FILE GROUPCOL [VALUECOL=wait_minutes]
//
// Runs  SELECT <GROUPCOL>, count(*), avg(<VALUECOL>) FROM read_csv('<FILE>') GROUP BY 1
// with threads=2 / memory_limit=200MB, fetches the whole result, then prints one
// JSON line: {"wallMs":…, "maxRssMB":…, "groups":…}
//   wallMs   = wall time from DuckDB instance creation to the fetched result
//   maxRssMB = process.resourceUsage().maxRSS / 1024 (peak RSS of this process)
//   groups   = number of result rows (distinct GROUPCOL values, NULL counted once)

import { existsSync } from 'node:fs';
import { DuckDBInstance } from '@duckdb/node-api';

const [file, groupCol, valueCol = 'wait_minutes'] = process.argv.slice(2);
if (!file || !groupCol) {
  console.error('usage: node scripts/bench-groupby.js FILE GROUPCOL [VALUECOL]');
  process.exit(2);
}
// a glob (the batch case: every file of a folder in one query) is DuckDB's to expand
if (!file.includes('*') && !existsSync(file)) {
  console.error(`no such file: ${file}`);
  process.exit(2);
}

/** @param {string} s */
const sqlString = (s) => `'${String(s).replace(/'/g, "''")}'`;
/** @param {string} s */
const ident = (s) => `"${String(s).replace(/"/g, '""')}"`;

const sql = `SELECT ${ident(groupCol)}, count(*), avg(${ident(valueCol)}) FROM read_csv(${sqlString(file)}) GROUP BY 1`;

const t0 = performance.now();
const inst = await DuckDBInstance.create(':memory:', { threads: '2', memory_limit: '200MB' });
const con = await inst.connect();
const reader = await con.runAndReadAll(sql);
const rows = reader.getRows();
const wallMs = performance.now() - t0;

const maxRssMB = process.resourceUsage().maxRSS / 1024;
console.log(
  JSON.stringify({
    wallMs: Math.round(wallMs * 10) / 10,
    maxRssMB: Math.round(maxRssMB * 10) / 10,
    groups: rows.length,
  }),
);

try {
  con.closeSync?.();
  inst.closeSync?.();
} catch {
  // best effort
}
