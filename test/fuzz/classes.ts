/**
 * Classes of generated input that still fail the contract, switched off until their fix lands,
 * each with the reason; `a+b` names the cases of both classes. The suite prints this list on
 * every run: a class here is not generated, and says so, rather than being skipped in silence.
 * Empty it as the fixes come in.
 */
export const PENDING: Record<string, string> = {
  'mixed-line-ends':
    'a CSV/TSV whose lines end in both LF and CRLF is refused: "cannot read as CSV (Invalid Input Error: Error when ' +
    'sniffing file)" (src/source: DuckDB\'s sniffer; e.g. "g,y\\n1,2\\r\\n1,3\\n2,4\\n2,5\\n")',
  ndjson:
    "an audit or problem-rows read of NDJSON of 3 to 40 records runs out of memory at the CLI's 100MB, now and then " +
    '(3 of 1,249 audits, most problem-rows reads; issue 11 item 4, src/source): flaky, so not generated',
  xlsx:
    'a workbook written by exceljs fails now and then: "cannot read as Excel .xlsx (Cannot read properties of undefined ' +
    "(reading 'sheets'))\" (5 of 1,585; the same file passes on a rerun; src/source/formats/xlsx.ts)",
  'quote-in-column-name':
    'a TSV (with BOM) whose header holds say "hi" (written "say ""hi""") is refused when the role map names it: ' +
    '"cannot read as TSV (Binder Error: Referenced column "say "hi"" not found in FROM clause!)" (src/source)',
  'padded-column-name':
    'a header name with edge spaces (" pad ") is read trimmed ("pad"), so a role map naming it as written is refused ' +
    '(src/source: the CSV sniffer and the Parquet writer trim it)',
};

/**
 * Checks not applied to one class of case, with the reason: the class is still generated and
 * every other check holds for it. Printed on every run, like PENDING.
 */
export const PENDING_CHECKS: { class: string; breach: string; reason: string }[] = [
  {
    class: 'xlsx',
    breach: 'temp files left',
    reason:
      'src/source/formats/xlsx.ts stops reading once it has its sheet; exceljs then keeps the worksheet it spooled to ' +
      'a tmp-* file until the process exits (the CLI leaves none; a library caller does)',
  },
];
