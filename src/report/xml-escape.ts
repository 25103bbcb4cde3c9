// characters XML 1.0 does not allow at all (C0 controls other than tab, LF, CR; U+FFFE/FFFF; lone surrogates)
const INVALID =
  // biome-ignore lint/suspicious/noControlCharactersInRegex: matching the control characters XML forbids is the point
  /[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/g;

/** Text for XML element content or a double-quoted attribute; disallowed characters become U+FFFD. */
export function xmlText(value: unknown): string {
  return String(value)
    .replace(INVALID, '\uFFFD')
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&apos;');
}

/** An attribute value: as xmlText, with tab, LF and CR kept as character references. */
export function xmlAttr(value: unknown): string {
  return xmlText(value).replace(/\t/g, '&#9;').replace(/\n/g, '&#10;').replace(/\r/g, '&#13;');
}
