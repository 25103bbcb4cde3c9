import { escapeHtml as e } from '../escape-html.js';
import { poissonTable } from '../poisson-table.js';
import { slopesTable } from '../slopes-table.js';
import { anovaTable, componentsTable, extremesTable, groupsTable, predictorsTable } from '../stat-tables.js';
import { threeLevelTables } from '../three-level-table.js';
import type { Report } from '../types.js';
import { statTableHtml } from './stat-table.js';

/** Rendered SVG of each chart by section (null where a chart has nothing to show). */
export interface ChartSvgs {
  sizes: string | null;
  means: Map<string, string>;
  icc: string | null;
  predictors: string | null;
}

function figure(svg: string | null, caption: string): string {
  if (!svg) return '';
  return `<figure class="chart">${svg}<figcaption>${e(caption)}</figcaption></figure>`;
}

/** What the group-size chart marks, saying only what this delivery has. */
function sizesCaption(report: Report): string {
  const threshold = report.plots?.smallGroupThreshold;
  const small = report.plots?.groupSizes.some((h) => h.count > 0 && (h.size === 1 || (threshold !== undefined && h.size < threshold)));
  const line = threshold !== undefined ? ` The dashed line marks the small-group threshold (${threshold} records).` : '';
  return small
    ? `Records per group. Singletons and groups below the small-group threshold have their own colour, named in the legend.${line}`
    : `Records per group: no singletons${threshold !== undefined ? ' and no small groups' : ''}.${line}`;
}

/** The statistics section: groups, each outcome's variance components, ICCs and level-1 shares, with plots. */
export function statisticsHtml(report: Report, svgs: ChartSvgs): string {
  const out = ['<section id="statistics" aria-labelledby="statistics-h">', '<h2 id="statistics-h">Statistics</h2>'];
  if (!report.plots) out.push('<p class="muted">This report carries no plot data, so it has no plots.</p>');

  out.push('<section aria-labelledby="groups-h"><h3 id="groups-h">Groups</h3>', statTableHtml(groupsTable(report)));
  out.push(figure(svgs.sizes, sizesCaption(report)), '</section>');

  const names = Object.keys(report.outcomes);
  out.push('<section aria-labelledby="outcomes-h"><h3 id="outcomes-h">Outcomes</h3>');
  if (!names.length) out.push('<p class="muted">No numeric outcome was profiled.</p>');
  for (const name of names) {
    const o = report.outcomes[name];
    out.push(
      `<h4>Outcome <code>${e(name)}</code></h4>`,
      '<div class="tables">',
      statTableHtml(componentsTable(name, o)),
      statTableHtml(anovaTable(name, o)),
      ...threeLevelTables(name, o).map(statTableHtml),
      '</div>',
    );
    out.push(
      figure(
        svgs.means.get(name) ?? null,
        `Group means of ${name}, lowest to highest, each with mean ± 1.96·SE; the dashed line is the overall (REML) mean. The wider ` +
          'the spread relative to the bars, the larger the ICC.' +
          (report.plots?.groupMeans[name]?.points.some((p) => p.n === 1)
            ? ' Hollow marks are singleton groups: one record gives no interval.'
            : ''),
      ),
    );
    const ext = extremesTable(report, name);
    if (ext) out.push(statTableHtml(ext));
    const slopes = slopesTable(name, o);
    if (slopes) out.push(statTableHtml(slopes));
    const poisson = poissonTable(name, o);
    if (poisson) out.push(statTableHtml(poisson));
  }
  if (svgs.icc) {
    out.push(
      '<h4>ICC by method</h4>',
      figure(
        svgs.icc,
        'REML, ML and ANOVA ICC(1) (with its 95% interval) for each outcome; methods differ in colour and shape. The dashed line is ' +
          'the low-ICC threshold.',
      ),
    );
  }
  out.push('</section>');

  const predictors = predictorsTable(report);
  if (predictors) {
    out.push(
      '<section aria-labelledby="predictors-h"><h3 id="predictors-h">Level-1 predictors</h3>',
      statTableHtml(predictors),
      figure(
        svgs.predictors,
        'Share of each numeric level-1 predictor’s variance between groups: bar REML ICC, tick ANOVA ICC(1). A clear between-group ' +
          'share calls for centring within groups.',
      ),
      '</section>',
    );
  }
  out.push('</section>');
  return out.join('\n');
}
