import { describe, expect, it } from 'vitest';
import { renderMarkdown } from '../../src/report/markdown.js';
import { mdHeading, mdLine, mdText } from '../../src/report/md-escape.js';
import { formatNumber } from '../../src/util/format.js';
import { demoReport, HOSTILE, hostileReport } from './fixtures/reports.js';

/** Cells of a Markdown table row, honouring `\|` escapes. */
function cells(line: string): string[] {
  return line
    .slice(1, -1)
    .split(/(?<!\\)\|/)
    .map((c) => c.trim());
}

describe('renderMarkdown', () => {
  it('has the verdict first, findings per severity as tables, then statistics', () => {
    const report = demoReport();
    const md = renderMarkdown(report);
    expect(md.split('\n').slice(0, 5)).toEqual([
      '# nestready: Not ready for a multilevel model',
      '',
      '**Not ready for a multilevel model: 3 blockers to send back, 1 note for the record.**',
      '',
      expect.stringMatching(new RegExp(`^grade F, score ${report.score} of 100 \\(100 less 25 a blocker, `)),
    ]);
    const at = (s: string) => md.indexOf(s);
    expect(at('### Blockers: send back to the sender (3)')).toBeGreaterThan(at('## Findings'));
    expect(at('### Notes: for the record (1)')).toBeGreaterThan(at('### Blockers: send back to the sender (3)'));
    expect(at('## Statistics')).toBeGreaterThan(at('### Notes: for the record (1)'));
    expect(md).not.toMatch(/\[X\]|\[!\]|\[i\]/);
    for (const f of report.findings) {
      expect(md).toContain(mdText(f.message));
      expect(md).toContain(mdText(f.fix));
      if (f.rows?.length) expect(md).toContain(f.rows.join(', '));
    }
  });

  it('formats the numbers as the HTML report does', () => {
    const report = demoReport();
    const md = renderMarkdown(report);
    const o = report.outcomes.repair_minutes;
    expect(md).toContain(`| REML | ${formatNumber(o.reml.tau2, 4)} | ${formatNumber(o.reml.sigma2, 4)} | ${formatNumber(o.reml.icc, 4)} |`);
    expect(md).toContain(`| ICC(1) 95% interval | ${formatNumber(o.anova.ci95[0], 4)} to ${formatNumber(o.anova.ci95[1], 4)} |`);
    expect(md).toContain(`| design effect | ${formatNumber(o.designEffect, 3)} |`);
    expect(md).toContain('| item\\_age\\_years | 0.082 | 0.082 |');
  });

  it('keeps every table row at its column count and lets no hostile value become markup', () => {
    const md = renderMarkdown(hostileReport());
    expect(md).not.toMatch(/<script|<img|<svg/i);
    // an escaped ] closes no link text, so the ( after it opens no link target
    expect(md).not.toMatch(/(?<!\\)\]\(javascript:/);
    expect(md).not.toMatch(/(?<!\\)\*\*bold/);
    expect(md).not.toMatch(/(?<!\\)`code/);
    const lines = md.split('\n');
    for (let i = 0; i < lines.length; i++) {
      if (!/^\|[-:|]+\|$/.test(lines[i])) continue;
      const width = cells(lines[i - 1]).length;
      for (let k = i + 1; k < lines.length && lines[k].startsWith('|'); k++) expect(cells(lines[k]), lines[k]).toHaveLength(width);
    }
    expect(md).toContain(mdText(HOSTILE.md));
  });

  it('mdText escapes what Markdown and HTML would read', () => {
    expect(mdText('a|b')).toBe('a\\|b');
    expect(mdText('<b>&')).toBe('&lt;b&gt;&amp;');
    expect(mdText('<script>alert(1)</script>')).toBe('&lt;script&gt;alert(1)&lt;/script&gt;');
    expect(mdText('*x* _y_ [l](u) `c` ~~s~~ a\\b')).toBe('\\*x\\* \\_y\\_ \\[l\\](u) \\`c\\` \\~\\~s\\~\\~ a\\\\b');
    expect(mdText('one\ntwo\r\nthree')).toBe('one two three');
  });

  it('mdText leaves ordinary text as written', () => {
    for (const plain of ['value(s)', '1.5', '-0.25', '50%', 'ICC(1) 95% interval', 'a + b = c', '#3 of 10', 'e.g. {x}', 'n!', 'W-014'])
      expect(mdText(plain)).toBe(plain);
  });

  it('escapes a block opener only where the text starts a line or ends a heading', () => {
    expect(mdLine('# title')).toBe('\\# title');
    expect(mdLine('- item')).toBe('\\- item');
    expect(mdLine('+ item')).toBe('\\+ item');
    expect(mdLine('===')).toBe('\\===');
    expect(mdLine('12. item')).toBe('12\\. item');
    expect(mdLine('    code')).toBe('&#32;   code');
    expect(mdLine('> quote')).toBe('&gt; quote');
    expect(mdLine('nestready')).toBe('nestready');
    expect(mdHeading('y #')).toBe('y \\#');
    expect(mdHeading('y#2')).toBe('y#2');
  });
});
