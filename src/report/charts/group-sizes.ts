import { PALETTE } from '../palette.js';
import type { PlotData } from '../types.js';
import { CHART_CONFIG, CHART_SIZE, COUNT_AXIS } from './theme.js';
import type { Chart } from './types.js';

/**
 * Distribution of group sizes (records per group) as a binned histogram, bars stacked by kind so
 * that singletons and small groups stand out, with the small-group threshold drawn and labelled.
 */
export function groupSizesChart(plots: PlotData): Chart | null {
  const hist = plots.groupSizes.filter((h) => h.count > 0);
  if (!hist.length) return null;
  const threshold = plots.smallGroupThreshold;
  const kind = (size: number) =>
    size === 1 ? 'singleton (1 record)' : threshold !== undefined && size < threshold ? `small (fewer than ${threshold})` : 'other groups';
  const colours: Record<string, string> = {
    'singleton (1 record)': PALETTE.highlight,
    [`small (fewer than ${threshold})`]: PALETTE.warning,
    'other groups': PALETTE.accent,
  };
  const values = hist.map((h) => ({ size: h.size, count: h.count, kind: kind(h.size) }));
  // the legend names only the kinds this delivery has, and none when all groups are of one kind
  const kinds = Object.keys(colours).filter((k) => values.some((v) => v.kind === k));
  const groups = hist.reduce((a, h) => a + h.count, 0);
  const singletons = hist.find((h) => h.size === 1)?.count ?? 0;
  const small = threshold === undefined ? 0 : hist.filter((h) => h.size < threshold).reduce((a, h) => a + h.count, 0);
  const min = hist[0].size;
  const max = hist[hist.length - 1].size;
  const subtitle =
    `${groups} groups of ${min}–${max} records; ${singletons} singleton(s)` +
    (threshold !== undefined ? `; ${small} with fewer than ${threshold} records` : '');

  const layers: unknown[] = [
    {
      data: { values },
      mark: { type: 'bar' },
      encoding: {
        x: { field: 'size', type: 'quantitative', bin: { maxbins: 40, minstep: 1 }, title: 'records per group', axis: COUNT_AXIS },
        y: { aggregate: 'sum', field: 'count', type: 'quantitative', title: 'groups', axis: COUNT_AXIS },
        color: {
          field: 'kind',
          type: 'nominal',
          title: null,
          scale: { domain: kinds, range: kinds.map((k) => colours[k]) },
          ...(kinds.length < 2 && { legend: null }),
        },
      },
    },
  ];
  if (threshold !== undefined) {
    const rule = { values: [{ x: threshold, label: `small-group threshold: ${threshold}` }] };
    layers.push(
      { data: rule, mark: { type: 'rule', color: PALETTE.ink, strokeDash: [4, 3] }, encoding: { x: { field: 'x', type: 'quantitative' } } },
      {
        data: rule,
        mark: { type: 'text', align: 'left', dx: 4, y: 8, color: PALETTE.ink, fontSize: 11 },
        encoding: { x: { field: 'x', type: 'quantitative' }, text: { field: 'label' } },
      },
    );
  }
  return {
    id: 'chart-group-sizes',
    title: 'Distribution of group sizes',
    description: `Histogram of records per group. ${subtitle}.`,
    spec: {
      $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
      config: CHART_CONFIG,
      title: { text: 'Group sizes', subtitle },
      ...CHART_SIZE,
      layer: layers,
    } as Chart['spec'],
  };
}
