// @ts-check
// `npm run demo`: audit the shipped demo delivery (it has planted defects, so its gate fails)
// and explain that the failed gate is the expected outcome, exiting 0.
import { spawnSync } from 'node:child_process';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const delivery = 'fixtures/demo/repairs-delivery.csv';
const roles = 'fixtures/demo/repairs-delivery.roles.yaml';
console.log(`$ nestready audit ${delivery} --roles ${roles}\n`);
const run = spawnSync(process.execPath, [join(root, 'bin/nestready.js'), 'audit', delivery, '--roles', roles], {
  cwd: root,
  stdio: 'inherit',
});
if (run.status === 1) {
  console.log('\nThe gate failed (exit code 1), as it should: this demo delivery has planted defects,');
  console.log('listed in fixtures/demo/README.md. The clean version passes:');
  console.log('  npx nestready audit fixtures/demo/repairs-clean.csv --roles fixtures/demo/repairs-clean.roles.yaml');
  process.exit(0);
}
process.exit(run.status ?? 2);
