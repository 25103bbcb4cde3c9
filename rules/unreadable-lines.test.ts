import { describe, expect, it } from 'vitest';
import { auditRows, findingsOf, onlyFinding } from '../test/helpers/delivery.js';
import { expectMessage } from '../test/helpers/messages.js';

const roles = { group: 'g', level1: ['x'] };

describe('unreadable-lines', () => {
  it('counts a line with too many fields, names its line number, leaves it out', async () => {
    // line 1 is the header; line 3 has four fields
    const report = await auditRows('g,x,z\na,1,p\nb,2,q,EXTRA\nc,3,r\n', roles);
    const f = onlyFinding(report, 'unreadable-lines');
    expect(f.severity).toBe('blocker');
    expect(f.count).toBe(1);
    expectMessage(f, 'rejected', { count: 1, columns: 3 });
    expect(f.data.lines).toMatch(/^line 3 \(.+\)$/);
    expect(report.input.rows).toBe(2);
    expect(report.input.rowsRejected).toBe(1);
  });

  it('a line with too few fields', async () => {
    const report = await auditRows('g,x,z\na,1,p\nb,2\nc,3,r\nd,4,s\n', roles);
    const f = onlyFinding(report, 'unreadable-lines');
    expect(f.count).toBe(1);
    expect(f.data.lines).toContain('line 3 (');
    expect(report.input.rows).toBe(3);
  });

  it('is silent on a clean file', async () => {
    const report = await auditRows('g,x\na,1\nb,2\n', roles);
    expect(findingsOf(report, 'unreadable-lines')).toEqual([]);
    expect(report.input.rowsRejected).toBe(0);
  });

  it('a value that is not a number in a numeric column is read, not rejected', async () => {
    // `x` is declared numeric, so it is first read as DOUBLE; "oops" makes the reader re-read it as text
    const report = await auditRows('g,x\na,1\nb,2\nc,oops\nd,4\n', { ...roles, types: { x: 'numeric' } });
    expect(findingsOf(report, 'unreadable-lines')).toEqual([]);
    expect(report.input.rows).toBe(4);
    expect(report.input.rowsRejected).toBe(0);
  });

  it('lists the first 20 lines and says how many more', async () => {
    const lines = ['g,x'];
    for (let i = 0; i < 30; i++) lines.push(i % 3 === 0 ? `g${i},${i},extra` : `g${i},${i}`);
    const report = await auditRows(`${lines.join('\n')}\n`, roles);
    const f = onlyFinding(report, 'unreadable-lines');
    expect(f.count).toBe(10);
    const listed = [...String(f.data.lines).matchAll(/line (\d+) \(/g)].map((m) => Number(m[1]));
    // record i is on line i + 2
    expect(listed).toEqual(Array.from({ length: 10 }, (_, k) => 3 * k + 2));
    expect(report.input.rows).toBe(20);

    const many = ['g,x'];
    for (let i = 0; i < 25; i++) many.push(`g${i},${i},extra`, `h${i},${i}`);
    const g = onlyFinding(await auditRows(`${many.join('\n')}\n`, roles), 'unreadable-lines');
    expect(g.count).toBe(25);
    expect([...String(g.data.lines).matchAll(/line (\d+) \(/g)]).toHaveLength(20);
    expect(g.data.lines).toMatch(/; … \(\+5 more\)$/);
  });

  it('severity override and off', async () => {
    const csv = 'g,x\na,1\nb,2,3\n';
    const noted = await auditRows(csv, { ...roles, rules: { 'unreadable-lines': { severity: 'note' } } });
    expect(onlyFinding(noted, 'unreadable-lines').severity).toBe('note');
    const off = await auditRows(csv, { ...roles, rules: { 'unreadable-lines': 'off' } });
    expect(findingsOf(off, 'unreadable-lines')).toEqual([]);
    // turning the rule off does not bring the line back
    expect(off.input.rowsRejected).toBe(1);
  });
});
