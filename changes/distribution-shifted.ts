import { binsOf } from '../src/compare/sketch-counts.js';
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
      'analysis plan decides what shift matters. Over the whole delivery (groups that appeared or vanished contribute to it) and ' +
      'over the groups present in both, which tells a shift within the groups that stayed from one of composition; the latter ' +
      'lists the groups whose own test is significant (Bonferroni), and needs both deliveries as files (a report keeps each column’s bins ' +
      'over the whole delivery only).',
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
      'shifted-in-both': {
        message:
          "{column}'s distribution within the {groups} groups present in both deliveries: stability index {psi}, " +
          'Kolmogorov–Smirnov D = {d}, p = {p}; {shifted} of these groups shifted on their own',
        fix: 'Ask the sender whether {column} is still measured, coded and recorded as before in the groups listed',
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
      if (!before) continue;
      const shift = shiftOf(binsOf(before.atOrBelow, before.n), binsOf(now.atOrBelow, now.n), params);
      if (shift) out.push({ messageId: 'shifted', column, severity: shift.severity, data: { column, ...shift.data } });
    }
    for (const [column, both] of measured.inBoth ?? []) {
      // the groups whose own values shifted, most significant first (each tested at alpha divided
      // by their number, Bonferroni, as missing-rate-changed tests its groups)
      const each = { ...params, alpha: params.alpha / Math.max(1, both.groups) };
      const tested = both.byGroup.flatMap((g) => {
        const own = shiftOf(g.previous, g.current, each);
        return own?.significant ? [{ id: g.id, p: own.p }] : [];
      });
      tested.sort((a, b) => a.p - b.p || (a.id < b.id ? -1 : 1));
      // a few groups can shift while the pooled groups do not: either is worth a finding
      const pooled = shiftOf(both.previous, both.current, params, true);
      if (!pooled || (!pooled.passes && !tested.length)) continue;
      out.push({
        messageId: 'shifted-in-both',
        column,
        severity: pooled.passes ? pooled.severity : 'note',
        data: { column, groups: both.groups, ...pooled.data, shifted: tested.length },
        ...(tested.length && { count: tested.length, groups: tested.map((g) => g.id) }),
      });
    }
    return out;
  },
});

/**
 * The stability index and KS test of two sets of bins over the same edges; undefined without
 * values on either side, or (unless `always`) below the notes' thresholds.
 */
function shiftOf(before: readonly number[], now: readonly number[], params: Params, always = false) {
  const n1 = before.reduce((a, b) => a + b, 0);
  const n2 = now.reduce((a, b) => a + b, 0);
  if (!(n1 > 0 && n2 > 0)) return undefined;
  const cdf = (bins: readonly number[], n: number) => {
    let below = 0;
    return bins.slice(0, -1).map((c) => {
      below += c;
      return below / n;
    });
  };
  const psi = populationStability(before, now);
  const ks = ksFromDistributions(cdf(before, n1), cdf(now, n2), n1, n2);
  const significant = ks.p < params.alpha && ks.d >= params.min_d;
  const passes = psi >= params.note_psi || significant;
  if (!passes && !always) return undefined;
  const severity: 'warning' | 'note' = psi >= params.warn_psi ? 'warning' : 'note';
  return { severity, significant, passes, p: ks.p, data: { psi: round(psi), d: round(ks.d), p: Number(ks.p.toPrecision(2)) } };
}

const round = (x: number) => Math.round(x * 1000) / 1000;
