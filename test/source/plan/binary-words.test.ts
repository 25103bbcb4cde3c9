import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { catalogue } from '../../../rules/index.js';
import { audit } from '../../../src/audit.js';
import { parseRoles } from '../../../src/roles/load.js';
import { auditRows, findingsOf, groupedRows } from '../../helpers/delivery.js';
import { expectSameAudit } from '../formats/same.js';

const CLEAN = 'fixtures/demo/repairs-clean.csv';
const dir = mkdtempSync(join(tmpdir(), 'nestready-words-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** The clean demo with its 0/1 column `fixed` written as two words. */
function worded(one: string, zero: string): string {
  const lines = readFileSync(CLEAN, 'utf8').trim().split('\n');
  const at = lines[0].split(',').indexOf('fixed');
  const out = lines.map((l, i) => {
    if (i === 0) return l;
    const f = l.split(',');
    f[at] = f[at] === '1' ? one : f[at] === '0' ? zero : f[at];
    return f.join(',');
  });
  const file = join(dir, `${one}-${zero}.csv`);
  writeFileSync(file, `${out.join('\n')}\n`);
  return file;
}

const rolesText = readFileSync('fixtures/demo/repairs-clean.roles.yaml', 'utf8').replace(
  'outcomes: [repair_minutes]',
  'outcomes: [repair_minutes, fixed]',
);
const roles = (types: string) => parseRoles(rolesText.replace('types: { fixed: binary }', types), 'roles.yaml', catalogue);

describe('a binary variable written in words', () => {
  it('Yes/No declared binary gives the report of its 0/1 version, and says which word is 1', async () => {
    const r = roles('types: { fixed: binary }');
    const [words, digits] = await Promise.all([audit(worded('Yes', 'No'), r, { threads: 1 }), audit(CLEAN, r, { threads: 1 })]);
    expectSameAudit(words, digits);
    expect(words.outcomes.fixed.logistic).toEqual(digits.outcomes.fixed.logistic);
    expect(words.input.reading).toEqual({ binary: { fixed: { one: 'yes', zero: 'no', written: { one: 'Yes', zero: 'No' } } } });
    expect(findingsOf(words, 'binary-outcome')[0].messageId).toBe('fit');
  });

  it('TRUE/FALSE not declared is read as 0/1 the way a 0/1 column is (binary, no constant-within warning)', async () => {
    const r = roles('');
    const [words, digits] = await Promise.all([audit(worded('TRUE', 'FALSE'), r, { threads: 1 }), audit(CLEAN, r, { threads: 1 })]);
    expectSameAudit(words, digits);
    expect(words.input.reading?.binary?.fixed).toMatchObject({ one: 'true', zero: 'false' });
    expect(findingsOf(words, 'outcome-constant-within')).toEqual([]);
  });

  it('the role map names the other word as 1: the latent ICC stays, the intercept changes sign', async () => {
    const file = worded('y', 'n');
    const [usual, flipped] = await Promise.all([
      audit(file, roles('types: { fixed: binary }'), { threads: 1 }),
      audit(file, roles('types: { fixed: { binary: { one: N } } }'), { threads: 1 }),
    ]);
    expect(flipped.input.reading?.binary?.fixed).toEqual({ one: 'n', zero: 'y' });
    expect(flipped.roles.binaryOne).toEqual({ fixed: 'N' });
    const [a, b] = [usual.outcomes.fixed.logistic!, flipped.outcomes.fixed.logistic!];
    expect(Math.abs(a.icc - b.icc)).toBeLessThanOrEqual(1e-9);
    expect(Math.abs(a.intercept + b.intercept)).toBeLessThanOrEqual(1e-9);
    expect(a.intercept).toBeGreaterThan(0); // 64.4% of the jobs are fixed
  });

  it('a value that is neither word stays as written: counted and listed as not a number', async () => {
    const rows = groupedRows(4, 10, (j, i) => ({ y: (i + j) % 3 === 0 ? 'no' : 'yes' }));
    rows[5].y = 'maybe';
    const report = await auditRows(rows, { group: 'g', outcome: 'y', types: { y: 'binary' } });
    expect(report.input.reading?.binary?.y).toEqual({ one: 'yes', zero: 'no' });
    const f = findingsOf(report, 'non-numeric-values')[0];
    expect(f).toMatchObject({ column: 'y', count: 1, rows: [6] });
    expect(report.outcomes.y.n).toBe(39);
  });

  it('two words of no known pair: an outcome blocks until the role map names the word that is 1', async () => {
    const rows = groupedRows(4, 10, (j, i) => ({ y: (i + j) % 3 === 0 ? 'fail' : 'pass' }));
    const unnamed = await auditRows(rows, { group: 'g', outcome: 'y', types: { y: 'binary' } });
    expect(findingsOf(unnamed, 'variable-without-statistics')[0]).toMatchObject({ severity: 'blocker', messageId: 'words' });
    expect(unnamed.outcomes).toEqual({});
    expect(findingsOf(unnamed, 'binary-outcome')).toEqual([]);
    const named = await auditRows(rows, { group: 'g', outcome: 'y', types: { y: { binary: { one: 'pass' } } } });
    expect(named.input.reading?.binary?.y).toEqual({ one: 'pass', zero: 'fail' });
    expect(findingsOf(named, 'variable-without-statistics')).toEqual([]);
    expect(named.outcomes.y.n).toBe(40);
  });
});
