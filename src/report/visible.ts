/**
 * Invisible characters made visible wherever a report prints an ID or a value, so that "W-014 "
 * and "W-014" no longer look alike. One convention for every human-readable output (HTML, text,
 * Markdown, JUnit); the JSON report and the problem-rows file keep the raw values (they are data).
 *
 * - a space at the start or end of an ID or value: ␣
 * - a control character: its control picture (tab ␉, line feed ␊, carriage return ␍, … ␡)
 * - any other character that prints as nothing or as a plain space (no-break space, zero-width
 *   space, byte-order mark, direction marks, …): its short name or code point in angle brackets,
 *   e.g. ⟨NBSP⟩, ⟨U+2007⟩
 * - a control picture written in the data itself is shown by its code point, so every marker in a
 *   report stands for an invisible character
 */

const NAMES: Record<number, [short: string, long: string]> = {
  160: ['NBSP', 'no-break space'],
  173: ['SHY', 'soft hyphen'],
  8203: ['ZWSP', 'zero-width space'],
  8204: ['ZWNJ', 'zero-width non-joiner'],
  8205: ['ZWJ', 'zero-width joiner'],
  8206: ['LRM', 'left-to-right mark'],
  8207: ['RLM', 'right-to-left mark'],
  8239: ['NNBSP', 'narrow no-break space'],
  8288: ['WJ', 'word joiner'],
  12288: ['IDSP', 'ideographic space'],
  65279: ['BOM', 'byte-order mark'],
};

// controls (C0, DEL, C1), spaces other than U+0020, zero-width and direction marks, and the
// control pictures themselves (see above); the combining grapheme joiner apart (it would combine in a class)
const INVISIBLE = new RegExp(
  '(?:[\\u0000-\\u001F\\u007F-\\u00A0\\u00AD\\u061C\\u115F\\u1160\\u1680\\u180E\\u2000-\\u200F\\u2028-\\u202F' +
    '\\u205F-\\u206F\\u2400-\\u2426\\u3000\\u3164\\uFEFF\\uFFA0\\uFFF9-\\uFFFB]|\\u034F)',
  'g',
);

const QUOTED_OR_INVISIBLE = new RegExp(`"(?:[^"\\\\\\n]|\\\\.)*"|${INVISIBLE.source}`, 'g');

/** The run of spaces and invisible characters at the start, and the one at the end. */
const EDGES = new RegExp(`^(?: |${INVISIBLE.source})*|(?: |${INVISIBLE.source})*$`, 'g');

const EDGE_SPACE = '␣';
/** Every marker this module writes, for a renderer that styles them (see markerPattern). */
const MARKER = /␣|[\u2400-\u2421]|⟨(?:[A-Z]+|U\+[0-9A-F]{4,6})⟩/g;

/** The marker of one invisible character. */
function marker(ch: string): string {
  const code = ch.codePointAt(0) as number;
  if (code < 0x20) return String.fromCodePoint(0x2400 + code);
  if (code === 0x7f) return '␡';
  const name = NAMES[code];
  return name ? `⟨${name[0]}⟩` : `⟨U+${code.toString(16).toUpperCase().padStart(4, '0')}⟩`;
}

/** Invisible characters inside running text marked; plain spaces stay (they separate words). */
function markInside(text: string): string {
  return text.replace(INVISIBLE, marker);
}

/** An ID or value as a report prints it: every invisible character marked, spaces at either end too. */
export function visibleValue(value: string): string {
  const edges = new RegExp(EDGES.source, 'g');
  const mark = (ch: string) => (ch === ' ' ? EDGE_SPACE : marker(ch));
  // the edges first (a space there is marked too), then whatever is left inside
  const [lead, trail] = [...value.matchAll(edges)].map((m) => ({ at: m.index, text: m[0] }));
  if (lead.text.length === value.length) return [...value].map(mark).join('');
  const inside = value.slice(lead.text.length, trail ? trail.at : value.length);
  return [...lead.text].map(mark).join('') + markInside(inside) + [...(trail?.text ?? '')].map(mark).join('');
}

/**
 * A message or fix as a report prints it: invisible characters marked anywhere, and a value the
 * rule quoted ("W-014 ", written by quoteId as a JSON string) shown with its edge spaces and
 * control characters marked instead of escaped.
 */
export function visibleText(text: string): string {
  return text.replace(QUOTED_OR_INVISIBLE, (found) => {
    if (found.length === 1) return marker(found);
    let raw: unknown;
    try {
      raw = JSON.parse(found);
    } catch {
      return markInside(found);
    }
    return typeof raw === 'string' ? `"${visibleValue(raw).replace(/\\/g, '\\\\').replace(/"/g, '\\"')}"` : markInside(found);
  });
}

/** The convention in one paragraph, for the reader of a report that shows markers. */
export const MARKER_LEGEND =
  'Invisible characters in IDs and values are shown as markers: ␣ a space at the start or end, ␉ a tab, ␊ a line feed, ' +
  '␍ a carriage return (other control characters by their control picture), ⟨NBSP⟩ a no-break space, ⟨ZWSP⟩ a zero-width ' +
  'space, ⟨BOM⟩ a byte-order mark, any other by its code point (⟨U+2007⟩). The JSON report and the problem-rows file keep ' +
  'the values as written.';

/** Whether a rendered text shows any marker (and so needs MARKER_LEGEND). */
export function showsMarkers(text: string): boolean {
  return markerPattern().test(text);
}

/** What a marker stands for, in words (the HTML report's hover text). */
export function markerMeaning(mark: string): string {
  if (mark === EDGE_SPACE) return 'space at the start or end';
  if (mark.length === 1) {
    const code = (mark.codePointAt(0) as number) - 0x2400;
    const words: Record<number, string> = { 9: 'tab', 10: 'line feed', 13: 'carriage return', 33: 'delete character' };
    return words[code] ?? `control character U+${code.toString(16).toUpperCase().padStart(4, '0')}`;
  }
  const inner = mark.slice(1, -1);
  const named = Object.entries(NAMES).find(([, [short]]) => short === inner);
  return named ? `${named[1][1]} (U+${Number(named[0]).toString(16).toUpperCase().padStart(4, '0')})` : `invisible character ${inner}`;
}

/** A fresh copy of the pattern that finds markers in already marked text. */
export function markerPattern(): RegExp {
  return new RegExp(MARKER.source, 'g');
}
