import { escapeHtml } from '../escape-html.js';
import { markerMeaning, markerPattern } from '../visible.js';

/**
 * Text already run through visibleValue/visibleText, escaped for HTML, each marker in a span of
 * its own: styled apart from the data around it and named on hover.
 */
export function markedHtml(text: string): string {
  return escapeHtml(text).replace(markerPattern(), (m) => `<span class="inv" title="${escapeHtml(markerMeaning(m))}">${m}</span>`);
}
