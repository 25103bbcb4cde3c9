const DELIMITERS = [',', ';', '\t', '|'];

/**
 * The delimiter of a delimited text when its first two lines leave no doubt: exactly one of
 * , ; tab | appears in the header, as often in the next line. DuckDB's sniffer then tries that
 * delimiter only (its guess of quotes, line ends and types is unchanged), which saves part of
 * the sniff of a large file. Anything less plain (a quoted delimiter, one line) is left to the sniffer.
 */
export function delimiterHint(text: string): string | undefined {
  const lines = text.replace(/^\uFEFF/, '').split(/\r?\n/, 3);
  if (lines.length < 3) return undefined; // the second line is not known to be whole
  const count = (line: string, d: string) => line.split(d).length - 1;
  const inHeader = DELIMITERS.filter((d) => count(lines[0], d) > 0);
  if (inHeader.length !== 1) return undefined;
  const [d] = inHeader;
  return count(lines[1], d) === count(lines[0], d) ? d : undefined;
}
