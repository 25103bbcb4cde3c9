/**
 * Text safe inside a Markdown table cell or paragraph: HTML-significant characters become
 * entities (no raw HTML reaches the page), Markdown punctuation is backslash-escaped (no
 * emphasis, links or code spans from data values), pipes cannot end a cell and line breaks
 * become spaces.
 */
export function mdText(value: unknown): string {
  return String(value)
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/[\\`*_[\]{}()#+!|~]/g, (c) => `\\${c}`)
    .replace(/\r\n|\r|\n/g, ' ');
}
