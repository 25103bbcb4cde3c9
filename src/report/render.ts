import type { FailOn } from '../grade.js';
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

/** Every report format and its renderer; each is a pure function of the report. */
export const RENDERERS = {
  text: (r, o) => renderText(r, { color: o.color }),
  json: (r, o) => renderJson(r, { withPlotData: o.withPlotData }),
  md: (r) => renderMarkdown(r),
  // loaded on demand: the chart libraries cost ~0.3 s of start-up that other formats need not pay
  html: async (r) => (await import('./html.js')).renderHtml(r),
  junit: (r, o) => renderJunit(r, { failOn: o.failOn }),
} satisfies Record<string, Renderer>;

export type ReportFormat = keyof typeof RENDERERS;

/** What each format is called in messages to the user. */
export const FORMAT_NAMES: Record<ReportFormat, string> = { text: 'text', json: 'JSON', md: 'Markdown', html: 'HTML', junit: 'JUnit XML' };
export const REPORT_FORMATS = Object.keys(RENDERERS) as ReportFormat[];

/** Whether a format reads the report's `plots` (JSON only with `withPlotData`): the audit can skip them otherwise. */
export function needsPlotData(format: ReportFormat, options: Pick<RenderOptions, 'withPlotData'>): boolean {
  return format === 'html' || format === 'md' || (format === 'json' && options.withPlotData);
}

/** Render a report in one format. */
export async function renderReport(report: Report, format: ReportFormat, options: RenderOptions): Promise<string> {
  return RENDERERS[format](report, options);
}

const EXTENSIONS: Record<string, ReportFormat> = {
  '.txt': 'text',
  '.json': 'json',
  '.md': 'md',
  '.markdown': 'md',
  '.html': 'html',
  '.htm': 'html',
  '.xml': 'junit',
};

/** The format an output file's extension names (`report.html` → html), or undefined. */
export function formatForPath(path: string): ReportFormat | undefined {
  const m = /\.[^./\\]+$/.exec(path.toLowerCase());
  return m ? EXTENSIONS[m[0]] : undefined;
}
