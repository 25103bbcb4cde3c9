import { describe, expect, it } from 'vitest';
import { catalogue } from '../../rules/index.js';
import { audit } from '../../src/audit.js';
import { InputError, readError } from '../../src/errors.js';
import { problemRows } from '../../src/problem-rows.js';
import { parseRoles } from '../../src/roles/load.js';
import type { Finding } from '../../src/rules/types.js';
import { writeDelivery } from '../helpers/delivery.js';

const roles = { group: 'g', outcome: 'y' };
const records = Array.from({ length: 40 }, (_, i) => `{"g":${i % 4},"y":${i}}`);

describe('an error while reading a delivery that opened is an input error naming the file', () => {
  it.each([
    ['JSON', 'd.json', `[${[...records, '{"g":1,"y":2,"y":3}'].join(',\n')}]`],
    ['NDJSON', 'd.ndjson', `${[...records, '{"g":1,"y":2,"y":3}'].join('\n')}\n`],
  ])('%s with a duplicate key in a record', async (_, name, text) => {
    const d = writeDelivery(text, roles, name);
    const error = await audit(d.csv, parseRoles('group: g\noutcome: y\n', d.roles, catalogue), { threads: 1 })
      .then(
        () => null,
        (e: unknown) => e,
      )
      .finally(d.remove);
    expect(error).toBeInstanceOf(InputError);
    const message = (error as Error).message;
    expect(message).toMatch(new RegExp(`^\\S*${name.replace('.', '\\.')}: cannot read the delivery \\(.*duplicate key "y"\\)$`));
    expect(message).not.toContain('\n');
  });

  it('the problem-rows read of such a delivery fails alike', async () => {
    const d = writeDelivery(`${[...records, '{"g":1,"y":2,"y":3}'].join('\n')}\n`, roles, 'd.ndjson');
    const finding = { rule: 'few-groups', severity: 'warning', message: 'm', rows: [41] } as unknown as Finding;
    const roleMap = parseRoles('group: g\noutcome: y\n', d.roles, catalogue).roles;
    const error = await problemRows(d.csv, roleMap, [finding], { threads: 1 })
      .then(
        () => null,
        (e: unknown) => e,
      )
      .finally(d.remove);
    expect(error).toBeInstanceOf(InputError);
    expect((error as Error).message.startsWith(`${d.csv}: `)).toBe(true);
  });

  it("readError passes on what is not the delivery's fault", () => {
    const bug = new TypeError('x is undefined');
    expect(readError(bug, 'd.csv')).toBe(bug);
    expect((readError(new Error('Out of Memory Error: could not allocate\nmore'), 'd.csv') as Error).message).toBe(
      'd.csv: out of memory within --memory-limit (Out of Memory Error: could not allocate); raise --memory-limit',
    );
  });
});
