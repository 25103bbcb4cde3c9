import { readsAsNumbers } from '../src/profile/reads-as-numbers.js';
import type { ColumnProfile } from '../src/profile/types.js';
import type { ValueType } from '../src/roles/types.js';
import { isNumberKind } from '../src/roles/types.js';
import { defineRule } from '../src/rules/define.js';
import { quoteId } from '../src/rules/describe.js';
import { kindCounts } from '../src/rules/token-kind.js';
import type { FindingDraft } from '../src/rules/types.js';
import type { Lookup } from '../src/source/lookups/lookup.js';

/** Kinds of token that are numbers written another way: the variable was meant to be numeric. */
const NUMBER_LIKE = new Set(['decimal comma', 'thousands separator', 'number with a unit', 'censored value']);

/** The most frequent values that are not numbers, shown in the finding. */
const SHOWN = 5;

const ROLE_NAMES = { outcome: 'an outcome', level1: 'a level-1 variable', level2: 'a level-2 variable' } as const;

/**
 * A declared variable the profile could compute nothing for is never passed over in silence: an
 * outcome without statistics blocks (every variance statistic of the audit is about it), a
 * level-1 or level-2 variable warns when its values are numbers written in a way that does not
 * read (a categorical predictor is a choice, not a defect; one missing everywhere is reported
 * by missing-by-group).
 */
export default defineRule<Record<string, never>>({
  meta: {
    id: 'variable-without-statistics',
    title: 'Declared variable yields no statistics',
    level: 'data',
    defaultSeverity: 'blocker',
    description:
      'A declared outcome yields no statistics (its values are all missing, are not numbers, are words of a ' +
      'binary variable whose 1 is not known, or the role map types it categorical), or a declared level-1 or ' +
      'level-2 variable that is not typed categorical holds numbers written in a way that does not read as ' +
      'numbers (decimal commas, thousands separators, units). The finding says why, so that an audit never ' +
      'reports a delivery ready while leaving its outcome out.',
    params: { type: 'object', properties: {}, additionalProperties: false },
    messages: {
      decimalComma: {
        message:
          '{column} is declared {role} but {numbers} of its {present} values read as numbers: they look like numbers with a decimal ' +
          'comma: {values}',
        fix:
          'If the fields are separated by semicolons or tabs, audit again with --decimal-comma; otherwise ask the sender to write ' +
          '{column} with a decimal point',
      },
      notNumbers: {
        message:
          '{column} is declared {role} but {numbers} of its {present} values read as numbers; the others are mostly {kinds}: {values}',
        fix:
          'Add the tokens that mean missing to `missing` in the role map; ask the sender to send {column} as plain numbers, or ' +
          'type it categorical under types if it is one',
      },
      allMissing: {
        message: '{column} is declared {role} but all of its {records} values are missing: it yields no statistics',
        fix: 'Ask the sender whether {column} was exported empty, or declare only the variables the delivery holds',
      },
      categorical: {
        message: '{column} is declared an outcome but typed categorical under types: no outcome statistics are computed for it',
        fix:
          'Type {column} numeric or binary under types if it holds numbers or 0/1; a categorical outcome needs a model of its own ' +
          '(ordinal or multinomial)',
      },
      words: {
        message:
          '{column} is declared {role} but written in two words that are not a known pair (yes/no, true/false, y/n), so which is 1 is ' +
          'not known: {values}',
        fix: 'If {column} is binary, name the word read as 1 in the role map: types: { {column}: { binary: { one: <word> } } }',
      },
    },
    sources: ['A declared outcome must yield the statistics the audit grades; a numeric predictor must read as numbers (common practice)'],
    profileNeeds: ['number-like'],
  },
  async check({ profile, roles, outcomes, lookup }) {
    // a delivery without records yields nothing for any variable: that is said once, elsewhere
    if (profile.rows === 0) return [];
    const declared: [string, Role][] = [
      ...roles.outcomes.map((c): [string, Role] => [c, 'outcome']),
      ...roles.level1.map((c): [string, Role] => [c, 'level1']),
      ...roles.level2.map((c): [string, Role] => [c, 'level2']),
    ];
    const findings: FindingDraft[] = [];
    for (const [column, role] of declared) {
      const col = profile.column(column);
      const yields = role === 'outcome' ? outcomes[column] !== undefined : readsAsNumbers(col) && col.numericCount > 0;
      if (yields) continue;
      const finding = await why(col, role, roles.types[column], lookup);
      if (finding) findings.push(finding);
    }
    return findings;
  },
});

type Role = keyof typeof ROLE_NAMES;

/** Why a declared variable yields no statistics, when that is a finding. */
async function why(col: ColumnProfile, role: Role, type: ValueType | undefined, lookup: Lookup): Promise<FindingDraft | null> {
  const column = col.name;
  const outcome = role === 'outcome';
  const severity = outcome ? 'blocker' : 'warning';
  const data = { column, role: ROLE_NAMES[role] };
  // a level-1/level-2 variable missing everywhere is missing-by-group's finding (every group); a
  // categorical one is a choice
  if (col.nonMissing === 0) return outcome ? { messageId: 'allMissing', severity, column, data: { ...data, records: col.missing } } : null;
  if (type === 'categorical') return outcome ? { messageId: 'categorical', severity, column, data } : null;
  // a categorical level-1/level-2 column: the profile counted no value written like a number
  if (!outcome && col.numberLike === 0 && !meantNumeric(col, type)) return null;
  const tokens = await lookup.nonNumericTokens(column);
  const kinds = kindCounts(tokens);
  const values = tokens.slice(0, SHOWN).map((t) => `${quoteId(t.token)} ×${t.count}`);
  const words = col.numericCount === 0 && tokens.length === 2 && kinds.every((k) => k.kind === 'other text');
  // two words of a level-1/level-2 variable not typed binary are categories ("Public"/"Catholic")
  if (words && !isNumberKind(type) && (outcome || type === 'binary')) return { messageId: 'words', severity, column, values, data };
  const numberLike = kinds.length > 0 && NUMBER_LIKE.has(kinds[0].kind);
  if (!outcome && !numberLike && !meantNumeric(col, type)) return null;
  return {
    messageId: kinds[0]?.kind === 'decimal comma' ? 'decimalComma' : 'notNumbers',
    severity,
    column,
    count: col.nonMissing - col.numericCount,
    values,
    data: {
      ...data,
      numbers: col.numericCount === 0 ? 'none' : col.numericCount,
      present: col.nonMissing,
      // kinds of the most frequent values only (the look-up is bounded): named, not counted
      kinds: kinds.map((k) => (k.kind === 'other text' ? 'text' : `${k.kind}s`)).join(', '),
    },
  };
}

/** Declared numeric or binary, or partly numbers: a level-1/level-2 variable meant to be numeric. */
function meantNumeric(col: ColumnProfile, type: ValueType | undefined): boolean {
  return isNumberKind(type) || type === 'binary' || col.numericCount > 0;
}
