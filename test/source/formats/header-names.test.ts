import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import { afterAll, describe, expect, it } from 'vitest';
import { catalogue } from '../../../rules/index.js';
import { audit } from '../../../src/audit.js';
import { parseRoles } from '../../../src/roles/load.js';
import { headerFields, withEdgeSpaces } from '../../../src/source/formats/header-line.js';

const dir = mkdtempSync(join(tmpdir(), 'nestready-header-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** 3 groups of 3 records: group, unit, outcome; `head` is the header line as written. */
function delivery(name: string, head: string, delim: string, gzip = false, crlf = false): string {
  const lines = [head];
  for (let g = 1; g <= 3; g++) for (let i = 0; i < 3; i++) lines.push([`G${g}`, `U${g}${i}`, String(g * 10 + i * 3)].join(delim));
  const text = `\uFEFF${lines.join(crlf ? '\r\n' : '\n')}\n`;
  const path = join(dir, name);
  writeFileSync(path, gzip ? gzipSync(text) : text);
  return path;
}

describe('header names as written', () => {
  it('headerFields reads quoted, escaped and padded names; null when the record does not end', () => {
    const tsv = { delim: '\t', quote: '"', escape: '"', skip: 0 };
    expect(headerFields(Buffer.from('\uFEFF"say ""hi"""\t pad \tz\r\n1\t2\t3\n'), tsv)).toEqual(['say "hi"', ' pad ', 'z']);
    expect(headerFields(Buffer.from('# note\na;" b ";c\n'), { delim: ';', quote: '"', escape: '\\', skip: 1 })).toEqual(['a', ' b ', 'c']);
    expect(headerFields(Buffer.from('a,"b'), { ...tsv, delim: ',' })).toBeNull();
    expect(headerFields(Buffer.from('a,b'), { ...tsv, delim: ',' })).toBeNull();
  });

  it('withEdgeSpaces gives back trimmed edges only where the names match, never onto another column', () => {
    const sniffed = ['g', 'pad', 'x'].map((column_name) => ({ column_name, column_type: 'VARCHAR' }));
    expect(withEdgeSpaces(sniffed, ['g', ' pad ', 'x']).map((d) => d.column_name)).toEqual(['g', ' pad ', 'x']);
    expect(withEdgeSpaces(sniffed, ['g', ' pad '])).toEqual(sniffed); // the header not read field for field
    expect(withEdgeSpaces(sniffed, ['g', 'other', 'x'])).toEqual(sniffed);
    const clash = ['pad', 'pad_1', ' pad_1'].map((column_name) => ({ column_name, column_type: 'VARCHAR' }));
    expect(withEdgeSpaces(clash, ['pad', 'pad_1', ' pad_1']).map((d) => d.column_name)).toEqual(['pad', 'pad_1', ' pad_1']);
  });

  it('a quote inside a gzipped TSV header name (the only quoted field: the sniffer reads no quoting)', async () => {
    const roles = parseRoles('group: say "hi"\nunit: u\noutcomes: [y]\n', 'roles.yaml', catalogue);
    for (const gzip of [false, true]) {
      const path = delivery(`quote${gzip ? '.tsv.gz' : '.tsv'}`, '"say ""hi"""\tu\ty', '\t', gzip, true);
      const r = await audit(path, roles);
      expect(r.input.columns).toEqual(['say "hi"', 'u', 'y']);
      expect(r.groups.count).toBe(3);
      expect(r.input.rows).toBe(9);
    }
  });

  it('a TSV header name quoting a tab, the only quoted field: one column, not two', async () => {
    const roles = parseRoles('group: "x\\ty"\nunit: u\noutcomes: [y]\n', 'roles.yaml', catalogue);
    for (const gzip of [false, true]) {
      const r = await audit(delivery(`tab${gzip ? '.tsv.gz' : '.tsv'}`, '"x\ty"\tu\ty', '\t', gzip), roles);
      expect(r.input.columns).toEqual(['x\ty', 'u', 'y']);
      expect(r.groups.count).toBe(3);
      expect(r.outcomes.y.n).toBe(9);
    }
  });

  it('a padded header name is read as written, quoted or not, so a role map naming it so is not refused', async () => {
    for (const [name, head, delim] of [
      ['padded.csv', 'g,u," y "', ','],
      ['padded.tsv', 'g\tu\t y ', '\t'],
    ] as const) {
      const r = await audit(delivery(name, head, delim), parseRoles('group: g\nunit: u\noutcomes: [" y "]\n', 'roles.yaml', catalogue));
      expect(r.input.columns).toEqual(['g', 'u', ' y ']);
      expect(Object.keys(r.outcomes)).toEqual([' y ']);
      expect(r.outcomes[' y '].n).toBe(9);
    }
  });
});
