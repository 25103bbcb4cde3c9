import type { OutcomeStats } from '../stats/types.js';
import { formatNumber as f, pClause } from '../util/format.js';
import type { StatTable } from './stat-tables.js';

/** A count outcome's Poisson null model, latent ICC, dispersion and zeros; null for other outcomes. */
export function poissonTable(name: string, o: OutcomeStats): StatTable | null {
  const p = o.poisson;
  if (!p) return null;
  const d = p.dispersion;
  return {
    caption: `${name}: random-intercept Poisson null model (ML, ${p.quadraturePoints}-point adaptive Gauss–Hermite)`,
    head: ['statistic', 'value'],
    rows: [
      ['intercept β0 (log scale)', f(p.intercept, 4)],
      ['τ² (between, log scale)', f(p.tau2, 4)],
      ['latent-scale ICC (lognormal approximation)', f(p.latentIcc, 4)],
      ['log-likelihood', f(p.logLik, 2)],
      ['dispersion within groups (D / df)', `${f(d.ratio, 3)} (D ${f(d.statistic, 2)} on ${d.df} df, ${pClause(d.p)})`],
      ['zeros observed / expected', `${p.zeros.observed} / ${f(p.zeros.expected, 1)}`],
      ...(p.nonCounts ? [['values that are not counts', String(p.nonCounts)]] : []),
    ],
    numeric: [1],
  };
}
