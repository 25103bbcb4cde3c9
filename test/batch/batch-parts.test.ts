import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { discover, namesDeliveryFormat } from '../../src/batch/discover.js';
import { assignFolders, bareName, senderOf, senderPattern } from '../../src/batch/sender.js';
import { engineShare, inPool } from '../../src/batch/share.js';
import { batchExitCode, buildSummary } from '../../src/batch/summary.js';
import type { BatchRow } from '../../src/batch/types.js';
import { InputError } from '../../src/errors.js';

describe('the sender of a delivery', () => {
  it('is the group named sender, else the first group, else the name without its extensions', () => {
    expect(senderOf('in/north_2026-01.csv.gz', senderPattern('^(?<month>[^_]+)_(?<sender>[a-z]+)'))).toBe('north_2026-01');
    expect(senderOf('in/2026-01_north.csv', senderPattern('^(?<month>[^_]+)_(?<sender>[a-z]+)'))).toBe('north');
    expect(senderOf('in/north_2026-01.csv', senderPattern('^([a-z]+)_'))).toBe('north');
    expect(senderOf('in/North-east.xlsx', senderPattern('^([a-z]+)_'))).toBe('North-east'); // no match
    expect(bareName('a/b/west.region.csv.gz')).toBe('west.region');
    expect(() => senderPattern('([a-z')).toThrow(InputError);
  });

  it('names folders apart: the first in file-name order keeps the name, the next get -2, -3, never a name another sender has', () => {
    const folders = assignFolders([
      { file: 'b/north.csv', sender: 'north' },
      { file: 'a/north.csv', sender: 'north' },
      { file: 'c/NORTH.csv', sender: 'NORTH' },
      { file: 'd/north-2.csv', sender: 'north-2' },
      { file: 'e/x.csv', sender: 'a/../b c' },
      { file: 'f/y.csv', sender: '..' },
    ]);
    expect(folders.map((d) => [d.file, d.folder])).toEqual([
      ['a/north.csv', 'north'],
      ['b/north.csv', 'north-3'],
      ['c/NORTH.csv', 'NORTH-4'],
      ['d/north-2.csv', 'north-2'],
      ['e/x.csv', 'a_.._b_c'],
      ['f/y.csv', '_'],
    ]);
  });
});

describe('running deliveries side by side', () => {
  it('gives each audit its share of threads (1 to 2) and of --memory-limit', () => {
    expect(engineShare(2, 2, '100MB')).toEqual({ threads: 1, memoryLimit: '50MB' });
    expect(engineShare(3, 8, '100MB')).toEqual({ threads: 2, memoryLimit: '33.3333MB' });
    expect(engineShare(1, 8, '1.5GiB')).toEqual({ threads: 2, memoryLimit: '1.5GiB' });
    // --repeatable: one thread an audit, whatever the cores
    expect(engineShare(1, 8, '100MB', 1)).toEqual({ threads: 1, memoryLimit: '100MB' });
  });

  it('runs at most the limit at once and keeps the order of the items', async () => {
    let running = 0;
    let most = 0;
    const out = await inPool([5, 1, 4, 2, 3], 2, async (n) => {
      most = Math.max(most, ++running);
      await new Promise((r) => setImmediate(r));
      running--;
      return n * 10;
    });
    expect(out).toEqual([50, 10, 40, 20, 30]);
    expect(most).toBe(2);
  });
});

describe('the exit code of a batch', () => {
  const audited = (file: string, gate: 'pass' | 'fail'): BatchRow => ({ file, sender: file, status: 'audited', gate, verdict: 'ready' });
  it('is 3 for a bug, else 2 for an unreadable delivery, else 1 for a failed gate, else 0', () => {
    const unreadable: BatchRow = { file: 'u', sender: 'u', status: 'unreadable', error: 'u: no records', gate: 'fail' };
    const bug: BatchRow = { file: 'b', sender: 'b', status: 'error', error: 'internal error: x', gate: 'fail' };
    expect(batchExitCode([audited('a', 'pass')])).toBe(0);
    expect(batchExitCode([audited('a', 'pass'), audited('b', 'fail')])).toBe(1);
    expect(batchExitCode([audited('b', 'fail'), unreadable])).toBe(2);
    expect(batchExitCode([unreadable, bug])).toBe(3);
    const s = buildSummary([audited('z', 'pass'), bug, unreadable], [], { roles: 'r.yaml', failOn: 'blocker' });
    expect([s.exitCode, s.counts.unreadable, s.deliveries.map((r) => r.file)]).toEqual([3, 2, ['b', 'u', 'z']]);
  });
});

describe('finding the deliveries', () => {
  let dir: string;
  const at = (...p: string[]) => join(dir, ...p);
  beforeAll(() => {
    dir = mkdtempSync(join(tmpdir(), 'nestready-discover-'));
    mkdirSync(at('in', 'sub'), { recursive: true });
    mkdirSync(at('in', 'reports'));
    for (const f of ['a.csv', 'b.parquet.gz', 'c.ndjson.gz', 'notes.md', '.hidden.csv', 'sub/d.xlsx', 'reports/e.json', 'data.dat']) {
      writeFileSync(at('in', f), 'x');
    }
  });
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it("takes a folder's files named as a format (gzip only where the format allows it), lists the others as skipped", () => {
    const found = discover([at('in')], { recurse: false, exclude: [] });
    expect(found.files).toEqual([at('in', 'a.csv'), at('in', 'c.ndjson.gz')]);
    expect(found.skipped.map((s) => s.file)).toEqual([at('in', 'b.parquet.gz'), at('in', 'data.dat'), at('in', 'notes.md')]);
    expect(namesDeliveryFormat('x.TSV')).toBe(true);
  });

  it('looks into subfolders only with recurse, never into an excluded output folder; a file named twice is audited once', () => {
    const found = discover([at('in'), at('in', 'a.csv'), at('in', 'data.dat')], { recurse: true, exclude: [at('in', 'reports')] });
    expect(found.files).toEqual([at('in', 'a.csv'), at('in', 'c.ndjson.gz'), at('in', 'data.dat'), at('in', 'sub', 'd.xlsx')]);
  });

  it('refuses standard input, a name that is nothing, a pattern that matches nothing, and a batch with no delivery', () => {
    const none = (args: string[]) => () => discover(args, { recurse: false, exclude: [] });
    expect(none(['-', at('in')])).toThrow(/standard input/);
    expect(none([at('nothing.csv')])).toThrow(/nothing\.csv: no such file or folder/);
    expect(none([at('in', '*.pq')])).toThrow(/no file matches this pattern/);
    expect(none([at('in', '*.md')])).toThrow(/no delivery found \(1 file\(s\) skipped/);
  });
});
