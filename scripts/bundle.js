#!/usr/bin/env node
import { rmSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
// @ts-check
// The command line starts from one bundle (dist/bundle/cli.js) rather than from the hundreds of
// modules tsc writes to dist/: Node resolves and loads each module file on its own, which was a
// large part of every `nestready audit`'s start-up (docs/performance.md). The library (dist/src/index.js)
// stays as tsc writes it. The native DuckDB binding and the libraries loaded only for some
// formats and reports stay outside the bundle; the audit engine and the HTML renderer become
// chunks loaded on demand, as their dynamic imports in src/ say.
import { build } from 'esbuild';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const outdir = join(root, 'dist/bundle');
rmSync(outdir, { recursive: true, force: true });
await build({
  entryPoints: [join(root, 'dist/src/cli.js')],
  outdir,
  bundle: true,
  splitting: true,
  format: 'esm',
  platform: 'node',
  target: 'node20',
  external: ['@duckdb/*', 'vega', 'vega-lite', 'exceljs', 'apache-arrow', 'pg'],
  // CommonJS dependencies (ajv, @stdlib) call require() for Node's own modules
  banner: { js: "import { createRequire as nrCreateRequire } from 'node:module'; const require = nrCreateRequire(import.meta.url);" },
  logLevel: 'warning',
});
