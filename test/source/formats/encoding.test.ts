import { spawnSync } from 'node:child_process';
import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { catalogue } from '../../../rules/index.js';
import { audit } from '../../../src/audit.js';
import type { Report } from '../../../src/report/types.js';
import { loadRoles } from '../../../src/roles/load-file.js';
import { windows1252ToUtf8 } from '../../../src/source/formats/windows-1252.js';
import { expectSameAudit } from './same.js';

// windows.cp1252.csv is windows.csv (UTF-8) saved as windows-1252 with CRLF line ends, as a
// spreadsheet on Windows exports it: ’ € – are the bytes 0x92 0x80 0x96 (scripts/make-format-fixtures.js)
const ROLES = 'fixtures/demo/repairs-delivery.roles.yaml';
const roles = loadRoles(ROLES, catalogue);
const UTF8 = 'fixtures/formats/windows.csv';
const CP1252 = 'fixtures/formats/windows.cp1252.csv';
const dir = mkdtempSync(join(tmpdir(), 'nestready-enc-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('windows-1252 deliveries', () => {
  let utf8: Report;
  beforeAll(async () => {
    utf8 = await audit(UTF8, roles);
  });

  it.each(['windows-1252', 'cp1252', 'latin1'] as const)('--encoding %s reads as the UTF-8 file does', async (encoding) => {
    const before = readFileSync(CP1252);
    const got = await audit(CP1252, roles, { encoding });
    expectSameAudit(got, utf8);
    expect(got.input.rowsRejected).toBe(0);
    expect(readFileSync(CP1252).equals(before)).toBe(true); // the delivery is only read
  });

  it('gzip-compressed windows-1252 with a name without .gz', async () => {
    const path = join(dir, 'export.csv');
    writeFileSync(path, gzipSync(readFileSync(CP1252)));
    const got = await audit(path, roles, { encoding: 'windows-1252' });
    expectSameAudit(got, utf8);
  });

  it('read as UTF-8: an input error naming the likely encoding and the option', async () => {
    await expect(audit(CP1252, roles)).rejects.toThrow(
      new RegExp(
        'windows\\.cp1252\\.csv: not UTF-8 text: \\d+ of the \\d+ lines with non-ASCII bytes in its first megabyte are invalid ' +
          'UTF-8; looks like windows-1252 \\(bytes 0x80-0x9F such as ’ € –\\): try --encoding windows-1252$',
      ),
    );
  });

  it('one line not UTF-8 among valid ones stays an unreadable line, its reason naming the option', async () => {
    const r = await audit('fixtures/formats/rejects.csv', roles);
    const f = r.findings.find((x) => x.rule === 'unreadable-lines');
    expect(f?.message).toMatch(/line 42 \(Invalid unicode .*not utf-8 encoded\.; looks like Latin-1: try --encoding latin1\)/);
  });

  it('the CLI: exit 2 and one line without the option, the report with it; no temp file left', () => {
    const run = (...extra: string[]) =>
      spawnSync(process.execPath, ['bin/nestready.js', 'audit', CP1252, '-r', ROLES, '-q', '-f', 'json', ...extra], {
        encoding: 'utf8',
        env: { ...process.env, TMPDIR: dir },
      });
    const wrong = run();
    expect(wrong.status).toBe(2);
    expect(wrong.stderr.trim().split('\n')).toHaveLength(1);
    expect(wrong.stderr).toContain('try --encoding windows-1252');
    const right = run('--encoding', 'windows-1252');
    expect(right.status).toBe(1);
    const report = JSON.parse(right.stdout) as Report;
    expect(report.input).toMatchObject({ rows: 1200, rowsRejected: 0 });
    // the UTF-8 copy is deleted with the engine
    expect(readdir(dir).filter((f) => f.startsWith('nestready-'))).toEqual([]);
  });
});

function readdir(path: string): string[] {
  return readdirSync(path);
}

describe('windows1252ToUtf8', () => {
  it('maps every byte as the cp1252 codec of Python 3.11.7 does (its five unassigned bytes kept as C1 code points, as WHATWG)', () => {
    // outside check: python3 -c "print([hex(ord(c)) for c in bytes(range(0x80,0xa0)).decode('cp1252', errors='replace')])"
    // (Python 3.11.7) gives these code points, U+FFFD for 0x81 0x8D 0x8F 0x90 0x9D
    const python = [
      0x20ac, 0xfffd, 0x201a, 0x192, 0x201e, 0x2026, 0x2020, 0x2021, 0x2c6, 0x2030, 0x160, 0x2039, 0x152, 0xfffd, 0x17d, 0xfffd, 0xfffd,
      0x2018, 0x2019, 0x201c, 0x201d, 0x2022, 0x2013, 0x2014, 0x2dc, 0x2122, 0x161, 0x203a, 0x153, 0xfffd, 0x17e, 0x178,
    ];
    const bytes = Buffer.from(Array.from({ length: 256 }, (_, i) => i));
    const text = [...windows1252ToUtf8(bytes).toString('utf8')].map((c) => c.codePointAt(0));
    expect(text).toHaveLength(256);
    for (let b = 0; b < 256; b++) {
      const want = b >= 0x80 && b < 0xa0 ? (python[b - 0x80] === 0xfffd ? b : python[b - 0x80]) : b;
      expect(text[b], `byte 0x${b.toString(16)}`).toBe(want);
    }
  });
});
