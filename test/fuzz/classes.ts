/**
 * Classes of generated input that still fail the contract, switched off until their fix lands,
 * each with the reason; `a+b` names the cases of both classes. The suite prints this list on
 * every run: a class here is not generated, and says so, rather than being skipped in silence.
 * Empty it as the fixes come in.
 */
export const PENDING: Record<string, string> = {};

/**
 * Checks not applied to one class of case, with the reason: the class is still generated and
 * every other check holds for it. Printed on every run, like PENDING.
 */
export const PENDING_CHECKS: { class: string; breach: string; reason: string }[] = [];
