import type { Config } from 'vega-lite';
import { PALETTE } from '../palette.js';

export const CHART_FONT = 'system-ui, -apple-system, "Segoe UI", Roboto, "Helvetica Neue", Arial, sans-serif';

/** The Vega-Lite config every chart shares: our palette, quiet axes, no per-mark ARIA bulk. */
export const CHART_CONFIG: Config = {
  background: PALETTE.panel,
  font: CHART_FONT,
  padding: 8,
  // per-mark aria-labels would repeat every data point; each chart gets one <title>/<desc> instead
  aria: false,
  view: { stroke: null },
  axis: {
    labelColor: PALETTE.muted,
    titleColor: PALETTE.ink,
    domainColor: PALETTE.line,
    tickColor: PALETTE.line,
    gridColor: PALETTE.grid,
    labelFontSize: 11,
    titleFontSize: 12,
    titleFontWeight: 600,
    // a long category (an outcome or column name) must not squeeze the plot; axis titles are our own words and are never cut
    labelLimit: 260,
  },
  // legend labels are our own words (kinds, methods): never cut
  legend: { labelColor: PALETTE.ink, titleColor: PALETTE.ink, labelFontSize: 11, titleFontSize: 12, orient: 'bottom', labelLimit: 0 },
  title: {
    color: PALETTE.ink,
    subtitleColor: PALETTE.muted,
    fontSize: 14,
    subtitleFontSize: 12,
    anchor: 'start',
    fontWeight: 600,
    subtitlePadding: 4,
  },
  range: { category: [PALETTE.accent, PALETTE.highlight, PALETTE.note, PALETTE.warning] },
  mark: { color: PALETTE.accent },
};

/** Height of a chart's plotting area in px; the width is the variant's (CHART_WIDTHS). */
export const CHART_SIZE = { width: 1088, height: 240 } as const;

/**
 * Each chart is drawn twice, at a whole width (axes, legend and padding included) that fills the
 * report's card on a wide screen and on a narrow screen or a printed page; the stylesheet shows
 * one. Scaling a single drawing would leave it either cramped wide or with unreadable text narrow.
 */
export const CHART_WIDTHS = { wide: 1088, narrow: 700 } as const;
export type ChartVariant = keyof typeof CHART_WIDTHS;

/** Count axes (groups, records per group, ranks): whole-number ticks only, never 0.5 groups. */
export const COUNT_AXIS = { tickMinStep: 1, format: 'd' } as const;
