import type { TopLevelSpec } from 'vega-lite';

/** One plot of the HTML report: a Vega-Lite spec plus the text a screen reader gets instead. */
export interface Chart {
  /** stable, attribute-safe id (never built from data values) */
  id: string;
  title: string;
  /** alt text: what the chart shows, in words and numbers */
  description: string;
  spec: TopLevelSpec;
}
