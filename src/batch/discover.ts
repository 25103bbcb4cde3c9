import { realpathSync, statSync } from 'node:fs';
import { isAbsolute, join, relative, resolve, sep } from 'node:path';
import { globSync, isDynamicPattern } from 'tinyglobby';
import { InputError } from '../errors.js';
import { FORMATS } from '../source/formats/registry.js';
import { STDIN } from '../source/types.js';
import type { SkippedFile } from './types.js';

export interface Discovered {
  /** the delivery files, each once, in file-name order */
  files: string[];
  /** files met in a folder or by a pattern whose name names no format nestready reads */
  skipped: SkippedFile[];
}

export interface DiscoverOptions {
  /** look into a folder's subfolders too (by default only the files directly in it) */
  recurse: boolean;
  /** files and folders never taken as deliveries: this run's own outputs */
  exclude: readonly string[];
}

/**
 * Whether a file name names a delivery format (an extension of the format registry, after a
 * `.gz` only for formats that may be compressed). Files named so in a folder are audited; others
 * are listed as skipped. A file named on the command line is audited whatever its name, as a
 * single audit would (its content decides).
 */
export function namesDeliveryFormat(file: string): boolean {
  const lower = file.toLowerCase();
  const gzip = lower.endsWith('.gz');
  const name = gzip ? lower.slice(0, -3) : lower;
  const dot = name.lastIndexOf('.');
  if (dot < 0) return false;
  const ext = name.slice(dot + 1);
  return FORMATS.some((f) => f.extensions.includes(ext) && (!gzip || f.gzip));
}

/** Whether an argument is a pattern to expand rather than a path: it has pattern characters and names no existing file. */
export function isPattern(arg: string): boolean {
  return isDynamicPattern(arg) && kindOf(arg) === null;
}

/** Whether the command line asks for a batch: several deliveries, a folder, or a pattern. */
export function asksForBatch(args: readonly string[]): boolean {
  return args.length > 1 || (args.length === 1 && (kindOf(args[0]) === 'folder' || isPattern(args[0])));
}

function kindOf(path: string): 'file' | 'folder' | null {
  try {
    return statSync(path).isDirectory() ? 'folder' : 'file';
  } catch {
    return null;
  }
}

/**
 * The deliveries the arguments name: a file as it is; a folder's files (hidden ones aside) whose
 * names name a delivery format, its subfolders only with `recurse`; a pattern's matches likewise
 * (tinyglobby; hidden files only when the pattern names them). The same file reached twice is
 * audited once. A name that is none of these, or a pattern that matches nothing, is a usage error.
 */
export function discover(args: readonly string[], options: DiscoverOptions): Discovered {
  const excluded = options.exclude.map((p) => resolve(p));
  const isExcluded = (file: string) => {
    const abs = resolve(file);
    return excluded.some((x) => abs === x || abs.startsWith(x + sep));
  };
  const files: string[] = [];
  const skipped: SkippedFile[] = [];
  const seen = new Set<string>();
  const take = (file: string) => {
    const real = realOf(file);
    if (seen.has(real) || isExcluded(file)) return;
    seen.add(real);
    files.push(file);
  };
  const met = (found: string[]) => {
    for (const file of found.sort()) {
      if (isExcluded(file)) continue;
      if (namesDeliveryFormat(file)) take(file);
      else skipped.push({ file, reason: 'its name names no delivery format' });
    }
  };
  for (const arg of args) {
    if (arg === STDIN) throw new InputError('- (standard input) cannot be one of several deliveries; give files, folders or patterns');
    const kind = kindOf(arg);
    if (kind === 'file') take(arg);
    else if (kind === 'folder') met(folderFiles(arg, options.recurse));
    else if (isDynamicPattern(arg)) {
      // an absolute pattern gives absolute paths, a relative one paths from the working folder
      const found = globSync(arg, { onlyFiles: true, expandDirectories: false, absolute: isAbsolute(arg) });
      if (!found.length) throw new InputError(`${arg}: no file matches this pattern`);
      met(found);
    } else throw new InputError(`${arg}: no such file or folder`);
  }
  if (!files.length) {
    throw new InputError(`${args.join(' ')}: no delivery found (${skipped.length} file(s) skipped: their names name no delivery format)`);
  }
  return { files: [...files].sort(), skipped: dedupeSkipped(skipped) };
}

/** A folder's files (hidden files and folders left out), as paths that start with the folder as given. */
function folderFiles(folder: string, recurse: boolean): string[] {
  const found = globSync(recurse ? '**/*' : '*', { cwd: folder, onlyFiles: true, expandDirectories: false });
  return found.map((f) => join(folder, f));
}

function realOf(file: string): string {
  try {
    return realpathSync(file);
  } catch {
    return resolve(file);
  }
}

function dedupeSkipped(skipped: readonly SkippedFile[]): SkippedFile[] {
  const byFile = new Map(skipped.map((s) => [relative('.', resolve(s.file)), s]));
  return [...byFile.values()].sort((a, b) => (a.file < b.file ? -1 : a.file > b.file ? 1 : 0));
}
