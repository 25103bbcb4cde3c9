import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { NUMBER_LIKE_PATTERN } from '../../src/profile/number-like.js';
import { tokenKind } from '../../src/rules/token-kind.js';
import { writeDelivery } from '../helpers/delivery.js';
import { profileOf } from '../helpers/profile-of.js';

// the kinds that make variable-without-statistics look closer (rules/variable-without-statistics.ts)
const NUMBER_LIKE = new Set(['decimal comma', 'thousands separator', 'number with a unit', 'censored value']);
const pattern = new RegExp(NUMBER_LIKE_PATTERN);

describe('the profile’s count of values that may be numbers written another way', () => {
  it('never misses a token the rules would read as a number written another way', () => {
    const piece = fc.constantFrom(
      '1',
      '12',
      '0',
      '5',
      ',',
      '.',
      ' ',
      '\u00a0',
      '\t',
      '<',
      '>',
      '=',
      '-',
      '+',
      'kg',
      'mm',
      '%',
      'µ',
      'e',
      'x',
    );
    fc.assert(
      fc.property(fc.array(piece, { maxLength: 8 }), (parts) => {
        const token = parts.join('');
        if (NUMBER_LIKE.has(tokenKind(token))) expect(pattern.test(token), token).toBe(true);
      }),
      { seed: 20261202, numRuns: 20000 },
    );
  });

  it('counts per column in the one pass: none in categories, each one written like a number', async () => {
    const rows = [
      { g: 'A', y: '1', band: '18-29', kind: 'fixed', w: '12,5' },
      { g: 'A', y: '2', band: '30-44', kind: 'pop-up', w: '3 kg' },
      { g: 'B', y: '3', band: '60-74', kind: 'fixed', w: '<5' },
      { g: 'B', y: '4', band: '18-29', kind: 'mobile', w: 'none' },
    ];
    const d = writeDelivery(rows, 'group: g\n');
    try {
      const { profile } = await profileOf(d.csv, 'group: g\noutcomes: [y]\nlevel1: [band, w]\nlevel2: [kind]\n');
      expect(profile.column('band').numberLike).toBe(0);
      expect(profile.column('kind').numberLike).toBe(0);
      expect(profile.column('w').numberLike).toBe(3);
      // numeric columns and undeclared ones are not counted
      expect(profile.column('y').numberLike).toBeNull();
    } finally {
      d.remove();
    }
  });
});
