import { describe, expect, it } from 'vitest';
import { catalogue } from '../../rules/index.js';
import { InputError, nameList, quoteName } from '../../src/errors.js';
import { checkColumns } from '../../src/roles/check-columns.js';
import { closestName } from '../../src/roles/did-you-mean.js';
import { parseRoles } from '../../src/roles/load.js';

/** The message of the InputError parseRoles throws for `text`. */
function messageOf(text: string): string {
  try {
    parseRoles(text, 'r.yaml', catalogue);
  } catch (e) {
    expect(e).toBeInstanceOf(InputError);
    return (e as InputError).message;
  }
  throw new Error(`expected an InputError for ${JSON.stringify(text)}`);
}

/** Aliases that expand tenfold per level: a few hundred bytes of YAML, ten thousand values. */
const ALIAS_BOMB = [
  'a: &a [x, x, x, x, x, x, x, x, x, x]',
  ...['b', 'c', 'd'].map((n, i) => `${n}: &${n} [${Array(10).fill(`*${'abc'[i]}`).join(', ')}]`),
  `e: [${Array(10).fill('*d').join(', ')}]`,
  'group: g',
].join('\n');

describe('role-map errors: one line, naming the file', () => {
  it('an alias bomb is an input error naming the file, not a crash', () => {
    expect(messageOf(ALIAS_BOMB)).toMatch(/^r\.yaml: invalid YAML: excessive alias count/);
  });

  it('a role-map key with a newline is quoted', () => {
    const message = messageOf('group: g\n"lev\\nel1": [a]\n');
    expect(message).toBe('r.yaml:2:1: the role map: unknown key "lev\\nel1" (did you mean "level1"?)');
  });

  it('a column named twice, with a newline in its name, stays on one line', () => {
    const message = messageOf('group: "a\\nb"\nlevel1: ["a\\nb"]\n');
    expect(message).toBe('r.yaml:2:10: column "a\\nb" is both group and level1');
  });

  it('a rule id with a newline is quoted', () => {
    const message = messageOf('group: g\nrules:\n  "few\\ngroups": off\n');
    expect(message.split('\n')).toHaveLength(1);
    expect(message).toMatch(/^r\.yaml:3:3: unknown rule "few\\ngroups"; did you mean "few-groups"\? \(known: /);
  });

  it('a column with a newline under types is quoted in the path', () => {
    const message = messageOf('group: g\ntypes:\n  "x\\ny": number\n');
    expect(message).toBe('r.yaml:3:3: types."x\\ny" must be one of "numeric", "categorical", "binary", "count", "ordinal", "bounded"');
  });

  it('a header with newlines, quotes and commas is listed unambiguously', () => {
    const roles = parseRoles('group: g\nlevel1: [age]\n', 'r.yaml', catalogue);
    const run = () => checkColumns(roles.roles, ['g', 'a\nb', 'say "hi"', 'x,y', ' pad'], roles.locate, 'd.csv');
    expect(run).toThrow('r.yaml:2:10: column "age" is not in d.csv; its header is: g, "a\\nb", "say \\"hi\\"", "x,y", " pad"');
  });
});

describe('did you mean', () => {
  it('a misspelt role-map key names the key it resembles', () => {
    expect(messageOf('group: g\noutcom: y\n')).toBe('r.yaml:2:1: the role map: unknown key "outcom" (did you mean "outcome"?)');
    expect(messageOf('group: g\nlevel_1: [a]\n')).toMatch(/unknown key "level_1" \(did you mean "level1"\?\)$/);
    expect(messageOf('gruop: g\n')).toMatch(/unknown key "gruop" \(did you mean "group"\?\)$/);
  });

  it('a misspelt rule param names the param', () => {
    const message = messageOf('group: g\nrules:\n  few-groups: { warn_blow: 5 }\n');
    expect(message).toMatch(/unknown key "warn_blow" \(did you mean "warn_below"\?\)$/);
  });

  it('a key like no known one gets no guess', () => {
    expect(messageOf('group: g\ncolour: red\n')).toBe('r.yaml:2:1: the role map: unknown key "colour"');
    expect(closestName('x'.repeat(500), ['group'])).toBeUndefined();
    expect(closestName('ab', ['group', 'unit'])).toBeUndefined();
  });
});

describe('quoteName and nameList', () => {
  it('quote so that no name can break a line or a list', () => {
    expect(quoteName('a\r\nb')).toBe('"a\\r\\nb"');
    expect(nameList(['plain', 'two words', ''])).toBe('plain, two words, ""');
  });
});
