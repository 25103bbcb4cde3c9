import { spawn } from 'node:child_process';
import { createHash } from 'node:crypto';
import { createReadStream, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { parse } from 'csv-parse/sync';
import { catalogue } from '../../rules/index.js';
import { endingFor } from '../../src/cli-exit.js';
import {
  audit,
  exitCode,
  loadRoles,
  problemRows,
  problemsCsv,
  renderHtml,
  renderJson,
  renderJunit,
  renderMarkdown,
  renderText,
} from '../../src/index.js';
import { FORMULA_LEAD, MARKUP } from './gen/cells.js';
import type { Written } from './write-case.js';

/** The CLI's default --memory-limit: the in-process runs use it too (the library's own default is larger). */
const CLI_MEMORY_LIMIT = '100MB';

/** What one run of a case gave: its exit code, its error line, its outputs by name. */
export interface RunResult {
  code: number | null;
  error: string | null;
  outputs: Record<string, string>;
  rows?: { rows: number; rejected: number };
}

/** Which outputs an in-process run renders (each costs time; the CLI share writes them all). */
export interface Wants {
  html: boolean;
  /** the HTML with its charts (the plot data and the charts' SVG) */
  plots: boolean;
  problems: boolean;
}

/**
 * Run a case in-process as the CLI does (role map, audit, renderers, problem rows), an error
 * classified by the CLI's own endingFor: 2 for input errors, 3 for anything else.
 */
export async function runInProcess(w: Written, wants: Wants): Promise<RunResult> {
  const outputs: Record<string, string> = {};
  try {
    const roles = loadRoles(w.roles, catalogue);
    const report = await audit(w.delivery, roles, { threads: 1, memoryLimit: CLI_MEMORY_LIMIT, plotData: wants.html && wants.plots });
    outputs.json = renderJson(report);
    outputs.text = renderText(report, { color: 0 });
    outputs.md = renderMarkdown(report);
    outputs.junit = renderJunit(report, { failOn: 'blocker' });
    if (wants.html) outputs.html = await renderHtml(report);
    if (wants.problems) {
      outputs.problems = problemsCsv(await problemRows(w.delivery, roles.roles, report.findings, { memoryLimit: CLI_MEMORY_LIMIT }));
    }
    const rows = { rows: report.input.rows, rejected: report.input.rowsRejected };
    return { code: exitCode(report.findings, 'blocker'), error: null, outputs, rows };
  } catch (e) {
    const ending = endingFor(e);
    const stack = e instanceof Error && ending.code === 3 ? ` [${e.stack?.split('\n').slice(1, 4).join(' | ')}]` : '';
    return { code: ending.code, error: `${ending.line}${stack}`, outputs };
  }
}

/** Run a case through the built CLI (bin/nestready.js), every output to a file in `dir`. */
export function runCli(w: Written, dir: string, tmp: string): Promise<RunResult> {
  const out = (name: string) => join(dir, name);
  const args = ['bin/nestready.js', 'audit', w.stdin ? '-' : w.delivery, '-r', w.roles, '-q'];
  args.push('--out', out('r.json'), '--out', out('r.html'), '--out', out('r.md'), '--problems', out('problems.csv'));
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, args, { env: { ...process.env, TMPDIR: tmp, NO_COLOR: '1' }, stdio: ['pipe', 'pipe', 'pipe'] });
    // the tool may refuse before it reads its input (a role-map error): a closed pipe is no failure
    child.stdin.on('error', () => {});
    if (w.stdin) createReadStream(w.delivery).on('error', reject).pipe(child.stdin);
    else child.stdin.end();
    let stderr = '';
    child.stderr.setEncoding('utf8').on('data', (s: string) => (stderr += s));
    child.stdout.resume();
    child.on('error', reject);
    child.on('close', (code) => {
      const outputs: Record<string, string> = {};
      for (const [k, f] of [
        ['json', 'r.json'],
        ['html', 'r.html'],
        ['md', 'r.md'],
        ['problems', 'problems.csv'],
      ]) {
        try {
          outputs[k] = readFileSync(out(f), 'utf8');
        } catch {
          // not written (an error, or no problem rows)
        }
      }
      resolve({ code, error: stderr.trim() ? stderr.replace(/\n$/, '') : null, outputs });
    });
  });
}

/** A digest of each input file, to show that a run left them byte-identical. */
export function digests(w: Written): string[] {
  return [w.delivery, w.roles].map((f) => createHash('sha256').update(readFileSync(f)).digest('hex'));
}

/** Entries a run left in the temp dir it was given (spill directories, spooled input). */
export function leftovers(tmp: string): string[] {
  return readdirSync(tmp);
}

/**
 * The contract every run must keep; returns what it broke (empty: kept). `records` is the number
 * of data records written, when the format lets it be counted.
 */
// biome-ignore lint/complexity/noExcessiveCognitiveComplexity: one flat list of the contract's clauses, each a line, read top to bottom
export function breaches(run: RunResult, w: Written, records: number | null): string[] {
  const out: string[] = [];
  if (run.code === null || ![0, 1, 2].includes(run.code)) out.push(`exit ${run.code}: ${run.error}`);
  if (run.code === 2) {
    const lines = (run.error ?? '').split('\n');
    if (lines.length !== 1) out.push(`error of ${lines.length} lines: ${JSON.stringify(run.error)}`);
    const named = [w.stdin ? '-' : w.delivery, w.roles];
    if (!/^nestready: /.test(lines[0]) || !named.some((f) => lines[0].startsWith(`nestready: ${f}:`))) {
      out.push(`error not naming the file: ${lines[0]}`);
    }
    if (/nestready-(stdin|lf|utf8)-/.test(lines[0])) out.push(`error naming a temp copy: ${lines[0]}`);
    if (/\n\s+at |\(file:\/\//.test(run.error ?? '')) out.push('stack trace in the error');
  }
  for (const where of ['html', 'md'] as const) {
    const text = run.outputs[where];
    if (!text) continue;
    for (const m of MARKUP) if (text.includes(m)) out.push(`raw markup in ${where}: ${m}`);
    if (/(href|src)\s*=\s*["']?\s*javascript:/i.test(text)) out.push(`javascript: URL in a ${where} attribute`);
    if (where === 'md' && /\]\(\s*javascript:/i.test(text)) out.push('javascript: URL as a Markdown link');
  }
  if (run.outputs.problems) {
    const rows = parse(run.outputs.problems.replace(/^#.*\r?\n?/m, ''), { relax_column_count: true }) as string[][];
    for (const cell of rows.flat()) {
      if (FORMULA_LEAD.test(cell)) out.push(`formula-leading cell in the problem rows: ${JSON.stringify(cell.slice(0, 40))}`);
    }
  }
  if (records !== null && run.rows && run.rows.rows + run.rows.rejected !== records) {
    out.push(`lines not counted: ${records} records written, report has rows ${run.rows.rows} + rejected ${run.rows.rejected}`);
  }
  return out;
}
