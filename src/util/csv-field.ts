/**
 * One CSV field (RFC 4180): quoted when it holds a comma, quote, CR or LF, quotes doubled. A
 * field that starts with `=`, `+`, `-`, `@`, a tab or CR gets a leading single quote first, so a
 * spreadsheet shows it as text instead of running it as a formula (OWASP, "CSV Injection").
 */
export function csvField(value: string | number | null | undefined): string {
  if (value === null || value === undefined) return '';
  let s = String(value);
  if (typeof value === 'string' && /^[=+\-@\t\r]/.test(s)) s = `'${s}`;
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}
