import { isAscii, isUtf8 } from 'node:buffer';
import { closeSync, openSync, readSync } from 'node:fs';
import { constants, gunzipSync } from 'node:zlib';
import type { Utf8Check } from './utf8-advice.js';
import { countUtf8Lines } from './utf8-advice.js';

export type { Utf8Check } from './utf8-advice.js';
export { encodingAdvice, mostlyNotUtf8 } from './utf8-advice.js';

/** How much of the start of a delivery is checked for UTF-8 (after gzip is undone). */
const SAMPLE_BYTES = 1 << 20;

/** The first megabyte of a delivery as text bytes, and whether that is the whole file. */
export function sample(file: string, gzip: boolean): { bytes: Buffer; whole: boolean } {
  const fd = openSync(file, 'r');
  try {
    const buf = Buffer.alloc(gzip ? SAMPLE_BYTES / 4 : SAMPLE_BYTES + 1);
    const n = readSync(fd, buf, 0, buf.length, 0);
    if (!gzip) return { bytes: buf.subarray(0, Math.min(n, SAMPLE_BYTES)), whole: n <= SAMPLE_BYTES };
    const text = gunzipSync(buf.subarray(0, n), { finishFlush: constants.Z_SYNC_FLUSH });
    return { bytes: text.subarray(0, SAMPLE_BYTES), whole: n < buf.length && text.length <= SAMPLE_BYTES };
  } catch {
    return { bytes: Buffer.alloc(0), whole: true }; // unreadable gzip: the reader says so
  } finally {
    closeSync(fd);
  }
}

/** Count the lines of the delivery's first megabyte that are not UTF-8 (a cut last line is left out). */
export function checkUtf8(file: string, gzip: boolean): Utf8Check {
  const { bytes, whole } = sample(file, gzip);
  return countUtf8Lines(bytes, whole, isAscii, isUtf8);
}
