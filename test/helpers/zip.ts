import { writeFileSync } from 'node:fs';
import { crc32, deflateRawSync } from 'node:zlib';
import { readZipEntries } from '../../src/source/formats/zip-entry.js';

/**
 * Rewrite a zip file (an .xlsx) as other writers lay a workbook out (deflated, no extras): `edit`
 * may change an entry's bytes, `order` gets the entry names and returns them reordered.
 */
export function rezip(
  file: string,
  edit: (name: string, data: Buffer) => Buffer = (_, data) => data,
  order: (names: string[]) => string[] = (names) => names,
): void {
  const entries = readZipEntries(file, () => true);
  const locals: Buffer[] = [];
  const central: Buffer[] = [];
  let offset = 0;
  const names = order([...entries.keys()]);
  for (const name of names) {
    const stored = entries.get(name);
    if (!stored) throw new Error(`no entry ${name}`);
    const data = edit(name, stored);
    const packed = deflateRawSync(data);
    const nameBytes = Buffer.from(name, 'utf8');
    const crc = crc32(data);
    const local = Buffer.alloc(30);
    local.writeUInt32LE(0x04034b50, 0);
    local.writeUInt16LE(20, 4);
    local.writeUInt16LE(8, 8); // deflate
    local.writeUInt32LE(crc, 14);
    local.writeUInt32LE(packed.length, 18);
    local.writeUInt32LE(data.length, 22);
    local.writeUInt16LE(nameBytes.length, 26);
    const dir = Buffer.alloc(46);
    dir.writeUInt32LE(0x02014b50, 0);
    dir.writeUInt16LE(20, 4);
    dir.writeUInt16LE(20, 6);
    dir.writeUInt16LE(8, 10);
    dir.writeUInt32LE(crc, 16);
    dir.writeUInt32LE(packed.length, 20);
    dir.writeUInt32LE(data.length, 24);
    dir.writeUInt16LE(nameBytes.length, 28);
    dir.writeUInt32LE(offset, 42);
    locals.push(local, nameBytes, packed);
    central.push(dir, nameBytes);
    offset += 30 + nameBytes.length + packed.length;
  }
  const dirBytes = Buffer.concat(central);
  const end = Buffer.alloc(22);
  end.writeUInt32LE(0x06054b50, 0);
  end.writeUInt16LE(names.length, 8);
  end.writeUInt16LE(names.length, 10);
  end.writeUInt32LE(dirBytes.length, 12);
  end.writeUInt32LE(offset, 16);
  writeFileSync(file, Buffer.concat([...locals, dirBytes, end]));
}
