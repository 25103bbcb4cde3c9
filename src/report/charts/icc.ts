import type { OutcomeStats } from '../../stats/types.js';
import { formatNumber } from '../../util/format.js';
import { PALETTE } from '../palette.js';
import { CHART_CONFIG, CHART_SIZE } from './theme.js';
import type { Chart } from './types.js';

const METHODS = ['REML', 'ML', 'ANOVA ICC(1)'] as const;

/**
 * ICC estimates per outcome: REML, ML and the ANOVA ICC(1) with its 95% interval, against the
 * low-ICC threshold. Methods differ in colour and in shape, and the threshold is labelled.
 */
export function iccChart(outcomes: Record<string, OutcomeStats>, lowIcc: number | undefined): Chart | null {
  const values: { row: string; outcome: string; method: string; icc: number; lo?: number; hi?: number }[] = [];
  const words: string[] = [];
  for (const [outcome, s] of Object.entries(outcomes)) {
    const est = { REML: s.reml.icc, ML: s.ml.icc, 'ANOVA ICC(1)': s.anova.icc };
    for (const method of METHODS) {
      const icc = est[method];
      if (!Number.isFinite(icc)) continue;
      const row = `${outcome} · ${method}`;
      const [lo, hi] = s.anova.ci95 ?? [NaN, NaN];
      values.push(
        method === 'ANOVA ICC(1)' && Number.isFinite(lo) && Number.isFinite(hi)
          ? { row, outcome, method, icc, lo, hi }
          : { row, outcome, method, icc },
      );
    }
    words.push(
      `${outcome}: REML ${formatNumber(s.reml.icc, 3)}, ML ${formatNumber(s.ml.icc, 3)}, ANOVA ICC(1) ${formatNumber(s.anova.icc, 3)} ` +
        `(95% ${formatNumber(s.anova.ci95?.[0], 3)} to ${formatNumber(s.anova.ci95?.[1], 3)})`,
    );
  }
  if (!values.length) return null;
  const rows = values.map((v) => v.row);
  // the legend names only the methods that gave an estimate
  const methods = METHODS.filter((m) => values.some((v) => v.method === m));
  const pick = <T>(range: readonly T[]) => methods.map((m) => range[METHODS.indexOf(m)]);
  const y = { field: 'row', type: 'nominal', title: null, sort: rows };
  const layers: unknown[] = [
    {
      data: { values: values.filter((v) => v.lo !== undefined) },
      mark: { type: 'rule', color: PALETTE.muted, strokeWidth: 2 },
      encoding: { y, x: { field: 'lo', type: 'quantitative' }, x2: { field: 'hi' } },
    },
    {
      data: { values },
      mark: { type: 'point', filled: true, size: 90, opacity: 1 },
      encoding: {
        y,
        x: { field: 'icc', type: 'quantitative', title: 'intraclass correlation (share of variance between groups)' },
        color: {
          field: 'method',
          type: 'nominal',
          title: 'estimate',
          scale: { domain: methods, range: pick([PALETTE.accent, PALETTE.note, PALETTE.highlight]) },
        },
        shape: {
          field: 'method',
          type: 'nominal',
          title: 'estimate',
          scale: { domain: methods, range: pick(['circle', 'square', 'diamond']) },
        },
      },
    },
  ];
  if (lowIcc !== undefined) {
    const rule = { values: [{ x: lowIcc, label: `low-ICC threshold ${lowIcc}` }] };
    layers.push(
      {
        data: rule,
        mark: { type: 'rule', color: PALETTE.blocker, strokeDash: [4, 3] },
        encoding: { x: { field: 'x', type: 'quantitative' } },
      },
      {
        data: rule,
        mark: { type: 'text', align: 'left', dx: 4, y: -6, color: PALETTE.blocker, fontSize: 11 },
        encoding: { x: { field: 'x', type: 'quantitative' }, text: { field: 'label' } },
      },
    );
  }
  return {
    id: 'chart-icc',
    title: 'ICC estimates by method',
    description:
      `Intraclass correlation of each outcome by method. ${words.join('; ')}.` +
      (lowIcc !== undefined ? ` The low-ICC threshold is ${lowIcc}.` : ''),
    spec: {
      $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
      config: CHART_CONFIG,
      title: { text: 'ICC estimates', subtitle: 'REML, ML and ANOVA ICC(1) with its 95% interval' },
      width: CHART_SIZE.width,
      // a fixed height by rows rather than a step, so the drawing can be fitted to its width
      height: 26 * values.length,
      layer: layers,
    } as Chart['spec'],
  };
}
