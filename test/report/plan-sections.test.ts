import { describe, expect, it } from 'vitest';
import { renderHtml } from '../../src/report/html.js';
import { renderMarkdown } from '../../src/report/markdown.js';
import { planSections } from '../../src/report/plan-sections.js';
import { renderText } from '../../src/report/text.js';
import type { Report } from '../../src/report/types.js';
import { demoReport } from './fixtures/reports.js';

/** The frozen demo report with the plan's parts added by hand. */
function planned(): Report {
  const r = demoReport();
  const name = Object.keys(r.outcomes)[0];
  r.outcomes[name].precision = {
    predictor: 'benches',
    kind: 'binary',
    category: '1',
    share: 0.4,
    groups: 60,
    meanSize: 50,
    sizeCv: 0.3,
    icc: 0.12,
    alpha: 0.05,
    targetPower: 0.8,
    df: 58,
    multiplier: 2.85,
    designEffect: 7.1,
    mdesEqual: 0.31,
    mdes: 0.33,
    effectSize: 0.25,
    power: 0.61,
  };
  r.weights = {
    level1: {
      column: 'w1',
      records: 3000,
      missing: 7,
      nonPositiveGroups: [],
      min: 0.5,
      designEffect: 1.4,
      effectiveN: 2142.9,
      scaling: {
        groups: 12,
        size: { min: 0.5, q1: 0.6, median: 50 / 75, q3: 0.7, max: 0.9 },
        effective: { min: 0.4, q1: 0.5, median: 40 / 75, q3: 0.6, max: 0.8 },
        extreme: Array.from({ length: 3 }, (_, j) => ({
          group: `<b>W-${j}`,
          n: 50,
          sum: 75,
          effectiveSize: 40,
          sizeScale: 50 / 75,
          effectiveScale: 40 / 75,
        })),
      },
    },
  };
  r.fitAdvice = {
    note: 'Guidance: the analysis plan decides.',
    items: [
      {
        topic: 'small-sample-inference',
        advice: 'REML',
        because: '60 groups',
        source: 'McNeish & Stapleton (2016)',
        rules: ['few-groups'],
      },
    ],
  };
  return r;
}

describe('plan sections in every renderer', () => {
  it('lists precision, weights (spread of the factors, extreme groups) and how to fit; none for a report without them', () => {
    const s = planSections(planned());
    expect(s.map((x) => x.heading)).toEqual(['Precision for the planned effect', 'Sampling weights', 'How to fit']);
    const [spread, extreme] = s[1].tables.slice(-2);
    expect(spread.caption).toMatch(/over 12 groups/);
    expect(spread.rows).toEqual([
      ['group size', '0.5000', '0.6000', '0.6667', '0.7000', '0.9000'],
      ['effective group size', '0.4000', '0.5000', '0.5333', '0.6000', '0.8000'],
    ]);
    expect(extreme.rows).toHaveLength(3);
    expect(extreme.caption).toMatch(/The 3 groups whose factors lie furthest from the median \(every group’s: --weight-factors/);
    expect(s[0].tables[0].rows.at(-1)).toEqual(['power for 0.25 SD (shifted central t)', '0.610']);
    expect(planSections(demoReport())).toEqual([]);
  });

  it('text, Markdown and HTML show them, values escaped', async () => {
    const r = planned();
    const text = renderText(r, { color: 0 });
    expect(text).toMatch(/How to fit\n {2}Guidance: the analysis plan decides\.\n {2}1\. REML\n {5}because: 60 groups \(few-groups\)/);
    expect(text).toMatch(/MDES \(SD\), unequal sizes +0\.330/);
    const md = renderMarkdown(r);
    expect(md).toContain('## Sampling weights');
    expect(md).toContain('| &lt;b&gt;W-0 | 50 | 75.000 | 40.00 | 0.6667 | 0.5333 |');
    const html = await renderHtml(r);
    expect(html).toContain('<h2 id="fit-h">How to fit</h2>');
    expect(html).toContain('&lt;b&gt;W-0');
    expect(html).not.toContain('<b>W-0');
  });
});
