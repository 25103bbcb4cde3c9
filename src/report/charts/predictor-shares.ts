import { formatNumber } from '../../util/format.js';
import { withoutWithinVariation } from '../centering-advice.js';
import { PALETTE } from '../palette.js';
import type { PlotData } from '../types.js';
import { CHART_CONFIG, CHART_SIZE } from './theme.js';
import type { Chart } from './types.js';

/**
 * Per numeric level-1 predictor, the share of its variance between groups (REML ICC as a bar,
 * ANOVA ICC(1) as a tick): a large share means the predictor carries a group-level part and
 * should be split into group mean and within-group deviation (centering within groups).
 */
export function predictorSharesChart(plots: PlotData): Chart | null {
  const values = Object.entries(plots.predictorShares)
    .filter(([, s]) => Number.isFinite(s.reml) || Number.isFinite(s.anova))
    .map(([column, s]) => ({ column, reml: Number.isFinite(s.reml) ? s.reml : null, anova: Number.isFinite(s.anova) ? s.anova : null }));
  if (!values.length) return null;
  const y = { field: 'column', type: 'nominal', title: null, sort: values.map((v) => v.column) };
  const x = {
    type: 'quantitative',
    scale: { domain: [0, 1], clamp: true },
    title: 'share of the predictor’s variance between groups (ICC)',
  };
  const layers: unknown[] = [
    {
      data: { values: values.filter((v) => v.reml !== null) },
      mark: { type: 'bar', color: PALETTE.accent, height: { band: 0.6 } },
      encoding: { y, x: { ...x, field: 'reml' } },
    },
    {
      data: { values: values.filter((v) => v.anova !== null) },
      mark: { type: 'tick', color: PALETTE.highlight, thickness: 3, size: 22 },
      encoding: { y, x: { ...x, field: 'anova' } },
    },
  ];
  const threshold = plots.lowIccThreshold;
  if (threshold !== undefined) {
    layers.push({
      data: { values: [{ x: threshold }] },
      mark: { type: 'rule', color: PALETTE.blocker, strokeDash: [4, 3] },
      encoding: { x: { field: 'x', type: 'quantitative' } },
    });
  }
  return {
    id: 'chart-predictor-shares',
    title: 'Between-group share of each level-1 predictor',
    description:
      'Share of each numeric level-1 predictor’s variance that lies between groups: ' +
      values.map((v) => `${v.column} ${formatNumber(v.reml ?? NaN, 3)} (REML), ${formatNumber(v.anova ?? NaN, 3)} (ANOVA)`).join('; ') +
      '. A share well above zero means the predictor has a group-level part: centre it within groups.' +
      groupLevel(values) +
      (threshold !== undefined ? ` Dashed line: ${threshold}.` : ''),
    spec: {
      $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
      config: CHART_CONFIG,
      title: {
        text: 'Level-1 predictors: between-group share',
        subtitle: `bar: REML ICC · tick: ANOVA ICC(1)${threshold !== undefined ? ` · dashed line: ${threshold}` : ''}`,
      },
      width: CHART_SIZE.width,
      height: 30 * values.length,
      layer: layers,
    } as Chart['spec'],
  };
}

/** The predictors that do not vary within any group: nothing to centre, they describe the group. */
function groupLevel(values: readonly { column: string; anova?: number | null }[]): string {
  const names = values.filter((v) => withoutWithinVariation(v.anova ?? Number.NaN)).map((v) => v.column);
  return names.length ? ` Without variation within groups (group-level variables, nothing to centre): ${names.join(', ')}.` : '';
}
