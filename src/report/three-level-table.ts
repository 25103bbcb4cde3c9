import type { OutcomeStats } from '../stats/types.js';
import { formatNumber as f, formatP } from '../util/format.js';
import type { StatTable } from './stat-tables.js';

const pct = (share: number) => `${f(100 * share, 1)}%`;

/** An outcome's three-level null model (with a parent declared), or null without one. */
export function threeLevelTable(name: string, o: OutcomeStats): StatTable | null {
  const t = o.threeLevel;
  if (!t) return null;
  const row = (label: string, c: NonNullable<OutcomeStats['threeLevel']>['reml']) => [
    label,
    `${f(c.tau2Parent, 4)} (${pct(c.shares.parent)})`,
    `${f(c.tau2Group, 4)} (${pct(c.shares.group)})`,
    `${f(c.sigma2, 4)} (${pct(c.shares.residual)})`,
    f(c.mean, 3),
    f(c.logLik, 2),
  ];
  const left = t.excludedGroups ? `, ${t.excludedGroups} under several parents or none left out` : '';
  return {
    caption:
      `${name}: three-level null model (${t.groups} groups in ${t.parents} parents, n ${t.n}${left}); ` +
      `two-level τ² on the same groups ${f(t.groupsOnly.tau2, 4)}, test of the parent variance p ${formatP(t.parentTest.p)}`,
    head: ['estimate', 'τ² parent (share)', 'τ² group (share)', 'σ² (share)', 'mean μ', 'log-likelihood'],
    rows: [row('REML', t.reml), row('ML', t.ml)],
    numeric: [1, 2, 3, 4, 5],
  };
}

/** The three-level table as a list of none or one, for renderers that append tables. */
export function threeLevelTables(name: string, o: OutcomeStats): StatTable[] {
  const t = threeLevelTable(name, o);
  return t ? [t] : [];
}

/** The same for the terminal: one line per estimate under the outcome. */
export function threeLevelLines(o: OutcomeStats): string[] {
  const t = o.threeLevel;
  if (!t) return [];
  const line = (label: string, c: NonNullable<OutcomeStats['threeLevel']>['reml']) =>
    `    ${label.padEnd(6)} 3-level: parent tau2 ${f(c.tau2Parent, 4)} (${pct(c.shares.parent)}), group tau2 ${f(c.tau2Group, 4)} ` +
    `(${pct(c.shares.group)}), sigma2 ${f(c.sigma2, 4)}`;
  return [
    line('REML', t.reml),
    line('ML', t.ml),
    `    two-level group tau2 on the same ${t.groups} groups ${f(t.groupsOnly.tau2, 4)}; ` +
      `parent variance test p ${formatP(t.parentTest.p)}` +
      (t.excludedGroups ? `; ${t.excludedGroups} group(s) under several parents or none left out` : ''),
  ];
}
