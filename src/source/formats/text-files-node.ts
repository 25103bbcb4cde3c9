import { lfCopy, mixedLineEnds } from './line-ends.js';
import type { TextFiles } from './text-files.js';
import { checkUtf8, sample } from './utf8-check.js';
import { transcodeToUtf8 } from './windows-1252.js';

/** The delivery's bytes read from disk (the command line and the library). */
export const nodeTextFiles: TextFiles = {
  checkUtf8,
  mixedLineEnds,
  head: (file, gzip) => sample(file, gzip).bytes,
  transcodeToUtf8,
  lfCopy,
};
