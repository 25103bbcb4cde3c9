import { InputError } from '../errors.js';
import type { BatchDelivery } from './types.js';

/**
 * The sender pattern (`--sender-from`): a regular expression matched against a delivery's file
 * name (not its folder). A bad expression is a usage error, like any other bad option value.
 */
export function senderPattern(source: string): RegExp {
  try {
    return new RegExp(source, 'u');
  } catch (e) {
    throw new InputError(`--sender-from: not a regular expression (${(e as Error).message})`);
  }
}

/** A file name without its folder and without its extensions (`north_2026-01.csv.gz` → `north_2026-01`). */
export function bareName(file: string): string {
  const name = file.split(/[\\/]/).pop() ?? file;
  const stem = name.replace(/\.gz$/i, '').replace(/\.[^.]+$/, '');
  return stem || name;
}

/**
 * Who sent a delivery, from its file name: the pattern's group named `sender`, else its first
 * group, else the whole match; the name without its extensions when there is no pattern, it does
 * not match, or what it captures is empty.
 */
export function senderOf(file: string, pattern?: RegExp): string {
  const name = file.split(/[\\/]/).pop() ?? file;
  const m = pattern?.exec(name);
  const captured = m ? (m.groups?.sender ?? m[1] ?? m[0]) : undefined;
  return captured?.trim() ? captured.trim() : bareName(file);
}

/** A sender as a folder name: only letters, digits, `.`, `_` and `-`; never empty, never `.` or `..`. */
export function folderSafe(sender: string): string {
  const safe = sender.replace(/[^\p{L}\p{N}._-]+/gu, '_').replace(/^[.]+/, '_');
  return safe === '' ? 'delivery' : safe;
}

/**
 * Each delivery's folder: its sender made safe as a folder name. Deliveries whose names collide
 * (the same sender twice, or names that differ only in case or in characters a folder name
 * cannot hold) are told apart by number in file-name order: the first keeps the name, the next
 * get `-2`, `-3`, … (skipping a name another sender already has).
 */
export function assignFolders(deliveries: readonly { file: string; sender: string }[]): BatchDelivery[] {
  const ordered = [...deliveries].sort((a, b) => (a.file < b.file ? -1 : a.file > b.file ? 1 : 0));
  const taken = new Set(ordered.map((d) => folderSafe(d.sender).toLowerCase()));
  const used = new Set<string>();
  return ordered.map((d) => {
    const base = folderSafe(d.sender);
    let folder = base;
    for (let n = 2; used.has(folder.toLowerCase()) || (folder !== base && taken.has(folder.toLowerCase())); n++) folder = `${base}-${n}`;
    used.add(folder.toLowerCase());
    return { ...d, folder };
  });
}
