import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { nestready } from '../helpers/cli.js';
import { writeHsbDeliveries } from './hsb-deliveries.js';

// needs the build: npm run build --silent
const dir = mkdtempSync(join(tmpdir(), 'nestready-compare-cli-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const paths = writeHsbDeliveries(dir);
const report = join(dir, 'previous.json');

describe('nestready compare and audit --baseline', () => {
  it('writes the previous report, compares with it and gates on the change findings; --baseline joins them to the audit', async () => {
    const first = await nestready('audit', paths.previous, '-r', paths.roles, '-q', '--out', report);
    expect(first.stderr).toBe('');
    expect(first.code).toBe(0);
    const compared = await nestready('compare', report, paths.current, '-r', paths.roles, '-q', '-f', 'json', '--fail-on', 'warning');
    expect(compared.stderr).toBe('');
    expect(compared.code).toBe(1);
    const json = JSON.parse(compared.stdout);
    expect(json.findings.every((f: { change?: boolean }) => f.change)).toBe(true);
    expect(json.changes.groups).toEqual({ both: 155, appeared: 2, vanished: 3 });
    const baseline = await nestready('audit', paths.current, '-r', paths.roles, '-q', '-f', 'json', '--baseline', report);
    const audited = JSON.parse(baseline.stdout);
    const changes = audited.findings.filter((f: { change?: boolean }) => f.change).map((f: { rule: string }) => f.rule);
    expect(changes).toContain('level2-value-changed');
    expect(audited.findings.length).toBeGreaterThan(changes.length);
    const same = await nestready('compare', report, paths.same, '-r', paths.roles, '-q', '--fail-on', 'warning');
    expect(same.code).toBe(0);
    const bad = await nestready('compare', paths.roles, paths.current, '-r', paths.roles, '-q');
    expect(bad.code).toBe(2);
    expect(bad.stderr).toMatch(/^nestready: [^\n]*roles[^\n]*\n$/);
    // a baseline that is not a report, or no file at all: one line naming it, exit 2
    const notReport = await nestready('audit', paths.current, '-r', paths.roles, '-q', '-f', 'json', '--baseline', paths.roles);
    expect(notReport.code).toBe(2);
    expect(notReport.stderr).toMatch(/^nestready: [^\n]+: not a readable JSON report \([^\n]*\)\n$/);
    expect(notReport.stderr).toContain(paths.roles);
  });
});
