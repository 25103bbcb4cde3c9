import { groupIds, groupSizes } from '../src/profile/group-stats.js';
import type { Severity } from '../src/roles/types.js';
import { defineRule } from '../src/rules/define.js';
import { percent } from '../src/rules/describe.js';

interface Params {
  size_below: number;
  note_share: number;
  warn_share: number;
}

const BINS: [number, number][] = [
  [1, 1],
  [2, 2],
  [3, 4],
  [5, 9],
  [10, 29],
  [30, 99],
  [100, Infinity],
];

/** Many small groups: their level-2 estimates rest on few records, and group means are unreliable. */
export default defineRule<Params>({
  meta: {
    id: 'small-groups',
    title: 'Share of small groups',
    level: 'structure',
    defaultSeverity: 'note',
    description:
      'The share of groups with fewer records than a size, with the distribution of group sizes. ' +
      'With an average of about five records per group the estimates are valid; at about two the ' +
      'group-level variance is overestimated, and observed group means used as predictors are biased.',
    params: {
      type: 'object',
      properties: {
        size_below: {
          type: 'integer',
          minimum: 2,
          default: 5,
          description:
            'a group is small below this many records (Clarke 2008: an average of 5 gives valid estimates, 2 overestimates the group ' +
            'variance)',
        },
        note_share: {
          type: 'number',
          minimum: 0,
          maximum: 1,
          default: 0.1,
          description: 'note at or above this share of small groups (common practice)',
        },
        warn_share: {
          type: 'number',
          minimum: 0,
          maximum: 1,
          default: 1,
          description:
            'warning above this share of small groups (default 1: never, since small groups are a caveat, not a defect; the strict ' +
            'preset uses 0.25)',
        },
      },
      additionalProperties: false,
    },
    messages: {
      small: {
        message: '{count} of {groups} groups ({share}) have fewer than {size} records; group sizes: {distribution}',
        fix:
          'Ask the sender whether the small groups are complete; if they are, expect their estimates to be shrunk strongly, and ' +
          'prefer latent group means to observed ones for any aggregated predictor',
      },
    },
    sources: [
      'Clarke, P. (2008). When can group level clustering be ignored? Journal of Epidemiology and Community Health, 62(8), 752–758: ' +
        'valid estimates with an average of 5 per group, group variance overestimated at 2',
      'Schunck, R. (2016). Cluster size and aggregated level 2 variables in multilevel models. Methods, Data, Analyses, 10(1), 97–108',
      'Lüdtke, O., et al. (2008). The multilevel latent covariate model. Psychological Methods, 13(3), 203–229',
      'note_share 0.1: common practice',
    ],
  },
  check({ profile, params }) {
    const sizes = groupSizes(profile.groups);
    const ids = groupIds(profile.groups);
    const small = ids.filter((_, i) => sizes[i] < params.size_below);
    if (sizes.length === 0) return [];
    const share = small.length / sizes.length;
    if (small.length === 0 || share < params.note_share) return [];
    const severity: Severity = share > params.warn_share ? 'warning' : 'note';
    const distribution = BINS.map(([lo, hi]) => {
      const k = sizes.filter((n) => n >= lo && n <= hi).length;
      const label = lo === hi ? `${lo}` : hi === Infinity ? `${lo}+` : `${lo}–${hi}`;
      return k ? `${label}: ${k}` : '';
    })
      .filter(Boolean)
      .join(', ');
    return [
      {
        messageId: 'small',
        severity,
        count: small.length,
        groups: small,
        data: { count: small.length, groups: sizes.length, share: percent(share), size: params.size_below, distribution },
      },
    ];
  },
});
