import { beforeAll, describe, expect, it } from 'vitest';
import { renderHtml } from '../../src/report/html.js';
import { renderJson } from '../../src/report/json.js';
import { renderJunit } from '../../src/report/junit.js';
import { renderMarkdown } from '../../src/report/markdown.js';
import { renderText } from '../../src/report/text.js';
import type { Report } from '../../src/report/types.js';
import { MARKER_LEGEND, markerMeaning, markerPattern, visibleText, visibleValue } from '../../src/report/visible.js';
import { demoReport } from './fixtures/reports.js';

describe('invisible characters made visible', () => {
  it('marks spaces at either end of an ID, not inside it', () => {
    expect(visibleValue('W-014 ')).toBe('W-014␣');
    expect(visibleValue('  W 014')).toBe('␣␣W 014');
    expect(visibleValue(' ')).toBe('␣');
    expect(visibleValue('')).toBe('');
    expect(visibleValue('W-014')).toBe('W-014');
  });

  it('marks controls by their control picture and other invisible characters by name or code point', () => {
    expect(visibleValue('a\tb\r\n')).toBe('a␉b␍␊');
    expect(visibleValue('\u0001\u007f')).toBe('␁␡');
    expect(visibleValue('W\u00a0014')).toBe('W⟨NBSP⟩014');
    expect(visibleValue('\ufeffW-014\u200b')).toBe('⟨BOM⟩W-014⟨ZWSP⟩');
    expect(visibleValue('1\u20072')).toBe('1⟨U+2007⟩2');
    // a space next to an invisible character at the end is still at the end
    expect(visibleValue('W \u00a0')).toBe('W␣⟨NBSP⟩');
  });

  it('shows a control picture written in the data by its code point, so a marker always means an invisible character', () => {
    expect(visibleValue('a␣b')).toBe('a⟨U+2423⟩b');
  });

  it('leaves ordinary text alone', () => {
    for (const s of ['W-052: 8 ×27 / 6 ×3', 'Zürich – café', '日本', 'a, b … (+7 more)']) {
      expect(visibleValue(s)).toBe(s);
      expect(visibleText(s)).toBe(s);
    }
  });

  it('marks values quoted in a message (as the rules quote them) and invisible characters anywhere in it', () => {
    const message = `2 workshop value(s) are one ID written in more than one way: ${JSON.stringify('W-014 ')} (3) / "W-014" (40)`;
    expect(visibleText(message)).toBe('2 workshop value(s) are one ID written in more than one way: "W-014␣" (3) / "W-014" (40)');
    expect(visibleText(`holds ${JSON.stringify('\tx"y\\')}`)).toBe('holds "␉x\\"y\\\\"');
    expect(visibleText('read as numbers ("12" = "12.0")')).toBe('read as numbers ("12" = "12.0")');
    expect(visibleText('a\u00a0b "unclosed \u200b')).toBe('a⟨NBSP⟩b "unclosed ⟨ZWSP⟩');
  });

  it('finds every marker it writes and says what each stands for', () => {
    const text = visibleValue(' \t\u00a0\u2007x\u0001 ');
    expect(text.match(markerPattern())).toEqual(['␣', '␉', '⟨NBSP⟩', '⟨U+2007⟩', '␁', '␣']);
    expect(text.match(markerPattern())?.map(markerMeaning)).toEqual([
      'space at the start or end',
      'tab',
      'no-break space (U+00A0)',
      'invisible character U+2007',
      'control character U+0001',
      'space at the start or end',
    ]);
  });
});

/** The demo report with one finding whose IDs and values hide invisible characters, as id-variants would word it. */
function reportWithHiddenCharacters(): Report {
  const r = demoReport();
  r.findings = [
    {
      rule: 'id-variants',
      severity: 'blocker',
      column: 'workshop',
      messageId: 'groups',
      data: { count: 1, column: 'workshop' },
      message: `1 workshop value(s) are one ID written in more than one way: ${JSON.stringify('W-014 ')} (3) / "W-014" (40)`,
      fix: 'Ask the sender to write each workshop one way',
      count: 2,
      groups: ['W-014 ', '\u00a0W-015'],
      rows: [12, 13],
      values: ['8\t9', 'x\u200b'],
    },
  ];
  return r;
}

describe('invisible characters in every human-readable output, raw in the JSON', () => {
  const report = reportWithHiddenCharacters();
  let html: string;
  beforeAll(async () => {
    html = await renderHtml(report);
  });

  it('marks them in the terminal text, with the convention explained once', () => {
    const text = renderText(report, { color: 0 });
    expect(text).toContain('one way: "W-014␣" (3) / "W-014" (40)');
    expect(text).toContain('groups: W-014␣, ⟨NBSP⟩W-015');
    expect(text).toContain('values: 8␉9; x⟨ZWSP⟩');
    expect(text).toContain(MARKER_LEGEND);
    // a report without markers says nothing about them
    expect(renderText(demoReport(), { color: 0 })).not.toContain(MARKER_LEGEND);
  });

  it('marks them in Markdown and JUnit', () => {
    const md = renderMarkdown(report);
    expect(md).toContain('"W-014␣" (3)');
    expect(md).toContain('| W-014␣, ⟨NBSP⟩W-015 |');
    expect(md).toContain('values: 8␉9; x⟨ZWSP⟩');
    expect(md).toContain(MARKER_LEGEND);
    const xml = renderJunit(report, { failOn: 'blocker' });
    expect(xml).toContain('groups: W-014␣, ⟨NBSP⟩W-015');
    expect(xml).toContain('values: 8␉9; x⟨ZWSP⟩');
    expect(xml).toContain('message="1 workshop value(s) are one ID written in more than one way: &quot;W-014␣&quot; (3)');
  });

  it('marks them in HTML, each marker styled apart and named on hover, the convention in the legend', () => {
    const edge = '<span class="inv" title="space at the start or end">␣</span>';
    expect(html).toContain(`&quot;W-014${edge}&quot; (3)`);
    expect(html).toContain(`<dd>W-014${edge}, <span class="inv" title="no-break space (U+00A0)">⟨NBSP⟩</span>W-015</dd>`);
    expect(html).toContain('<li>8<span class="inv" title="tab">␉</span>9</li>');
    expect(html).toContain('<p class="reading-legend">Invisible characters in IDs and values are shown as markers: <span class="inv"');
  });

  it('keeps the raw values in the JSON report', () => {
    const json = JSON.parse(renderJson(report));
    expect(json.findings[0].groups).toEqual(['W-014 ', '\u00a0W-015']);
    expect(json.findings[0].values).toEqual(['8\t9', 'x\u200b']);
    expect(json.findings[0].message).toContain('"W-014 " (3)');
  });

  it('marks a group ID in the table of extreme group means', () => {
    const r = demoReport();
    r.plots!.groupMeans.repair_minutes.points[0].group = 'W-017 ';
    expect(renderMarkdown(r)).toContain('| W-017␣ | 1 of 66 |');
  });
});
