import type { Roles } from '../../roles/types.js';
import { openSource } from '../engines/registry.js';
import type { DeliveryInput } from '../engines/types.js';
import type { OpenOptions, RejectedLine, Source } from '../types.js';
import { settleSource } from './settle.js';

/** Open the delivery as the audit read it and settle it for a second reading (see settleSource). */
export async function openSettled(
  input: DeliveryInput,
  roles: Roles,
  options: Omit<OpenOptions, 'missing'>,
): Promise<{ source: Source; rejected: RejectedLine[] }> {
  const source = await openSource(input, roles, { ...options, missing: roles.missing });
  try {
    return { source, rejected: await settleSource(source) };
  } catch (e) {
    await source.close();
    throw e;
  }
}
