import fc from 'fast-check';
import { stringify } from 'yaml';
import { MARKUP } from './cells.js';
import type { Table } from './table.js';

/** What is wrong with a role map (`valid`: nothing). */
export type RoleFault =
  | 'valid'
  | 'misspelt-key'
  | 'wrong-type'
  | 'yaml-syntax'
  | 'alias-bomb'
  | 'odd-name'
  | 'rule-range'
  | 'odd-value'
  | 'collection-key'
  | 'deep'
  | 'two-docs'
  | 'too-many-missing';

/** A generated role map: its text, its fault, and whether its missing tokens are odd (quotes, delimiters, line ends). */
export interface GeneratedRoles {
  fault: RoleFault;
  yaml: string;
  oddMissing?: boolean;
}

/** Missing tokens a CSV reader cannot take as its NULL strings: a quote, a delimiter, a tab or a line end in them. */
export const ODD_MISSING = ['N"A', 'a,b', "it's", 'x;y', 'p|q', 'a\tb', 'x\ny', '"', ','];

/** The role map of a table: its columns by role, with rule settings in range. */
function validMap(t: Table, withUnit: boolean, withLevel1: boolean, rules: Record<string, unknown>): Record<string, unknown> {
  const { header, columns } = t;
  return {
    group: header[columns.group],
    ...(withUnit && { unit: header[columns.unit] }),
    outcome: header[columns.outcome],
    ...(withLevel1 && header[columns.level1] !== header[columns.outcome] && { level1: [header[columns.level1]] }),
    ...(Object.keys(rules).length && { rules }),
  };
}

const inRange = fc.constantFrom<Record<string, unknown>>(
  {},
  { 'few-groups': { warn_below: 3 } },
  { 'low-icc': 'off' },
  { 'non-numeric-values': { block_share: 0.5, severity: 'warning' } },
);
const outOfRange = fc.constantFrom<Record<string, unknown>>(
  { 'few-groups': { warn_below: -5 } },
  { 'non-numeric-values': { block_share: 7 } },
  { 'low-icc': { severity: 'fatal' } },
  { 'few-groups': 'of' },
  { 'few-groups': { warn_below: '10' } },
  { 'no-such-rule': 'off' },
  { 'few\ngroups': 'off' },
  { [MARKUP[0]]: 'off' },
);

const WRONG_TYPES: Record<string, unknown>[] = [{ group: 5 }, { level1: { a: 1 } }, { missing: 'NA' }, { types: { y: 'integer' } }];

const ALIAS_BOMB = [
  'a: &a [x, x, x, x, x, x, x, x, x, x]',
  ...['b', 'c', 'd'].map((n, i) => `${n}: &${n} [${Array(10).fill(`*${'abc'[i]}`).join(', ')}]`),
  `e: [${Array(10).fill('*d').join(', ')}]`,
].join('\n');

/** The role-map text for a table, and which fault it carries. */
export function roleMap(t: Table): fc.Arbitrary<GeneratedRoles> {
  return fc
    .record({
      fault: fc.oneof(
        { weight: 12, arbitrary: fc.constant<RoleFault>('valid') },
        {
          weight: 1,
          arbitrary: fc.constantFrom<RoleFault>(
            'misspelt-key',
            'wrong-type',
            'yaml-syntax',
            'alias-bomb',
            'odd-name',
            'rule-range',
            'odd-value',
            'collection-key',
            'deep',
            'two-docs',
            'too-many-missing',
          ),
        },
      ),
      odd: fc.oneof(
        { weight: 6, arbitrary: fc.constant(null) },
        { weight: 1, arbitrary: fc.subarray(ODD_MISSING, { minLength: 1, maxLength: 3 }) },
      ),
      withUnit: fc.boolean(),
      withLevel1: fc.boolean(),
      rules: inRange,
      bad: outOfRange,
      k: fc.nat(),
    })
    .map(({ fault, withUnit, withLevel1, rules, bad, k, odd }) => {
      const map: Record<string, unknown> = {
        ...validMap(t, withUnit, withLevel1, fault === 'rule-range' ? bad : rules),
        ...(odd && { missing: ['', ...odd] }),
      };
      switch (fault) {
        case 'misspelt-key': {
          const { outcome, ...rest } = map;
          return { fault, yaml: stringify({ ...rest, [['outcom', 'levl1', 'Outcome', 'group_'][k % 4]]: outcome }) };
        }
        case 'wrong-type':
          return { fault, yaml: stringify({ ...map, ...WRONG_TYPES[k % WRONG_TYPES.length] }) };
        case 'yaml-syntax':
          return { fault, yaml: ['group: [g\n', 'group: g\n\toutcome: y\n', 'group: "g\n', 'group: g\ngroup: h\n', ': x\n'][k % 5] };
        case 'alias-bomb':
          return { fault, yaml: `${ALIAS_BOMB}\n${stringify(map)}` };
        case 'odd-name':
          return { fault, yaml: stringify({ ...map, [['out\ncome', MARKUP[1], 'a"b'][k % 3]]: 'y' }) };
        case 'odd-value':
          return { fault, yaml: stringify({ ...map, group: ['g\nh', 'say "hi"', "it's", ' g'][k % 4] }) };
        case 'collection-key':
          return { fault, yaml: `${['? [complex, key]\n: v', '? { a: 1 }\n: v', '[a, b]: v'][k % 3]}\n${stringify(map)}` };
        case 'deep': {
          const n = [65, 20_000][k % 2];
          return { fault, yaml: `${stringify(map)}level2: ${'['.repeat(n)}${']'.repeat(n)}\n` };
        }
        case 'two-docs':
          return { fault, yaml: `${stringify(map)}---\n${stringify(map)}` };
        case 'too-many-missing':
          return { fault, yaml: stringify({ ...map, missing: Array.from({ length: 1001 + (k % 5000) }, (_, i) => `m${i}`) }) };
        default:
          return { fault, yaml: stringify(map), ...(odd && { oddMissing: true }) };
      }
    });
}
