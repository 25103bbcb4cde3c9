import { writeFileSync } from 'node:fs';
import { Command, CommanderError, Option } from 'commander';
import { catalogue } from '../rules/index.js';
import { audit } from './audit.js';
import { InputError } from './errors.js';
import { exitCode } from './grade.js';
import type { FailOn } from './grade.js';
import { catalogueJson, catalogueMarkdown, catalogueText } from './report/catalogue.js';
import { renderJson } from './report/json.js';
import { renderText } from './report/text.js';
import type { Report } from './report/types.js';
import { loadRoles } from './roles/load.js';
import { roleMapSchema } from './roles/schema.js';
import { TOOL } from './version.js';

const REPORT_FORMATS = { text: true, json: true } satisfies Record<string, true>;
const CATALOGUE_FORMATS = { text: catalogueText, json: catalogueJson, md: catalogueMarkdown };
const FAIL_ON = { blocker: true, warning: true, never: true } satisfies Record<FailOn, true>;

interface AuditFlags {
  roles: string;
  format: keyof typeof REPORT_FORMATS;
  out?: string;
  failOn: FailOn;
  values: boolean;
  color?: boolean;
  memoryLimit: string;
}

/** Colour only for a terminal, never when NO_COLOR is set or output goes to a file. */
function colorLevel(flags: AuditFlags): 0 | 1 | 2 | 3 {
  if (flags.color === false || flags.out || process.env.NO_COLOR) return 0;
  if (flags.color === true) return 2;
  return process.stdout.isTTY ? 2 : 0;
}

function render(report: Report, flags: AuditFlags): string {
  return flags.format === 'json' ? renderJson(report) : renderText(report, { color: colorLevel(flags) });
}

function buildProgram(): Command {
  const program = new Command('nestready')
    .description('Audit a two-level delivery (records nested in groups) before multilevel modelling')
    .version(TOOL.version)
    .exitOverride()
    .configureOutput({ writeErr: (s) => process.stderr.write(s) });

  program
    .command('audit')
    .description('profile a delivery, run the rule catalogue, grade it and print the report')
    .argument('<delivery>', 'the data file (CSV or TSV)')
    .requiredOption('-r, --roles <file>', 'the YAML role map')
    .addOption(new Option('-f, --format <format>', 'report format').choices(Object.keys(REPORT_FORMATS)).default('text'))
    .option('-o, --out <file>', 'write the report to a file instead of stdout')
    .addOption(new Option('--fail-on <severity>', 'exit 1 when a finding is at least this severe').choices(Object.keys(FAIL_ON)).default('blocker'))
    .option('--no-values', 'leave raw data values out of the report (IDs and record numbers stay)')
    .option('--color', 'force colour')
    .option('--no-color', 'no colour')
    .option('--memory-limit <size>', 'DuckDB memory before it spills to disk', '200MB')
    .action(async (delivery: string, flags: AuditFlags) => {
      const roles = loadRoles(flags.roles, catalogue);
      const report = await audit(delivery, roles, { includeValues: flags.values, memoryLimit: flags.memoryLimit });
      const text = render(report, flags);
      if (flags.out) writeFileSync(flags.out, text);
      else process.stdout.write(text);
      process.exitCode = exitCode(report.findings, flags.failOn);
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
    if (e instanceof CommanderError) {
      // help and version are not errors; commander has already printed its message
      process.exitCode = e.exitCode === 0 ? 0 : 2;
      return;
    }
    if (e instanceof InputError) {
      process.stderr.write(`nestready: ${e.message}\n`);
      process.exitCode = 2;
      return;
    }
    process.stderr.write(`nestready: internal error: ${(e as Error).message ?? e}\n`);
    process.exitCode = 3;
  }
}
