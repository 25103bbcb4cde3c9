import { readFileSync } from 'node:fs';
import type { ErrorObject } from 'ajv';
import { describe, expect, it } from 'vitest';
import { validate as generated } from '../../src/roles/role-map-validator.generated.js';
import { roleMapSchema } from '../../src/roles/schema.js';
import { ROLE_MAP_VALIDATOR_FILE, roleMapValidatorSource } from '../../src/roles/validator-source.js';
import { createAjv } from '../../src/util/ajv.js';

const validate = generated as ((data: unknown) => boolean) & { errors?: ErrorObject[] | null };

describe('the precompiled role-map validator', () => {
  it('is the code ajv generates from the schema today (run npm run docs when this fails)', () => {
    expect(readFileSync(ROLE_MAP_VALIDATOR_FILE, 'utf8')).toBe(roleMapValidatorSource());
  });

  it('needs nothing from ajv at run time', () => {
    expect(readFileSync(ROLE_MAP_VALIDATOR_FILE, 'utf8')).not.toMatch(/\brequire\(|^import /m);
  });

  it('gives the same verdicts and errors as ajv compiling the schema', () => {
    const compiled = createAjv({ checkSchemas: true }).compile(roleMapSchema);
    const maps: unknown[] = [
      { group: 'site' },
      { group: 'site', unit: 'rec', outcomes: ['y', 'z'], level1: 'x', level2: ['w'], missing: ['-9', 'NA'] },
      { group: '' },
      {},
      { group: 'site', colour: 'red' },
      { group: 'site', outcomes: ['y', 'y'] },
      { group: 'site', types: { y: 'words' } },
      { group: 'site', rules: { 'few-groups': { severity: 'loud' } } },
      { group: 'site', missing: [1, null] },
      'site',
    ];
    for (const map of maps) {
      const a = structuredClone(map);
      const b = structuredClone(map);
      expect(validate(a)).toBe(compiled(b));
      expect(validate.errors ?? null).toEqual(compiled.errors ?? null);
      expect(a).toEqual(b); // defaults filled in alike
    }
  });
});
