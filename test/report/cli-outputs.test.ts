import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { planOutputs } from '../../src/cli-output.js';
import { formatForPath, needsPlotData, REPORT_FORMATS } from '../../src/report/render.js';
import { nestready } from '../helpers/cli.js';

// needs the build: npm run build --silent
const DEMO = ['fixtures/demo/repairs-delivery.csv', '-r', 'fixtures/demo/repairs-delivery.roles.yaml'];
const dir = mkdtempSync(join(tmpdir(), 'nestready-out-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('output selection', () => {
  it('takes the format from the extension, else from --format', () => {
    expect(formatForPath('a/report.HTML')).toBe('html');
    expect(formatForPath('r.json')).toBe('json');
    expect(formatForPath('r.md')).toBe('md');
    expect(formatForPath('junit.xml')).toBe('junit');
    expect(formatForPath('r.txt')).toBe('text');
    expect(formatForPath('report')).toBeUndefined();
    expect(formatForPath('dir.html/report')).toBeUndefined();
    expect(planOutputs([], 'md')).toEqual([{ path: null, format: 'md' }]);
    expect(planOutputs(['a.html', 'b.out'], 'junit')).toEqual([
      { path: 'a.html', format: 'html' },
      { path: 'b.out', format: 'junit' },
    ]);
  });

  it('the plots are computed only for a format that reads them', () => {
    const needs = REPORT_FORMATS.filter((f) => needsPlotData(f, { withPlotData: false }));
    expect(needs.sort()).toEqual(['html', 'md']);
    expect(needsPlotData('json', { withPlotData: true })).toBe(true);
    expect(needsPlotData('text', { withPlotData: true })).toBe(false);
  });
});

describe('nestready audit with several outputs', () => {
  it('writes each --out in its format and nothing to stdout', async () => {
    const p = (n: string) => join(dir, n);
    const plain = await nestready('audit', ...DEMO, '--out', p('plain.json'));
    expect(plain.code).toBe(1);
    const stable = JSON.parse(readFileSync(p('plain.json'), 'utf8'));
    expect(stable.plots).toBeUndefined();
    expect(stable.rulesRun).toBeUndefined();
    const run = await nestready(
      'audit',
      ...DEMO,
      '--out',
      p('r.html'),
      '--out',
      p('r.json'),
      '--out',
      p('r.md'),
      '--out',
      p('r.xml'),
      '--out',
      p('r.other'),
      '-f',
      'md',
      '--problems',
      p('rows.csv'),
      '--out',
      p('full.json'),
      '--with-plot-data',
    );
    expect(run.code, run.stderr).toBe(1); // the demo has blockers
    expect(run.stdout).toBe('');
    // one line per file written, in the order written: the reports, then the problem rows
    expect(run.stderr.trimEnd().split('\n')).toEqual([
      `nestready: wrote the HTML report to ${p('r.html')}`,
      `nestready: wrote the JSON report to ${p('r.json')}`,
      `nestready: wrote the Markdown report to ${p('r.md')}`,
      `nestready: wrote the JUnit XML report to ${p('r.xml')}`,
      `nestready: wrote the Markdown report to ${p('r.other')}`,
      `nestready: wrote the JSON report to ${p('full.json')}`,
      `nestready: wrote the problem rows (CSV) to ${p('rows.csv')}`,
    ]);
    expect(readFileSync(p('r.html'), 'utf8')).toMatch(/^<!DOCTYPE html>/);
    const json = JSON.parse(readFileSync(p('r.json'), 'utf8'));
    expect(json.plots).toBeDefined(); // --with-plot-data applies to every JSON output
    const full = JSON.parse(readFileSync(p('full.json'), 'utf8'));
    expect(full.rulesRun.length).toBeGreaterThanOrEqual(6);
    const failing = new Set(
      full.findings.filter((f: { severity: string }) => f.severity === 'blocker').map((f: { rule: string }) => f.rule),
    );
    expect(readFileSync(p('r.md'), 'utf8')).toMatch(/^# nestready: Not ready for a multilevel model\n/);
    expect(readFileSync(p('r.other'), 'utf8')).toMatch(/^# nestready: Not ready for a multilevel model\n/);
    expect(readFileSync(p('r.xml'), 'utf8')).toMatch(
      new RegExp(
        `^<\\?xml version="1.0" encoding="UTF-8"\\?>\n<testsuites name="nestready" tests="${full.rulesRun.length}" ` +
          `failures="${failing.size}"`,
      ),
    );
    const rows = readFileSync(p('rows.csv'), 'utf8').trimEnd().split('\r\n');
    expect(rows[0]).toBe('record,group,unit,rule,severity,column,reason');
    // the demo's planted defects: 10 missing IDs, 3 + 5 level-2 disagreements, 4 singletons (and more as rules are added)
    expect(rows.length).toBeGreaterThanOrEqual(1 + 22);
    expect(rows.some((r) => r.startsWith('305,W-052,J000305,level2-varies,blocker,benches,'))).toBe(true);
    expect(rows.some((r) => r.startsWith('309,,'))).toBe(true);
  });

  it('--format applies to stdout; --with-plot-data adds plots to JSON; --fail-on reaches JUnit', async () => {
    const json = await nestready('audit', ...DEMO, '-f', 'json', '--with-plot-data');
    expect(Object.keys(JSON.parse(json.stdout))).toContain('plots');
    const junit = await nestready('audit', ...DEMO, '-f', 'junit', '--fail-on', 'never');
    expect(junit.code).toBe(0);
    expect(junit.stdout).toContain('failures="0"');
  });

  it('reports left-out problem rows on stderr unless --quiet; rejects a bad --max-rows', async () => {
    const [loud, quiet, bad, nowhere] = await Promise.all([
      nestready('audit', ...DEMO, '-f', 'json', '--problems', join(dir, 'few.csv'), '--max-rows', '3'),
      nestready('audit', ...DEMO, '-f', 'json', '--problems', join(dir, 'few-quiet.csv'), '--max-rows', '3', '--quiet'),
      nestready('audit', ...DEMO, '--max-rows', 'lots'),
      nestready('audit', ...DEMO, '--out', join(dir, 'no/such/dir/r.html')),
    ]);
    expect(loud.stderr.split('\n')[0]).toBe(`nestready: wrote the problem rows (CSV) to ${join(dir, 'few.csv')}`);
    const m = /^nestready: (.+): (\d+) of (\d+) problem rows left out \(--max-rows 3\)\n$/m.exec(loud.stderr)!;
    expect(m, loud.stderr).not.toBeNull();
    expect(m[1]).toBe(join(dir, 'few.csv'));
    expect(Number(m[3]) - Number(m[2])).toBe(3);
    expect(readFileSync(join(dir, 'few.csv'), 'utf8')).toContain(`\r\n# ${m[2]} more problem rows of ${m[3]} not written`);
    expect(quiet.stderr).toBe('');
    expect(bad.code).toBe(2);
    expect(nowhere.code).toBe(2);
    expect(nowhere.stderr).toMatch(/cannot write the output/);
  });
});
