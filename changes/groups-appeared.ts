import { groupsOnlyIn } from '../src/compare/group-index.js';
import { defineChange } from '../src/compare/types.js';

/** Groups in this delivery that the previous one did not have. */
export default defineChange({
  meta: {
    id: 'groups-appeared',
    title: 'Groups that appeared',
    level: 'structure',
    defaultSeverity: 'note',
    description:
      'Group IDs present in this delivery and absent from the previous one: a new site, or an ID written another way ' +
      '(then the same group also shows as vanished).',
    params: { type: 'object', properties: {}, additionalProperties: false },
    messages: {
      appeared: {
        message: '{count} groups appeared since the previous delivery',
        fix: 'Confirm with the sender that these groups are new, not groups of the previous delivery under another ID',
      },
    },
    sources: ['common practice'],
  },
  check({ previous, current }) {
    const ids = groupsOnlyIn(current.snapshot, previous.report.snapshot);
    return ids.length ? [{ messageId: 'appeared', data: { count: ids.length }, count: ids.length, groups: ids }] : [];
  },
});
