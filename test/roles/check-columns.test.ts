import { describe, expect, it } from 'vitest';
import { catalogue } from '../../rules/index.js';
import { InputError } from '../../src/errors.js';
import { checkColumns } from '../../src/roles/check-columns.js';
import { parseRoles } from '../../src/roles/load.js';

const parse = (text: string) => parseRoles(text, 'r.yaml', catalogue);

describe('checkColumns', () => {
  const header = ['site', 'y', 'Age', 'kind'];
  const check = (text: string) => {
    const { roles, locate } = parse(text);
    return () => checkColumns(roles, header, locate, 'data.csv');
  };

  it('passes when every named column is in the header', () => {
    expect(check('group: site\noutcome: y\nlevel1: [Age, kind]\n')).not.toThrow();
  });

  it('a role naming a column not in the header: error at its key, listing the header', () => {
    const run = check('group: site\noutcome: y\nlevel2: [kind, staff]\n');
    expect(run).toThrow(InputError);
    expect(run).toThrow('r.yaml:3:16: column "staff" is not in data.csv; its header is: site, y, Age, kind');
  });

  it.each([
    ['group', 'group: school\n', 'r.yaml:1:1', 'school'],
    ['unit', 'group: site\nunit: id\n', 'r.yaml:2:1', 'id'],
    ['parent', 'group: site\nparent: region\n', 'r.yaml:2:1', 'region'],
    ['outcome', 'group: site\noutcome: wait\n', 'r.yaml:2:1', 'wait'],
    ['types', 'group: site\ntypes: { flag: binary }\n', 'r.yaml:2:10', 'flag'],
  ])('checks %s', (_, text, at, column) => {
    const run = check(text);
    expect(run).toThrow(`${at}: column "${column}" is not in data.csv; its header is: site, y, Age, kind`);
  });

  it('suggests a column that differs only in case or spaces', () => {
    expect(check('group: site\nlevel1: [age]\n')).toThrow(
      'column "age" is not in data.csv (did you mean "Age"?); its header is: site, y, Age, kind',
    );
  });

  it('the message is one line', () => {
    try {
      check('group: nope\n')();
    } catch (e) {
      expect((e as Error).message).not.toContain('\n');
      return;
    }
    throw new Error('expected an error');
  });
});
