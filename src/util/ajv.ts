import type { Ajv, ErrorObject } from 'ajv';
import { quoteName } from '../errors.js';
import { ajvClass } from './ajv-class.js';

/**
 * The one Ajv factory: all errors, defaults filled in, unknown keywords tolerated in docs. The
 * schemas are the project's own, checked against the JSON Schema meta-schema by the tests
 * (`checkSchemas`); checking them again on every run would compile the meta-schema each time.
 */
export function createAjv(options: { checkSchemas?: boolean } = {}): Ajv {
  const AjvClass = ajvClass();
  return new AjvClass({ allErrors: true, useDefaults: true, strict: false, validateSchema: options.checkSchemas ?? false });
}

/** One readable fragment for an ajv error, e.g. `rules.few-groups.warn_below must be >= 1`. */
export function describeAjvError(error: ErrorObject, prefix: string[] = []): string {
  const path = [...prefix, ...pointerToPath(error.instancePath)];
  // a key that is not a plain name (a column with a newline or a dot) is quoted: one line, unambiguous
  const where = path.length ? path.map((p) => (/^[\w-]+$/.test(p) ? p : quoteName(p))).join('.') : 'the role map';
  if (error.keyword === 'additionalProperties') {
    const extra = (error.params as { additionalProperty: string }).additionalProperty;
    return `${where}: unknown key ${quoteName(extra)}`;
  }
  if (error.keyword === 'enum') {
    const allowed = (error.params as { allowedValues: unknown[] }).allowedValues;
    return `${where} must be one of ${allowed.map((v) => JSON.stringify(v)).join(', ')}`;
  }
  return `${where} ${error.message ?? 'is invalid'}`;
}

/** JSON pointer (`/a/b~1c`) to path segments. */
export function pointerToPath(pointer: string): string[] {
  if (!pointer) return [];
  return pointer
    .slice(1)
    .split('/')
    .map((s) => s.replace(/~1/g, '/').replace(/~0/g, '~'));
}
