/**
 * Text safe inside a Markdown table cell or a line of running text, escaped no more than that
 * context needs, so that ordinary text (`value(s)`, `1.5`, `50%`) stays as written:
 * - HTML-significant `&`, `<`, `>` become entities: no raw HTML, no autolink, no entity from data;
 * - what opens inline markup is backslash-escaped: `*` and `_` (emphasis), backtick (code span),
 *   `[` and `]` (links and images: `(` after an escaped `]` opens nothing), `~` (strikethrough on
 *   the usual hosts), and the backslash itself;
 * - `|` cannot end a table cell, and line breaks become spaces (a cell is one line).
 */
export function mdText(value: unknown): string {
  return String(value)
    .replace(/\r\n|\r|\n/g, ' ')
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/[\\`*_[\]~|]/g, (c) => `\\${c}`);
}

/**
 * mdText for text that begins a line, where a leading character can start a block: a heading
 * (`#`), a list item (`-`, `+`, `1.`, `1)`), a setext underline (`=`, `-`) or, after four spaces,
 * a code block. (`>`, `*`, `_`, backtick and `~` are escaped by mdText already.)
 */
export function mdLine(value: unknown): string {
  return mdText(value)
    .replace(/^([#+=-])/, '\\$1')
    .replace(/^(\d+)([.)])/, '$1\\$2')
    .replace(/^ /, '&#32;');
}

/** mdText for the end of an ATX heading, where a run of `#` after a space would be dropped as its closing sequence. */
export function mdHeading(value: unknown): string {
  return mdText(value).replace(/(^|\s)(#+\s*)$/, '$1\\$2');
}
