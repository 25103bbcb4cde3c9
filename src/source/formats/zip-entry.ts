import { closeSync, createReadStream, fstatSync, openSync, readSync } from 'node:fs';
import { Readable } from 'node:stream';
import { createInflateRaw, inflateRawSync } from 'node:zlib';

/** Bytes of a file from `at`, at most `n`. */
function readAt(fd: number, at: number, n: number): Buffer {
  const buf = Buffer.alloc(n);
  const got = readSync(fd, buf, 0, n, at);
  return buf.subarray(0, got);
}

/** An entry of a zip file as its central directory lists it: where its data starts and how long it is. */
export interface ZipEntry {
  name: string;
  /** 0 stored, 8 deflated (other methods are not read) */
  method: number;
  /** offset of the entry's data in the file (past its local header) */
  start: number;
  compressed: number;
}

const MAX32 = 0xffffffff;

/** The 64-bit sizes and offset a ZIP64 entry keeps in its extra field (tag 1), in the order the 32-bit fields overflowed. */
function zip64Fields(extra: Buffer, wanted: number): number[] {
  for (let at = 0; at + 4 <= extra.length; ) {
    const tag = extra.readUInt16LE(at);
    const size = extra.readUInt16LE(at + 2);
    if (tag === 1) {
      const out: number[] = [];
      for (let k = 0; k < wanted && at + 4 + 8 * (k + 1) <= extra.length; k++) out.push(Number(extra.readBigUInt64LE(at + 4 + 8 * k)));
      return out;
    }
    at += 4 + size;
  }
  return [];
}

/** Where the central directory is and how many entries it holds (ZIP64 included); null when the file has none. */
function directoryOf(fd: number, size: number): { count: number; start: number; size: number } | null {
  // the end-of-central-directory record: 22 bytes and a comment of up to 65,535 bytes
  const tailStart = Math.max(0, size - 22 - 0xffff);
  const tail = readAt(fd, tailStart, size - tailStart);
  const eocd = tail.lastIndexOf(Buffer.from([0x50, 0x4b, 0x05, 0x06]));
  if (eocd < 0 || eocd + 22 > tail.length) return null;
  const dir = { count: tail.readUInt16LE(eocd + 10), size: tail.readUInt32LE(eocd + 12), start: tail.readUInt32LE(eocd + 16) };
  if (dir.start === MAX32 || dir.count === 0xffff) {
    // ZIP64: the locator just before the record points at the ZIP64 end record
    const locator = eocd - 20;
    if (locator < 0 || tail.readUInt32LE(locator) !== 0x07064b50) return null;
    const record = readAt(fd, Number(tail.readBigUInt64LE(locator + 8)), 56);
    if (record.length < 56 || record.readUInt32LE(0) !== 0x06064b50) return null;
    dir.count = Number(record.readBigUInt64LE(32));
    dir.size = Number(record.readBigUInt64LE(40));
    dir.start = Number(record.readBigUInt64LE(48));
  }
  return dir.start + dir.size > size ? null : dir;
}

/**
 * The entries of a zip file (an .xlsx) through its central directory, in the directory's order:
 * the directory is what the file says it holds, whatever order its entries were written in
 * (the local headers may defer their sizes to a data descriptor). Null when the file has no
 * readable central directory (not a zip, or cut short).
 */
export function zipDirectory(file: string): ZipEntry[] | null {
  const fd = openSync(file, 'r');
  try {
    const size = fstatSync(fd).size;
    const where = directoryOf(fd, size);
    if (!where) return null;
    const dir = readAt(fd, where.start, where.size);
    const out: ZipEntry[] = [];
    let at = 0;
    for (let i = 0; i < where.count && at + 46 <= dir.length && dir.readUInt32LE(at) === 0x02014b50; i++) {
      const method = dir.readUInt16LE(at + 10);
      let compressed = dir.readUInt32LE(at + 20);
      const uncompressed = dir.readUInt32LE(at + 24);
      const nameLength = dir.readUInt16LE(at + 28);
      const extraLength = dir.readUInt16LE(at + 30);
      const commentLength = dir.readUInt16LE(at + 32);
      let local = dir.readUInt32LE(at + 42);
      const name = dir.subarray(at + 46, at + 46 + nameLength).toString('utf8');
      const extra = dir.subarray(at + 46 + nameLength, at + 46 + nameLength + extraLength);
      at += 46 + nameLength + extraLength + commentLength;
      if (compressed === MAX32 || uncompressed === MAX32 || local === MAX32) {
        const big = zip64Fields(extra, 3);
        let k = 0;
        if (uncompressed === MAX32) k++;
        if (compressed === MAX32) compressed = big[k++] ?? MAX32;
        if (local === MAX32) local = big[k] ?? MAX32;
      }
      const header = readAt(fd, local, 30);
      if (header.length < 30 || header.readUInt32LE(0) !== 0x04034b50) continue;
      out.push({ name, method, compressed, start: local + 30 + header.readUInt16LE(26) + header.readUInt16LE(28) });
    }
    return out;
  } finally {
    closeSync(fd);
  }
}

/** Whether an entry's data can be read (stored or deflated). */
const readable = (e: ZipEntry) => e.method === 0 || e.method === 8;

/**
 * Small entries of a zip file by name, read whole: only the directory and the named entries are
 * read; the map keeps the directory's order. An entry that is not there, or not stored or
 * deflated, gives no entry; a file without a central directory none.
 */
export function readZipEntries(file: string, names: readonly string[] | ((name: string) => boolean)): Map<string, Buffer> {
  const wanted = typeof names === 'function' ? names : (name: string) => names.includes(name);
  const out = new Map<string, Buffer>();
  const entries = (zipDirectory(file) ?? []).filter((e) => wanted(e.name) && readable(e));
  if (!entries.length) return out;
  const fd = openSync(file, 'r');
  try {
    for (const e of entries) {
      const data = readAt(fd, e.start, e.compressed);
      out.set(e.name, e.method === 8 ? inflateRawSync(data) : data);
    }
    return out;
  } finally {
    closeSync(fd);
  }
}

/** One entry's uncompressed bytes as a stream (a worksheet may be far larger than what should sit in memory). */
export function zipEntryStream(file: string, entry: ZipEntry): Readable {
  // an empty range: createReadStream would read on to the file's end
  if (entry.compressed <= 0) return Readable.from([]);
  const raw = createReadStream(file, { start: entry.start, end: entry.start + entry.compressed - 1 });
  if (entry.method === 0) return raw;
  const inflate = createInflateRaw();
  raw.on('error', (e) => inflate.destroy(e));
  inflate.on('close', () => raw.destroy());
  return raw.pipe(inflate);
}
