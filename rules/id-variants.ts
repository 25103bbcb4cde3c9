import { groupIds, groupSizes } from '../src/profile/group-stats.js';
import { defineRule } from '../src/rules/define.js';
import { firstRows, listSome, quoteId } from '../src/rules/describe.js';
import type { FoundRecord } from '../src/rules/rows.js';
import type { FindingDraft } from '../src/rules/types.js';
import { normalizeId } from '../src/source/lookups/lookup.js';

interface Params {
  units: boolean;
}

const INTO = 'several groups: {sets}';
const HOW = 'after trimming spaces, case-folding, stripping leading zeros and reading numbers as numbers ("12" = "12.0")';

/** IDs that differ only in spelling split one group (or one unit) into several. */
export default defineRule<Params>({
  meta: {
    id: 'id-variants',
    title: 'IDs written in more than one way',
    level: 'data',
    defaultSeverity: 'blocker',
    description:
      'Group or unit IDs that become the same after trimming spaces, case-folding, stripping leading ' +
      'zeros, or reading "12" and "12.0" as one number. A group written two ways is split into two ' +
      'groups by the model, each with part of its records; a unit written two ways is counted twice.',
    params: {
      type: 'object',
      properties: {
        units: {
          type: 'boolean',
          default: true,
          description: 'also check unit IDs (one aggregate over the unit column; groups are checked from the profile)',
        },
      },
      additionalProperties: false,
    },
    messages: {
      groups: {
        message: `{count} {column} value(s) are one ID written in more than one way (${HOW}), which splits each into ${INTO}`,
        fix:
          'Ask the sender to write each {column} one way (the most common spelling is listed first) and to correct the listed ' +
          'records, or to confirm in writing that the spellings are different groups',
      },
      units: {
        message: `{count} {column} value(s) are one ID written in more than one way (${HOW}): {sets}`,
        fix:
          'Ask the sender to write each {column} one way and to correct the listed records; until then each spelling counts as a ' +
          'different unit',
      },
    },
    sources: [
      'Group and unit IDs must identify their group or unit; the spellings folded together are common data-entry and export variants ' +
        '(common practice)',
    ],
    prefetch: ['unit-ids'],
  },
  async check({ profile, roles, params, lookup }) {
    const findings: FindingDraft[] = [];
    const ids = groupIds(profile.groups);
    const sizes = groupSizes(profile.groups);
    const size = new Map(ids.map((id, i) => [id, sizes[i]]));
    const byKey = new Map<string, string[]>();
    // one key and one push per group: half a million groups are common
    for (const id of ids) {
      const key = normalizeId(id);
      const set = byKey.get(key);
      if (set) set.push(id);
      else byKey.set(key, [id]);
    }
    // most records first: the usual spelling leads each set, the others are the ones to fix
    const sets = [...byKey.values()]
      .filter((set) => set.length > 1)
      .map((set) => set.sort((a, b) => (size.get(b) ?? 0) - (size.get(a) ?? 0) || (a < b ? -1 : 1)));
    if (sets.length) {
      const minority = sets.flatMap((set) => set.slice(1));
      findings.push({
        messageId: 'groups',
        column: roles.group,
        count: sets.length,
        groups: sets.flat(),
        rows: await lookup.rowsInGroups(minority),
        data: {
          count: sets.length,
          column: roles.group,
          sets: listSome(sets.map((set) => set.map((id) => `${quoteId(id)} (${size.get(id)})`).join(' / '))),
        },
      });
    }
    if (params.units && roles.unit) {
      const { variants } = await lookup.unitIds(roles.unit);
      if (variants.sets > 0) {
        const described = variants.examples.map((set) => [...set.ids].sort((a, b) => b.count - a.count || (a.id < b.id ? -1 : 1)));
        findings.push({
          messageId: 'units',
          column: roles.unit,
          count: variants.sets,
          rows: firstRows(described.map((set) => set.slice(1).flatMap((x) => x.rows))),
          data: {
            count: variants.sets,
            column: roles.unit,
            sets: listSome(described.map((set) => set.map((x) => `${quoteId(x.id)} (${x.count})`).join(' / '))),
          },
        });
      }
    }
    return findings;
  },
  // the records the finding lists, each naming its spelling and, for group IDs, the usual one
  rows: (finding, { roles, records }) => {
    if (!finding.rows?.length) return null;
    if (finding.column === roles.group) {
      // the finding's groups come set by set, the most common spelling of each set first
      const usual = new Map<string, string>();
      for (const id of finding.groups ?? []) {
        const key = normalizeId(id);
        if (!usual.has(key)) usual.set(key, id);
      }
      return {
        query: records.listed(finding.rows),
        reason: (r: FoundRecord) => {
          const lead = r.grp === null ? undefined : usual.get(normalizeId(r.grp));
          const spelt = `${roles.group} ${r.grp === null ? '(missing)' : quoteId(r.grp)}`;
          if (lead !== undefined && lead !== r.grp) return `${spelt} is ${quoteId(lead)} written another way`;
          return `${spelt} is one ID written in more than one way`;
        },
      };
    }
    const column = finding.column ?? 'the unit ID';
    return {
      query: records.listed(finding.rows),
      reason: (r: FoundRecord) => `${column} ${r.unit === null ? '(missing)' : quoteId(r.unit)} is one ID written in more than one way`,
    };
  },
});
