import { rmSync } from 'node:fs';
import { Command, InvalidArgumentError, Option } from 'commander';
import { changeCatalogue } from '../changes/index.js';
import { catalogue } from '../rules/index.js';
import type { BatchFlags } from './batch/wants.js';
import { wantsBatch } from './batch/wants.js';
import { endingFor } from './cli-exit.js';
import { memorySize, sheetNote } from './cli-options.js';
import { planOutputs, protectInputs, refuseInputOverwrite, writeDraftFile, writeOutput } from './cli-output.js';
import { startProgress } from './cli-progress.js';
import { InputError } from './errors.js';
import type { FailOn } from './grade.js';
import { exitCode } from './grade.js';
import type { PresetName } from './presets/index.js';
import { PRESETS } from './presets/index.js';
import { problemsCsv } from './problems/csv.js';
import { DEFAULT_MAX_ROWS } from './problems/types.js';
import { catalogueJson, catalogueMarkdown, catalogueText } from './report/catalogue.js';
import { needsPlotData, REPORT_FORMAT_TABLE, REPORT_FORMATS, renderReport } from './report/render.js';
import { weightFactorsCsv } from './report/weight-factors-csv.js';
import { loadRoles } from './roles/load-file.js';
import { roleMapSchema } from './roles/schema.js';
import type { Roles } from './roles/types.js';
import { databaseInput, isFileInput } from './source/engines/kinds.js';
import { deliveryHelp } from './source/formats/registry.js';
import { spoolStdin } from './source/stdin.js';
import type { Encoding, InputFormat } from './source/types.js';
import { ENCODINGS, INPUT_FORMATS, STDIN } from './source/types.js';
import { TOOL } from './version.js';

const CATALOGUE_FORMATS = { text: catalogueText, json: catalogueJson, md: catalogueMarkdown };
const OUT_EXTENSIONS = REPORT_FORMATS.map((f) => `${REPORT_FORMAT_TABLE[f].extensions.join(' ')} ${f}`).join(', ');
const FAIL_ON = { blocker: true, warning: true, never: true } satisfies Record<FailOn, true>;

/** Every `audit` flag: the batch reads the same (src/batch/wants.ts), the colour is the command line's. */
interface AuditFlags extends BatchFlags {
  color?: boolean;
}

type CompareFlags = Pick<AuditFlags, 'roles' | 'preset' | 'format' | 'out' | 'quiet' | 'failOn' | 'values' | 'color' | 'memoryLimit'>;

interface DraftFlags {
  group?: string;
  out?: string;
  candidates: number;
  quiet?: boolean;
  memoryLimit: string;
  inputFormat?: InputFormat;
  encoding?: Encoding;
  sheet?: string;
}

/** The delivery the flags name: a file, `-` (stdin, spooled once so every reader sees the same bytes), or PostgreSQL. */
async function deliveryInput(delivery: string | undefined, flags: Pick<AuditFlags, 'source' | 'table' | 'query'>) {
  if (flags.source !== undefined) {
    if (delivery !== undefined) throw new InputError('give either a delivery file or --source, not both');
    const input = databaseInput(flags.source, flags);
    if ((flags.table === undefined) === (flags.query === undefined))
      throw new InputError('--source needs exactly one of --table or --query');
    return { input, label: flags.table ?? 'query', done: () => {} };
  }
  if (delivery === undefined) throw new InputError('no delivery: give a file, - for stdin, or --source postgres://… --table NAME');
  if (flags.table !== undefined || flags.query !== undefined) throw new InputError('--table and --query go with --source');
  if (delivery !== STDIN) return { input: delivery, label: delivery, done: () => {} };
  const { file, dir } = await spoolStdin();
  return { input: file, label: STDIN, displayPath: STDIN, done: () => rmSync(dir, { recursive: true, force: true }) };
}

/** `--weight-factors` has nothing to write without level-1 weights: said before the audit runs. */
function needsLevel1Weights(rolesFile: string, roles: Roles): void {
  if (roles.weights?.level1 === undefined) {
    throw new InputError(`${rolesFile}: --weight-factors needs level-1 weights in the role map (weights: { level1: column })`);
  }
}

/** Colour only for a terminal, never when NO_COLOR is set or output goes to a file. */
function colorLevel(flags: AuditFlags, toFile: boolean): 0 | 1 | 2 | 3 {
  if (flags.color === false || toFile || process.env.NO_COLOR) return 0;
  if (flags.color === true) return 2;
  return process.stdout.isTTY ? 2 : 0;
}

const collect = (value: string, previous: string[]) => [...previous, value];
function count(value: string): number {
  if (!/^\d+$/.test(value)) throw new InvalidArgumentError('expected a whole number');
  return Number(value);
}

