// What is decided about a delivery's encoding from its first bytes, whoever read them: the
// command line (utf8-check.ts, from the file) or the page (engines/wasm, from the picked file).

/** The lines of a sample that are not UTF-8, and the encoding they most likely are in. */
export interface Utf8Check {
  /** lines holding a byte above 0x7F */
  nonAscii: number;
  /** of those, lines that are not valid UTF-8 */
  invalid: number;
  /**
   * windows-1252 when an invalid line holds a byte 0x80-0x9F (’ € – there; control characters in
   * Latin-1, which no text holds), else latin1 (accented letters only)
   */
  guess: 'windows-1252' | 'latin1';
}

/**
 * Count the lines of a sample that are not UTF-8 (a cut last line is left out when the sample is
 * not the whole file). The byte tests are the caller's: Node's own, or a TextDecoder's.
 */
export function countUtf8Lines(
  bytes: Uint8Array,
  whole: boolean,
  isAscii: (b: Uint8Array) => boolean,
  isUtf8: (b: Uint8Array) => boolean,
): Utf8Check {
  const check: Utf8Check = { nonAscii: 0, invalid: 0, guess: 'latin1' };
  if (isAscii(bytes)) return check;
  let start = 0;
  while (start < bytes.length) {
    const nl = bytes.indexOf(0x0a, start);
    if (nl < 0 && !whole) break;
    const line = bytes.subarray(start, nl < 0 ? bytes.length : nl);
    start = nl < 0 ? bytes.length : nl + 1;
    if (isAscii(line)) continue;
    check.nonAscii++;
    if (isUtf8(line)) continue;
    check.invalid++;
    if (line.some((b) => b >= 0x80 && b <= 0x9f)) check.guess = 'windows-1252';
  }
  return check;
}

/** The advice for text that is not UTF-8: the likely encoding and the option that reads it. */
export function encodingAdvice(check: Utf8Check): string {
  if (!check.invalid) return 'if it was saved by a Windows program, try --encoding windows-1252';
  return check.guess === 'windows-1252'
    ? 'looks like windows-1252 (bytes 0x80-0x9F such as ’ € –): try --encoding windows-1252'
    : 'looks like Latin-1: try --encoding latin1';
}

/**
 * Whether the sample shows a delivery in another encoding rather than a few damaged lines: at
 * least two lines not UTF-8, and more than half of the lines that hold non-ASCII bytes. One bad
 * line among valid UTF-8 ones is listed as an unreadable line instead.
 */
export function mostlyNotUtf8(check: Utf8Check): boolean {
  return check.invalid >= 2 && check.invalid * 2 > check.nonAscii;
}
