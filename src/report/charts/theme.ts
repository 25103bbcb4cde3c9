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
    labelLimit: 260,
    // a long column name must not stretch the chart
    titleLimit: 240,
  },
  legend: { labelColor: PALETTE.ink, titleColor: PALETTE.ink, labelFontSize: 11, titleFontSize: 12, orient: 'bottom', labelLimit: 320 },
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

/** Width and height of a chart's plotting area in px. */
export const CHART_SIZE = { width: 620, height: 240 } as const;
