/**
 * Classes of generated input that still fail the contract, switched off until their fix lands,
 * each with the reason. The suite prints this list on every run: a class here is not generated,
 * and says so, rather than being skipped in silence. Empty it as the fixes come in.
 */
export const PENDING: Record<string, string> = {};

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
