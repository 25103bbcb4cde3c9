import { writeFileSync } from 'node:fs';
import { InputError } from './errors.js';
import { formatForPath } from './report/render.js';
import type { ReportFormat } from './report/render.js';

/** Where one rendering of the report goes: a file, or stdout (path null). */
export interface OutputTarget {
  path: string | null;
  format: ReportFormat;
}

/**
 * Outputs of one run: each `--out` file in the format its extension names (.html, .json, .md,
 * .xml = JUnit, .txt), or in `--format` when the extension names none; stdout in `--format`
 * when there is no `--out`.
 */
export function planOutputs(outs: readonly string[], format: ReportFormat): OutputTarget[] {
  if (!outs.length) return [{ path: null, format }];
  return outs.map((path) => ({ path, format: formatForPath(path) ?? format }));
}

/** Write one output; a file that cannot be written is an input error (exit 2), not a crash. */
export function writeOutput(target: OutputTarget | string, text: string): void {
  const path = typeof target === 'string' ? target : target.path;
  if (path === null) {
    process.stdout.write(text);
    return;
  }
  try {
    writeFileSync(path, text);
  } catch (e) {
    throw new InputError(`${path}: cannot write the output (${(e as NodeJS.ErrnoException).code ?? e})`);
  }
}
