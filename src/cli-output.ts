import { writeFileSync } from 'node:fs';
import { InputError } from './errors.js';
import type { ReportFormat } from './report/render.js';
import { formatForPath, formatName } from './report/render.js';

/** Where one output goes: a file, or stdout (path null); `problems` is the CSV of problem rows. */
export interface OutputTarget {
  path: string | null;
  format: ReportFormat | 'problems';
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
 */
export function writeOutput(target: OutputTarget, text: string, options: { quiet: boolean }): void {
  if (target.path === null) {
    process.stdout.write(text);
    return;
  }
  try {
    writeFileSync(target.path, text);
  } catch (e) {
    throw new InputError(`${target.path}: cannot write the output (${(e as NodeJS.ErrnoException).code ?? e})`);
  }
  if (!options.quiet) {
    const what = target.format === 'problems' ? 'the problem rows (CSV)' : `the ${formatName(target.format)} report`;
    process.stderr.write(`nestready: wrote ${what} to ${target.path}\n`);
  }
}

/** The drafted role map to stdout, or to a file with a line on stderr saying where. */
export function writeDraftFile(path: string | undefined, text: string, quiet: boolean): void {
  if (path === undefined) {
    process.stdout.write(text);
    return;
  }
  try {
    writeFileSync(path, text);
  } catch (e) {
    throw new InputError(`${path}: cannot write the draft (${(e as NodeJS.ErrnoException).code ?? e})`);
  }
  if (!quiet) process.stderr.write(`nestready: wrote the drafted role map to ${path}\n`);
}
