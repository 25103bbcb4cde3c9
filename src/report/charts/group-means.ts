import { formatNumber } from '../../util/format.js';
import { PALETTE } from '../palette.js';
import type { GroupMeans } from '../types.js';
import { CHART_CONFIG, CHART_SIZE, COUNT_AXIS } from './theme.js';
import type { Chart } from './types.js';

const MEAN = 'group mean ± 1.96·SE';
const SINGLETON = 'singleton group (1 record: no interval)';

/**
 * Group means of one outcome sorted from lowest to highest, each with its interval
 * mean ± 1.96·SE (SE from the REML within-group variance), and the overall REML mean: the spread
 * the ICC summarises, as a "caterpillar" plot. A group with one value is drawn as a hollow mark
 * without an interval: its SE is the whole within-group SD, a bar that long would say nothing
 * about the group and stretch the axis for all the others.
 */
export function groupMeansChart(outcome: string, means: GroupMeans, index: number): Chart | null {
  const values = means.points
    .filter((p) => Number.isFinite(p.mean))
    .map((p) => {
      const half = Number.isFinite(p.se) ? 1.96 * p.se : 0;
      const single = p.n === 1;
      return { rank: p.rank, mean: p.mean, lo: p.mean - half, hi: p.mean + half, kind: single ? SINGLETON : MEAN, single };
    });
  if (!values.length) return null;
  const shown =
    values.length < means.total
      ? `${values.length} of ${means.total} groups shown (lowest, highest and an even sample)`
      : `${means.total} groups`;
  const lo = values[0];
  const hi = values[values.length - 1];
  const singletons = values.filter((v) => v.kind === SINGLETON).length;
  const kinds = [MEAN, SINGLETON].filter((k) => values.some((v) => v.kind === k));
  const subtitle =
    `${shown}; overall mean ${formatNumber(means.mean, 2)} (REML); bars: mean ± 1.96·SE` +
    (singletons ? `; hollow: ${singletons} singleton group(s), no interval` : '');
  const many = values.length > 400;
  const layers: unknown[] = [
    {
      data: { values: values.filter((v) => v.kind === MEAN) },
      mark: { type: 'rule', color: PALETTE.accentSoft, strokeWidth: many ? 0.6 : 1.2 },
      encoding: {
        x: {
          field: 'rank',
          type: 'quantitative',
          title: 'groups, sorted by mean',
          scale: { domain: [0, means.total + 1], nice: false },
          axis: COUNT_AXIS,
        },
        y: { field: 'lo', type: 'quantitative', title: 'group mean (± 1.96·SE)', scale: { zero: false } },
        y2: { field: 'hi' },
      },
    },
    {
      data: { values },
      // one mark for all means (filled) and singletons (hollow ring), told apart by colour and fill
      mark: { type: 'point', strokeWidth: 1.5, opacity: 1 },
      encoding: {
        x: { field: 'rank', type: 'quantitative' },
        y: { field: 'mean', type: 'quantitative' },
        color: {
          field: 'kind',
          type: 'nominal',
          title: null,
          scale: { domain: kinds, range: kinds.map((k) => (k === MEAN ? PALETTE.accent : PALETTE.highlight)) },
          // a legend only when there is something to tell apart
          ...(kinds.length < 2 && { legend: null }),
        },
        fill: {
          field: 'kind',
          type: 'nominal',
          scale: { domain: kinds, range: kinds.map((k) => (k === MEAN ? PALETTE.accent : PALETTE.panel)) },
          ...(kinds.length < 2 && { legend: null }),
        },
        size: { condition: { test: 'datum.single', value: many ? 18 : 40 }, value: many ? 8 : 22 },
      },
    },
  ];
  if (Number.isFinite(means.mean)) {
    const rule = { values: [{ y: means.mean, label: `overall mean ${formatNumber(means.mean, 2)}` }] };
    layers.push(
      {
        data: rule,
        mark: { type: 'rule', color: PALETTE.highlight, strokeDash: [5, 3] },
        encoding: { y: { field: 'y', type: 'quantitative' } },
      },
      {
        data: rule,
        mark: { type: 'text', align: 'left', baseline: 'bottom', x: 4, dy: -3, color: PALETTE.highlight, fontSize: 11 },
        encoding: { y: { field: 'y', type: 'quantitative' }, text: { field: 'label' } },
      },
    );
  }
  return {
    id: `chart-means-${index}`,
    title: `Group means of ${outcome}`,
    description:
      `Group means of ${outcome}, sorted from lowest to highest, with 95% intervals (mean ± 1.96·SE). ${shown}. ` +
      (singletons ? `${singletons} singleton group(s) are marked apart, without an interval. ` : '') +
      `Lowest mean ${formatNumber(lo.mean, 2)}, highest ${formatNumber(hi.mean, 2)}, overall mean ${formatNumber(means.mean, 2)}.`,
    spec: {
      $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
      config: CHART_CONFIG,
      title: { text: `Group means: ${outcome}`, subtitle },
      ...CHART_SIZE,
      layer: layers,
    } as Chart['spec'],
  };
}
