import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import { tableFromArrays, tableToIPC } from 'apache-arrow';
import { afterAll, describe, expect, it } from 'vitest';
import { catalogue } from '../../rules/index.js';
import { audit } from '../../src/audit.js';
import { parseRoles } from '../../src/roles/load.js';
import { splitNullTokens } from '../../src/source/engines/duckdb/csv-null-tokens.js';
import { profileOf } from '../helpers/profile-of.js';

const dir = mkdtempSync(join(tmpdir(), 'nestready-hostile-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const file = (name: string, text: string) => {
  const path = join(dir, name);
  writeFileSync(path, text);
  return path;
};

describe('missing tokens holding a quote or the delimiter', () => {
  it('are split from the tokens the CSV reader takes', () => {
    expect(splitNullTokens(['', 'NA', 'N"A', 'a,b', "it's", 'x\ty', 'n/a'], ',')).toEqual({
      reader: ['', 'NA', 'n/a'],
      after: ['N"A', 'a,b', "it's", 'x\ty'],
    });
    expect(splitNullTokens(['a:b'], ':').after).toEqual(['a:b']);
  });

  it('are read as missing in a CSV with quoted fields, text and number columns alike', async () => {
    const csv = file(
      'quoted.csv',
      'g,y,z\n1,2,"a,b"\n1,3,"x ""q"""\n1,4,plain\n2,"N""A","N""A"\n2,6,"a,b"\n2,7,NA\n3,8,"say ""a,b"""\n3,9,w\n',
    );
    const { profile } = await profileOf(csv, 'group: g\noutcome: y\nlevel1: [z]\nmissing: ["", "NA", "N\\"A", "a,b"]\n');
    expect(profile.rows).toBe(8);
    expect(profile.rejected).toEqual([]);
    const z = profile.column('z');
    // "a,b" twice, N"A once, NA once; 'x "q"' and 'say "a,b"' are values (whole-field match)
    expect([z.missing, z.nonMissing]).toEqual([4, 4]);
    const y = profile.column('y');
    expect([y.missing, y.nonMissing, y.numericCount]).toEqual([1, 7, 7]);
  });

  it('a tab in a token of a TSV delivery', async () => {
    const tsv = file('tab.tsv', 'g\ty\tz\n1\t2\t"a\tb"\n1\t3\tq\n2\t4\t"a\tb"\n2\t5\tr\n');
    const { profile } = await profileOf(tsv, 'group: g\noutcome: y\nlevel1: [z]\nmissing: ["", "a\\tb"]\n');
    expect(profile.rows).toBe(4);
    expect([profile.column('z').missing, profile.column('z').nonMissing]).toEqual([2, 2]);
  });
});

describe('the role map names a column the delivery lacks', () => {
  const csv = () => file('d.csv', 'g,y\n1,2\n1,3\n2,4\n');
  it.each([
    ['an absent group column', 'group: nope\noutcome: y\n', '"nope"'],
    ['a YAML tag on the group value', 'group: !!js/function "function(){}"\noutcome: y\n', '"function(){}"'],
  ])('%s: roles.yaml:line:col names the column and the header, not a reader error', async (_, yaml, name) => {
    const path = csv();
    const roles = parseRoles(yaml, 'roles.yaml', catalogue);
    await expect(audit(path, roles)).rejects.toThrow(`roles.yaml:1:1: column ${name} is not in ${path}; its header is: g, y`);
  });
});

describe('header names with spaces at their edges keep them', () => {
  const csv = () => file('edges.csv', 'g,y," z","w "\n1,2,3,4\n1,3,4,5\n2,5,5,6\n2,6,6,8\n');
  it('a role map spelling them as written reads them', async () => {
    const { profile } = await profileOf(csv(), 'group: g\noutcome: y\nlevel1: [" z", "w "]\n');
    expect(profile.header).toEqual(['g', 'y', ' z', 'w ']);
    expect(profile.column('w ').numericCount).toBe(4);
  });

  it('a near miss gets "did you mean"', async () => {
    const path = csv();
    const roles = parseRoles('group: g\noutcome: y\nlevel1: [w]\n', 'roles.yaml', catalogue);
    await expect(audit(path, roles)).rejects.toThrow(
      `roles.yaml:3:10: column "w" is not in ${path} (did you mean "w "?); its header is: g, y, " z", "w "`,
    );
  });
});

// The 10,000-case fuzz run of 2026-12-03 (seed 20261204): DuckDB's sniffer takes the header to be
// one line, so a quoted name holding a line break refused gzipped files with the sniffer's message
// and made the name's second line a record of a plain one (5 records read of 4 written).
describe('a header name holding a line break', () => {
  const header = '\uFEFF"y\nz",u,y,x\r\n';
  const body = 'G1,U1,0,4\r\nG1,U2,3,4\r\nG2,U3,1,2\r\nG2,U4,5,6\r\n';
  it.each([
    ['a CSV', 'nl.csv', header + body],
    ['a gzipped TSV', 'nl.tsv.gz', gzipSync((header + body).replaceAll(',', '\t'))],
    // the name second on the line: read with a comma, the semicolon's header has no break in it
    ['a CSV with semicolons', 'nl-semi.csv', `u;"y\nz";x\r\n${body.replaceAll(',', ';')}`],
  ])('%s is refused, naming the column', async (_, name, content) => {
    const path = join(dir, name);
    writeFileSync(path, content);
    const roles = parseRoles('group: u\noutcome: y\nlevel1: [x]\n', 'roles.yaml', catalogue);
    await expect(audit(path, roles)).rejects.toThrow(`${path}: the header's column name "y\\nz" holds a line break`);
  });

  // a NUL byte in a header name ended in DuckDB's SQL parser ("unterminated quoted string")
  it('a NUL byte in a name is refused the same way', async () => {
    const path = join(dir, 'nul.csv');
    writeFileSync(path, `u,y\0z,x\n${body}`);
    const roles = parseRoles('group: u\noutcome: x\n', 'roles.yaml', catalogue);
    await expect(audit(path, roles)).rejects.toThrow(`${path}: the header's column name "y\\u0000z" holds a NUL byte`);
  });
});

// The 2,000-case fuzz run of 2026-12-03 (seed 20261205, case 684): a header name holding a quote
// ("a"",b") with quoted line breaks in the records below made DuckDB's sniffer choose a quote
// without an escape, drop the header as a broken line and take the first record for the header.
describe('a header name holding a quote, with quoted line breaks below', () => {
  const rows = [
    ['"a"",b"', 'u', 'y', 'x'],
    ['G1', 'U9', '0', '"a\nb"'],
    ['G1', 'U12', '"a\nb"', '0'],
    ['G2', 'U5', '0', '227'],
    ['G2', 'U6', '3', '"a\r\nb"'],
  ];
  const text = `\uFEFF${rows.map((r, i) => r.join('\t') + (i % 2 ? '\n' : '\r\n')).join('')}`;
  it.each([
    ['a TSV', 'quote-name.tsv', text],
    ['a gzipped TSV', 'quote-name.tsv.gz', gzipSync(text)],
  ])('%s is read with its header as written', async (_, name, content) => {
    const path = join(dir, name);
    writeFileSync(path, content);
    const { profile } = await profileOf(path, 'group: a",b\nunit: u\noutcome: y\n');
    expect(profile.rows).toBe(4);
    expect(profile.rejected).toEqual([]);
    expect(profile.groups.numRows()).toBe(2);
  });
});

// a JSON key or an Arrow field name holding a NUL byte ended in DuckDB's SQL parser
// ("unterminated quoted identifier")
describe('a column name holding a NUL byte outside CSV', () => {
  it.each([
    ['JSON', 'nul.json', '[{"g":"G1","u\\u0000x":"U1","y":1},{"g":"G2","u\\u0000x":"U2","y":2}]'],
    ['NDJSON', 'nul.ndjson', '{"g":"G1","u\\u0000x":"U1","y":1}\n{"g":"G2","u\\u0000x":"U2","y":2}\n'],
    ['Arrow', 'nul.arrow', tableToIPC(tableFromArrays({ g: ['G1', 'G2'], 'u\0x': ['U1', 'U2'], y: Float64Array.from([1, 2]) }), 'file')],
  ])('in %s is refused, naming the column', async (_, name, content) => {
    const path = join(dir, name);
    writeFileSync(path, content);
    const roles = parseRoles('group: g\noutcome: y\n', 'roles.yaml', catalogue);
    await expect(audit(path, roles)).rejects.toThrow(`${path}: the column name "u\\u0000x" holds a NUL byte`);
  });
});
