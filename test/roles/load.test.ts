import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { catalogue } from '../../rules/index.js';
import { InputError } from '../../src/errors.js';
import { parseRoles } from '../../src/roles/load.js';
import { loadRoles } from '../../src/roles/load-file.js';
import { DEFAULT_MISSING } from '../../src/roles/schema.js';

const parse = (text: string) => parseRoles(text, 'r.yaml', catalogue);

/** The InputError parseRoles throws for `text` (fails the test when it does not throw one). */
function errorOf(text: string): InputError {
  try {
    parse(text);
  } catch (e) {
    expect(e).toBeInstanceOf(InputError);
    return e as InputError;
  }
  throw new Error(`expected an InputError for ${JSON.stringify(text)}`);
}

/** Assert a one-line error at `r.yaml:line:col:` whose text matches `pattern`. */
function expectErrorAt(text: string, line: number, col: number, pattern: RegExp): void {
  const { message } = errorOf(text);
  expect(message).not.toContain('\n');
  expect(message.startsWith(`r.yaml:${line}:${col}: `), message).toBe(true);
  expect(message).toMatch(pattern);
}

describe('parseRoles: normalisation', () => {
  it('a minimal map gets every default', () => {
    const { roles, file } = parse('group: site\n');
    expect(file).toBe('r.yaml');
    expect(roles).toEqual({
      group: 'site',
      outcomes: [],
      level1: [],
      level2: [],
      missing: DEFAULT_MISSING,
      types: {},
      rules: {},
    });
    expect(roles).not.toHaveProperty('unit');
    expect(roles).not.toHaveProperty('parent');
    expect(DEFAULT_MISSING).toEqual(['', 'NA', 'N/A', 'NULL', 'null', '.']);
  });

  it('a single outcome becomes the outcomes list', () => {
    expect(parse('group: g\noutcome: y\n').roles.outcomes).toEqual(['y']);
    expect(parse('group: g\noutcomes: y\n').roles.outcomes).toEqual(['y']);
    expect(parse('group: g\noutcomes: [y, z]\n').roles.outcomes).toEqual(['y', 'z']);
  });

  it('single level-1 / level-2 names become lists', () => {
    const { roles } = parse('group: g\nlevel1: a\nlevel2: b\n');
    expect(roles.level1).toEqual(['a']);
    expect(roles.level2).toEqual(['b']);
  });

  it('missing tokens are kept as text, numbers included', () => {
    expect(parse('group: g\nmissing: [-999, NA, ""]\n').roles.missing).toEqual(['-999', 'NA', '']);
    expect(parse('group: g\nmissing: []\n').roles.missing).toEqual([]);
  });

  it('reads the demo role map', () => {
    const loaded = loadRoles('fixtures/demo/repairs-delivery.roles.yaml', catalogue);
    expect(loaded.roles).toEqual({
      group: 'workshop',
      unit: 'job_id',
      parent: 'network',
      outcomes: ['repair_minutes'],
      level1: ['item_kind', 'item_age_years', 'helpers'],
      level2: ['workshop_format', 'benches', 'opened_year'],
      missing: ['', 'NA', '-999'],
      types: { fixed: 'binary' },
      rules: {},
    });
    expect(loaded.file).toBe('fixtures/demo/repairs-delivery.roles.yaml');
  });

  it('rule settings: off, severity overrides, params with the other defaults filled in', () => {
    const { roles } = parse(
      [
        'group: g',
        'rules:',
        '  few-groups: { warn_below: 5 }',
        '  singleton-groups: { severity: blocker }',
        '  low-icc: off',
        '  level2-varies:',
        '    tolerance: 0.001',
        '    severity: warning',
        '',
      ].join('\n'),
    );
    expect(roles.rules).toEqual({
      'few-groups': { warn_below: 5, block_below: 10, note_below: 50 },
      'singleton-groups': { severity: 'blocker', warn_share: 0.1, block_share: 0.5, many_groups: 400 },
      'low-icc': 'off',
      'level2-varies': { severity: 'warning', tolerance: 0.001 },
    });
  });

  it('locate() points at keys and list items', () => {
    const text = 'group: g\nlevel1: [a, b]\nrules:\n  few-groups: { warn_below: 5 }\n';
    const { locate } = parse(text);
    expect(locate(['group'])).toBe('r.yaml:1:1');
    expect(locate(['level1'])).toBe('r.yaml:2:1');
    expect(locate(['level1', 1])).toBe('r.yaml:2:13');
    expect(locate(['rules', 'few-groups'])).toBe('r.yaml:4:3');
    expect(locate(['rules', 'few-groups', 'warn_below'])).toBe('r.yaml:4:17');
    // a path that does not exist falls back to the deepest part that does
    expect(locate(['rules', 'few-groups', 'nothing'])).toBe('r.yaml:4:3');
    expect(locate(['nothing'])).toBe('r.yaml:1:1');
  });
});

