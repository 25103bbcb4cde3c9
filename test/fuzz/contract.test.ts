import { describe, expect, it } from 'vitest';
import type { RunResult } from './contract.js';
import { breaches } from './contract.js';

// the checker must be able to fail: each breach it looks for, shown to it once
const w = { delivery: '/t/delivery.csv', roles: '/t/roles.yaml' };
const ok: RunResult = { code: 0, error: null, outputs: {}, rows: { rows: 3, rejected: 1 } };

describe('the fuzz contract flags what it promises to', () => {
  it('passes a clean run', () => {
    expect(breaches(ok, w, 4)).toEqual([]);
    expect(breaches({ code: 2, error: 'nestready: /t/roles.yaml:2:1: the role map: unknown key "x"', outputs: {} }, w, null)).toEqual([]);
  });

  it('exit 3, and errors of several lines, without the file, or with a stack', () => {
    expect(breaches({ ...ok, code: 3, error: 'nestready: internal error: x' }, w, null)[0]).toMatch(/^exit 3/);
    const run = (error: string) => breaches({ code: 2, error, outputs: {} }, w, null);
    expect(run('nestready: /t/delivery.csv: column "a\nb" is not in it')[0]).toMatch(/^error of 2 lines/);
    expect(run('nestready: out of memory within --memory-limit')[0]).toMatch(/^error not naming the file/);
    expect(run('nestready: /t/delivery.csv: boom\n    at f (file:///x.js:1:2)')).toContain('stack trace in the error');
  });

  it('raw markup or a javascript: URL in HTML or Markdown', () => {
    expect(breaches({ ...ok, outputs: { html: '<td><script>nrFuzz()</script></td>' } }, w, null)).toEqual([
      'raw markup in html: <script>nrFuzz()</script>',
    ]);
    expect(breaches({ ...ok, outputs: { html: '<td>&lt;script&gt;nrFuzz()&lt;/script&gt;</td>' } }, w, null)).toEqual([]);
    expect(breaches({ ...ok, outputs: { md: '[x](javascript:nrFuzz())' } }, w, null)).toEqual(['javascript: URL as a Markdown link']);
    expect(breaches({ ...ok, outputs: { md: 'value javascript:nrFuzz() as text' } }, w, null)).toEqual([]);
    const link = '<a href="javascript:nrFuzz()">x</a>';
    expect(breaches({ ...ok, outputs: { html: link } }, w, null)).toEqual(['javascript: URL in a html attribute']);
  });

  it('a formula-leading cell in the problem rows', () => {
    const csv = (cell: string) => `record,group,reason\r\n1,"${cell}",x\r\n`;
    expect(breaches({ ...ok, outputs: { problems: csv("'=1+1") } }, w, null)).toEqual([]);
    expect(breaches({ ...ok, outputs: { problems: csv('=1+1') } }, w, null)).toEqual(['formula-leading cell in the problem rows: "=1+1"']);
    expect(breaches({ ...ok, outputs: { problems: csv('\tx') } }, w, null)).toHaveLength(1);
  });

  it('a line neither read nor counted as unreadable', () => {
    expect(breaches(ok, w, 5)).toEqual(['lines not counted: 5 records written, report has rows 3 + rejected 1']);
  });
});
