import { catalogue } from '../../rules/index.js';
import { buildProfile } from '../../src/profile/build.js';
import type { Profile } from '../../src/profile/types.js';
import { parseRoles } from '../../src/roles/load.js';
import { openDelivery } from '../../src/source/open.js';

/** The profile of a delivery file under a role map (YAML text), for tests of what rules read. */
export async function profileOf(path: string, rolesYaml: string): Promise<{ profile: Profile }> {
  const { roles } = parseRoles(rolesYaml, 'roles.yaml', catalogue);
  const source = await openDelivery(path, roles, { missing: roles.missing, threads: 1 });
  try {
    return { profile: await buildProfile(source, roles) };
  } finally {
    await source.close();
  }
}
