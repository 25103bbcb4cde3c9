import { createReadStream, createWriteStream, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Transform } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { createGunzip } from 'node:zlib';

/**
 * A delivery rewritten into a temp file, streamed through `transform` (gzip undone on the way),
 * for what DuckDB's CSV reader cannot read as written. The caller deletes `dir`; the delivery
 * itself is only read.
 *
 * @param prefix the temp folder's name prefix (it says why the copy exists)
 */
export async function tempCopy(
  file: string,
  gzip: boolean,
  transform: () => Transform,
  prefix: string,
): Promise<{ file: string; dir: string }> {
  const dir = mkdtempSync(join(tmpdir(), prefix));
  const out = join(dir, 'delivery.csv');
  try {
    if (gzip) await pipeline(createReadStream(file), createGunzip(), transform(), createWriteStream(out));
    else await pipeline(createReadStream(file), transform(), createWriteStream(out));
  } catch (e) {
    rmSync(dir, { recursive: true, force: true });
    throw e;
  }
  return { file: out, dir };
}
