import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { catalogue } from '../../../rules/index.js';
import { audit } from '../../../src/audit.js';
import { loadRoles } from '../../../src/roles/load-file.js';
import { expectMessage } from '../../helpers/messages.js';

const CLEAN = 'fixtures/demo/repairs-clean.csv';
const roles = loadRoles('fixtures/demo/repairs-clean.roles.yaml', catalogue);
const dir = mkdtempSync(join(tmpdir(), 'nestready-decimal-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** The clean demo written as a locale with decimal commas writes it: ';' between fields, 77,1 for 77.1. */
function european(sep = ';', quote = false): string {
  const lines = readFileSync(CLEAN, 'utf8').trim().split('\n');
  const file = join(dir, `eu-${sep === ';' ? 'semicolon' : 'comma'}.csv`);
  const field = (v: string) => (/^-?\d+\.\d+$/.test(v) ? (quote ? `"${v.replace('.', ',')}"` : v.replace('.', ',')) : v);
  writeFileSync(file, `${lines.map((l) => l.split(',').map(field).join(sep)).join('\n')}\n`);
  return file;
}

describe('numbers written with a decimal comma', () => {
  it('a file separated by semicolons gives the statistics of the same data with decimal points, and says how it was read', async () => {
    const [eu, plain] = await Promise.all([audit(european(), roles, { threads: 1 }), audit(CLEAN, roles, { threads: 1 })]);
    expect(eu.input.reading).toEqual({ decimalComma: true });
    expect(plain.input.reading).toBeUndefined();
    // the same values read two ways: equal to rounding, whatever order the engine added them in
    expect(Math.abs(eu.outcomes.repair_minutes.reml.icc - plain.outcomes.repair_minutes.reml.icc)).toBeLessThanOrEqual(1e-12);
    expect(eu.outcomes.repair_minutes.n).toBe(3000);
    expect(eu.findings.map((f) => [f.rule, f.messageId, f.column])).toEqual(plain.findings.map((f) => [f.rule, f.messageId, f.column]));
    expect(eu.verdict).toBe(plain.verdict);
  });

  it('decimalComma forces the reading; with commas between the fields it is an input error naming the file', async () => {
    const forced = await audit(european(), roles, { threads: 1, decimalComma: true });
    expect(forced.input.reading).toEqual({ decimalComma: true });
    expect(forced.outcomes.repair_minutes.n).toBe(3000);
    await expect(audit(CLEAN, roles, { decimalComma: true })).rejects.toThrow(
      /repairs-clean\.csv: numbers with a decimal comma need fields/,
    );
  });

  it('quoted decimal commas in a comma-separated file are not guessed: the outcome without statistics blocks, saying why', async () => {
    const report = await audit(european(',', true), roles, { threads: 1 });
    expect(report.input.reading).toBeUndefined();
    expect(report.outcomes).toEqual({});
    expect(report.verdict).toBe('not-ready');
    const f = report.findings.find((x) => x.rule === 'variable-without-statistics' && x.column === 'repair_minutes');
    expect(f?.severity).toBe('blocker');
    expectMessage(f!, 'decimalComma', { column: 'repair_minutes', role: 'an outcome', numbers: 'none', present: 3000 });
    // item_age_years (level-1) is written the same way: a warning
    const l1 = report.findings.find((x) => x.rule === 'variable-without-statistics' && x.column === 'item_age_years');
    expect(l1?.severity).toBe('warning');
  });
});
