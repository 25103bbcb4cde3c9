/**
 * A chart title or subtitle as lines that fit `maxChars`: broken after "; " between clauses where
 * it can, else between words, so that a narrow drawing shows the whole text instead of cutting
 * it; only a single word longer than a line (a very long column name) is cut, with an ellipsis.
 */
export function wrapLines(text: string, maxChars: number): string[] {
  const lines: string[] = [];
  let line = '';
  for (const piece of text.split(/(?<=; )/)) {
    for (const word of piece.length > maxChars ? piece.split(/(?<= )/) : [piece]) {
      if (line && (line + word).trimEnd().length > maxChars) {
        lines.push(line.trimEnd());
        line = '';
      }
      line += word;
    }
  }
  if (line.trim()) lines.push(line.trimEnd());
  return lines.map((l) => (l.length > maxChars ? `${l.slice(0, maxChars - 1)}…` : l));
}
