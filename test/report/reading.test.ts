import { describe, expect, it } from 'vitest';
import { readingLines } from '../../src/report/reading.js';
import { withheldWords } from '../../src/source/plan/binary-words.js';

describe('readingLines', () => {
  it('says how values were read, the words as the delivery writes them', () => {
    expect(readingLines(undefined)).toEqual([]);
    expect(readingLines({})).toEqual([]);
    const reading = { decimalComma: true, binary: { fixed: { one: 'yes', zero: 'no', written: { one: 'Yes', zero: 'No' } } } };
    expect(readingLines(reading)).toEqual(['read: numbers with a decimal comma (12,5 as 12.5); fixed: "Yes" as 1, "No" as 0']);
  });

  it('with values withheld, the words of a known pair stay (ours to name), the others go', () => {
    const reading = {
      binary: {
        fixed: { one: 'yes', zero: 'no', written: { one: 'Yes', zero: 'No' } },
        passed: { one: 'pass', zero: 'fail' },
      },
    };
    const withheld = withheldWords(reading);
    expect(withheld.binary).toEqual({ fixed: { one: 'yes', zero: 'no' }, passed: { one: '(value withheld)', zero: '(value withheld)' } });
    expect(readingLines(withheld)).toEqual(['read: fixed: "yes" as 1, "no" as 0; passed: two words as 0/1 (value withheld)']);
  });
});