describe('parseRoles: malformed YAML', () => {
  it.each([
    ['a stray closing bracket', 'group: g\nlevel1: [a, b]]\n', 2, 15],
    ['a duplicate key', 'group: g\noutcome: y\ngroup: h\n', 3, 1],
    ['a tab as indentation', 'group: g\nrules:\n\tfew-groups: off\n', 3, 1],
    ['a nested mapping in a compact one', 'group: g\nunit: u: v\n', 2, 7],
  ])('%s → one line at file:line:col', (_, text, line, col) => {
    expectErrorAt(text, line, col, /: invalid YAML: \S/);
  });

  it('an empty map is an error naming the file', () => {
    expect(errorOf('').message).toBe('r.yaml: the role map is empty');
    expect(errorOf('# only a comment\n').message).toBe('r.yaml: the role map is empty');
  });

  it('a map that is not a mapping', () => {
    expectErrorAt('just a string\n', 1, 1, /must be object/);
    expectErrorAt('- group\n- g\n', 1, 1, /must be object/);
  });
});

describe('parseRoles: invalid maps point at the offending key', () => {
  it('no group', () => {
    expectErrorAt('outcome: y\n', 1, 1, /required property 'group'/);
  });

  it('an unknown top-level key', () => {
    expectErrorAt('group: g\ncolour: red\n', 2, 1, /unknown key "colour"/);
    // the key, not the first key inside its value
    expectErrorAt('group: g\ncolour:\n  shade: red\n', 2, 1, /unknown key "colour"/);
  });

  it('a value of the wrong type', () => {
    expectErrorAt('group: [a, b]\n', 1, 1, /group must be string/);
    expectErrorAt('group: g\nlevel1: 5\n', 2, 1, /level1 must be/);
    expectErrorAt('group: g\nmissing: NA\n', 2, 1, /missing must be array/);
    expectErrorAt('group: g\ntypes: { a: text }\n', 2, 10, /types\.a must be one of "numeric", "categorical", "binary"/);
  });

  it('a list item of the wrong type points at the item', () => {
    expectErrorAt('group: g\nlevel1: [a, 5]\n', 2, 13, /level1\.1 must be string/);
  });

  it('an empty column name', () => {
    expectErrorAt('group: ""\n', 1, 1, /group must NOT have fewer than 1 characters/);
  });

  it('an unknown rule id lists the known ones', () => {
    const text = 'group: g\nrules:\n  no-such-rule: off\n';
    expectErrorAt(text, 3, 3, /unknown rule "no-such-rule"/);
    expect(errorOf(text).message).toContain(`(known: ${catalogue.map((r) => r.meta.id).join(', ')})`);
  });

  it('a bad rule param', () => {
    expectErrorAt('group: g\nrules:\n  few-groups: { warn_below: -1 }\n', 3, 17, /rules\.few-groups\.warn_below must be >= 1/);
    expectErrorAt('group: g\nrules:\n  few-groups:\n    warn_below: -1\n', 4, 5, /warn_below must be >= 1/);
    expectErrorAt('group: g\nrules:\n  few-groups: { warn_below: 2.5 }\n', 3, 17, /warn_below must be integer/);
    expectErrorAt('group: g\nrules:\n  low-icc: { icc_below: 2 }\n', 3, 14, /icc_below must be <= 1/);
  });

  it('an unknown rule param', () => {
    expectErrorAt('group: g\nrules:\n  few-groups: { warn_blow: 5 }\n', 3, 17, /rules\.few-groups: unknown key "warn_blow"/);
    expectErrorAt('group: g\nrules:\n  missing-group-id: { strict: true }\n', 3, 23, /unknown key "strict"/);
  });

  it('a bad severity names the severity and its choices', () => {
    expectErrorAt(
      'group: g\nrules:\n  few-groups: { severity: fatal }\n',
      3,
      17,
      /rules\.few-groups\.severity must be one of "blocker", "warning", "note"/,
    );
  });

  it('a rule setting that is neither off nor an object', () => {
    expectErrorAt('group: g\nrules:\n  few-groups: on\n', 3, 3, /rules\.few-groups/);
  });

  it.each([
    ['level-1 and level-2', 'group: g\nlevel1: [a, b]\nlevel2: [c, a]\n', 3, 13, /column "a" is both level1 and level2/],
    ['group and outcome', 'group: g\noutcome: g\n', 2, 1, /column "g" is both group and outcomes/],
    ['unit and level-1', 'group: g\nunit: id\nlevel1: [x, id]\n', 3, 13, /column "id" is both unit and level1/],
    ['outcome and level-1', 'group: g\noutcomes: [y]\nlevel1:\n  - a\n  - y\n', 5, 5, /column "y" is both outcomes and level1/],
  ])('a column in two roles (%s)', (_, text, line, col, pattern) => {
    expectErrorAt(text, line, col, pattern);
  });

  it('a binary variable written in words may name the word read as 1 (types stay column → type)', () => {
    const r = parse(
      'group: g\noutcome: y\ntypes:\n  y: { binary: { one: "No" } }\n  z: categorical\n  t: { binary: { one: true } }\n',
    ).roles;
    expect(r.types).toEqual({ y: 'binary', z: 'categorical', t: 'binary' });
    expect(r.binaryOne).toEqual({ y: 'No', t: 'true' });
    expect(parse('group: g\ntypes: { y: binary }\n').roles).not.toHaveProperty('binaryOne');
  });

  it('a bad word read as 1 points at it', () => {
    expectErrorAt('group: g\ntypes:\n  y: { binary: { one: 3 } }\n', 3, 18, /types\.y\.binary\.one must be/);
    expectErrorAt('group: g\ntypes:\n  y: { binary: { one: "" } }\n', 3, 18, /types\.y\.binary\.one/);
    expectErrorAt('group: g\ntypes:\n  y: { binary: {} }\n', 3, 8, /types\.y\.binary must have required property 'one'/);
    expectErrorAt('group: g\ntypes:\n  y: binry\n', 3, 3, /types\.y must be one of "numeric", "categorical", "binary"/);
  });

  it('outcome and outcomes together', () => {
    expectErrorAt('group: g\noutcome: y\noutcomes: [y]\n', 2, 1, /either outcome or outcomes, not both/);
  });

  it('a repeated column inside one list', () => {
    expectErrorAt('group: g\nlevel1: [a, a]\n', 2, 1, /level1 must NOT have duplicate items/);
  });
});

describe('loadRoles', () => {
  it('a missing file is an InputError naming it', () => {
    expect(() => loadRoles('no/such/roles.yaml', catalogue)).toThrow(InputError);
    expect(() => loadRoles('no/such/roles.yaml', catalogue)).toThrow('no/such/roles.yaml: cannot read the role map (ENOENT)');
  });

  it('messages use the path it was given', () => {
    const text = readFileSync('fixtures/demo/repairs-clean.roles.yaml', 'utf8');
    expect(parseRoles(text, 'x/y.yaml', catalogue).locate(['group'])).toMatch(/^x\/y\.yaml:\d+:1$/);
  });
});
