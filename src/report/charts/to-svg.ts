import * as vega from 'vega';
import * as vl from 'vega-lite';
import { escapeHtml } from '../escape-html.js';
import type { Chart } from './types.js';

/**
 * Render a chart headless to one SVG string: Vega-Lite compiled to Vega, a View with no
 * renderer, `toSVG()`. Vega escapes every text and attribute it writes. The root gets
 * role="img" with a <title> and <desc> (the alt text), and every id inside is renamed with the
 * chart's id so that several SVGs can sit in one page and the bytes are the same on every run.
 */
export async function chartToSvg(chart: Chart): Promise<string> {
  const view = new vega.View(vega.parse(vl.compile(chart.spec).spec), { renderer: 'none' });
  let svg: string;
  try {
    svg = await view.toSVG();
  } finally {
    view.finalize();
  }
  return accessible(localIds(svg, chart.id), chart);
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

function accessible(svg: string, chart: Chart): string {
  const t = `${chart.id}-title`;
  const d = `${chart.id}-desc`;
  const open = svg.indexOf('>', svg.indexOf('<svg')) + 1;
  const head = svg.slice(0, open).replace('<svg ', `<svg role="img" aria-labelledby="${t} ${d}" focusable="false" `);
  return (
    `${head}<title id="${t}">${escapeHtml(chart.title)}</title><desc id="${d}">${escapeHtml(chart.description)}</desc>` +
    `${svg.slice(open)}`
  );
}
