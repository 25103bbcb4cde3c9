import { groupsOnlyIn } from '../src/compare/group-index.js';
import { defineChange } from '../src/compare/types.js';

/** Groups of the previous delivery that this one lacks. */
export default defineChange({
  meta: {
    id: 'groups-vanished',
    title: 'Groups that vanished',
    level: 'structure',
    defaultSeverity: 'warning',
    description:
      'Group IDs of the previous delivery absent from this one: a site closed, was merged, or was left out of the ' +
      'extract by mistake. A group silently missing changes every between-group comparison.',
    params: { type: 'object', properties: {}, additionalProperties: false },
    messages: {
      vanished: {
        message: '{count} groups of the previous delivery are missing from this one',
        fix: 'Ask the sender whether these groups closed or merged, or were left out of the extract',
      },
    },
    sources: ['common practice'],
  },
  check({ previous, current }) {
    const ids = groupsOnlyIn(previous.report.snapshot, current.snapshot);
    return ids.length ? [{ messageId: 'vanished', data: { count: ids.length }, count: ids.length, groups: ids }] : [];
  },
});
