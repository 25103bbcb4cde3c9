#!/usr/bin/env node
// @ts-check
// The sender's page (src/page/): one browser bundle of the shared audit core and the WASM
// engine, the page's HTML, and DuckDB-WASM's worker and module beside them, in dist/page/,
// which `nestready page` copies and fills in. The bundle is built for the browser and fails on
// any import of a Node built-in: the core must import nothing Node-only. The one module put in
// another's place is the Ajv loader (src/util/ajv-class.ts, which loads Ajv on first use in
// Node; src/page/ajv-class.ts bundles it).
import { copyFileSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { builtinModules, createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { build } from 'esbuild';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');

/** The DuckDB-WASM files the page loads (the bundle with WebAssembly exceptions: every current browser). */
export const WASM_ASSETS = ['duckdb-browser-eh.worker.js', 'duckdb-eh.wasm'];

const NODE_BUILTIN = new RegExp(`^(node:.*|${builtinModules.map((m) => m.replace(/[/.]/g, '\\$&')).join('|')})$`);

/** @type {import('esbuild').Plugin} */
const browserOnly = {
  name: 'nestready-browser-only',
  setup(b) {
    b.onResolve({ filter: /ajv-class\.js$/ }, (args) =>
      /[\\/]util$/.test(args.resolveDir) ? { path: join(args.resolveDir, '../page/ajv-class.js') } : undefined,
    );
    b.onResolve({ filter: NODE_BUILTIN }, (args) => ({
      errors: [{ text: `the page may not import the Node built-in "${args.path}" (imported by ${args.importer.replace(`${root}/`, '')})` }],
    }));
  },
};

/**
 * Bundle a page entry (default the page's main module in dist/) for the browser.
 *
 * @param {{ entry?: string, outfile?: string, write?: boolean }} options
 */
export async function bundlePage(options = {}) {
  return build({
    entryPoints: [options.entry ?? join(root, 'dist/src/page/main.js')],
    ...(options.outfile && { outfile: options.outfile }),
    write: options.write ?? true,
    bundle: true,
    format: 'esm',
    platform: 'browser',
    target: ['chrome110', 'firefox110', 'safari16'],
    minify: true,
    legalComments: options.outfile ? 'linked' : 'none',
    plugins: [browserOnly],
    logLevel: 'silent',
  });
}

if (process.argv[1] === fileURLToPath(import.meta.url)) {
  const out = join(root, 'dist/page');
  rmSync(out, { recursive: true, force: true });
  mkdirSync(out, { recursive: true });
  try {
    await bundlePage({ outfile: join(out, 'page.js') });
  } catch (e) {
    const errors = /** @type {{ errors?: { text: string }[] }} */ (e).errors ?? [];
    for (const err of errors) process.stderr.write(`page-build: ${err.text}\n`);
    process.exit(1);
  }
  writeFileSync(join(out, 'index.html'), readFileSync(join(root, 'src/page/index.html'), 'utf8'));
  const dist = dirname(createRequire(import.meta.url).resolve('@duckdb/duckdb-wasm/dist/duckdb-eh.wasm'));
  for (const f of WASM_ASSETS) copyFileSync(join(dist, f), join(out, f));
}
