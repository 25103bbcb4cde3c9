import { rmSync, statSync } from 'node:fs';
import { InputError, ownCopiesNamed } from '../../../errors.js';
import type { Roles } from '../../../roles/types.js';
import { detectFormat } from '../../formats/detect.js';
import { formatSpec } from '../../formats/registry.js';
import { nodeTextFiles } from '../../formats/text-files-node.js';
import { spoolStdin } from '../../stdin.js';
import type { OpenOptions, Source } from '../../types.js';
import { STDIN } from '../../types.js';
import { createEngine } from './engine.js';
import { duckSource } from './views.js';

/**
 * Open a delivery file (or `-`, standard input, spooled to a temp file deleted on close) in an
 * embedded DuckDB without modifying or copying it, read by its format's reader (see
 * formats/registry.ts). The format comes from `options.format`, else the file.
 */
export async function openDelivery(path: string, roles: Roles, options: OpenOptions): Promise<Source> {
  const display = options.displayPath ?? path;
  let file = path;
  let spooled: string | null = null;
  if (path === STDIN) {
    const s = await spoolStdin();
    file = s.file;
    spooled = s.dir;
  }
  try {
    checkFile(file, display);
  } catch (e) {
    if (spooled) rmSync(spooled, { recursive: true, force: true });
    throw e;
  }
  let engine: Awaited<ReturnType<typeof createEngine>>;
  try {
    engine = await createEngine(options);
  } catch (e) {
    if (spooled) rmSync(spooled, { recursive: true, force: true });
    throw e;
  }
  if (spooled) engine.cleanup.push(spooled);
  // a blank field is always missing, whatever else the role map lists
  const missing = [...new Set(['', ...options.missing])];
  let format: string = options.format ?? 'csv';
  try {
    const detected = detectFormat(file, options.format);
    format = detected.format;
    const layout = await formatSpec(detected.format).read({
      engine,
      files: nodeTextFiles,
      file,
      display,
      roles,
      missing,
      gzip: detected.gzip,
      ...(detected.delimiter !== undefined && { delimiter: detected.delimiter }),
      options,
    });
    if (!layout.header.length) throw new InputError(`${display}: no columns found`);
    return await duckSource(engine, layout, roles, missing);
  } catch (e) {
    engine.close();
    if (e instanceof InputError) throw e;
    const first = ownCopiesNamed((e as Error).message.split('\n')[0], display);
    if (/Out of Memory Error/i.test(first)) {
      throw new InputError(`${display}: out of memory within --memory-limit (${first}); raise --memory-limit`);
    }
    throw new InputError(`${display}: cannot read as ${format.toUpperCase()} (${first})`);
  }
}

function checkFile(path: string, display: string): void {
  let size: number;
  try {
    const st = statSync(path);
    if (!st.isFile()) throw new InputError(`${display}: not a file`);
    size = st.size;
  } catch (e) {
    if (e instanceof InputError) throw e;
    throw new InputError(`${display}: cannot read the delivery (${(e as NodeJS.ErrnoException).code ?? e})`);
  }
  if (size === 0) throw new InputError(`${display}: the file is empty (no header, no records)`);
}
