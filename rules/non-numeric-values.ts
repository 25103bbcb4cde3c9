import { readsAsNumbers } from '../src/profile/reads-as-numbers.js';
import type { Severity } from '../src/roles/types.js';
import { defineRule } from '../src/rules/define.js';
import { firstRows, percent, quoteId } from '../src/rules/describe.js';
import type { FoundRecord } from '../src/rules/rows.js';
import { listedRecords } from '../src/rules/rows.js';
import { describeKinds, kindCounts } from '../src/rules/token-kind.js';
import type { FindingDraft } from '../src/rules/types.js';

interface Params {
  block_share: number;
}

export { tokenKind } from '../src/rules/token-kind.js';

/** Text in a numeric column is silently read as missing by every numeric statistic. */
export default defineRule<Params>({
  meta: {
    id: 'non-numeric-values',
    title: 'Non-numeric values in a numeric column',
    level: 'data',
    defaultSeverity: 'warning',
    description:
      'A column declared or inferred numeric holds values that are not numbers: undeclared missing ' +
      'codes ("n/a"), censored values ("<5"), thousands separators ("1,234"), decimal commas, units. ' +
      'Every numeric statistic treats them as missing. The finding lists each token with its count ' +
      'and first records.',
    params: {
      type: 'object',
      properties: {
        block_share: {
          type: 'number',
          minimum: 0,
          maximum: 1,
          default: 0.05,
          description: "blocker when at least this share of the column's non-missing values are not numbers (common practice)",
        },
      },
      additionalProperties: false,
    },
    messages: {
      tokens: {
        message: '{column} is numeric but {count} of its {present} non-missing values ({share}) are not numbers ({kinds}): {values}',
        fix:
          'Add the tokens that mean missing to `missing` in the role map; ask the sender to send the others as plain numbers (a ' +
          'censored value needs its own indicator column)',
      },
    },
    sources: ['A numeric variable holds numbers; anything else is read as missing (common practice)', 'block_share 0.05: common practice'],
  },
  async check({ profile, params, lookup }) {
    const findings: FindingDraft[] = [];
    for (const column of profile.header) {
      const col = profile.column(column);
      // a DOUBLE column holds no text, but may hold ±inf, NaN or overflowing values (not numbers)
      if (!readsAsNumbers(col)) continue;
      const count = col.nonMissing - col.numericCount;
      if (count <= 0) continue;
      const tokens = await lookup.nonNumericTokens(column);
      const share = count / col.nonMissing;
      const severity: Severity = share >= params.block_share ? 'blocker' : 'warning';
      findings.push({
        messageId: 'tokens',
        severity,
        column,
        count,
        rows: firstRows(tokens.map((t) => t.rows)),
        values: tokens.map(
          (t) => `${quoteId(t.token)} ×${t.count} (records ${t.rows.slice(0, 5).join(', ')}${t.rows.length > 5 ? ', …' : ''})`,
        ),
        data: {
          column,
          count,
          present: col.nonMissing,
          share: percent(share),
          kinds: describeKinds(kindCounts(tokens)),
        },
      });
    }
    return findings;
  },
  // the records the finding lists, each with the value that is not a number
  rows: (finding, { records, includeValues }) =>
    listedRecords(finding, records, finding.column, (r: FoundRecord) =>
      includeValues
        ? `${finding.column} holds ${quoteId(String(r.value))}, which does not read as a number`
        : `${finding.column} holds a value that does not read as a number (values withheld)`,
    ),
});
