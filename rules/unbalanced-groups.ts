import { groupSizes } from '../src/profile/group-stats.js';
import type { Severity } from '../src/roles/types.js';
import { defineRule } from '../src/rules/define.js';
import { clusterSizeVariation } from '../src/stats/cluster-size-variation.js';
import { formatNumber } from '../src/util/format.js';

interface Params {
  note_cv: number;
  warn_cv: number;
}

/** Very unequal group sizes cost efficiency and make n̄-based summaries misleading. */
export default defineRule<Params>({
  meta: {
    id: 'unbalanced-groups',
    title: 'Unbalanced group sizes',
    level: 'structure',
    defaultSeverity: 'note',
    description:
      'How unequal the group sizes are: the coefficient of variation of the sizes (SD / mean) and the ' +
      'largest-to-smallest ratio. Below a CV of 0.23 the effect of unequal sizes is negligible; above ' +
      'it, design effects and power computed from the mean size are optimistic, and n0 rather than the ' +
      'mean size belongs in ICC formulas.',
    params: {
      type: 'object',
      properties: {
        note_cv: {
          type: 'number',
          minimum: 0,
          default: 0.23,
          description: 'note at or above this CV (Eldridge et al. 2006: below 0.23 negligible)',
        },
        warn_cv: {
          type: 'number',
          minimum: 0,
          default: 1,
          description: 'warning at or above this CV (heuristic; Eldridge et al. 2006 report about 0.65 as typical)',
        },
      },
      additionalProperties: false,
    },
    messages: {
      unbalanced: {
        message:
          'group sizes vary with CV {cv} (sizes {min} to {max}, ratio {ratio}; mean {mean}): above the {limit} below which unequal ' +
          'sizes are negligible',
        fix:
          'No change to the delivery is needed; use n0 (reported with the ANOVA) rather than the mean group size when planning ' +
          'power or a design effect',
      },
    },
    sources: [
      'Eldridge, S. M., Ashby, D., & Kerry, S. (2006). Sample size for cluster randomized trials: effect of coefficient of variation ' +
        'of cluster size and analysis method. International Journal of Epidemiology, 35(5), 1292–1300: CV < 0.23 negligible, about ' +
        '0.65 typical',
      'warn_cv 1: heuristic',
    ],
  },
  check({ profile, params }) {
    const sizes = groupSizes(profile.groups);
    if (sizes.length < 2) return [];
    const v = clusterSizeVariation(sizes);
    if (!(v.cv >= params.note_cv)) return [];
    const severity: Severity = v.cv >= params.warn_cv ? 'warning' : 'note';
    return [
      {
        messageId: 'unbalanced',
        severity,
        data: {
          cv: formatNumber(v.cv, 2),
          min: v.min,
          max: v.max,
          ratio: formatNumber(v.ratio, 1),
          mean: formatNumber(v.mean, 1),
          limit: params.note_cv,
        },
      },
    ];
  },
});
