import { defineRule } from '../src/rules/define.js';
import { linearOutcomes } from '../src/rules/linear-outcomes.js';
import type { FindingDraft } from '../src/rules/types.js';
import { zeroTau2Probability } from '../src/stats/zero-tau2-probability.js';
import { formatNumber, pClause } from '../src/util/format.js';

interface Params {
  note_from: number;
}

/** A random intercept the data can put at zero gives a singular fit; say how likely that is before the fit. */
export default defineRule<Params>({
  meta: {
    id: 'intercept-variance-at-zero',
    title: 'Between-group variance likely estimated as zero',
    level: 'variance',
    defaultSeverity: 'note',
    description:
      'For each outcome, whether REML puts the between-group variance τ² at zero (a singular fit), and the probability that a ' +
      'delivery of the same design would, if the true variance ratio were the one observed: P(F(J − 1, N − J) ≤ 1/F) with F the ' +
      'one-way ANOVA F (Searle, Casella & McCulloch 1992, ch. 3). Exact for balanced groups; for unbalanced groups n0 stands in ' +
      'for the common size, an approximation. Binary outcomes are left out (their model is logistic).',
    params: {
      type: 'object',
      properties: {
        note_from: {
          type: 'number',
          exclusiveMinimum: 0,
          maximum: 1,
          default: 0.05,
          description: 'a note from this probability of a zero estimate (common practice: the conventional 5%)',
        },
      },
      additionalProperties: false,
    },
    messages: {
      atZero: {
        message:
          '{column}: REML puts the between-group variance at zero (F = {f} on ({df1}, {df2}) df, not above 1): a random-intercept ' +
          'model of it will be a singular fit',
        fix:
          'No change to the delivery; expect a singular fit of the random intercept. Guidance, not law: the analysis plan decides ' +
          'whether to keep the random intercept for the design, or to fit a single-level model with cluster-robust errors',
      },
      likely: {
        message:
          '{column}: a delivery of this design would put the between-group variance at zero with probability {probability} ' +
          '(F = {f} on ({df1}, {df2}) df, {p}; approximation with n0 = {n0} for unbalanced groups)',
        fix:
          'No change to the delivery; the random intercept is weakly identified, so a fit may come out singular. Guidance: more ' +
          'groups narrow it more than more records per group; the analysis plan decides the model',
      },
    },
    sources: [
      'Searle, S. R., Casella, G., & McCulloch, C. E. (1992). Variance Components. Wiley, ch. 3 (probability of a negative ANOVA ' +
        'estimate, balanced one-way data) and ch. 6 (balanced REML as the ANOVA estimate truncated at zero)',
      'note_from 0.05: common practice (the conventional 5%)',
    ],
  },
  check({ profile, roles, params, outcomes }) {
    const findings: FindingDraft[] = [];
    for (const column of linearOutcomes(profile, roles, outcomes)) {
      const o = outcomes[column];
      const { f, df1, df2, n0, p } = o.anova;
      const probability = zeroTau2Probability(f, df1, df2);
      if (!Number.isFinite(probability) || !Number.isFinite(o.reml.tau2)) continue;
      const data = { column, f: formatNumber(f, 3), df1, df2 };
      if (o.reml.tau2 === 0) findings.push({ messageId: 'atZero', severity: 'warning', column, data });
      else if (probability >= params.note_from) {
        findings.push({
          messageId: 'likely',
          column,
          data: { ...data, probability: formatNumber(probability, 3), p: pClause(p), n0: formatNumber(n0, 1) },
        });
      }
    }
    return findings;
  },
});
