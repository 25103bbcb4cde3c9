import { defineChange } from '../src/compare/types.js';
import type { FindingDraft } from '../src/rules/types.js';

/** Unit IDs of the previous delivery missing from this one, and unit IDs it did not have. */
export default defineChange({
  meta: {
    id: 'units-left-or-joined',
    title: 'Units that left or joined',
    level: 'structure',
    defaultSeverity: 'note',
    description:
      'Unit IDs of the previous delivery absent from this one, and unit IDs absent from the previous delivery (new, or back after ' +
      'an absence). Expected in a stream of deliveries; worth a look when many leave at once or a whole group turns over. Only when ' +
      'both deliveries are given as files and the role map declares the unit ID.',
    params: { type: 'object', properties: {}, additionalProperties: false },
    messages: {
      left: {
        message: '{count} units of the previous delivery are not in this one (first: {units})',
        fix: 'Confirm with the sender that these units left, rather than being left out of the extract',
      },
      joined: {
        message: '{count} units are new since the previous delivery, or back after an absence (first: {units})',
        fix: 'Nothing to ask unless the number is unexpected for the period',
      },
    },
    sources: ['common practice'],
  },
  check({ measured }) {
    const u = measured.units;
    if (!u) return [];
    const out: FindingDraft[] = [];
    if (u.left.count) {
      out.push({
        messageId: 'left',
        data: { count: u.left.count, units: u.left.units.slice(0, 5).join(', ') },
        count: u.left.count,
        groups: u.left.groups,
      });
    }
    if (u.joined.count) {
      const data = { count: u.joined.count, units: u.joined.units.slice(0, 5).join(', ') };
      out.push({ messageId: 'joined', data, count: u.joined.count, rows: u.joined.rows, groups: u.joined.groups });
    }
    return out;
  },
});
