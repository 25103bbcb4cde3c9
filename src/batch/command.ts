import { availableParallelism } from 'node:os';
import { changeCatalogue } from '../../changes/index.js';
import { catalogue } from '../../rules/index.js';
import { planOutputs, refuseInputOverwrite, writeFileAtomic } from '../cli-output.js';
import { InputError } from '../errors.js';
import { formatName } from '../report/render.js';
import { loadRoles } from '../roles/load-file.js';
import { discover } from './discover.js';
import { standing } from './labels.js';
import { summaryAt } from './links.js';
import { BATCH_FORMATS, isBatchFormat } from './render.js';
import { deliveryFiles, runBatch } from './run.js';
import { assignFolders, senderOf, senderPattern } from './sender.js';
import { buildSummary } from './summary.js';
import type { BatchRow } from './types.js';
import type { BatchFlags } from './wants.js';

/**
 * `nestready audit DIR_OR_PATTERN… --roles ROLES`: audit each delivery found, write each one's own
 * reports into its folder under `--reports-dir`, then the summary (stdout or `--out`, as a single
 * audit's report), and end with the batch's exit code.
 *
 * @param color the colour level for text written to stdout (false) or a file (true)
 */
export async function auditBatch(args: readonly string[], flags: BatchFlags, color: (toFile: boolean) => 0 | 1 | 2 | 3): Promise<void> {
  if (flags.source !== undefined || flags.table !== undefined || flags.query !== undefined) {
    throw new InputError('--source audits one table or query; give either delivery files or --source');
  }
  if (flags.problems !== undefined) {
    throw new InputError("--problems names one file: in a batch each delivery's problem rows go into its folder under --reports-dir");
  }
  if (flags.weightFactors !== undefined) {
    throw new InputError("--weight-factors names one file of one delivery's groups: audit that delivery alone");
  }
  if (flags.baseline !== undefined) {
    throw new InputError('--baseline names one previous report: compare each delivery with its own (nestready compare)');
  }
  if (flags.atOnce !== undefined && flags.atOnce < 1) throw new InputError('--at-once must be at least 1');
  const targets = planOutputs(flags.out, flags.format).map((t) => {
    if (isBatchFormat(t.format)) return { path: t.path, format: t.format };
    throw new InputError(
      `${t.path ?? '--format'}: the batch summary has no ${formatName(t.format)} form; write text, JSON, Markdown or HTML`,
    );
  });
  // the role map may set change checks too (a map shared with compare): known ids, not errors
  const roles = loadRoles(flags.roles, [...catalogue, ...changeCatalogue], { preset: flags.preset });
  const pattern = flags.senderFrom === undefined ? undefined : senderPattern(flags.senderFrom);
  const exclude = [...flags.out, ...(flags.reportsDir === undefined ? [] : [flags.reportsDir])];
  const found = discover(args, { recurse: flags.recurse === true, exclude });
  const deliveries = assignFolders(found.files.map((file) => ({ file, sender: senderOf(file, pattern) })));
  // no output may land on an input: the summaries, and every delivery's own files
  const outputs = flags.out.map((path) => ({ path, option: '--out' }));
  if (flags.reportsDir !== undefined) {
    for (const d of deliveries) {
      for (const path of Object.values(deliveryFiles(flags.reportsDir, d.folder))) outputs.push({ path, option: '--reports-dir' });
    }
  }
  refuseInputOverwrite(outputs, [
    { path: flags.roles, what: 'the role map' },
    ...deliveries.map((d) => ({ path: d.file, what: 'a delivery' })),
  ]);

  let done = 0;
  const progress = (row: BatchRow) => {
    done++;
    if (flags.quiet) return;
    const s = standing(row);
    const grade = row.grade ? ` (grade ${row.grade})` : '';
    process.stderr.write(`nestready: [${done}/${deliveries.length}] ${row.file}: ${s.word}${grade}\n`);
  };
  const rows = await runBatch(deliveries, roles, {
    failOn: flags.failOn,
    includeValues: flags.values,
    memoryLimit: flags.memoryLimit,
    atOnce: flags.atOnce ?? availableParallelism(),
    cores: availableParallelism(),
    repeatable: flags.repeatable === true,
    reportsDir: flags.reportsDir,
    maxRows: flags.maxRows,
    withPlotData: flags.withPlotData === true,
    inputFormat: flags.inputFormat,
    encoding: flags.encoding,
    sheet: flags.sheet,
    decimalComma: flags.decimalComma === true,
    strict: flags.strict === true,
    onDone: progress,
  });
  const summary = buildSummary(rows, found.skipped, { roles: flags.roles, failOn: flags.failOn });
  if (flags.reportsDir !== undefined && !flags.quiet) {
    const written = rows.filter((r) => r.files).length;
    process.stderr.write(`nestready: wrote the reports of ${written} deliveries, a folder each, under ${flags.reportsDir}\n`);
  }
  for (const target of targets) {
    const text = BATCH_FORMATS[target.format](summaryAt(summary, target.path), { color: color(target.path !== null) });
    if (target.path === null) {
      process.stdout.write(text);
      continue;
    }
    writeFileAtomic(target.path, text);
    if (!flags.quiet) process.stderr.write(`nestready: wrote the ${formatName(target.format)} batch summary to ${target.path}\n`);
  }
  process.exitCode = summary.exitCode;
}
