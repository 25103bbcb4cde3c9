import { Transform } from 'node:stream';
import { tempCopy } from './temp-copy.js';

/**
 * Bytes 0x80-0x9F in windows-1252, from the WHATWG Encoding Standard's index-windows-1252; the
 * five bytes it leaves unassigned (0x81, 0x8D, 0x8F, 0x90, 0x9D) keep their own code point, as
 * there. 0xA0-0xFF are the same code points as the byte (Latin-1).
 */
const C1 = [
  0x20ac, 0x81, 0x201a, 0x192, 0x201e, 0x2026, 0x2020, 0x2021, 0x2c6, 0x2030, 0x160, 0x2039, 0x152, 0x8d, 0x17d, 0x8f, 0x90, 0x2018, 0x2019,
  0x201c, 0x201d, 0x2022, 0x2013, 0x2014, 0x2dc, 0x2122, 0x161, 0x203a, 0x153, 0x9d, 0x17e, 0x178,
];

/** The UTF-8 bytes of each byte 0x80-0xFF read as windows-1252. */
const UTF8 = Array.from({ length: 128 }, (_, i) => Buffer.from(String.fromCodePoint(i < 32 ? C1[i] : 0x80 + i), 'utf8'));

/**
 * windows-1252 bytes as UTF-8. One byte is one character, so a chunk needs nothing from the one
 * before it. Node's TextDecoder('windows-1252') is not used: Node 20 decodes that label as
 * Latin-1 (0x80 as U+0080, not €).
 */
export function windows1252ToUtf8(chunk: Buffer): Buffer {
  let size = chunk.length;
  for (const b of chunk) if (b >= 0x80) size += UTF8[b - 0x80].length - 1;
  if (size === chunk.length) return chunk;
  const out = Buffer.allocUnsafe(size);
  let at = 0;
  for (const b of chunk) {
    if (b < 0x80) out[at++] = b;
    else {
      const bytes = UTF8[b - 0x80];
      bytes.copy(out, at);
      at += bytes.length;
    }
  }
  return out;
}

/**
 * A windows-1252 (or Latin-1) delivery as a UTF-8 temp file: DuckDB's CSV reader knows UTF-8 and
 * Latin-1 only, and its Latin-1 refuses bytes 0x80-0x9F. Lines stay where they were, so line
 * numbers are the delivery's.
 */
export function transcodeToUtf8(file: string, gzip: boolean): Promise<{ file: string; dir: string }> {
  const decode = () =>
    new Transform({
      transform(chunk: Buffer, _encoding, done) {
        done(null, windows1252ToUtf8(chunk));
      },
    });
  return tempCopy(file, gzip, decode, 'nestready-utf8-');
}
