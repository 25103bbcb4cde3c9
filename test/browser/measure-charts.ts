/** One chart of the HTML report as the browser lays it out. */
export interface ChartMeasure {
  /** the chart's id (from its aria-labelledby) */
  id: string;
  /** which drawing is shown: 'wide' or 'narrow' */
  variant: string;
  /** how many drawings of the chart are shown (one) */
  shown: number;
  /** the figure's inner width (without padding) and the shown drawing's width, in CSS px */
  inner: number;
  width: number;
  height: number;
  title: string;
  desc: string;
  /** marks with a non-empty box */
  drawn: number;
  texts: string[];
  /** texts whose box reaches outside the drawing's box */
  outside: string[];
  legend: string[];
  axes: { title: string; labels: string[] }[];
}

/**
 * Measure every chart figure of a page. Runs inside the browser ($$eval), so it is one
 * self-contained function that reads only the elements it gets.
 */
export function measureCharts(figures: Element[]): ChartMeasure[] {
  return figures.map((figure) => {
    const all = [...figure.querySelectorAll('svg[role="img"]')];
    const shown = all.filter((s) => s.getBoundingClientRect().width > 0);
    const svg = shown[0] ?? all[0];
    const box = svg.getBoundingClientRect();
    const style = getComputedStyle(figure);
    const inner = figure.clientWidth - Number.parseFloat(style.paddingLeft) - Number.parseFloat(style.paddingRight);
    const texts = [...svg.querySelectorAll('text')].filter((t) => (t.textContent ?? '').trim() !== '');
    // half a pixel of slack: anti-aliasing of a glyph at the very edge is not a cut
    const outside = texts
      .filter((t) => {
        const b = t.getBoundingClientRect();
        return b.left < box.left - 0.5 || b.right > box.right + 0.5 || b.top < box.top - 0.5 || b.bottom > box.bottom + 0.5;
      })
      .map((t) => t.textContent ?? '');
    const marks = [...svg.querySelectorAll('g[class^="mark-"] > path, g[class^="mark-"] > line, g[class^="mark-"] > rect')];
    const textOf = (root: Element, role: string) => [...root.querySelectorAll(`g.${role} text`)].map((t) => t.textContent ?? '');
    const axes = [...svg.querySelectorAll('g.role-axis')].map((axis) => ({
      title: textOf(axis, 'role-axis-title').join(' '),
      labels: textOf(axis, 'role-axis-label'),
    }));
    return {
      id: (svg.getAttribute('aria-labelledby') ?? '').split(' ')[0].replace(/(-narrow)?-title$/, ''),
      variant: svg.classList.contains('narrow') ? 'narrow' : 'wide',
      shown: shown.length,
      inner,
      width: box.width,
      height: box.height,
      title: svg.querySelector('title')?.textContent ?? '',
      desc: svg.querySelector('desc')?.textContent ?? '',
      drawn: marks.filter((m) => {
        const b = (m as SVGGraphicsElement).getBBox();
        return b.width > 0 || b.height > 0;
      }).length,
      texts: texts.map((t) => t.textContent ?? ''),
      outside,
      legend: textOf(svg, 'role-legend-label'),
      axes,
    };
  });
}
