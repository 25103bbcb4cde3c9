import { existsSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

/** nestready's own package.json, found by walking up from this file (src/ or dist/src/). */
function readPackage(): { name: string; version: string } {
  let dir = dirname(fileURLToPath(import.meta.url));
  for (let i = 0; i < 5; i++) {
    const candidate = join(dir, 'package.json');
    if (existsSync(candidate)) {
      const pkg = JSON.parse(readFileSync(candidate, 'utf8'));
      if (pkg.name === 'nestready') return { name: pkg.name, version: pkg.version };
    }
    dir = dirname(dir);
  }
  return { name: 'nestready', version: '0.0.0' };
}

export const TOOL = readPackage();
