import type { OutcomeStats } from '../stats/types.js';
import { formatNumber as f, formatP } from '../util/format.js';
import { centeringAdvice } from './centering-advice.js';
import type { Report } from './types.js';
import { visibleValue } from './visible.js';

/** A table as plain text cells, shared by the HTML and Markdown renderers (same content). */
export interface StatTable {
  caption: string;
  head: string[];
  rows: string[][];
  /** columns (by index) that hold numbers and are right-aligned */
  numeric: number[];
}

/** Default for centering advice when the report carries no low-ICC threshold (low-icc's default). */
const DEFAULT_SHARE_THRESHOLD = 0.05;

export function groupsTable(report: Report): StatTable {
  const s = report.groups.sizes;
  return {
    caption: 'Groups and records per group',
    head: ['records', 'groups', 'singletons', 'min', 'median', 'mean', 'max'],
    rows: [
      [
        String(report.input.rows),
        String(report.groups.count),
        String(report.groups.singletons),
        String(s.min),
        f(s.median, 1),
        f(s.mean, 1),
        String(s.max),
      ],
    ],
    numeric: [0, 1, 2, 3, 4, 5, 6],
  };
}

export function componentsTable(name: string, o: OutcomeStats): StatTable {
  const row = (label: string, v: OutcomeStats['reml']) => [label, f(v.tau2, 4), f(v.sigma2, 4), f(v.icc, 4), f(v.mean, 3), f(v.logLik, 2)];
  return {
    caption: `${name}: variance components of the null model (n ${o.n} in ${o.groups} groups, mean ${f(o.mean, 3)})`,
    head: ['estimate', 'τ² (between)', 'σ² (within)', 'ICC', 'mean μ', 'log-likelihood'],
    rows: [row('REML', o.reml), row('ML', o.ml)],
    numeric: [1, 2, 3, 4, 5],
  };
}

export function anovaTable(name: string, o: OutcomeStats): StatTable {
  const a = o.anova;
  return {
    caption: `${name}: one-way ANOVA`,
    head: ['statistic', 'value'],
    rows: [
      ['ICC(1)', f(a.icc, 4)],
      ['ICC(1) 95% interval', `${f(a.ci95?.[0] ?? NaN, 4)} to ${f(a.ci95?.[1] ?? NaN, 4)}`],
      ['ICC(2), reliability of group means', f(a.icc2, 4)],
      ['F', `${f(a.f, 3)} on (${a.df1}, ${a.df2}) df`],
      ['p', formatP(a.p)],
      ['MSB / MSW', `${f(a.msb, 4)} / ${f(a.msw, 4)}`],
      ['n0 (effective group size)', f(a.n0, 2)],
      ['design effect', f(o.designEffect, 3)],
      ['effective N', f(o.effectiveN, 1)],
      ['mean reliability of group means (REML)', f(o.meanReliability, 3)],
    ],
    numeric: [1],
  };
}

export function predictorsTable(report: Report): StatTable | null {
  const shares = report.plots?.predictorShares;
  if (!shares || !Object.keys(shares).length) return null;
  const threshold = report.plots?.lowIccThreshold ?? DEFAULT_SHARE_THRESHOLD;
  return {
    caption: 'Level-1 predictors: share of variance between groups (centring advice)',
    head: ['predictor', 'REML ICC', 'ANOVA ICC(1)', 'advice'],
    rows: Object.entries(shares).map(([col, s]) => [col, f(s.reml, 3), f(s.anova, 3), centeringAdvice(s.reml, threshold, s.anova)]),
    numeric: [1, 2],
  };
}

/** The lowest and highest group means of an outcome (from the plot data), `k` of each. */
export function extremesTable(report: Report, outcome: string, k = 5): StatTable | null {
  const m = report.plots?.groupMeans[outcome];
  if (!m?.points.length) return null;
  const pts = m.points;
  const picked = pts.length <= 2 * k ? pts : [...pts.slice(0, k), ...pts.slice(-k)];
  return {
    caption: `${outcome}: ${pts.length <= 2 * k ? 'all group means' : `the ${k} lowest and ${k} highest group means`}`,
    head: ['group', 'rank', 'records', 'mean', '95% interval'],
    rows: picked.map((p) => [
      visibleValue(p.group),
      `${p.rank} of ${m.total}`,
      String(p.n),
      f(p.mean, 3),
      Number.isFinite(p.se) && p.se !== null ? `${f(p.mean - 1.96 * p.se, 3)} to ${f(p.mean + 1.96 * p.se, 3)}` : 'n/a',
    ]),
    numeric: [2, 3],
  };
}
