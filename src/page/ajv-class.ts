import { Ajv } from 'ajv';

/** The Ajv class in the page: bundled, in place of src/util/ajv-class.ts (scripts/page-build.js). */
export function ajvClass(): typeof Ajv {
  return Ajv;
}
