import { groupIds, groupSizes } from '../src/profile/group-stats.js';
import type { Severity } from '../src/roles/types.js';
import { defineRule } from '../src/rules/define.js';

interface Params {
  warn_share: number;
  block_share: number;
  many_groups: number;
}

/** Groups with one record carry no within-group information; many of them weaken the level-2 estimates. */
export default defineRule<Params>({
  meta: {
    id: 'singleton-groups',
    title: 'Groups with a single record',
    level: 'structure',
    defaultSeverity: 'note',
    description:
      'Groups that hold exactly one record. A model can use them, but they add nothing to the ' +
      'within-group variance and, when groups are few, inflate standard errors. No published share is ' +
      'a cutoff: the harm grows as the number of groups falls, so severity scales with both.',
    params: {
      type: 'object',
      properties: {
        warn_share: {
          type: 'number',
          minimum: 0,
          maximum: 1,
          default: 0.1,
          description: 'warning at or above this share of singleton groups (common practice)',
        },
        block_share: {
          type: 'number',
          minimum: 0,
          maximum: 1,
          default: 0.5,
          description: 'blocker at or above this share (common practice)',
        },
        many_groups: {
          type: 'integer',
          minimum: 1,
          default: 400,
          description:
            'with at least this many groups singletons are only noted (Theall et al. 2011: 90% singletons harmless at 459 groups)',
        },
      },
      additionalProperties: false,
    },
    messages: {
      singletons: {
        message: '{count} of {groups} groups ({share}) have a single record',
        fix: 'Ask the sender whether the listed groups are complete or whether their IDs are mistyped variants of other groups',
      },
    },
    sources: [
      'Theall, K. P., et al. (2011). Impact of small group size on neighbourhood influences in multilevel models. Journal of ' +
        'Epidemiology and Community Health, 65(8), 688–695',
      'Clarke, P. (2008). When can group level clustering be ignored? Journal of Epidemiology and Community Health, 62(8), 752–758',
      'shares 0.1 and 0.5: common practice (no published cutoff)',
    ],
  },
  async check({ profile, params }) {
    const ids = groupIds(profile.groups);
    const sizes = groupSizes(profile.groups);
    const singles = ids.filter((_, i) => sizes[i] === 1);
    if (singles.length === 0) return [];
    const share = singles.length / ids.length;
    let severity: Severity = 'note';
    if (ids.length < params.many_groups) {
      if (share >= params.block_share) severity = 'blocker';
      else if (share >= params.warn_share) severity = 'warning';
    }
    return [
      {
        messageId: 'singletons',
        severity,
        column: undefined,
        count: singles.length,
        groups: singles,
        // no record numbers: a one-record group's ID already finds its record (the problem-rows file lists it)
        data: { count: singles.length, groups: ids.length, share: `${(100 * share).toFixed(1)}%` },
      },
    ];
  },
  // the finding lists no records, but the problem-rows file sends back each singleton's record
  rows: (_finding, { records }) => ({ query: records.singletons(), reason: () => 'the only record of its group' }),
});
