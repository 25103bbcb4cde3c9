import { Transform } from 'node:stream';
import { tempCopy } from './temp-copy.js';
import { endsMixed } from './text-sample.js';
import { sample } from './utf8-check.js';

/**
 * Whether the delivery's first megabyte ends some lines with CRLF and others with LF alone (a
 * file edited on both Windows and elsewhere): DuckDB's CSV sniffer and reader refuse such a file.
 */
export function mixedLineEnds(file: string, gzip: boolean): boolean {
  return endsMixed(sample(file, gzip).bytes);
}

/**
 * The delivery with every CRLF written as LF, in a temp file. Only line ends change, so line
 * numbers and every field stay as they were (but a CRLF inside a quoted field, which becomes LF).
 */
export function lfCopy(file: string, gzip: boolean): Promise<{ file: string; dir: string }> {
  let pendingCr = false;
  const toLf = () =>
    new Transform({
      transform(chunk: Buffer, _encoding, done) {
        // a CR at the end of one chunk may be the first half of a CRLF split across two
        const text = pendingCr ? Buffer.concat([Buffer.from([0x0d]), chunk]) : chunk;
        pendingCr = text.length > 0 && text[text.length - 1] === 0x0d;
        const body = pendingCr ? text.subarray(0, text.length - 1) : text;
        done(null, Buffer.from(body.toString('latin1').replace(/\r\n/g, '\n'), 'latin1'));
      },
      flush(done) {
        done(null, pendingCr ? Buffer.from([0x0d]) : Buffer.alloc(0));
      },
    });
  return tempCopy(file, gzip, toLf, 'nestready-lf-');
}
