import { defineChange } from '../src/compare/types.js';

/** Unit IDs found in another group than in the previous delivery. */
export default defineChange({
  meta: {
    id: 'units-moved',
    title: 'Units moved to another group',
    level: 'structure',
    defaultSeverity: 'warning',
    description:
      'Unit IDs present in both deliveries whose group differs: a real move (a pupil who changed school), or a unit ID reused ' +
      'for another person. Only when both deliveries are given as files and the role map declares the unit ID; the report of a ' +
      'delivery holds no unit IDs.',
    params: { type: 'object', properties: {}, additionalProperties: false },
    messages: {
      moved: {
        message: '{count} units are in another group than in the previous delivery (first: {units})',
        fix: 'Ask the sender whether these units really moved, or whether their IDs were given to other units',
      },
    },
    sources: ['common practice'],
  },
  check({ measured }) {
    const m = measured.units?.moved;
    if (!m?.count) return [];
    return [
      {
        messageId: 'moved',
        data: { count: m.count, units: m.units.slice(0, 5).join(', ') },
        count: m.count,
        rows: m.rows,
        groups: m.groups,
      },
    ];
  },
});
