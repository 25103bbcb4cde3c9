import * as aq from 'arquero';
import { describe, expect, it } from 'vitest';
import { catalogue } from '../../rules/index.js';
import { cappedIndices } from '../../src/analysis/capped-indices.js';
import { GROUP_MEAN_ENDS, MAX_GROUP_MEANS } from '../../src/analysis/group-means.js';
import { buildPlotData } from '../../src/analysis/plot-data.js';
import { plotThresholds, SMALL_GROUP_THRESHOLD } from '../../src/analysis/plot-thresholds.js';
import { sizeHistogram } from '../../src/analysis/size-histogram.js';
import type { ColumnProfile, Profile } from '../../src/profile/types.js';
import type { Roles } from '../../src/roles/types.js';
import { outcomeStats } from '../../src/stats/index.js';
import type { GroupMoments } from '../../src/stats/types.js';

interface GroupRow {
  group: string;
  n: number;
  [key: string]: string | number | null;
}

/** A profile from per-group rows (`c:num`, `c:mean`, `c:ss` per numeric column), as buildProfile holds it. */
function fakeProfile(rows: GroupRow[], columns: Record<string, Partial<ColumnProfile>>): Profile {
  const groups = aq.from(rows);
  return {
    rows: rows.reduce((a, r) => a + r.n, 0),
    rejected: [],
    header: ['g', ...Object.keys(columns)],
    missingGroupRows: 0,
    groups,
    columns: aq.from([]),
    column: (name) => ({ name, numericProfiled: true, type: 'numeric', ...columns[name] }) as ColumnProfile,
    moments(name): GroupMoments[] {
      return rows
        .filter((r) => (r[`${name}:num`] as number) > 0)
        .map((r) => ({ n: r[`${name}:num`] as number, mean: r[`${name}:mean`] as number, ss: r[`${name}:ss`] as number }));
    },
  };
}

function roles(extra: Partial<Roles> = {}): Roles {
  return { group: 'g', outcomes: ['y'], level1: ['x', 'kind'], level2: [], missing: [''], types: {}, rules: {}, ...extra };
}

const rows: GroupRow[] = [
  { group: 'A', n: 3, 'y:num': 3, 'y:mean': 10, 'y:ss': 8, 'x:num': 3, 'x:mean': 1, 'x:ss': 2 },
  { group: 'B', n: 1, 'y:num': 1, 'y:mean': 4, 'y:ss': 0, 'x:num': 1, 'x:mean': 2, 'x:ss': 0 },
  { group: 'C', n: 4, 'y:num': 4, 'y:mean': 7, 'y:ss': 6, 'x:num': 4, 'x:mean': 1.5, 'x:ss': 3 },
  { group: 'D', n: 3, 'y:num': 0, 'y:mean': null, 'y:ss': null, 'x:num': 3, 'x:mean': 3, 'x:ss': 1 },
];

describe('buildPlotData', () => {
  const profile = fakeProfile(rows, { y: {}, x: {}, kind: { type: 'categorical', numericProfiled: false } });
  const stats = outcomeStats(profile.moments('y'));

  it('histograms group sizes and sorts group means with se = sqrt(σ²_REML / n_j)', () => {
    const plots = buildPlotData(profile, roles(), { y: stats }, {});
    expect(plots.groupSizes).toEqual([
      { size: 1, count: 1 },
      { size: 3, count: 2 },
      { size: 4, count: 1 },
    ]);
    const m = plots.groupMeans.y;
    expect(m.total).toBe(3); // D has no value of y
    expect(m.sigma2).toBe(stats.reml.sigma2);
    expect(m.mean).toBe(stats.reml.mean);
    expect(m.points.map((p) => [p.group, p.rank, p.n, p.mean])).toEqual([
      ['B', 1, 1, 4],
      ['C', 2, 4, 7],
      ['A', 3, 3, 10],
    ]);
    for (const p of m.points) expect(p.se).toBeCloseTo(Math.sqrt(stats.reml.sigma2 / p.n), 12);
  });

  it('gives each numeric level-1 column its REML and ANOVA between-group share, skipping categorical ones', () => {
    const plots = buildPlotData(profile, roles(), { y: stats }, {});
    const x = outcomeStats(profile.moments('x'));
    expect(plots.predictorShares).toEqual({ x: { reml: x.reml.icc, anova: x.anova.icc } });
  });

  it('carries the thresholds it is given, and only those', () => {
    const given = buildPlotData(profile, roles(), {}, { smallGroups: 3, lowIcc: 0.1 });
    expect(given).toMatchObject({ smallGroupThreshold: 3, lowIccThreshold: 0.1 });
    const none = buildPlotData(profile, roles(), {}, {});
    expect('smallGroupThreshold' in none || 'lowIccThreshold' in none).toBe(false);
  });
});

