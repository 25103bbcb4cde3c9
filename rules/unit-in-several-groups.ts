import type { Severity } from '../src/roles/types.js';
import { defineRule } from '../src/rules/define.js';
import { firstRows, listSome, percent, quoteId, recordId } from '../src/rules/describe.js';
import type { FoundRecord } from '../src/rules/rows.js';

interface Params {
  block_share: number;
}

/** A unit in two groups breaks strict nesting: it needs a multiple-membership model, or its ID is wrong. */
export default defineRule<Params>({
  meta: {
    id: 'unit-in-several-groups',
    title: 'Unit in more than one group',
    level: 'structure',
    defaultSeverity: 'warning',
    description:
      'A unit ID that occurs in more than one group: the unit moved (mobility) or belongs to several ' +
      'groups at once (multiple membership), or the ID was reused. A strictly nested two-level model ' +
      'assumes each unit sits in exactly one group, so it does not fit these units.',
    params: {
      type: 'object',
      properties: {
        block_share: {
          type: 'number',
          minimum: 0,
          maximum: 1,
          default: 0.05,
          description: 'blocker when at least this share of the records belongs to such units (common practice)',
        },
      },
      additionalProperties: false,
    },
    messages: {
      mobile: {
        message:
          '{count} {column} value(s) occur in more than one {group} ({records} records, {share}): {ids}. A strictly nested model does ' +
          'not fit these units',
        fix:
          'Ask the sender whether these units really moved or belong to several groups (then plan a multiple-membership or ' +
          'cross-classified model, or one record per unit) or whether the IDs were reused',
      },
    },
    sources: [
      'Hill, P. W., & Goldstein, H. (1998). Multilevel modeling of educational data with cross-classification and missing ' +
        'identification for units. Journal of Educational and Behavioral Statistics, 23(2), 117–128',
      'block_share 0.05: common practice',
    ],
    prefetch: ['unit-ids'],
  },
  async check({ profile, roles, params, lookup }) {
    if (!roles.unit) return [];
    const { mobile } = await lookup.unitIds(roles.unit);
    if (mobile.ids === 0) return [];
    const share = mobile.records / profile.rows;
    const severity: Severity = share >= params.block_share ? 'blocker' : 'warning';
    return [
      {
        messageId: 'mobile',
        severity,
        column: roles.unit,
        count: mobile.ids,
        groups: [...new Set(mobile.examples.flatMap((x) => x.groups))],
        rows: firstRows(mobile.examples.map((x) => x.rows)),
        data: {
          count: mobile.ids,
          column: roles.unit,
          group: roles.group,
          records: mobile.records,
          share: percent(share),
          ids: listSome(
            mobile.examples.map((x) => `${quoteId(x.id)} in ${x.groups.join(', ')}${x.groupCount > x.groups.length ? ', …' : ''}`),
          ),
        },
      },
    ];
  },
  // the records the finding lists, each naming its unit ID and group (IDs, so kept under --no-values)
  rows: (finding, { roles, records }) => {
    const column = finding.column;
    if (column === undefined || !finding.rows?.length) return null;
    return {
      query: records.listed(finding.rows),
      reason: (r: FoundRecord) =>
        `${column} ${recordId(r.unit)} is in ${roles.group} ${recordId(r.grp)} here and in another ${roles.group} on other records`,
    };
  },
});
