import { createRequire } from 'node:module';

/**
 * The Ajv class, loaded on first use: an audit whose role map sets no rule params never needs it
 * (the role map itself is checked by precompiled code), and loading it would delay every start.
 * The one Node-only module the shared core reaches: the page's build puts src/page/ajv-class.ts,
 * which bundles Ajv, in its place (scripts/page-build.js).
 */
export function ajvClass(): typeof import('ajv').Ajv {
  return (createRequire(import.meta.url)('ajv') as typeof import('ajv')).Ajv;
}
