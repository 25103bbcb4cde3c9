import { describe, expect, it } from 'vitest';
import { renderJson } from '../../src/report/json.js';
import { demoReport } from './fixtures/reports.js';

const STABLE = ['schema', 'tool', 'input', 'roles', 'groups', 'outcomes', 'findings', 'score', 'grade', 'verdict'];

describe('renderJson', () => {
  it('writes only the stable fields by default (no plots, no rulesRun)', () => {
    const out = JSON.parse(renderJson(demoReport()));
    expect(Object.keys(out)).toEqual(STABLE);
  });

  it('writes the whole report object with withPlotData', () => {
    const report = demoReport();
    const out = JSON.parse(renderJson(report, { withPlotData: true }));
    expect(Object.keys(out)).toEqual([...STABLE, 'plots', 'rulesRun']);
    expect(out).toEqual(report);
  });
});