/** The command line's definition, not run: `main` parses with it, and `npm run docs` reads its options for the README. */
export function buildProgram(): Command {
  const program = new Command('nestready')
    .description('Audit a two-level delivery (records nested in groups) before multilevel modelling')
    .version(TOOL.version)
    .exitOverride()
    .configureOutput({ writeErr: (s) => process.stderr.write(s) });

  program
    .command('audit')
    .description('profile a delivery (or each of several, with a summary), run the rule catalogue, grade it and print the report')
    .argument('[deliveries...]', `${deliveryHelp()}; several files, a folder or a quoted pattern audit each (README: Auditing a folder)`)
    .requiredOption('-r, --roles <file>', 'the YAML role map')
    .addOption(
      new Option('--preset <name>', "rule settings merged under the role map's own (README: Presets)").choices(Object.keys(PRESETS)),
    )
    .addOption(
      new Option('-f, --format <format>', 'report format on stdout, or for --out files without a known extension')
        .choices(REPORT_FORMATS)
        .default('text'),
    )
    .option(
      '-o, --out <file>',
      'write the report to this file instead of stdout; repeat it for several files, each in the format its extension names ' +
        `(${OUT_EXTENSIONS}), else in --format`,
      collect,
      [],
    )
    .option('--with-plot-data', 'JSON: also write the plot data and the rules that ran (the whole report object)')
    .option('--problems <file>', 'write every offending record to this CSV (record, group, unit, rule, severity, column, reason)')
    .option('--max-rows <n>', 'at most this many problem rows; a last "#" line counts the rest', count, DEFAULT_MAX_ROWS)
    .option(
      '--weight-factors <file>',
      "write every group's scale factors of the level-1 weights to this CSV (the report keeps their spread and extremes)",
    )
    .option('-q, --quiet', 'no progress line, no "wrote" line per file and no notes on stderr')
    .addOption(
      new Option('--fail-on <severity>', 'exit 1 when a finding is at least this severe').choices(Object.keys(FAIL_ON)).default('blocker'),
    )
    .option('--no-values', 'leave raw data values out of every output (IDs and record numbers stay: the sender needs them)')
    .option('--color', 'force colour (by default only on a terminal, never with NO_COLOR set or into a file)')
    .option('--no-color', 'no colour')
    .option(
      '--memory-limit <size>',
      'DuckDB memory before it spills to disk; raised to what the delivery needs (its readers, its groups), and a query that ' +
        'runs out of memory anyway is run again with four times the limit, up to 4 GiB',
      memorySize,
      '100MB',
    )
    .addOption(new Option('--input-format <format>', 'the delivery format (default: from the name and content)').choices(INPUT_FORMATS))
    .addOption(new Option('--encoding <encoding>', 'text encoding of a CSV/TSV delivery').choices(ENCODINGS).default('utf-8'))
    .option('--sheet <name>', "Excel: the worksheet to read (default: the first whose header holds the role map's columns)")
    .option(
      '--decimal-comma',
      'CSV/TSV: numbers are written with a decimal comma (12,5); by default read so when the fields are not separated by commas ' +
        'and the first records leave no doubt',
    )
    .option('--source <url>', 'audit a table or query in PostgreSQL where it lives (postgres://user@host:port/db)')
    .option('--table <name>', 'with --source: the table or view')
    .option('--query <sql>', 'with --source: a query whose rows are the delivery')
    .option('--strict', 'any line that cannot be read is an input error (exit 2), not a finding')
    .option(
      '--repeatable',
      'one engine thread, so that reruns of a large delivery give byte-identical reports (slower; README: Repeatable reports)',
    )
    .option('--reports-dir <dir>', "batch: write each delivery's HTML and JSON report and problem rows into a folder of its own here")
    .option('--sender-from <regex>', "batch: the sender's name from the file name: the group named sender, else the first group")
    .option('--at-once <n>', 'batch: audit at most this many deliveries at once (default: the cores)', count)
    .option('--recurse', "batch: a folder's subfolders too")
    .option('--baseline <report>', "compare with the previous delivery's JSON report: change findings join the audit's (README: Compare)")
    .action(async (deliveryArgs: string[], flags: AuditFlags) => {
      if (wantsBatch(deliveryArgs, flags)) {
        const { auditBatch } = await import('./batch/command.js');
        return auditBatch(deliveryArgs, flags, (toFile) => colorLevel(flags, toFile));
      }
      const deliveryArg = deliveryArgs[0];
      protectInputs(flags, deliveryArg);
      const roles = loadRoles(flags.roles, [...catalogue, ...changeCatalogue], { preset: flags.preset });
      if (flags.weightFactors !== undefined) needsLevel1Weights(flags.roles, roles.roles);
      const resolved = await deliveryInput(deliveryArg, flags);
      const delivery = isFileInput(resolved.input) ? (resolved.displayPath ?? resolved.input) : resolved.label;
      const note = isFileInput(resolved.input) ? sheetNote(resolved.input, resolved.label, flags.sheet, flags.inputFormat) : null;
      if (note && !flags.quiet) process.stderr.write(`nestready: ${note}\n`);
      try {
        const stop = startProgress(resolved.label, 'auditing', { quiet: flags.quiet === true });
        // the engine (DuckDB, arquero, stats) loads only for an audit: `rules` and `schema` start fast
        const { audit } = await import('./audit.js');
        const targets = planOutputs(flags.out, flags.format);
        const withPlotData = flags.withPlotData === true;
        const { baselineFor } = await import('./compare/cli-compare.js');
        const report = await audit(resolved.input, roles, {
          ...baselineFor(flags.baseline, roles.roles, targets),
          plotData: targets.some((t) => needsPlotData(t.format, { withPlotData })),
          includeValues: flags.values,
          memoryLimit: flags.memoryLimit,
          inputFormat: flags.inputFormat,
          encoding: flags.encoding,
          sheet: flags.sheet,
          decimalComma: flags.decimalComma === true,
          strict: flags.strict === true,
          ...(flags.repeatable && { threads: 1 }),
          displayPath: resolved.displayPath,
          weightFactors: flags.weightFactors !== undefined,
        }).finally(stop);
        for (const target of targets) {
          const options = { color: colorLevel(flags, target.path !== null), failOn: flags.failOn, withPlotData };
          await writeOutput(target, () => renderReport(report, target.format, options), { quiet: flags.quiet === true });
        }
        if (flags.weightFactors !== undefined) {
          const target = { path: flags.weightFactors, format: 'weight-factors' } as const;
          await writeOutput(target, weightFactorsCsv(report), { quiet: flags.quiet === true });
        }
        if (flags.problems) {
          const stopRows = startProgress(delivery, 'collecting problem rows of', { quiet: flags.quiet === true });
          const { problemRows } = await import('./problem-rows.js');
          const found = await problemRows(resolved.input, roles.roles, report.findings, {
            maxRows: flags.maxRows,
            includeValues: flags.values,
            memoryLimit: flags.memoryLimit,
            format: flags.inputFormat,
            encoding: flags.encoding,
            sheet: flags.sheet,
            decimalComma: flags.decimalComma === true,
            ...(flags.repeatable && { threads: 1 }),
            displayPath: resolved.displayPath,
          }).finally(stopRows);
          await writeOutput({ path: flags.problems, format: 'problems' }, problemsCsv(found), { quiet: flags.quiet === true });
          if (found.omitted && !flags.quiet) {
            process.stderr.write(
              `nestready: ${flags.problems}: ${found.omitted} of ${found.total} problem rows left out (--max-rows ${flags.maxRows})\n`,
            );
          }
        }
        process.exitCode = exitCode(report.findings, flags.failOn);
      } finally {
        resolved.done();
      }
    });

  program
    .command('compare')
    .description('compare a delivery with the previous one (the delivery or its JSON report): what changed, as findings')
    .argument('<previous>', 'the previous delivery, or the JSON report of it (written with --format json)')
    .argument('<current>', 'the current delivery')
    .requiredOption('-r, --roles <file>', 'the YAML role map (its rules: section sets the change checks too)')
    .addOption(new Option('--preset <name>', "rule settings merged under the role map's own").choices(Object.keys(PRESETS)))
    .addOption(
      new Option('-f, --format <format>', 'report format on stdout, or for --out files without a known extension')
        .choices(REPORT_FORMATS)
        .default('text'),
    )
    .option('-o, --out <file>', 'write the report to this file instead of stdout; repeat it for several files', collect, [])
    .option('-q, --quiet', 'no progress line and no "wrote" line per file')
    .addOption(
      new Option('--fail-on <severity>', 'exit 1 when a change finding is at least this severe')
        .choices(Object.keys(FAIL_ON))
        .default('blocker'),
    )
    .option('--no-values', 'leave raw data values out of every output')
    .option('--color', 'force colour')
    .option('--no-color', 'no colour')
    .option('--memory-limit <size>', 'DuckDB memory before it spills to disk', memorySize, '100MB')
    .action(async (previous: string, current: string, flags: CompareFlags) => {
      const all = { ...flags, withPlotData: false } as AuditFlags;
      refuseInputOverwrite(
        flags.out.map((path) => ({ path, option: '--out' })),
        [flags.roles, previous, current].map((path) => ({ path, what: 'an input' })),
      );
      const roles = loadRoles(flags.roles, [...catalogue, ...changeCatalogue], { preset: flags.preset });
      const stop = startProgress(current, 'comparing', { quiet: flags.quiet === true });
      const { compare } = await import('./compare/compare.js');
      const targets = planOutputs(flags.out, flags.format);
      const report = await compare(previous, current, roles, {
        plotData: targets.some((t) => needsPlotData(t.format, { withPlotData: false })),
        includeValues: flags.values,
        memoryLimit: flags.memoryLimit,
      }).finally(stop);
      for (const target of targets) {
        const options = { color: colorLevel(all, target.path !== null), failOn: flags.failOn, withPlotData: false };
        await writeOutput(target, () => renderReport(report, target.format, options), { quiet: flags.quiet === true });
      }
      process.exitCode = exitCode(report.findings, flags.failOn);
    });

  program
    .command('draft')
    .description('propose a role map from the data alone: a commented YAML draft, each choice with its evidence, to review')
    .argument('<delivery>', 'the delivery file (any format audit reads), or - for standard input')
    .option('--group <column>', 'take this column as the group ID instead of the best candidate')
    .option('-o, --out <file>', 'write the draft to this file instead of stdout')
    .option('--candidates <n>', 'screen at most this many group candidates', count, 5)
    .option('-q, --quiet', 'no progress line and no "wrote" line')
    .option('--memory-limit <size>', 'DuckDB memory before it spills to disk', memorySize, '100MB')
    .addOption(new Option('--input-format <format>', 'the delivery format (default: from the name and content)').choices(INPUT_FORMATS))
    .addOption(new Option('--encoding <encoding>', 'text encoding of a CSV/TSV delivery').choices(ENCODINGS).default('utf-8'))
    .option('--sheet <name>', 'Excel: the worksheet to read (default the first)')
    .action(async (deliveryArg: string, flags: DraftFlags) => {
      const resolved = await deliveryInput(deliveryArg, {});
      try {
        const stop = startProgress(resolved.label, 'drafting a role map for', { quiet: flags.quiet === true });
        const { draftRoles } = await import('./draft/draft.js');
        const draft = await draftRoles(resolved.input, {
          group: flags.group,
          candidates: flags.candidates,
          memoryLimit: flags.memoryLimit,
          inputFormat: flags.inputFormat,
          encoding: flags.encoding,
          sheet: flags.sheet,
          displayPath: resolved.displayPath,
        }).finally(stop);
        writeDraftFile(flags.out, draft.text, flags.quiet === true, isFileInput(resolved.input) ? resolved.input : undefined);
      } finally {
        resolved.done();
      }
    });

  program
    .command('page')
    .description("write the sender's page: a static folder that runs this audit in a browser, the records never leaving it")
    .requiredOption('-r, --roles <file>', 'the YAML role map baked into the page')
    .addOption(new Option('--preset <name>', "rule settings merged under the role map's own").choices(Object.keys(PRESETS)))
    .requiredOption('-o, --out <folder>', 'the folder to write (new or empty)')
    .option('-q, --quiet', 'no "wrote" line')
    .action(async (flags: { roles: string; preset?: PresetName; out: string; quiet?: boolean }) => {
      const { writePage } = await import('./page-command.js');
      const files = writePage(flags);
      if (!flags.quiet) process.stderr.write(`wrote the page to ${flags.out} (${files.length} files; open index.html from a web server)\n`);
    });

  program
    .command('rules')
    .description('list the rule catalogue: id, what it catches, default severity, params')
    .addOption(new Option('-f, --format <format>', 'output format').choices(Object.keys(CATALOGUE_FORMATS)).default('text'))
    .action((flags: { format: keyof typeof CATALOGUE_FORMATS }) => {
      process.stdout.write(CATALOGUE_FORMATS[flags.format](catalogue));
    });

  program
    .command('schema')
    .description('print the JSON Schema of the role map')
    .action(() => {
      process.stdout.write(`${JSON.stringify(roleMapSchema, null, 2)}\n`);
    });

  return program;
}

/** Entry point: exit 0/1 from the gate, 2 for usage or input errors, 3 for a bug in nestready. */
export async function main(argv: string[]): Promise<void> {
  try {
    await buildProgram().parseAsync(argv);
  } catch (e) {
    const ending = endingFor(e);
    if (ending.line !== null) process.stderr.write(`${ending.line}\n`);
    process.exitCode = ending.code;
  }
}
