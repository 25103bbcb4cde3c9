/** Whether a text sample ends some lines with CRLF and others with LF alone (see mixedLineEnds). */
export function endsMixed(bytes: Uint8Array): boolean {
  let crlf = false;
  let lf = false;
  for (let i = bytes.indexOf(0x0a); i >= 0 && !(crlf && lf); i = bytes.indexOf(0x0a, i + 1)) {
    if (i > 0 && bytes[i - 1] === 0x0d) crlf = true;
    else lf = true;
  }
  return crlf && lf;
}
