import { describe, expect, it } from 'vitest';
import { catalogue } from '../../rules/index.js';
import { InputError } from '../../src/errors.js';
import { checkColumns } from '../../src/roles/check-columns.js';
import { parseRoles } from '../../src/roles/load.js';

const parse = (text: string) => parseRoles(text, 'r.yaml', catalogue);

function errorOf(text: string): string {
  try {
    parse(text);
  } catch (e) {
    expect(e).toBeInstanceOf(InputError);
    return (e as InputError).message;
  }
  throw new Error(`expected an InputError for ${JSON.stringify(text)}`);
}

describe('role map: the model the analyst plans', () => {
  it('slopes and time join level1, the predictor to detect joins level2, weights keep their own part', () => {
    const { roles } = parse(
      [
        'group: site',
        'outcome: y',
        'level1: [age]',
        'slopes: [age, dose]',
        'time: week',
        'detect: { predictor: arm, effect_size: 0.3 }',
        'weights: { level1: w_rec, level2: w_site }',
        'types: { y: count, pain: ordinal, score: { bounded: { lower: 0, upper: 100 } } }',
      ].join('\n'),
    );
    expect(roles.level1).toEqual(['age', 'dose', 'week']);
    expect(roles.level2).toEqual(['arm']);
    expect(roles.slopes).toEqual(['age', 'dose']);
    expect(roles.time).toBe('week');
    expect(roles.detect).toEqual({ predictor: 'arm', effectSize: 0.3 });
    expect(roles.weights).toEqual({ level1: 'w_rec', level2: 'w_site' });
    expect(roles.types).toEqual({ y: 'count', pain: 'ordinal', score: 'bounded' });
    expect(roles.bounds).toEqual({ score: { lower: 0, upper: 100 } });
  });

  it('a map without them has none of the keys (reports stay as they were)', () => {
    const { roles } = parse('group: site\noutcome: y\n');
    for (const key of ['slopes', 'time', 'detect', 'weights', 'bounds']) expect(roles).not.toHaveProperty(key);
  });

  it('refuses a slope that is a level-2 variable, and a weight that plays another part, at line:column', () => {
    expect(errorOf('group: site\nlevel2: [size]\nslopes: [size]\n')).toMatch(/^r\.yaml:3:10: column "size" is both level2 and slopes$/);
    expect(errorOf('group: site\noutcome: y\nweights: { level1: y }\n')).toMatch(
      /^r\.yaml:3:12: column "y" is both an outcome and weights\.level1$/,
    );
    expect(errorOf('group: site\ndetect: { effect_size: 0.2 }\n')).toMatch(/^r\.yaml:2:1: .*predictor/);
    expect(errorOf('group: site\ndetect: { predictor: x, effect_size: 0 }\n')).toMatch(/^r\.yaml:2:25: /);
  });

  it('every column the plan names must be in the header', () => {
    const loaded = parse('group: site\nslopes: [dose]\nweights: { level2: w_site }\n');
    expect(() => checkColumns(loaded.roles, ['site', 'w_site'], loaded.locate, 'd.csv')).toThrow(
      /^r\.yaml:2:10: column "dose" is not in d\.csv/,
    );
    expect(() => checkColumns(loaded.roles, ['site', 'dose'], loaded.locate, 'd.csv')).toThrow(
      /^r\.yaml:3:12: column "w_site" is not in d\.csv/,
    );
  });
});
