import { InputError, quoteName } from '../../errors.js';

/**
 * A NUL byte in a column name (a JSON key "u\u0000x", an Arrow field) cannot be written in the SQL
 * that names the column: refused, naming the file and the column, before any query names it.
 */
export function refuseNulNames(names: readonly string[], display: string): void {
  const bad = names.find((n) => n.includes('\0'));
  if (bad !== undefined) {
    throw new InputError(`${display}: the column name ${quoteName(bad)} holds a NUL byte; rename the column and send the file again`);
  }
}
