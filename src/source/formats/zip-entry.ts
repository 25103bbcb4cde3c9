import { closeSync, fstatSync, openSync, readSync } from 'node:fs';
import { inflateRawSync } from 'node:zlib';

/** Bytes of a file from `at`, at most `n`. */
function readAt(fd: number, at: number, n: number): Buffer {
  const buf = Buffer.alloc(n);
  const got = readSync(fd, buf, 0, n, at);
  return buf.subarray(0, got);
}

/**
 * Small entries of a zip file (an .xlsx) by name, read through its central directory: only the
 * directory and the named entries are read, whatever the order of the entries in the file; the
 * map keeps the directory's order.
 * Stored and deflated entries; a ZIP64 archive or an entry that is not there gives no entry.
 */
export function readZipEntries(file: string, names: readonly string[] | ((name: string) => boolean)): Map<string, Buffer> {
  const wanted = typeof names === 'function' ? names : (name: string) => names.includes(name);
  const out = new Map<string, Buffer>();
  const fd = openSync(file, 'r');
  try {
    const size = fstatSync(fd).size;
    // the end-of-central-directory record: 22 bytes and a comment of up to 65,535 bytes
    const tailStart = Math.max(0, size - 22 - 0xffff);
    const tail = readAt(fd, tailStart, size - tailStart);
    const eocd = tail.lastIndexOf(Buffer.from([0x50, 0x4b, 0x05, 0x06]));
    if (eocd < 0 || eocd + 22 > tail.length) return out;
    const count = tail.readUInt16LE(eocd + 10);
    const dirSize = tail.readUInt32LE(eocd + 12);
    const dirStart = tail.readUInt32LE(eocd + 16);
    if (dirStart === 0xffffffff || dirStart + dirSize > size) return out;
    const dir = readAt(fd, dirStart, dirSize);
    let at = 0;
    for (let i = 0; i < count && at + 46 <= dir.length && dir.readUInt32LE(at) === 0x02014b50; i++) {
      const method = dir.readUInt16LE(at + 10);
      const compressed = dir.readUInt32LE(at + 20);
      const nameLength = dir.readUInt16LE(at + 28);
      const extraLength = dir.readUInt16LE(at + 30);
      const commentLength = dir.readUInt16LE(at + 32);
      const local = dir.readUInt32LE(at + 42);
      const name = dir.subarray(at + 46, at + 46 + nameLength).toString('utf8');
      at += 46 + nameLength + extraLength + commentLength;
      if (!wanted(name) || (method !== 0 && method !== 8)) continue;
      const header = readAt(fd, local, 30);
      if (header.length < 30 || header.readUInt32LE(0) !== 0x04034b50) continue;
      const data = readAt(fd, local + 30 + header.readUInt16LE(26) + header.readUInt16LE(28), compressed);
      out.set(name, method === 8 ? inflateRawSync(data) : data);
    }
    return out;
  } finally {
    closeSync(fd);
  }
}
