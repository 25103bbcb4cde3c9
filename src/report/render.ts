import type { FailOn } from '../severity.js';
import { renderJson } from './json.js';
import { renderJunit } from './junit.js';
import { renderMarkdown } from './markdown.js';
import { renderText } from './text.js';
import type { Report } from './types.js';

export interface RenderOptions {
  /** chalk colour level for text: 0 none … 3 truecolor */
  color: 0 | 1 | 2 | 3;
  failOn: FailOn;
  /** JSON: include `plots` and `rulesRun` */
  withPlotData: boolean;
}

type Renderer = (report: Report, options: RenderOptions) => string | Promise<string>;

/** One report format: everything the CLI, the docs and the audit need to know of it. */
interface ReportFormatEntry {
  /** what messages to the user call it ("wrote the HTML report to …") */
  name: string;
  /** `--out` file extensions that choose it, lower case */
  extensions: readonly string[];
  /** whether it reads the report's `plots` (so the audit computes them): always, never, or with `--with-plot-data` */
  plots: 'always' | 'never' | 'on-request';
  render: Renderer;
}

/** Every report format, one record each; every renderer is a pure function of the report. */
export const REPORT_FORMAT_TABLE = {
  text: { name: 'text', extensions: ['.txt'], plots: 'never', render: (r, o) => renderText(r, { color: o.color }) },
  json: { name: 'JSON', extensions: ['.json'], plots: 'on-request', render: (r, o) => renderJson(r, { withPlotData: o.withPlotData }) },
  md: { name: 'Markdown', extensions: ['.md', '.markdown'], plots: 'always', render: (r) => renderMarkdown(r) },
  // loaded on demand: the chart libraries cost start-up time that other formats need not pay
  html: { name: 'HTML', extensions: ['.html', '.htm'], plots: 'always', render: async (r) => (await import('./html.js')).renderHtml(r) },
  junit: { name: 'JUnit XML', extensions: ['.xml'], plots: 'never', render: (r, o) => renderJunit(r, { failOn: o.failOn }) },
} satisfies Record<string, ReportFormatEntry>;

export type ReportFormat = keyof typeof REPORT_FORMAT_TABLE;
export const REPORT_FORMATS = Object.keys(REPORT_FORMAT_TABLE) as ReportFormat[];

const entry = (format: ReportFormat): ReportFormatEntry => REPORT_FORMAT_TABLE[format];

/** What messages to the user call a format. */
export function formatName(format: ReportFormat): string {
  return entry(format).name;
}

/** Whether a format reads the report's `plots` (JSON only with `withPlotData`): the audit can skip them otherwise. */
export function needsPlotData(format: ReportFormat, options: Pick<RenderOptions, 'withPlotData'>): boolean {
  const plots = entry(format).plots;
  return plots === 'always' || (plots === 'on-request' && options.withPlotData);
}

/** Render a report in one format. */
export async function renderReport(report: Report, format: ReportFormat, options: RenderOptions): Promise<string> {
  return entry(format).render(report, options);
}

/** The format an output file's extension names (`report.html` → html), or undefined. */
export function formatForPath(path: string): ReportFormat | undefined {
  const m = /\.[^./\\]+$/.exec(path.toLowerCase());
  return m ? REPORT_FORMATS.find((f) => entry(f).extensions.includes(m[0])) : undefined;
}
