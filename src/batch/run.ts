import { mkdirSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { audit } from '../audit.js';
import { endingFor } from '../cli-exit.js';
import { writeFileAtomic } from '../cli-output.js';
import { InputError } from '../errors.js';
import { problemRows } from '../problem-rows.js';
import { problemsCsv } from '../problems/csv.js';
import { renderReport } from '../report/render.js';
import type { Report } from '../report/types.js';
import type { LoadedRoles } from '../roles/load.js';
import type { FailOn } from '../severity.js';
import type { Encoding, InputFormat } from '../source/types.js';
import { engineShare, inPool } from './share.js';
import { auditedRow, failedRow } from './summary.js';
import type { BatchDelivery, BatchRow, DeliveryFiles } from './types.js';

export interface BatchRunOptions {
  failOn: FailOn;
  /** keep raw data values in each delivery's own reports (the summary never has any) */
  includeValues: boolean;
  /** `--memory-limit`: what the audits running at once share */
  memoryLimit: string;
  /** audits at most this many deliveries at once */
  atOnce: number;
  /** the cores the audits share */
  cores: number;
  /** each delivery's HTML and JSON report and problem rows go into a folder of its own under this one */
  reportsDir?: string;
  /** per delivery: at most this many problem rows */
  maxRows: number;
  /** each delivery's JSON report with the plot data and the rules that ran */
  withPlotData: boolean;
  inputFormat?: InputFormat;
  encoding?: Encoding;
  sheet?: string;
  decimalComma: boolean;
  strict: boolean;
  /** one engine thread per audit (`--repeatable`): reruns give byte-identical reports */
  repeatable?: boolean;
  /** told of each delivery as its audit ends, in the order they end */
  onDone?(row: BatchRow): void;
}

/** The files a delivery's own reports go to, under the reports folder. */
export function deliveryFiles(reportsDir: string, folder: string): DeliveryFiles {
  const dir = join(reportsDir, folder);
  return { html: join(dir, 'report.html'), json: join(dir, 'report.json'), problems: join(dir, 'problem-rows.csv') };
}

/**
 * Audit every delivery of a batch, at most `atOnce` at a time, each with its share of threads
 * and memory, through the one-delivery audit and problem rows. A delivery that cannot be read
 * (or on which nestready fails) becomes a row with its one-line error; the batch goes on.
 * Returns the rows in the deliveries' order.
 */
export function runBatch(deliveries: readonly BatchDelivery[], roles: LoadedRoles, options: BatchRunOptions): Promise<BatchRow[]> {
  const atOnce = Math.max(1, Math.min(options.atOnce, deliveries.length));
  const share = engineShare(atOnce, options.cores, options.memoryLimit, options.repeatable ? 1 : undefined);
  return inPool(deliveries, atOnce, async (delivery) => {
    let row: BatchRow;
    try {
      row = await auditOne(delivery, roles, options, share);
    } catch (e) {
      row = failedRow(delivery, endingFor(e));
    }
    options.onDone?.(row);
    return row;
  });
}

async function auditOne(
  delivery: BatchDelivery,
  roles: LoadedRoles,
  options: BatchRunOptions,
  share: { threads: number; memoryLimit: string },
): Promise<BatchRow> {
  const reading = {
    memoryLimit: share.memoryLimit,
    threads: share.threads,
    encoding: options.encoding,
    sheet: options.sheet,
    decimalComma: options.decimalComma,
    // each report names the file as its sender knows it, not the folder it was found in
    displayPath: basename(delivery.file),
  };
  const report = await audit(delivery.file, roles, {
    ...reading,
    inputFormat: options.inputFormat,
    includeValues: options.includeValues,
    strict: options.strict,
    plotData: options.reportsDir !== undefined,
  });
  if (options.reportsDir === undefined) return auditedRow(delivery, report, options.failOn);
  const files = deliveryFiles(options.reportsDir, delivery.folder);
  await writeDeliveryFiles(delivery, report, roles, files, { ...options, ...reading });
  return auditedRow(delivery, report, options.failOn, files);
}

/** A delivery's HTML and JSON report and its problem rows, each written whole, into its own folder. */
async function writeDeliveryFiles(
  delivery: BatchDelivery,
  report: Report,
  roles: LoadedRoles,
  files: DeliveryFiles,
  options: BatchRunOptions & { threads: number; displayPath: string },
): Promise<void> {
  const render = { color: 0, failOn: options.failOn, withPlotData: options.withPlotData } as const;
  const [html, json] = await Promise.all([renderReport(report, 'html', render), renderReport(report, 'json', render)]);
  const found = await problemRows(delivery.file, roles.roles, report.findings, {
    maxRows: options.maxRows,
    includeValues: options.includeValues,
    memoryLimit: options.memoryLimit,
    threads: options.threads,
    format: options.inputFormat,
    encoding: options.encoding,
    sheet: options.sheet,
    decimalComma: options.decimalComma,
    displayPath: options.displayPath,
  });
  const dir = dirname(files.html);
  try {
    mkdirSync(dir, { recursive: true });
  } catch (e) {
    throw new InputError(`${dir}: cannot create the folder (${(e as NodeJS.ErrnoException).code ?? e})`);
  }
  writeFileAtomic(files.html, html);
  writeFileAtomic(files.json, json);
  writeFileAtomic(files.problems, problemsCsv(found));
}
