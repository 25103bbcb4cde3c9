import { closeSync, openSync, readSync } from 'node:fs';
import { constants, gunzipSync } from 'node:zlib';
import { InputError } from '../../errors.js';
import type { InputFormat } from './registry.js';
import { FORMATS, formatSpec } from './registry.js';

export { delimiterHint } from './delimiter-hint.js';

export interface Detected {
  format: InputFormat;
  /** the file is gzip-compressed (formats whose record allows it only) */
  gzip: boolean;
  /** CSV: the delimiter when the first lines leave no doubt (see delimiterHint) */
  delimiter?: string;
}

/** The first bytes of a file (at most `n`). */
function head(path: string, n: number): Buffer {
  const fd = openSync(path, 'r');
  try {
    const buf = Buffer.alloc(n);
    const got = readSync(fd, buf, 0, n, 0);
    return buf.subarray(0, got);
  } finally {
    closeSync(fd);
  }
}

/** The format a text file's start shows; the first format of the registry when none claims it. */
function textKind(bytes: Buffer): InputFormat {
  let text = bytes.toString('utf8');
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  return (FORMATS.find((f) => f.looksLike?.(text)) ?? FORMATS[0]).name;
}

/**
 * Which format a delivery is in: the user's word, else the binary formats' magic numbers,
 * else the file name's extension (after a .gz), else a look at the text.
 */
export function detectFormat(path: string, given?: InputFormat): Detected {
  let bytes = head(path, 65536);
  const gzip = bytes.length >= 2 && bytes[0] === 0x1f && bytes[1] === 0x8b;
  if (gzip) {
    try {
      bytes = gunzipSync(bytes, { finishFlush: constants.Z_SYNC_FLUSH });
    } catch (e) {
      throw new InputError(`${path}: not a readable gzip file (${(e as Error).message})`);
    }
  }
  const name = path.toLowerCase().replace(/\.gz$/, '');
  const ext = name.includes('.') ? name.slice(name.lastIndexOf('.') + 1) : '';
  const format =
    given ?? FORMATS.find((f) => f.magic?.(bytes))?.name ?? FORMATS.find((f) => f.extensions.includes(ext))?.name ?? textKind(bytes);
  const spec = formatSpec(format);
  if (gzip && !spec.gzip) {
    throw new InputError(`${path}: a gzip-compressed ${format} file cannot be read; decompress it first`);
  }
  const delimiter = spec.hints?.(bytes).delimiter;
  return { format, gzip, ...(delimiter !== undefined && { delimiter }) };
}
