/**
 * Classes of generated input that still fail the contract, switched off until their fix lands,
 * each with the reason; `a+b` names the cases of both classes. The suite prints this list on
 * every run: a class here is not generated, and says so, rather than being skipped in silence.
 * Empty it as the fixes come in.
 */
export const PENDING: Record<string, string> = {
  xlsx:
    'a workbook written by exceljs fails now and then: "cannot read as Excel .xlsx (Cannot read properties of undefined ' +
    "(reading 'sheets'))\" and leaves exceljs's tmp-* file (5 of 1,585 at seed 20261202, case 270 of the seeded 500 once " +
    'the mixed-line-ends class was generated again; the same file passes on a rerun; src/source/formats/xlsx.ts)',
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
export const PENDING_CHECKS: { class: string; breach: string; reason: string }[] = [];
