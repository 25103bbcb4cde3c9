import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
// @ts-expect-error a checked JavaScript script without declarations
import { bundlePage } from '../../scripts/page-build.js';

// `npm run build` bundles the page with this check; here it must refuse a Node built-in reached
// through the shared code, and name the module that imports it.
describe('the page build', () => {
  it('fails on a Node built-in anywhere in what the page imports', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'nestready-page-build-'));
    try {
      const entry = join(dir, 'entry.ts');
      // the CSV reader is shared with the page; the file-reading text checks are the command line's
      writeFileSync(entry, `import '${resolve('src/source/formats/text-files-node.ts')}';\nimport '${resolve('src/audit-source.ts')}';\n`);
      const failed = await bundlePage({ entry, write: false }).then(
        () => null,
        (e: { errors: { text: string }[] }) => e.errors.map((x) => x.text),
      );
      // esbuild reports each import of it it meets; the module the entry names is among them
      expect(failed).toEqual(
        expect.arrayContaining([
          expect.stringMatching(
            /^the page may not import the Node built-in "node:fs" \(imported by src\/source\/formats\/[a-z0-9-]+\.ts\)$/,
          ),
        ]),
      );
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
