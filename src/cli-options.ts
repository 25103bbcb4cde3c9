import { InvalidArgumentError } from 'commander';
import { detectFormat } from './source/formats/detect.js';

const UNITS: Record<string, number> = { kb: 1e3, kib: 2 ** 10, mb: 1e6, mib: 2 ** 20, gb: 1e9, gib: 2 ** 30, tb: 1e12, tib: 2 ** 40 };
/** Below this DuckDB cannot hold one vector of a scan: the run would fail on memory at once. */
const MIN_MEMORY = 1e6;

/**
 * `--memory-limit`: a size with its unit, as DuckDB reads it ("200MB", "1.5GiB", "512 mb"). Checked
 * when the option is parsed, so a value DuckDB would refuse is a usage error (exit 2), not a crash.
 */
export function memorySize(value: string): string {
  const m = /^\s*(\d+(?:\.\d*)?|\.\d+)\s*([kmgt]i?b)\s*$/i.exec(value);
  const bytes = m ? Number(m[1]) * UNITS[m[2].toLowerCase()] : Number.NaN;
  if (!(bytes >= MIN_MEMORY) || !Number.isFinite(bytes)) {
    throw new InvalidArgumentError('expected a size of at least 1MB with its unit, such as 200MB or 1.5GB');
  }
  return value.trim();
}

/**
 * `--sheet` only means something for an Excel workbook: for any other delivery it is said, not
 * silently ignored (a note, not an error: the audit of the file given is still the one wanted).
 * Returns the note, or null when there is none to give.
 */
export function sheetNote(file: string, display: string, sheet: string | undefined, format: string | undefined): string | null {
  if (sheet === undefined) return null;
  let detected: string;
  try {
    detected = format ?? detectFormat(file).format;
  } catch {
    return null; // an unreadable file: the audit reports it
  }
  if (detected === 'xlsx') return null;
  return `${display}: --sheet ${JSON.stringify(sheet)} ignored: the delivery is ${detected.toUpperCase()}, not an Excel workbook`;
}
