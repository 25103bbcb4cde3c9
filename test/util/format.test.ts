import { describe, expect, it } from 'vitest';
import { renderMarkdown } from '../../src/report/markdown.js';
import { renderText } from '../../src/report/text.js';
import { formatNumber, formatP, pClause } from '../../src/util/format.js';
import { demoReport } from '../report/fixtures/reports.js';

describe('formatNumber', () => {
  it('fixed digits, no "-0", "n/a" for non-finite', () => {
    expect(formatNumber(1.5, 2)).toBe('1.50');
    expect(formatNumber(-0.0001, 2)).toBe('0.00');
    expect(formatNumber(Number.NaN, 2)).toBe('n/a');
  });
});

describe('p-values', () => {
  it('three decimals without the leading zero, "< .001" below', () => {
    expect(pClause(0.0321)).toBe('p = .032');
    expect(pClause(0.05)).toBe('p = .050');
    expect(pClause(0.001)).toBe('p = .001');
    expect(pClause(0.000999)).toBe('p < .001');
    expect(pClause(3e-77)).toBe('p < .001');
    expect(pClause(0)).toBe('p < .001');
    expect(pClause(0.9996)).toBe('p > .999');
    expect(pClause(1)).toBe('p = 1');
    expect(pClause(Number.NaN)).toBe('p = n/a');
  });

  it('as a cell under "p": the relation only when it is not "="', () => {
    expect(formatP(0.0321)).toBe('.032');
    expect(formatP(1e-9)).toBe('< .001');
    expect(formatP(0.9999)).toBe('> .999');
  });

  it('the text and Markdown reports never write "p = <"', () => {
    const report = demoReport();
    const text = renderText(report, { color: 0 });
    // the demo outcome's ANOVA F has p ≈ 3e-77
    expect(text).toContain('df, p < .001');
    expect(text).not.toMatch(/p = [<>]/);
    const md = renderMarkdown(report);
    expect(md).toContain('| p | &lt; .001 |');
    expect(md).not.toMatch(/p = (&lt;|&gt;|<|>)/);
  });
});
