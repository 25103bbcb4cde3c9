import { spawnSync } from 'node:child_process';
import { mkdtempSync, readdirSync, readFileSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { delimiterHint, detectFormat } from '../../src/source/formats/detect.js';

const CLI = 'bin/nestready.js';
const ROLES = 'fixtures/demo/repairs-delivery.roles.yaml';
const F = 'fixtures/formats';

// the CLI's temp folder of its own: other test files spool standard input at the same time
const TMP = mkdtempSync(join(tmpdir(), 'nr-input-test-'));
afterAll(() => rmSync(TMP, { recursive: true, force: true }));

function run(args: string[], input?: Buffer) {
  return spawnSync(process.execPath, [CLI, 'audit', ...args, '-r', ROLES, '-q', '-f', 'json', '--fail-on', 'never'], {
    input,
    env: { ...process.env, TMPDIR: TMP },
    encoding: 'utf8',
    maxBuffer: 1 << 26,
  });
}
const spooled = () =>
  readdirSync(TMP)
    .filter((n) => n.startsWith('nestready-stdin-'))
    .sort();

describe('formats are detected from the extension and the content', () => {
  it.each([
    ['repairs.parquet', 'parquet', false],
    ['repairs.arrow', 'arrow', false],
    ['repairs.arrows', 'arrow', false],
    ['repairs.xlsx', 'xlsx', false],
    ['repairs.json', 'json', false],
    ['repairs.ndjson', 'ndjson', false],
    ['repairs.tsv', 'tsv', false],
    ['repairs.csv.gz', 'csv', true],
    ['repairs-bom.csv', 'csv', false],
  ])('%s is %s', (file, format, gzip) => {
    const delimiter = format === 'csv' ? { delimiter: ',' } : {};
    expect(detectFormat(`${F}/${file}`)).toEqual({ format, gzip, ...delimiter });
  });

  it.each([
    ['a,b,c\n1,2,3\n', ','],
    ['a;b;c\r\n1,5;2;3\r\n', ';'], // a decimal comma is not in the header
    ['a\tb\n1\t2\n', '\t'],
    ['a|b\n1|2\n', '|'],
    ['a,b\n"x,y",2\n', undefined], // a quoted delimiter: left to DuckDB's sniffer
    ['a;b,c\n1;2\n', undefined], // two candidates in the header
    ['a\n1\n', undefined], // one column
    ['a,b\n1,2', undefined], // the second line may be cut off
  ])('the delimiter of %j is plain: %j', (text, delim) => {
    expect(delimiterHint(text)).toBe(delim);
  });

  it("the user's --input-format wins", () => {
    expect(detectFormat(`${F}/repairs.tsv`, 'csv').format).toBe('csv');
  });
});

describe('- reads standard input, spooled to a temp file that is deleted afterwards', () => {
  it.each([
    ['CSV', 'fixtures/demo/repairs-delivery.csv'],
    ['Parquet (detected from its content)', `${F}/repairs.parquet`],
    ['gzip-compressed CSV', `${F}/repairs.csv.gz`],
  ])('%s on stdin gives the report of the file', (_, file) => {
    const before = spooled();
    const fromFile = run([file]);
    const fromStdin = run(['-'], readFileSync(file));
    expect(fromStdin.status, fromStdin.stderr).toBe(fromFile.status);
    const a = JSON.parse(fromFile.stdout);
    const b = JSON.parse(fromStdin.stdout);
    expect(b.input.path).toBe('-');
    expect(b.findings).toEqual(a.findings);
    expect(b.groups).toEqual(a.groups);
    expect(b.outcomes).toEqual(a.outcomes);
    expect(spooled()).toEqual(before);
  });

  it('the delivery file is never modified', () => {
    const file = `${F}/repairs.xlsx`;
    const before = { bytes: readFileSync(file), mtime: statSync(file).mtimeMs };
    expect(run([file]).status).toBe(0);
    expect(readFileSync(file).equals(before.bytes)).toBe(true);
    expect(statSync(file).mtimeMs).toBe(before.mtime);
  });

  it('an empty stdin is an input error', () => {
    const res = run(['-'], Buffer.alloc(0));
    expect(res.status).toBe(2);
    expect(res.stderr).toMatch(/^nestready: -: the file is empty/);
  });
});
