import { describe, expect, it } from 'vitest';
import { escapeHtml } from '../../src/report/escape-html.js';
import { renderHtml } from '../../src/report/html.js';
import { formatNumber } from '../../src/util/format.js';
import { demoReport, HOSTILE, hostileReport } from './fixtures/reports.js';

/** The <svg role="img"> charts of a page, each as its own string. */
function charts(html: string): string[] {
  return [...html.matchAll(/<svg role="img"[\s\S]*?<\/svg>(?=<figcaption>)/g)].map((m) => m[0]);
}

/** [whole, name, value] of each attribute of one tag (values are always quoted in our output). */
function attributes(tag: string): string[][] {
  const body = tag.replace(/^<[\w:-]+/, '').replace(/\/?>$/, '');
  const found = [...body.matchAll(/\s*([^\s=]+)(?:="([^"]*)"|='([^']*)')?/g)].map((m) => [m[0], m[1], m[2] ?? m[3] ?? '']);
  // everything in the tag must be name="value" pairs: a stray quote would have split an attribute
  expect(found.map((f) => f[0]).join(''), tag).toBe(body);
  return found;
}

describe('renderHtml', () => {
  it('says in its head how values were read (decimal commas, the word read as 1), escaped', async () => {
    const report = demoReport();
    report.input.reading = { decimalComma: true, binary: { fixed: { one: '<Yes>', zero: 'No' } } };
    const html = await renderHtml(report);
    expect(html).toContain('<p class="source">read: numbers with a decimal comma (12,5 as 12.5); fixed: &quot;&lt;Yes&gt;&quot; as 1');
    expect(await renderHtml(demoReport())).not.toContain('read: ');
  });

  it('puts the verdict first as a sentence, grade and score beneath it, then findings by severity, then statistics', async () => {
    const report = demoReport();
    const html = await renderHtml(report);
    const at = (s: string) => html.indexOf(s);
    expect(at('<h2 id="verdict-h">Not ready for a multilevel model</h2>')).toBeGreaterThan(0);
    const blockers = /<li class="sev-blocker"><span class="shape" aria-hidden="true">■<\/span> <strong>3 blockers<\/strong> to send back/;
    expect(html).toMatch(blockers);
    // a severity with nothing found stays in the tally, muted
    expect(html).toContain('<li class="sev-warning nil"><span class="shape" aria-hidden="true">◆</span> <strong>no warning</strong>');
    expect(html).toContain(`<p class="grade-line"><strong>grade F, score ${report.score} of 100</strong>`);
    expect(at('<h2 id="verdict-h">')).toBeLessThan(at('<p class="grade-line">'));
    expect(at('<p class="grade-line">')).toBeLessThan(at('id="findings-h"'));
    // no report card and no badges
    expect(html).not.toMatch(/class="(letter|badge)"|\/100/);
    expect(at('id="sev-blocker-h"')).toBeLessThan(at('id="sev-note-h"'));
    expect(at('id="findings-h"')).toBeLessThan(at('id="statistics-h"'));
    expect(html).toMatch(/^<!DOCTYPE html>\n<html lang="en">/);
  });

  it('shows every finding with its fix, listed groups and records', async () => {
    const report = demoReport();
    const html = await renderHtml(report);
    expect(report.findings.length).toBeGreaterThan(0);
    for (const f of report.findings) {
      expect(html).toContain(escapeHtml(f.message));
      expect(html).toContain(escapeHtml(f.fix));
      for (const g of f.groups ?? []) expect(html).toContain(escapeHtml(g));
      if (f.rows?.length) expect(html).toContain(f.rows.join(', '));
    }
    // severity is carried by words, not colour alone
    expect(html).toContain('Blockers: send back to the sender (3)</h3>');
    expect(html).toContain('<ol class="findings" start="4">'); // numbered through the report
    expect(html).toContain(
      '<li class="finding sev-blocker"><p class="sev"><span class="num">1</span> ' +
        '<span class="shape" aria-hidden="true">■</span> <span class="word">blocker</span></p>',
    );
    for (const f of report.findings) {
      expect(html).toContain(`<p class="origin">rule ${f.rule}${f.column ? `, column ${escapeHtml(f.column)}` : ''}</p>`);
    }
  });

  it('formats the statistics', async () => {
    const report = demoReport();
    const html = await renderHtml(report);
    const o = report.outcomes.repair_minutes;
    for (const [x, d] of [
      [o.reml.tau2, 4],
      [o.reml.sigma2, 4],
      [o.reml.icc, 4],
      [o.ml.icc, 4],
      [o.anova.icc, 4],
      [o.designEffect, 3],
      [o.effectiveN, 1],
      [o.meanReliability, 3],
      [report.groups.sizes.median, 1],
      [report.groups.sizes.mean, 1],
    ] as const) {
      expect(html).toContain(`>${formatNumber(x, d)}<`);
    }
    expect(html).toContain(`>${formatNumber(o.anova.ci95[0], 4)} to ${formatNumber(o.anova.ci95[1], 4)}<`);
    expect(html).toContain('>&lt; .001<'); // p of F
    expect(html).toContain('<caption>');
    expect(html).toContain('<th scope="col">');
    expect(html).toContain('<th scope="row">REML</th>');
  });

  it('renders every chart to an inline SVG with marks, a title and a description', async () => {
    const html = await renderHtml(demoReport());
    const svgs = charts(html);
    expect(svgs).toHaveLength(4); // sizes, group means, ICC, level-1 shares
    for (const svg of svgs) {
      expect(svg).toMatch(/<svg role="img" aria-labelledby="(chart-[\w-]+)-title \1-desc"/);
      expect(svg).toMatch(/<title id="chart-[\w-]+-title">[^<]+<\/title><desc id="chart-[\w-]+-desc">[^<]+<\/desc>/);
      expect(svg).toMatch(/class="mark-(rect|symbol|rule|tick|text)[^"]*"/);
      expect((svg.match(/<(path|line|rect)\b/g) ?? []).length).toBeGreaterThan(5);
    }
    // one mark per plotted group mean
    const means = demoReport().plots!.groupMeans.repair_minutes;
    const meansSvg = svgs.find((s) => s.includes('chart-means-0-title'))!;
    const symbols = /class="mark-symbol[^"]*"[^>]*>([\s\S]*?)<\/g>/.exec(meansSvg)![1];
    expect((symbols.match(/<path /g) ?? []).length).toBe(means.points.length);
  });

  it('is self-contained: no script, no external reference, a CSP that allows nothing else', async () => {
    const html = await renderHtml(demoReport());
    expect(html).not.toMatch(/<script|<link|<iframe|<object|<embed|<img/i);
    expect(html).not.toMatch(/(src|href)\s*=\s*["']?(https?:|\/\/|javascript:)/i);
    expect(html).not.toMatch(/url\((?!#)/);
    expect(html).toContain(`<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'`);
    const ids = [...html.matchAll(/\sid="([^"]+)"/g)].map((m) => m[1]);
    expect(new Set(ids).size).toBe(ids.length); // ids unique across all inline SVGs
  });

  it('is deterministic', async () => {
    expect(await renderHtml(demoReport())).toBe(await renderHtml(demoReport()));
  });

  it('escapes hostile values everywhere, including inside the charts', async () => {
    const html = await renderHtml(hostileReport());
    expect(html).not.toMatch(/<script|<img|<svg onload|<svg [^>]*onload/i);
    // no tag carries an event handler or a javascript: URL
    for (const tag of html.match(/<[a-zA-Z][^>]*>/g) ?? []) {
      for (const [, name, value] of attributes(tag)) {
        expect(name, tag).not.toMatch(/^on/i);
        if (/^(href|src|xlink:href|action)$/i.test(name)) expect(value, tag).toMatch(/^#/);
      }
    }
    expect(html).toContain(escapeHtml(HOSTILE.script));
    expect(html).toContain(escapeHtml(HOSTILE.attr));
    expect(html).toContain(escapeHtml(HOSTILE.img));
    expect(html).toContain(escapeHtml(HOSTILE.formula));
    expect(charts(html)).toHaveLength(4);
  });

  it('says so when the report carries no plot data', async () => {
    const report = demoReport();
    delete report.plots;
    const html = await renderHtml(report);
    expect(charts(html)).toHaveLength(0);
    expect(html).toContain('no plot data');
    for (const f of report.findings) expect(html).toContain(escapeHtml(f.message));
  });

  it('handles a clean report and statistics that are not estimable (null in JSON)', async () => {
    const report = demoReport();
    report.findings = [];
    report.verdict = 'ready';
    report.grade = 'A';
    report.score = 100;
    const o = report.outcomes.repair_minutes as unknown as Record<string, Record<string, unknown>>;
    o.reml.icc = null;
    o.anova.ci95 = [null, null];
    const html = await renderHtml(report);
    expect(html).toContain('No findings.');
    expect(html).toContain('<h2 id="verdict-h">Ready for a multilevel model</h2>');
    expect(html).toContain('grade A, score 100 of 100');
    expect(html).toContain('>n/a<');
    expect(charts(html).length).toBeGreaterThanOrEqual(3);
  });
});
