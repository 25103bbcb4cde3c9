import { describe, expect, it } from 'vitest';
import { groupMeansChart } from '../../src/report/charts/group-means.js';
import { groupSizesChart } from '../../src/report/charts/group-sizes.js';
import { wrapLines } from '../../src/report/charts/wrap.js';
import type { PlotData } from '../../src/report/types.js';
import { demoReport } from './fixtures/reports.js';

type Layer = { data: { values: Record<string, unknown>[] }; encoding: Record<string, Record<string, unknown>> };
const layers = (spec: unknown) => (spec as { layer: Layer[] }).layer;

describe('chart specs', () => {
  it('names in the size legend only the kinds of group the delivery has', () => {
    const plots = demoReport().plots as PlotData;
    const all = layers(groupSizesChart(plots)?.spec)[0].encoding.color;
    expect((all.scale as { domain: string[] }).domain).toEqual(['singleton (1 record)', 'small (fewer than 5)', 'other groups']);
    const large = layers(groupSizesChart({ ...plots, groupSizes: plots.groupSizes.filter((h) => h.size >= 5) })?.spec)[0].encoding.color;
    expect((large.scale as { domain: string[] }).domain).toEqual(['other groups']);
    expect(large.legend).toBeNull();
  });

  it('gives the count axes whole-number ticks', () => {
    const plots = demoReport().plots as PlotData;
    const sizes = layers(groupSizesChart(plots)?.spec)[0].encoding;
    expect(sizes.x.axis).toEqual({ tickMinStep: 1, format: 'd' });
    expect(sizes.y.axis).toEqual({ tickMinStep: 1, format: 'd' });
    const means = layers(groupMeansChart('repair_minutes', plots.groupMeans.repair_minutes, 0)?.spec)[0].encoding;
    expect(means.x.axis).toEqual({ tickMinStep: 1, format: 'd' });
  });

  it('draws singleton groups without an interval, as a kind of their own', () => {
    const means = (demoReport().plots as PlotData).groupMeans.repair_minutes;
    const singletons = means.points.filter((p) => p.n === 1).length;
    expect(singletons).toBe(4);
    const [intervals, points] = layers(groupMeansChart('repair_minutes', means, 0)?.spec);
    expect(intervals.data.values).toHaveLength(means.points.length - singletons);
    expect(points.data.values.filter((v) => v.single)).toHaveLength(singletons);
    const none = groupMeansChart('m', { ...means, points: means.points.filter((p) => p.n > 1) }, 0);
    expect(layers(none?.spec)[1].encoding.color.legend).toBeNull();
  });

  it('wraps a title between clauses, else between words, and cuts only a word longer than a line', () => {
    expect(wrapLines('66 groups; overall mean 52.83 (REML); bars: mean ± 1.96·SE', 40)).toEqual([
      '66 groups; overall mean 52.83 (REML);',
      'bars: mean ± 1.96·SE',
    ]);
    expect(wrapLines('short', 40)).toEqual(['short']);
    expect(wrapLines('Group means: a_very_long_outcome_name_of_a_delivery', 20)).toEqual(['Group means:', 'a_very_long_outcome…']);
  });
});
