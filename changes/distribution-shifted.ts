import { defineChange } from '../src/compare/types.js';
import type { FindingDraft } from '../src/rules/types.js';
import { ksFromDistributions } from '../src/stats/ks-two-sample.js';
import { populationStability } from '../src/stats/population-stability.js';

interface Params {
  note_psi: number;
  warn_psi: number;
  alpha: number;
  min_d: number;
}

/** A numeric column's distribution moved: population stability index over the previous delivery's bins, and a KS test. */
export default defineChange<Params>({
  meta: {
    id: 'distribution-shifted',
    title: 'Distribution shifted',
    level: 'data',
    defaultSeverity: 'note',
    description:
      "A numeric column's values fall into the previous delivery's 20 bins (its snapshot's sketch) in other shares than before: the " +
      'population stability index with its usual bands, and a two-sample Kolmogorov–Smirnov test at the bin edges (a lower bound of ' +
      'D, so conservative). A shift can be real (a new intake) or a change of unit, coding or source. Rules of thumb: the study ' +
      'analysis plan decides what shift matters. Over the whole delivery; groups that appeared or vanished contribute to it.',
    params: {
      type: 'object',
      properties: {
        note_psi: { type: 'number', minimum: 0, default: 0.1, description: 'note from this index on (Siddiqi 2006: 0.10–0.25 some shift)' },
        warn_psi: {
          type: 'number',
          minimum: 0,
          default: 0.25,
          description: 'warning from this index on (Siddiqi 2006: above 0.25 a major shift)',
        },
        alpha: { type: 'number', exclusiveMinimum: 0, maximum: 1, default: 0.001, description: 'level of the KS test (common practice)' },
        min_d: {
          type: 'number',
          minimum: 0,
          maximum: 1,
          default: 0.1,
          description:
            'a significant KS test is a note only from this D on, so that large deliveries do not list trivial shifts (common practice)',
        },
      },
      additionalProperties: false,
    },
    messages: {
      shifted: {
        message: "{column}'s distribution shifted since the previous delivery (stability index {psi}, Kolmogorov–Smirnov D = {d}, p = {p})",
        fix: 'Ask the sender whether {column} is still measured, coded and recorded as before',
      },
    },
    sources: [
      'Siddiqi, N. (2006). Credit Risk Scorecards: Developing and Implementing Intelligent Credit Scoring. Wiley, ch. 8 (population stability index and its bands).',
      'Smirnov, N. (1948). Table for estimating the goodness of fit of empirical distributions. Annals of Mathematical Statistics, 19(2), 279–281.',
    ],
  },
  check({ previous, measured, params }) {
    const out: FindingDraft[] = [];
    for (const [column, now] of measured.atPreviousEdges) {
      const before = previous.report.snapshot.columns[column]?.sketch;
      if (!before || !(before.n > 0 && now.n > 0)) continue;
      const bins = (s: { n: number; atOrBelow: number[] }) => [...s.atOrBelow, s.n].map((c, k, all) => c - (k ? all[k - 1] : 0));
      const psi = populationStability(bins(before), bins(now));
      const ks = ksFromDistributions(
        before.atOrBelow.map((c) => c / before.n),
        now.atOrBelow.map((c) => c / now.n),
        before.n,
        now.n,
      );
      const byTest = ks.p < params.alpha && ks.d >= params.min_d;
      if (!(psi >= params.note_psi) && !byTest) continue;
      out.push({
        messageId: 'shifted',
        column,
        severity: psi >= params.warn_psi ? 'warning' : 'note',
        data: { column, psi: round(psi), d: round(ks.d), p: Number(ks.p.toPrecision(2)) },
      });
    }
    return out;
  },
});

const round = (x: number) => Math.round(x * 1000) / 1000;
