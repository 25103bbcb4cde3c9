import { closeSync, openSync, readSync } from 'node:fs';
import { lfCopy, mixedLineEnds } from './line-ends.js';
import type { TextFiles } from './text-files.js';
import { checkUtf8 } from './utf8-check.js';
import { transcodeToUtf8 } from './windows-1252.js';

/** The delivery's bytes read from disk (the command line and the library). */
export const nodeTextFiles: TextFiles = { checkUtf8, mixedLineEnds, hasQuote, transcodeToUtf8, lfCopy };

/** Whether the first megabyte of a (plain) file holds a double quote. */
function hasQuote(file: string): boolean {
  const fd = openSync(file, 'r');
  try {
    const buf = Buffer.alloc(1 << 20);
    const n = readSync(fd, buf, 0, buf.length, 0);
    return buf.subarray(0, n).includes(0x22);
  } finally {
    closeSync(fd);
  }
}
