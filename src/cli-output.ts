import { randomBytes } from 'node:crypto';
import { chmodSync, realpathSync, renameSync, statSync, unlinkSync, writeFileSync } from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';
import { InputError } from './errors.js';
import type { ReportFormat } from './report/render.js';
import { formatForPath, formatName } from './report/render.js';
import { STDIN } from './source/types.js';

/** Where one output goes: a file, or stdout (path null); `problems` is the CSV of problem rows, `weight-factors` that of scale factors. */
export interface OutputTarget {
  path: string | null;
  format: ReportFormat | 'problems' | 'weight-factors';
}

/**
 * Outputs of one run: each `--out` file in the format its extension names (.html, .json, .md,
 * .xml = JUnit, .txt), or in `--format` when the extension names none; stdout in `--format`
 * when there is no `--out`.
 */
export function planOutputs(outs: readonly string[], format: ReportFormat): (OutputTarget & { format: ReportFormat })[] {
  if (!outs.length) return [{ path: null, format }];
  return outs.map((path) => ({ path, format: formatForPath(path) ?? format }));
}

/**
 * Write one output, and say on stderr where a file went (unless `quiet`): with several `--out`
 * files and no stdout, that line is how a user learns what the run made. A file that cannot be
 * written is an input error (exit 2), not a crash.
 *
 * @param content the text, or the render that makes it: run before the file is touched, so a
 *   render that fails leaves the file as it was
 */
export async function writeOutput(
  target: OutputTarget,
  content: string | (() => string | Promise<string>),
  options: { quiet: boolean },
): Promise<void> {
  const text = typeof content === 'string' ? content : await content();
  if (target.path === null) {
    process.stdout.write(text);
    return;
  }
  writeFileAtomic(target.path, text);
  if (!options.quiet) {
    const what =
      target.format === 'problems'
        ? 'the problem rows (CSV)'
        : target.format === 'weight-factors'
          ? 'the weight scale factors (CSV)'
          : `the ${formatName(target.format)} report`;
    process.stderr.write(`nestready: wrote ${what} to ${target.path}\n`);
  }
}

/**
 * Write a file whole or not at all: into a temporary file in the same folder (so the rename
 * stays on one file system), then renamed over the target, which readers see either as it was
 * or complete, never half written. A symbolic link is written through (its target replaced),
 * as a plain write would; an existing file keeps its permissions. Nothing is left behind when
 * the write fails.
 */
export function writeFileAtomic(path: string, text: string): void {
  const real = realTarget(path);
  const temp = join(dirname(real), `.${basename(real)}.${process.pid}.${randomBytes(4).toString('hex')}.tmp`);
  try {
    writeFileSync(temp, text, { flag: 'wx' });
    const mode = existingMode(real);
    if (mode !== undefined) chmodSync(temp, mode);
    renameSync(temp, real);
  } catch (e) {
    try {
      unlinkSync(temp);
    } catch {
      // never created, or already renamed
    }
    throw new InputError(`${path}: cannot write the output (${(e as NodeJS.ErrnoException).code ?? e})`);
  }
}

/**
 * Refuse an output that would overwrite an input: `--out` or `--problems` naming the delivery
 * or the role map, however written (relative, through a link, another hard link). Checked
 * before the audit starts, so the input is never touched.
 *
 * @param outputs the output files asked for, with the option that named each
 * @param inputs the input files, with what each is ("the delivery", "the role map")
 */
export function refuseInputOverwrite(
  outputs: readonly { path: string; option: string }[],
  inputs: readonly { path: string; what: string }[],
): void {
  const ids = inputs.flatMap((input) => {
    const id = fileId(input.path);
    return id ? [{ ...input, id, real: realTarget(input.path) }] : [];
  });
  for (const out of outputs) {
    const id = fileId(out.path);
    const real = realTarget(out.path);
    const hit = ids.find((input) => input.real === real || (id !== undefined && id === input.id));
    if (hit) throw new InputError(`${out.path}: ${out.option} would overwrite ${hit.what}; choose another file`);
  }
}

/**
 * The audit command's guard: its `--out` files and `--problems` file must not be its delivery
 * file (not stdin, not a database) or its role map.
 */
export function protectInputs(
  flags: { out: readonly string[]; problems?: string; weightFactors?: string; roles: string; source?: string },
  delivery: string | undefined,
): void {
  const outputs = [...flags.out.map((path) => ({ path, option: '--out' }))];
  if (flags.problems !== undefined) outputs.push({ path: flags.problems, option: '--problems' });
  if (flags.weightFactors !== undefined) outputs.push({ path: flags.weightFactors, option: '--weight-factors' });
  const inputs = [{ path: flags.roles, what: 'the role map' }];
  if (delivery !== undefined && delivery !== STDIN && flags.source === undefined) inputs.push({ path: delivery, what: 'the delivery' });
  refuseInputOverwrite(outputs, inputs);
}

/** The path a write to `path` lands on: links resolved, for a file not yet there its folder's. */
function realTarget(path: string): string {
  try {
    return realpathSync(path);
  } catch {
    try {
      return join(realpathSync(dirname(resolve(path))), basename(path));
    } catch {
      return resolve(path);
    }
  }
}

/** Device and inode of an existing file (hard links share them), else undefined. */
function fileId(path: string): string | undefined {
  try {
    const s = statSync(path);
    return `${s.dev}:${s.ino}`;
  } catch {
    return undefined;
  }
}

function existingMode(path: string): number | undefined {
  try {
    return statSync(path).mode & 0o7777;
  } catch {
    return undefined;
  }
}

/** The drafted role map to stdout, or to a file (written whole, never over the delivery) with a line on stderr saying where. */
export function writeDraftFile(path: string | undefined, text: string, quiet: boolean, delivery?: string): void {
  if (path === undefined) {
    process.stdout.write(text);
    return;
  }
  if (delivery !== undefined && delivery !== STDIN)
    refuseInputOverwrite([{ path, option: '--out' }], [{ path: delivery, what: 'the delivery' }]);
  writeFileAtomic(path, text);
  if (!quiet) process.stderr.write(`nestready: wrote the drafted role map to ${path}\n`);
}
