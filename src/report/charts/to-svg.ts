import * as vega from 'vega';
import * as vl from 'vega-lite';
import { escapeHtml } from '../escape-html.js';
import type { ChartVariant } from './theme.js';
import { CHART_WIDTHS } from './theme.js';
import type { Chart } from './types.js';
import { wrapLines } from './wrap.js';

/**
 * Render a chart headless to one SVG string at a variant's whole width: Vega-Lite compiled to
 * Vega, a View with no renderer, `toSVG()`. Vega escapes every text and attribute it writes. The
 * root gets role="img" with a <title> and <desc> (the alt text) and the variant as its class, and
 * every id inside is renamed with the chart's id and variant so that several SVGs can sit in one
 * page and the bytes are the same on every run.
 */
export async function chartToSvg(chart: Chart, variant: ChartVariant = 'wide'): Promise<string> {
  const width = CHART_WIDTHS[variant];
  const spec = {
    ...chart.spec,
    width,
    // the given width is the whole drawing's, axes and legend included, so it fills its card exactly
    autosize: { type: 'fit-x', contains: 'padding' },
    title: fitted(chart.spec.title as Title, width),
  } as Chart['spec'];
  const view = new vega.View(vega.parse(vl.compile(spec).spec), { renderer: 'none' });
  let svg: string;
  try {
    svg = await view.toSVG();
  } finally {
    view.finalize();
  }
  const id = variant === 'wide' ? chart.id : `${chart.id}-${variant}`;
  return accessible(localIds(svg, id), chart, id, variant);
}

interface Title {
  text: string;
  subtitle?: string;
}

/**
 * Title and subtitle wrapped onto lines that fit the width, rather than cut by Vega: headless Vega
 * has no font metrics and guesses every glyph 0.8 em wide, so its own cut would fall far too early.
 */
function fitted(title: Title, width: number): object {
  const room = width - 24;
  // generous average glyph widths of the 14 px bold title and the 12 px subtitle, so a line never reaches the edge
  const subtitle = title.subtitle === undefined ? {} : { subtitle: wrapLines(title.subtitle, Math.floor(room / 7)) };
  return { ...title, text: wrapLines(title.text, Math.floor(room / 9)), ...subtitle, limit: 0 };
}

function localIds(svg: string, prefix: string): string {
  const names = new Map<string, string>();
  const local = (id: string) => {
    let name = names.get(id);
    if (name === undefined) {
      name = `${prefix}-${names.size + 1}`;
      names.set(id, name);
    }
    return name;
  };
  return svg
    .replace(/\bid="([^"]+)"/g, (_, id: string) => `id="${local(id)}"`)
    .replace(/url\(#([^)]+)\)/g, (_, id: string) => `url(#${local(id)})`)
    .replace(/href="#([^"]+)"/g, (_, id: string) => `href="#${local(id)}"`);
}

function accessible(svg: string, chart: Chart, id: string, variant: ChartVariant): string {
  const t = `${id}-title`;
  const d = `${id}-desc`;
  const open = svg.indexOf('>', svg.indexOf('<svg')) + 1;
  const head = svg
    .slice(0, open)
    .replace('<svg ', `<svg role="img" aria-labelledby="${t} ${d}" focusable="false" `)
    .replace(/\bclass="([^"]*)"/, `class="$1 ${variant}"`);
  return (
    `${head}<title id="${t}">${escapeHtml(chart.title)}</title><desc id="${d}">${escapeHtml(chart.description)}</desc>` +
    `${svg.slice(open)}`
  );
}
