import { defineRule } from '../src/rules/define.js';

/** Records whose group ID is blank or a missing code belong to no group and cannot be nested. */
export default defineRule<Record<string, never>>({
  meta: {
    id: 'missing-group-id',
    title: 'Missing group ID',
    level: 'data',
    defaultSeverity: 'blocker',
    description:
      'Records whose group ID is blank or one of the missing codes. A two-level model assumes every ' +
      'record belongs to a known group; such records are dropped by the model or need special handling.',
    params: { type: 'object', properties: {}, additionalProperties: false },
    messages: {
      missing: {
        message: '{count} of {rows} records have no {column} (blank or a missing code), so they belong to no group',
        fix: 'Ask the sender to supply {column} for the listed records, or to confirm in writing that they should be dropped',
      },
    },
    sources: [
      'van Buuren, S. (2018). Flexible Imputation of Missing Data (2nd ed.), §7.3: the standard model assumes the class variable is ' +
        'fully observed',
      'Hill, P. W., & Goldstein, H. (1998). Journal of Educational and Behavioral Statistics, 23(2), 117–128: models for missing unit ' +
        'identification',
    ],
  },
  async check({ profile, roles, lookup }) {
    const count = profile.missingGroupRows;
    if (count === 0) return [];
    return [
      {
        messageId: 'missing',
        column: roles.group,
        count,
        data: { count, rows: profile.rows, column: roles.group },
        rows: await lookup.rowsMissingGroup(),
      },
    ];
  },
  rows: (_finding, { roles, records }) => ({
    query: records.missingGroup(),
    reason: () => `no ${roles.group} (blank or a missing code): the record belongs to no group`,
  }),
});
