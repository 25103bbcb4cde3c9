import { dropoutDifference, sharedTiming } from '../src/analysis/occasions.js';
import { defineRule } from '../src/rules/define.js';
import type { FindingDraft } from '../src/rules/types.js';
import { formatNumber } from '../src/util/format.js';

interface Params {
  three_share_below: number;
  zero_share_below: number;
  dropout_difference: number;
  min_dropouts: number;
}

const percent = (x: number) => `${formatNumber(100 * x, 0)}%`;

/** Longitudinal data: the occasions each person gives, where time zero sits and how persons go missing. */
export default defineRule<Params>({
  meta: {
    id: 'occasions-per-person',
    title: 'Occasions per person',
    level: 'structure',
    defaultSeverity: 'note',
    description:
      'With `time` in the role map (measurements nested in persons, the group being the person): how many occasions each person ' +
      'gives, whether timing is shared or person-specific, where time zero sits (it gives the intercept its meaning), whether ' +
      'missing occasions are a monotone dropout or intermittent, and whether dropouts’ last observed outcome differs from ' +
      'completers’ at the same occasion. A random slope on time needs three or more occasions for most persons.',
    params: {
      type: 'object',
      properties: {
        three_share_below: {
          type: 'number',
          minimum: 0,
          maximum: 1,
          default: 0.5,
          description:
            'warning when fewer than this share of persons have three or more occasions (Singer & Willett 2003: three or more ' +
            'waves to study individual change; "most persons": common practice)',
        },
        zero_share_below: {
          type: 'number',
          minimum: 0,
          maximum: 1,
          default: 0.5,
          description: 'note when fewer than this share of persons are observed at time 0, the intercept’s time (common practice)',
        },
        dropout_difference: {
          type: 'number',
          minimum: 0,
          default: 0.2,
          description:
            'warning when dropouts’ last outcome differs from completers’ at the same occasion by this many SD (Cohen 1988: .2 is a ' +
            'small standardised difference)',
        },
        min_dropouts: {
          type: 'integer',
          minimum: 1,
          default: 5,
          description: 'dropouts needed before their outcome is compared (common practice)',
        },
      },
      additionalProperties: false,
    },
    messages: {
      fewOccasions: {
        message:
          '{column}: only {three} of {persons} persons have three or more occasions (one: {one}, two: {two}); a random slope on ' +
          'time is poorly supported (Singer & Willett 2003: three or more waves; guidance)',
        fix: 'Ask the sender whether later occasions exist; otherwise plan a fixed slope on time (the analysis plan decides)',
      },
      timeZero: {
        message:
          '{column}: time 0 is observed for {share} of persons (earliest time {values}, mean {mean}): the intercept describes the ' +
          'outcome at a time outside most persons’ data',
        fix:
          'No change to the delivery; centre time where zero means something (e.g. subtract the first occasion) so the intercept ' +
          'and its variance describe an observed time (Singer & Willett 2003)',
      },
      missingOccasions: {
        message:
          '{column}: {complete} of {persons} persons are observed at all {occasions} occasions; {dropout} drop out and stay away ' +
          '(monotone), {gap} miss an occasion between observed ones (intermittent), {late} join late',
        fix:
          'Ask the sender whether the missing occasions were measured; a mixed model uses every observed occasion, assuming ' +
          'they are missing at random given the data',
      },
      dropoutDiffers: {
        message:
          '{outcome}: the last observed value of {dropouts} dropouts differs from completers’ at the same occasion by {difference} ' +
          'SD: dropout may depend on the outcome (not missing completely at random; guidance)',
        fix: 'No change to the delivery; ask the sender why persons left, and plan a sensitivity analysis for the dropout',
      },
      personSpecific: {
        message:
          '{column}: timing is person-specific ({occasions} distinct times, at most {most} per person): dropout patterns are not ' +
          'assessed; treat time as a continuous variable',
        fix: 'No change to the delivery',
      },
    },
    sources: [
      'Singer, J. D., & Willett, J. B. (2003). Applied Longitudinal Data Analysis. Oxford University Press: three or more waves ' +
        'of data to study individual change; the intercept is the outcome at time zero',
      'Little, R. J. A., & Rubin, D. B. (2002). Statistical Analysis with Missing Data (2nd ed.). Wiley: monotone and ' +
        'non-monotone missingness; missing completely at random',
      'Cohen, J. (1988). Statistical Power Analysis for the Behavioral Sciences (2nd ed.): d = .2 is a small effect',
    ],
  },
  async check({ roles, outcomes, profile, lookup, params }) {
    const time = roles.time;
    if (!time) return [];
    const outcome = roles.outcomes.find((o) => outcomes[o] !== undefined);
    const s = await lookup.occasions(time, outcome);
    if (!s.persons) return [];
    const out: FindingDraft[] = [];
    const column = time;
    const shareThree = s.threeOrMore / s.persons;
    if (shareThree < params.three_share_below) {
      out.push({
        messageId: 'fewOccasions',
        severity: 'warning',
        column,
        data: { column, persons: s.persons, three: percent(shareThree), one: percent(s.one / s.persons), two: percent(s.two / s.persons) },
      });
    }
    const shareZero = s.atZero / s.persons;
    const col = profile.column(time);
    if (shareZero < params.zero_share_below) {
      out.push({
        messageId: 'timeZero',
        column,
        data: { column, share: percent(shareZero), mean: formatNumber(col.mean ?? Number.NaN, 2) },
        values: [String(col.numMin)],
      });
    }
    if (!sharedTiming(s)) {
      out.push({ messageId: 'personSpecific', column, data: { column, occasions: s.occasions, most: s.most } });
      return out;
    }
    if (s.dropout + s.gap + s.late > 0) {
      out.push({
        messageId: 'missingOccasions',
        column,
        count: s.gap,
        groups: s.gapIds,
        data: { column, persons: s.persons, occasions: s.occasions, complete: s.complete, dropout: s.dropout, gap: s.gap, late: s.late },
      });
    }
    const d = outcome === undefined ? undefined : dropoutDifference(s);
    if (outcome && d && d.dropouts >= params.min_dropouts && Math.abs(d.difference) >= params.dropout_difference) {
      out.push({
        messageId: 'dropoutDiffers',
        severity: 'warning',
        column: outcome,
        data: { outcome, dropouts: d.dropouts, difference: formatNumber(d.difference, 2) },
      });
    }
    return out;
  },
});
