import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import type { Run } from './helpers/cli.js';
import { cliScratch, nestready, nestreadyWithStdin } from './helpers/cli.js';

/** Exit 2 with one line on stderr, no stack trace, no library warning; the line is returned. */
function oneLine(run: Run): string {
  expect(run.code, run.stderr).toBe(2);
  expect(run.stderr.trimEnd().split('\n'), run.stderr).toHaveLength(1);
  expect(run.stderr).not.toMatch(/ {4}at |Warning|trace-warnings|Maximum call stack/);
  return run.stderr.trimEnd();
}

const scratch = cliScratch('nestready-hostile-cli-');
const file = scratch.file;

describe.concurrent('hostile input through the command line', () => {
  it('--problems with an NDJSON delivery audits and writes the rows (the demo as NDJSON)', async ({ expect }) => {
    const out = join(scratch.dir(), 'repairs-problems.csv');
    const run = await nestready(
      'audit',
      'fixtures/formats/repairs.ndjson',
      '-r',
      'fixtures/demo/repairs-delivery.roles.yaml',
      '--problems',
      out,
    );
    expect(run.code, run.stderr).toBe(1);
    expect(run.stderr).toBe(`nestready: wrote the problem rows (CSV) to ${out}\n`);
    expect(readFileSync(out, 'utf8').split('\n')[0]).toMatch(/^record,group,unit,rule,severity,column,reason/);
  });

  it('--problems with a one-record NDJSON delivery', async ({ expect }) => {
    const out = join(scratch.dir(), 'one-problems.csv');
    const run = await nestready(
      'audit',
      file('one.ndjson', '{"group":"g"}\n'),
      '-r',
      file('one.yaml', 'group: group\n'),
      '--problems',
      out,
    );
    expect([0, 1], run.stderr).toContain(run.code);
    expect(run.stderr).toBe(`nestready: wrote the problem rows (CSV) to ${out}\n`);
  });

  it('a key that is a list: one line, no warning from the YAML library', async ({ expect }) => {
    const roles = file('complex-key.yaml', '? [complex, key]\n: v\ngroup: g\noutcome: y\n');
    const line = oneLine(await nestready('audit', file('d.csv', 'g,y\n1,2\n'), '-r', roles));
    expect(line).toBe(`nestready: ${roles}:1:3: a key that is a list; keys are names`);
  });

  it('20,000 nested levels: said at line:column, no stack overflow', async ({ expect }) => {
    const roles = file('deep.yaml', `group: g\noutcome: ${'['.repeat(20_000)}${']'.repeat(20_000)}\n`);
    const line = oneLine(await nestready('audit', file('d2.csv', 'g,y\n1,2\n'), '-r', roles));
    expect(line).toBe(`nestready: ${roles}:2:73: nested deeper than 64 levels`);
  });

  it('a 10 MB role map is refused by its size', async ({ expect }) => {
    const roles = file('big.yaml', `group: g\nmissing:\n${'  - token\n'.repeat(1_000_000)}`);
    const line = oneLine(await nestready('audit', file('d3.csv', 'g,y\n1,2\n'), '-r', roles));
    expect(line).toBe(`nestready: ${roles}: the role map is 10,000,018 bytes; the limit is 1 MiB (1048576 bytes)`);
  });

  it('a line of invalid UTF-8 in the unit ID: one unreadable line, not an engine crash', async ({ expect }) => {
    const lines = ['g,u,y', ...Array.from({ length: 12 }, (_, i) => `G${i % 3},U${1000 + i},${i}`)];
    const bytes = Buffer.from(`${lines.join('\n')}\n`);
    const at = bytes.indexOf('U', bytes.indexOf('\n'));
    const path = join(scratch.dir(), 'unit-utf8.csv');
    writeFileSync(path, Buffer.concat([bytes.subarray(0, at + 1), Buffer.from([0xff, 0xc0]), bytes.subarray(at + 1)]));
    // the early unit check scanned the unit column alone, beside the profile, before the rejects
    // were read: DuckDB 1.5 failed ("Attempted to access index 1 within vector of size 1"), exit 3
    const roles = file('unit-utf8.yaml', 'group: g\nunit: u\noutcome: y\nmissing: [""]\n');
    const run = await nestready('audit', path, '-r', roles, '--format', 'json');
    expect(run.code, run.stderr).toBe(1);
    const { input } = JSON.parse(run.stdout) as { input: { rows: number; rowsRejected: number } };
    expect([input.rows, input.rowsRejected]).toEqual([11, 1]);
  });

  it.each([
    ['a role map naming an absent column', 'g,y\n1,2\n', 'group: nope\n', /: column "nope" is not in -; its header is: g, y$/],
    [
      'an NDJSON record with a duplicate key',
      '{"g":1,"g":2,"y":3}\n',
      'group: g\n',
      /^nestready: -: cannot read as NDJSON \(.*in file "-"/,
    ],
    ['a cut-off Parquet file', 'PAR1garbage', 'group: g\n', /^nestready: -: cannot read as PARQUET \(.*File '-' too small/],
    ['a gzip header-only CSV', gzipSync('g,y\n'), 'group: g\n', /^nestready: -: no records/],
    ['empty input', '', 'group: g\n', /^nestready: -: the file is empty/],
  ])('standard input: %s is named "-", never the spooled copy', async (name, input, yaml, pattern) => {
    const roles = file(`roles-${name.replace(/\W+/g, '-')}.yaml`, yaml);
    const line = oneLine(await nestreadyWithStdin(input, 'audit', '-', '-r', roles));
    expect(line).toMatch(pattern);
    expect(line).not.toMatch(/nestready-stdin|[\\/]stdin\b/);
  });
});
