import type { FactorSpread, WeightScaling } from '../analysis/weights.js';
import type { OutcomeStats } from '../stats/types.js';
import { formatNumber as f } from '../util/format.js';
import type { StatTable } from './stat-tables.js';
import type { Report } from './types.js';
import { visibleValue } from './visible.js';

/** A report section on the model the analyst plans: a heading, an optional note, tables. */
export interface PlanSection {
  id: string;
  heading: string;
  note?: string;
  tables: StatTable[];
}

/**
 * The sections the role map's plan asks for, in report order: precision for the planned effect
 * (per outcome), the weights, and how to fit. Empty when the report carries none of them.
 */
export function planSections(report: Report): PlanSection[] {
  const out: PlanSection[] = [];
  const precision = Object.entries(report.outcomes).flatMap(([name, o]) => (o.precision ? [precisionTable(name, o)] : []));
  if (precision.length) out.push({ id: 'precision-h', heading: 'Precision for the planned effect', tables: precision });
  const weights = weightsTables(report);
  if (weights.length) out.push({ id: 'weights-h', heading: 'Sampling weights', tables: weights });
  const advice = report.fitAdvice;
  if (advice?.items.length) {
    out.push({
      id: 'fit-h',
      heading: 'How to fit',
      note: advice.note,
      tables: [
        {
          caption: 'Estimation advice',
          head: ['advice', 'because', 'source'],
          rows: advice.items.map((i) => [i.advice, i.rules?.length ? `${i.because} (${i.rules.join(', ')})` : i.because, i.source]),
          numeric: [],
        },
      ],
    });
  }
  return out;
}

function precisionTable(name: string, o: OutcomeStats): StatTable {
  const p = o.precision as NonNullable<OutcomeStats['precision']>;
  const predictor =
    p.kind === 'binary'
      ? `${p.predictor}: share ${f(p.share ?? Number.NaN, 3)} of groups at ${p.category}`
      : `${p.predictor}, per SD across groups`;
  const rows = [
    ['predictor', predictor],
    ['groups J, mean size, size CV', `${p.groups}, ${f(p.meanSize, 1)}, ${f(p.sizeCv, 3)}`],
    ['ICC (REML)', f(p.icc, 4)],
    ['α (two-sided), power', `${p.alpha}, ${p.targetPower}`],
    ['df, multiplier M', `${p.df}, ${f(p.multiplier, 3)}`],
    ['design effect, unequal sizes (Eldridge et al. 2006)', f(p.designEffect, 3)],
    ['MDES (SD), equal sizes', f(p.mdesEqual, 3)],
    ['MDES (SD), unequal sizes', f(p.mdes, 3)],
  ];
  if (p.effectSize !== undefined) rows.push([`power for ${p.effectSize} SD (shifted central t)`, f(p.power ?? Number.NaN, 3)]);
  return { caption: `${name}: minimum detectable effect (Bloom 2005)`, head: ['statistic', 'value'], rows, numeric: [] };
}

function weightsTables(report: Report): StatTable[] {
  const w = report.weights;
  if (!w) return [];
  const row = (level: string, column: string, n: number, missing: number, deff: number, effective: number, nonPositive: number) => [
    level,
    column,
    String(n),
    String(missing),
    f(deff, 3),
    f(effective, 1),
    String(nonPositive),
  ];
  const rows: string[][] = [];
  const [l1, l2] = [w.level1, w.level2];
  if (l1) rows.push(row('level 1', l1.column, l1.records, l1.missing, l1.designEffect, l1.effectiveN, l1.nonPositiveGroups.length));
  if (l2) rows.push(row('level 2', l2.column, l2.groups, l2.missing, l2.designEffect, l2.effectiveGroups, l2.nonPositiveGroups.length));
  const tables: StatTable[] = [
    {
      caption: 'Weights: Kish design effect of weighting (1 + CV²) and effective size',
      head: ['level', 'column', 'with a weight', 'without', 'design effect', 'effective size', 'groups with a weight ≤ 0'],
      rows,
      numeric: [2, 3, 4, 5, 6],
    },
  ];
  if (w.form) {
    tables.push({
      caption: 'Level-1 weights: conditional or total? (a heuristic)',
      head: ['looks', 'log correlation with the level-2 weight', 'groups with no record weight below the group’s', 'groups compared'],
      rows: [[w.form.form, f(w.form.correlation, 3), f(w.form.atLeastGroupWeight, 3), String(w.form.groups)]],
      numeric: [1, 2, 3],
    });
  }
  const scaling = w.level1?.scaling;
  if (scaling?.groups) tables.push(...scalingTables(scaling));
  return tables;
}

function scalingTables(scaling: WeightScaling): StatTable[] {
  const spread = (name: string, s: FactorSpread) => [name, ...[s.min, s.q1, s.median, s.q3, s.max].map((x) => f(x, 4))];
  return [
    {
      caption: `Scale factors of the level-1 weights over ${scaling.groups} groups (Pfeffermann et al. 1998; Carle 2009)`,
      head: ['scaled to', 'min', 'lower quartile', 'median', 'upper quartile', 'max'],
      rows: [spread('group size', scaling.size), spread('effective group size', scaling.effective)],
      numeric: [1, 2, 3, 4, 5],
    },
    {
      caption:
        `The ${scaling.extreme.length} groups whose factors lie furthest from the median ` +
        '(every group’s: --weight-factors, or the library’s weightFactors option)',
      head: ['group', 'records', 'Σw', 'effective size', 'factor to size', 'factor to effective size'],
      rows: scaling.extreme.map((g) => [
        visibleValue(g.group),
        String(g.n),
        f(g.sum, 3),
        f(g.effectiveSize, 2),
        f(g.sizeScale, 4),
        f(g.effectiveScale, 4),
      ]),
      numeric: [1, 2, 3, 4, 5],
    },
  ];
}
