import type { ValueReading } from '../source/types.js';

/**
 * How values were read, in a sentence for the report's head (none when plainly): decimal commas,
 * and which word of a binary variable was read as 1.
 */
export function readingLines(reading: ValueReading | undefined): string[] {
  if (!reading) return [];
  const parts: string[] = [];
  if (reading.decimalComma) parts.push('numbers with a decimal comma (12,5 as 12.5)');
  for (const [column, w] of Object.entries(reading.binary ?? {})) {
    const { one, zero } = w.written ?? w;
    // both words withheld (--no-values) read the same
    parts.push(one === zero ? `${column}: two words as 0/1 ${one}` : `${column}: "${one}" as 1, "${zero}" as 0`);
  }
  return parts.length ? [`read: ${parts.join('; ')}`] : [];
}
