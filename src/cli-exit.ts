import { CommanderError } from 'commander';
import { InputError } from './errors.js';

/** How a run that threw ends: the exit code and the one line for stderr (null: nothing to add). */
export interface Ending {
  code: 0 | 2 | 3;
  line: string | null;
}

/**
 * Classify what a run threw: 2 for usage or input errors (the user can fix them), 3 for a bug in
 * nestready. The one place that decides, so that the fuzz suite judges its in-process runs alike.
 */
export function endingFor(e: unknown): Ending {
  // help and version are not errors; commander has already printed its message
  if (e instanceof CommanderError) return { code: e.exitCode === 0 ? 0 : 2, line: null };
  if (e instanceof InputError) return { code: 2, line: `nestready: ${e.message}` };
  const first = String((e as Error)?.message ?? e).split('\n')[0];
  // a resource limit the user sets, not a bug: say which option to change
  if (/Out of Memory Error/i.test(first)) {
    return { code: 2, line: `nestready: out of memory within --memory-limit (${first}); raise --memory-limit` };
  }
  return { code: 3, line: `nestready: internal error: ${first}` };
}
