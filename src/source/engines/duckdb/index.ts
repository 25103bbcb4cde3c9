import type { Engine } from '../types.js';
import { openDelivery } from './open.js';

/** Embedded DuckDB: files in every registered format, and standard input (spooled). */
export const duckdbEngine: Engine = {
  name: 'duckdb',
  open: (input, roles, options) => {
    if (typeof input !== 'string') throw new Error('the DuckDB engine reads files only');
    return openDelivery(input, roles, options);
  },
};