describe('plotThresholds', () => {
  it('reads the thresholds from the params the rules run with: defaults, role map settings, off', () => {
    expect(plotThresholds(catalogue, roles())).toEqual({ smallGroups: 5, lowIcc: 0.05 });
    expect(plotThresholds(catalogue, roles({ rules: { 'low-icc': { icc_below: 0.1 }, 'small-groups': { size_below: 8 } } }))).toEqual({
      smallGroups: 8,
      lowIcc: 0.1,
    });
    expect(plotThresholds(catalogue, roles({ rules: { 'low-icc': 'off', 'small-groups': 'off' } }))).toEqual({});
  });

  it('falls back to the documented small-group size, and to no ICC line, when the catalogue lacks the rules', () => {
    expect(plotThresholds([], roles())).toEqual({ smallGroups: SMALL_GROUP_THRESHOLD });
  });
});

describe('buildPlotData at scale', () => {
  it('caps the group means for many groups: ends kept, an even sample between, ranks of the whole', () => {
    const J = 12_345;
    const many: GroupRow[] = Array.from({ length: J }, (_, j) => ({
      group: `G${j}`,
      n: 2,
      'y:num': 2,
      'y:mean': (j * 7919) % J,
      'y:ss': 1,
    }));
    const p = fakeProfile(many, { y: {} });
    const plots = buildPlotData(p, roles({ level1: [] }), { y: outcomeStats(p.moments('y')) }, {});
    const pts = plots.groupMeans.y.points;
    expect(plots.groupMeans.y.total).toBe(J);
    expect(pts).toHaveLength(MAX_GROUP_MEANS);
    expect(pts.slice(0, GROUP_MEAN_ENDS).map((q) => q.rank)).toEqual(Array.from({ length: GROUP_MEAN_ENDS }, (_, i) => i + 1));
    expect(pts.slice(-GROUP_MEAN_ENDS).map((q) => q.rank)).toEqual(
      Array.from({ length: GROUP_MEAN_ENDS }, (_, i) => J - GROUP_MEAN_ENDS + i + 1),
    );
    for (let i = 1; i < pts.length; i++) {
      expect(pts[i].rank).toBeGreaterThan(pts[i - 1].rank);
      expect(pts[i].mean).toBeGreaterThanOrEqual(pts[i - 1].mean);
    }
    expect(plots.groupSizes).toEqual([{ size: 2, count: J }]);
    // the plot data stays small in JSON
    expect(JSON.stringify(plots).length).toBeLessThan(200_000);
  });
});

describe('plot helpers', () => {
  it('sizeHistogram counts each size once, ascending', () => {
    expect(sizeHistogram([3, 1, 3, 10, 1, 1])).toEqual([
      { size: 1, count: 3 },
      { size: 3, count: 2 },
      { size: 10, count: 1 },
    ]);
    expect(sizeHistogram([])).toEqual([]);
  });

  it('cappedIndices keeps everything that fits, else ends plus an even sample', () => {
    expect(cappedIndices(5, 10, 2)).toEqual([0, 1, 2, 3, 4]);
    const idx = cappedIndices(100, 10, 2);
    expect(idx).toHaveLength(10);
    expect(idx.slice(0, 2)).toEqual([0, 1]);
    expect(idx.slice(-2)).toEqual([98, 99]);
    expect(new Set(idx).size).toBe(10);
    expect([...idx].sort((a, b) => a - b)).toEqual(idx);
  });
});

describe('audit({ plotData: false })', () => {
  it('leaves the plots out and changes nothing else', async () => {
    const { auditRows } = await import('../helpers/delivery.js');
    const rows = Array.from({ length: 60 }, (_, i) => ({ g: `G${i % 6}`, x: (i * 7) % 5, y: (i % 6) + ((i * 3) % 4) }));
    const roles = { group: 'g', outcome: 'y', level1: ['x'] };
    const withPlots = await auditRows(rows, roles);
    const without = await auditRows(rows, roles, { plotData: false });
    expect(withPlots.plots).toBeDefined();
    expect(without.plots).toBeUndefined();
    // each audit reads its own temp copy of the delivery: the paths differ
    const { plots: _plots, ...rest } = withPlots;
    expect({ ...without, input: { ...without.input, path: '' } }).toEqual({ ...rest, input: { ...rest.input, path: '' } });
  });
});
