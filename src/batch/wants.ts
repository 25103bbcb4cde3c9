import type { PresetName } from '../presets/index.js';
import type { ReportFormat } from '../report/render.js';
import type { FailOn } from '../severity.js';
import type { Encoding, InputFormat } from '../source/types.js';
import { asksForBatch } from './discover.js';

/** The `audit` flags a batch reads (src/cli.ts defines them). */
export interface BatchFlags {
  roles: string;
  preset?: PresetName;
  format: ReportFormat;
  out: string[];
  withPlotData?: boolean;
  problems?: string;
  /** refused in a batch: one file of one delivery's groups */
  weightFactors?: string;
  /** refused in a batch: a baseline is one previous report */
  baseline?: string;
  maxRows: number;
  quiet?: boolean;
  failOn: FailOn;
  values: boolean;
  memoryLimit: string;
  inputFormat?: InputFormat;
  encoding?: Encoding;
  sheet?: string;
  decimalComma?: boolean;
  source?: string;
  table?: string;
  query?: string;
  strict?: boolean;
  reportsDir?: string;
  senderFrom?: string;
  atOnce?: number;
  recurse?: boolean;
  /** one engine thread per audit, so that reruns give byte-identical reports */
  repeatable?: boolean;
}

/**
 * Whether `audit` runs a batch: several deliveries, a folder, a pattern, or an option only a
 * batch has. One plain file without those is the single audit, exactly as before. Decided
 * before the batch's code is loaded.
 */
export function wantsBatch(args: readonly string[], flags: BatchFlags): boolean {
  const batchOption = flags.reportsDir !== undefined || flags.senderFrom !== undefined || flags.atOnce !== undefined || flags.recurse;
  return asksForBatch(args) || (args.length > 0 && batchOption === true);
}
