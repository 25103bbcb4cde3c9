import { execFileSync, spawnSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import { catalogue } from '../../rules/index.js';
import { audit } from '../../src/audit.js';
import { loadRoles } from '../../src/roles/load-file.js';
import { writeDelivery } from '../helpers/delivery.js';

const ROLES = 'fixtures/demo/repairs-delivery.roles.yaml';
const roles = loadRoles(ROLES, catalogue);
const CLI = 'bin/nestready.js';

describe('unreadable lines are counted and listed, never dropped silently', () => {
  it('ragged rows, broken quoting and invalid UTF-8: each line by its number (header = line 1)', async () => {
    const r = await audit('fixtures/formats/rejects.csv', roles);
    expect(r.input.rows).toBe(60);
    expect(r.input.rowsRejected).toBe(4);
    const f = r.findings.find((x) => x.rule === 'unreadable-lines');
    expect(f?.count).toBe(4);
    expect(f?.message).toContain('line 12 (Expected Number of Columns: 11 Found: 6)');
    expect(f?.message).toContain('line 22 (Expected Number of Columns: 11 Found: 12)');
    expect(f?.message).toContain('line 32 (Value with unterminated quote found.)');
    expect(f?.message).toMatch(/line 42 \(Invalid unicode/);
  });

  it('a well-quoted field loses its quotes even when other quotes in the file are broken', async () => {
    const r = await audit('fixtures/formats/rejects.csv', roles);
    // "W-014 " (quoted, with its trailing space) is a group of its own, not '"W-014 "'
    const f = r.findings.find((x) => x.rule === 'singleton-groups');
    expect(f?.groups).toContain('W-014 ');
  });

  it('a quote never closed: the record is rejected and the lines it runs over are named', async () => {
    const r = await audit('fixtures/formats/runaway-quote.csv', roles);
    expect(r.input.rows).toBe(4);
    const f = r.findings.find((x) => x.rule === 'unreadable-lines');
    expect(f?.message).toContain('line 6 (Value with unterminated quote found. (it runs on to line 12))');
  });

  it('a value that is not a number rejects no line (the column is re-read as text)', async () => {
    const d = writeDelivery('g,y\na,1\na,2\nb,x\nb,4\n', { group: 'g', outcomes: ['y'] });
    try {
      const r = await audit(d.csv, loadRoles(d.roles, catalogue));
      expect(r.input.rows).toBe(4);
      expect(r.input.rowsRejected).toBe(0);
    } finally {
      d.remove();
    }
  });

  it('--strict makes any unreadable line an input error (exit 2, one line on stderr)', () => {
    const res = spawnSync(process.execPath, [CLI, 'audit', 'fixtures/formats/rejects.csv', '-r', ROLES, '--strict', '-q'], {
      encoding: 'utf8',
    });
    expect(res.status).toBe(2);
    expect(res.stderr.trim().split('\n')).toHaveLength(1);
    expect(res.stderr).toMatch(/rejects\.csv: 4 line\(s\) could not be read \(first: line 12, .*--strict/);
  });

  it('--strict passes a delivery whose every line reads', () => {
    const out = execFileSync(
      process.execPath,
      [CLI, 'audit', 'fixtures/formats/repairs.tsv', '-r', ROLES, '--strict', '-q', '-f', 'json', '--fail-on', 'never'],
      { encoding: 'utf8' },
    );
    expect(JSON.parse(out).input.rowsRejected).toBe(0);
  });
});
