import type { Engine } from '../types.js';
import { openPostgres } from './open.js';

/** PostgreSQL: a table or query where the delivery lives (a bare URL names neither, and is refused by openPostgres). */
export const postgresEngine: Engine = {
  name: 'postgres',
  open: (input, roles, options) => openPostgres(typeof input === 'string' ? { url: input } : input, roles, options),
};
