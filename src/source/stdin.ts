import { createWriteStream, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';

/**
 * Spool standard input to a temp file (DuckDB's readers need a file they can seek in). The
 * caller deletes the returned directory when done; the input itself is never touched.
 */
export async function spoolStdin(input: Readable = process.stdin): Promise<{ file: string; dir: string }> {
  const dir = mkdtempSync(join(tmpdir(), 'nestready-stdin-'));
  const file = join(dir, 'stdin');
  try {
    await pipeline(input, createWriteStream(file));
  } catch (e) {
    rmSync(dir, { recursive: true, force: true });
    throw e;
  }
  return { file, dir };
}
