import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { catalogue } from '../../../rules/index.js';
import { audit } from '../../../src/audit.js';
import type { Report } from '../../../src/report/types.js';
import { loadRoles } from '../../../src/roles/load-file.js';
import { lfCopy, mixedLineEnds } from '../../../src/source/formats/line-ends.js';
import { expectSameAudit } from './same.js';

// A delivery edited on Windows and elsewhere ends some lines with CRLF and others with LF alone;
// DuckDB's CSV sniffer refuses such a file ("Error when sniffing file"), so it is read from an LF copy
const ROLES = 'fixtures/demo/repairs-delivery.roles.yaml';
const roles = loadRoles(ROLES, catalogue);
const CSV = 'fixtures/demo/repairs-delivery.csv';
const dir = mkdtempSync(join(tmpdir(), 'nestready-lines-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** The demo delivery with every third line ended by CRLF. */
function mixed(): Buffer {
  const lines = readFileSync(CSV, 'utf8').split('\n');
  return Buffer.from(lines.map((l, i) => (i < lines.length - 1 && i % 3 === 1 ? `${l}\r` : l)).join('\n'));
}

describe('mixed line ends', () => {
  let lf: Report;
  beforeAll(async () => {
    lf = await audit(CSV, roles);
  });

  it('a CSV with CRLF and LF line ends audits as its LF version, and the delivery stays as it was', async () => {
    const path = join(dir, 'mixed.csv');
    writeFileSync(path, mixed());
    expect(mixedLineEnds(path, false)).toBe(true);
    const got = await audit(path, roles);
    expectSameAudit(got, lf);
    expect(got.input.rowsRejected).toBe(0);
    expect(readFileSync(path).equals(mixed())).toBe(true);
    expect(readdirSync(tmpdir()).filter((f) => f.startsWith('nestready-lf-'))).toEqual([]);
  });

  it('gzip-compressed, with a name without .gz', async () => {
    const path = join(dir, 'mixed-export.csv');
    writeFileSync(path, gzipSync(mixed()));
    expect(mixedLineEnds(path, true)).toBe(true);
    expectSameAudit(await audit(path, roles), lf);
  });

  it('a file with one kind of line end is read as it is', () => {
    expect(mixedLineEnds(CSV, false)).toBe(false);
    const crlf = join(dir, 'crlf.csv');
    writeFileSync(crlf, 'g,y\r\n1,2\r\n');
    expect(mixedLineEnds(crlf, false)).toBe(false);
  });

  it('a CRLF split across two read chunks becomes one LF', async () => {
    // the read stream hands over 64 KiB chunks: put the CR last in the first one
    const head = `g,y\n${'1,2\n'.repeat(16383)}1,`; // 65,538 characters, cut to 65,535 below
    const first = head.slice(0, 65535);
    const text = `${first}\r\n2,3\n`;
    const path = join(dir, 'split.csv');
    writeFileSync(path, text);
    const copy = await lfCopy(path, false);
    try {
      expect(readFileSync(copy.file, 'latin1')).toBe(`${first}\n2,3\n`);
    } finally {
      rmSync(copy.dir, { recursive: true, force: true });
    }
  });
});
