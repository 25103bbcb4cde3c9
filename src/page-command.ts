import { copyFileSync, existsSync, mkdirSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { catalogue } from '../rules/index.js';
import { InputError } from './errors.js';
import { SETTINGS_ID, settingsScript } from './page/settings.js';
import type { PresetName } from './presets/index.js';
import { loadRoles } from './roles/load-file.js';
import { TOOL } from './version.js';

/** Where `npm run build` put the page (scripts/page-build.js): dist/page, from this module in dist/src, dist/bundle or src. */
function builtPage(): string {
  const here = dirname(fileURLToPath(import.meta.url));
  const found = [join(here, '../page'), join(here, '../dist/page')].find((d) => existsSync(join(d, 'index.html')));
  if (!found) throw new Error('the page is not built: run npm run build');
  return found;
}

/**
 * `nestready page`: a folder with the sender's page, the role map (checked here, as `audit` checks
 * it) and its rule settings baked in. The role map's text goes in as written, so that the page
 * parses it with the command line's own errors when a data manager edits it there.
 *
 * @returns the files written
 */
export function writePage(options: { roles: string; preset?: PresetName; out: string }): string[] {
  loadRoles(options.roles, catalogue, options.preset ? { preset: options.preset } : {});
  const text = readFileSync(options.roles, 'utf8');
  const out = options.out;
  if (existsSync(out) && (!statSync(out).isDirectory() || readdirSync(out).length > 0)) {
    throw new InputError(`${out}: not an empty folder (the page is written into a new or empty one)`);
  }
  const from = builtPage();
  mkdirSync(out, { recursive: true });
  const written: string[] = [];
  for (const name of readdirSync(from)) {
    const target = join(out, name);
    if (name === 'index.html') {
      const settings = settingsScript({
        tool: TOOL,
        roles: { file: options.roles.split(/[\\/]/).pop() ?? options.roles, text },
        ...(options.preset && { preset: options.preset }),
      });
      const html = readFileSync(join(from, name), 'utf8').split('"__NR_SETTINGS__"');
      if (html.length !== 2 || !html[0].includes(`id="${SETTINGS_ID}"`)) throw new Error('dist/page/index.html: no settings slot');
      writeFileSync(target, html.join(settings));
    } else copyFileSync(join(from, name), target);
    written.push(target);
  }
  return written;
}
