import { InputError } from '../../../errors.js';
import type { TextFiles } from '../../formats/text-files.js';
import { endsMixed } from '../../formats/text-sample.js';
import { countUtf8Lines } from '../../formats/utf8-advice.js';

/** How much of the start of a delivery is looked at (as formats/utf8-check.ts does). */
const SAMPLE_BYTES = 1 << 20;

/** A file the sender picked, held in the page's memory. */
export interface PickedFile {
  name: string;
  bytes: Uint8Array;
}

/** The picked file as DuckDB will read it, with its first megabyte as text. */
export interface PreparedFile {
  bytes: Uint8Array;
  gzip: boolean;
  /** the first megabyte, gzip undone */
  head: Uint8Array;
  /** whether `head` is the whole text */
  whole: boolean;
}

export function isGzip(b: Uint8Array): boolean {
  return b.length >= 2 && b[0] === 0x1f && b[1] === 0x8b;
}

/** Up to `limit` bytes of a gzip stream's text (all of it without a limit). */
export async function gunzip(bytes: Uint8Array, limit = Number.POSITIVE_INFINITY): Promise<{ text: Uint8Array; whole: boolean }> {
  const reader = new Blob([bytes as BlobPart]).stream().pipeThrough(new DecompressionStream('gzip')).getReader();
  const parts: Uint8Array[] = [];
  let size = 0;
  let whole = true;
  try {
    while (true) {
      const { done, value } = await reader.read();
      if (done) break;
      parts.push(value);
      size += value.length;
      if (size > limit) {
        whole = false;
        await reader.cancel();
        break;
      }
    }
  } catch (e) {
    if (!parts.length) throw new InputError(`not a readable gzip file (${(e as Error).message})`);
  }
  const text = new Uint8Array(size);
  let at = 0;
  for (const p of parts) {
    text.set(p, at);
    at += p.length;
  }
  return { text: whole ? text : text.subarray(0, limit), whole };
}

/**
 * The picked file ready for DuckDB: a file that ends some lines with CRLF and others with LF
 * (which DuckDB's CSV reader refuses) has every CRLF written as LF first, as the command line
 * does in a temp copy (formats/line-ends.ts), here in memory (a gzip file is decompressed for it).
 */
export async function prepare(picked: PickedFile): Promise<PreparedFile> {
  let { bytes } = picked;
  let gzip = isGzip(bytes);
  // a copy: registering the file hands its buffer to DuckDB's worker
  const first = gzip ? await gunzip(bytes, SAMPLE_BYTES) : { text: bytes.slice(0, SAMPLE_BYTES), whole: bytes.length <= SAMPLE_BYTES };
  if (!endsMixed(first.text)) return { bytes, gzip, head: first.text, whole: first.whole };
  if (gzip) bytes = (await gunzip(bytes)).text;
  gzip = false;
  bytes = crlfToLf(bytes);
  return { bytes, gzip, head: bytes.slice(0, SAMPLE_BYTES), whole: bytes.length <= SAMPLE_BYTES };
}

function crlfToLf(b: Uint8Array): Uint8Array {
  const out = new Uint8Array(b.length);
  let n = 0;
  for (let i = 0; i < b.length; i++) {
    if (b[i] === 0x0d && b[i + 1] === 0x0a) continue;
    out[n++] = b[i];
  }
  return out.subarray(0, n);
}

const isAscii = (b: Uint8Array) => b.every((x) => x < 0x80);
const strict = new TextDecoder('utf-8', { fatal: true });
const isUtf8 = (b: Uint8Array) => {
  try {
    strict.decode(b);
    return true;
  } catch {
    return false;
  }
};

/**
 * The CSV reader's questions about the bytes, answered from the prepared file's first megabyte.
 * Line ends were made one already; the page reads UTF-8 only (it has no encoding option).
 */
export function pageTextFiles(file: PreparedFile): TextFiles {
  return {
    checkUtf8: () => countUtf8Lines(file.head, file.whole, isAscii, isUtf8),
    mixedLineEnds: () => false,
    head: () => file.head,
    transcodeToUtf8: () => Promise.reject(new Error('the page reads UTF-8 only')),
    lfCopy: () => Promise.reject(new Error('line ends are made one when the file is picked')),
  };
}
