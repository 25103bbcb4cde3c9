import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { InvalidArgumentError } from 'commander';
import { afterAll, describe, expect, it } from 'vitest';
import { memorySize, sheetNote } from '../src/cli-options.js';
import { nestready } from './helpers/cli.js';

const dir = mkdtempSync(join(tmpdir(), 'nestready-cli-options-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const csv = join(dir, 'd.csv');
const roles = join(dir, 'r.yaml');
writeFileSync(csv, 'g,y\n1,1\n1,2\n2,3\n2,5\n');
writeFileSync(roles, 'group: g\noutcome: y\n');

describe('--memory-limit', () => {
  it.each(['200MB', '1.5GiB', '512 mb', '.5GB', '2TB'])('accepts %s', (v) => {
    expect(memorySize(v)).toBe(v.trim());
  });

  it.each(['lots', '100', '-1GB', '100b', '0MB', '512KB', '1e3MB', '', 'NaNGB'])('refuses %j', (v) => {
    expect(() => memorySize(v)).toThrow(InvalidArgumentError);
  });

  it('a bad value is a one-line usage error, exit 2', async () => {
    const run = await nestready('audit', csv, '-r', roles, '--memory-limit', 'lots');
    expect(run.code).toBe(2);
    expect(run.stderr.trim().split('\n')).toHaveLength(1);
    expect(run.stderr).toMatch(/--memory-limit.*'lots' is invalid\. expected a size/);
  });
});

describe('--sheet on a delivery that is no workbook', () => {
  it('is named in a note, not silently ignored', () => {
    const note = 'd.csv: --sheet "pupils" ignored: the delivery is CSV, not an Excel workbook';
    expect(sheetNote(csv, 'd.csv', 'pupils', undefined)).toBe(note);
    expect(sheetNote(csv, 'd.csv', undefined, undefined)).toBeNull();
    expect(sheetNote(join(dir, 'absent.csv'), 'absent.csv', 'x', undefined)).toBeNull();
  });

  it('the CLI prints the note and still audits the file', async () => {
    const run = await nestready('audit', csv, '-r', roles, '--sheet', 'pupils', '-f', 'json');
    expect(run.stderr).toContain(`nestready: ${csv}: --sheet "pupils" ignored: the delivery is CSV, not an Excel workbook`);
    expect(JSON.parse(run.stdout).input.rows).toBe(4);
  });
});
