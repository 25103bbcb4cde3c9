import { defineRule } from '../src/rules/define.js';
import { firstRows, percent, quoteId } from '../src/rules/describe.js';
import type { Severity } from '../src/roles/types.js';
import type { FindingDraft } from '../src/rules/types.js';

interface Params {
  block_share: number;
}

const KINDS: [string, RegExp][] = [
  // read by some parsers, but no statistic can use them: not numbers here
  ['non-finite value', /^[-+]?(inf|infinity|nan)$/i],
  ['out-of-range value', /^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i],
  ['missing code', /^(n\/?a|na|nan|null|none|missing|unknown|unk|-+|\?+|\.|x|\*|not applicable|refused|dk)$/i],
  ['censored value', /^[<>]=?\s*[-+]?\d/],
  ['thousands separator', /^[-+]?\d{1,3}(,\d{3})+(\.\d+)?$/],
  ['decimal comma', /^[-+]?\d+,\d+$/],
  ['number with a unit', /^[-+]?\d+(\.\d+)?\s*[a-z%µ]+\.?$/i],
];

/** What a token probably is, so that the fix can be specific. */
export function tokenKind(token: string): string {
  const t = token.trim();
  return KINDS.find(([, re]) => re.test(t))?.[0] ?? 'other text';
}

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
          type: 'number', minimum: 0, maximum: 1, default: 0.05,
          description: 'blocker when at least this share of the column\'s non-missing values are not numbers (common practice)',
        },
      },
      additionalProperties: false,
    },
    messages: {
      tokens: {
        message: '{column} is numeric but {count} of its {present} non-missing values ({share}) are not numbers ({kinds}): {values}',
        fix: 'Add the tokens that mean missing to `missing` in the role map; ask the sender to send the others as plain numbers (a censored value needs its own indicator column)',
      },
    },
    sources: ['A numeric variable holds numbers; anything else is read as missing (common practice)', 'block_share 0.05: common practice'],
  },
  async check({ profile, params, lookup }) {
    const findings: FindingDraft[] = [];
    for (const column of profile.header) {
      const col = profile.column(column);
      // a DOUBLE column holds no text, but may hold ±inf, NaN or overflowing values (not numbers)
      if (!col.numericProfiled || col.type === 'categorical') continue;
      const count = col.nonMissing - col.numeric;
      if (count <= 0) continue;
      const tokens = await lookup.nonNumericTokens(column);
      const kinds = new Map<string, number>();
      for (const t of tokens) kinds.set(tokenKind(t.token), (kinds.get(tokenKind(t.token)) ?? 0) + t.count);
      const share = count / col.nonMissing;
      const severity: Severity = share >= params.block_share ? 'blocker' : 'warning';
      findings.push({
        messageId: 'tokens',
        severity,
        column,
        count,
        rows: firstRows(tokens.map((t) => t.rows)),
        values: tokens.map((t) => `${quoteId(t.token)} ×${t.count} (records ${t.rows.slice(0, 5).join(', ')}${t.rows.length > 5 ? ', …' : ''})`),
        data: {
          column,
          count,
          present: col.nonMissing,
          share: percent(share),
          kinds: [...kinds].map(([kind, k]) => `${k} ${kind}${k === 1 ? '' : 's'}`).join(', '),
        },
      });
    }
    return findings;
  },
});
