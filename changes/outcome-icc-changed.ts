import { defineChange } from '../src/compare/types.js';
import type { FindingDraft } from '../src/rules/types.js';
import { iccDifference } from '../src/stats/icc-difference.js';

interface Params {
  alpha: number;
}

/** The outcome's ICC changed by more than sampling explains. */
export default defineChange<Params>({
  meta: {
    id: 'outcome-icc-changed',
    title: 'Outcome ICC changed',
    level: 'variance',
    defaultSeverity: 'warning',
    description:
      "An outcome's ANOVA ICC(1) differs from the previous delivery's by more than sampling explains: a z-test on Fisher's " +
      'transformation of the intraclass correlation, assuming normal outcomes, near-balanced groups and independent deliveries ' +
      '(deliveries sharing groups make it conservative). Both ICCs with their 95% intervals and the REML variance components are in ' +
      "the report's changes section. A jump often means groups were recoded or merged, or the outcome's measurement changed.",
    params: {
      type: 'object',
      properties: {
        alpha: { type: 'number', exclusiveMinimum: 0, maximum: 1, default: 0.01, description: 'level of the test (common practice)' },
      },
      additionalProperties: false,
    },
    messages: {
      changed: {
        message:
          "{column}'s ICC changed from {before} to {now} since the previous delivery (z = {z}, p = {p}): more than sampling explains",
        fix: 'Ask the sender whether groups were recoded or merged, or {column} measured differently; check before pooling the deliveries',
      },
    },
    sources: [
      'Fisher, R. A. (1925). Statistical Methods for Research Workers, §40 (the z transformation of the intraclass correlation).',
      'Fisher, R. A. (1924). On a distribution yielding the error functions of several well known statistics. Proceedings of the International Congress of Mathematics, Toronto, 2, 805–813.',
    ],
  },
  check({ previous, current, params }) {
    const out: FindingDraft[] = [];
    for (const [column, now] of Object.entries(current.outcomes)) {
      const before = previous.report.outcomes[column];
      if (!before) continue;
      const test = iccDifference(before.anova, now.anova);
      if (!(test.p < params.alpha)) continue;
      const r = (x: number) => Math.round(x * 1000) / 1000;
      out.push({
        messageId: 'changed',
        column,
        data: {
          column,
          before: r(before.anova.icc),
          now: r(now.anova.icc),
          z: Math.round(test.z * 100) / 100,
          p: Number(test.p.toPrecision(2)),
        },
      });
    }
    return out;
  },
});
