import {
  copyFileSync,
  linkSync,
  lstatSync,
  mkdirSync,
  mkdtempSync,
  readdirSync,
  readFileSync,
  rmSync,
  statSync,
  symlinkSync,
  writeFileSync,
} from 'node:fs';
import { tmpdir } from 'node:os';
import { join, relative } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { refuseInputOverwrite, writeFileAtomic, writeOutput } from '../src/cli-output.js';
import { InputError } from '../src/errors.js';
import { nestready } from './helpers/cli.js';

// the CLI cases need the build: npm run build --silent
const dir = mkdtempSync(join(tmpdir(), 'nestready-write-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const quiet = { quiet: true };

/** A fresh folder for one case, so that "no temporary file left" can list it. */
function folder(name: string): string {
  const d = join(dir, name);
  mkdirSync(d);
  return d;
}

describe('writing an output file', () => {
  it('replaces the file whole and leaves no temporary file', () => {
    const d = folder('whole');
    const path = join(d, 'r.json');
    writeFileSync(path, 'old content, longer than the new one');
    writeFileAtomic(path, '{}\n');
    expect(readFileSync(path, 'utf8')).toBe('{}\n');
    expect(readdirSync(d)).toEqual(['r.json']);
  });

  it('a failing render leaves the file as it was and no partial or temporary file', async () => {
    const d = folder('render');
    const kept = join(d, 'kept.html');
    writeFileSync(kept, 'the previous report');
    const failing = () => {
      throw new Error('render failed');
    };
    await expect(writeOutput({ path: kept, format: 'html' }, failing, quiet)).rejects.toThrow('render failed');
    await expect(writeOutput({ path: join(d, 'new.html'), format: 'html' }, async () => failing(), quiet)).rejects.toThrow();
    expect(readFileSync(kept, 'utf8')).toBe('the previous report');
    expect(readdirSync(d)).toEqual(['kept.html']);
  });

  it('a write that fails is an input error naming the file, and cleans up after itself', () => {
    const d = folder('fails');
    // the target is a folder: the temporary file is written, the rename fails
    const target = join(d, 'taken');
    mkdirSync(target);
    writeFileSync(join(target, 'inside'), 'x');
    expect(() => writeFileAtomic(target, 'report')).toThrow(InputError);
    expect(() => writeFileAtomic(target, 'report')).toThrow(new RegExp(`^${target}: cannot write the output \\(E[A-Z]+\\)$`));
    expect(readdirSync(d)).toEqual(['taken']);
    expect(() => writeFileAtomic(join(d, 'no-such-folder', 'r.json'), 'x')).toThrow(
      /no-such-folder\/r\.json: cannot write the output \(ENOENT\)/,
    );
  });

  it('writes through a symbolic link and keeps the permissions of the file it replaces', () => {
    const d = folder('link');
    const real = join(d, 'real.md');
    writeFileSync(real, 'old', { mode: 0o640 });
    symlinkSync('real.md', join(d, 'link.md'));
    writeFileAtomic(join(d, 'link.md'), 'new');
    expect(readFileSync(real, 'utf8')).toBe('new');
    expect(lstatSync(join(d, 'link.md')).isSymbolicLink()).toBe(true);
    expect(statSync(real).mode & 0o777).toBe(0o640);
    expect(readdirSync(d).sort()).toEqual(['link.md', 'real.md']);
  });
});

describe('outputs never overwrite an input', () => {
  const d = folder('inputs');
  const delivery = join(d, 'delivery.csv');
  const roles = join(d, 'roles.yaml');
  writeFileSync(delivery, 'g,y\nA,1\n');
  writeFileSync(roles, 'group: g\n');
  const inputs = [
    { path: delivery, what: 'the delivery' },
    { path: roles, what: 'the role map' },
  ];

  it('however the path is written: as given, relative, through a link or a hard link', () => {
    symlinkSync(delivery, join(d, 'via-link.csv'));
    linkSync(roles, join(d, 'hard.yaml'));
    const same = [delivery, relative(process.cwd(), delivery), join(d, '.', 'delivery.csv'), join(d, 'via-link.csv')];
    for (const path of same) {
      expect(() => refuseInputOverwrite([{ path, option: '--out' }], inputs)).toThrow(
        `${path}: --out would overwrite the delivery; choose another file`,
      );
    }
    expect(() => refuseInputOverwrite([{ path: join(d, 'hard.yaml'), option: '--problems' }], inputs)).toThrow(
      /would overwrite the role map/,
    );
    expect(() => refuseInputOverwrite([{ path: join(d, 'report.json'), option: '--out' }], inputs)).not.toThrow();
  });

  it('the CLI refuses --out on the delivery and --problems on the role map: exit 2, one line, inputs byte-identical', async () => {
    const copy = folder('cli');
    const csv = join(copy, 'repairs.csv');
    const map = join(copy, 'repairs.roles.yaml');
    copyFileSync('fixtures/demo/repairs-delivery.csv', csv);
    copyFileSync('fixtures/demo/repairs-delivery.roles.yaml', map);
    const before = [readFileSync(csv), readFileSync(map)];
    for (const [option, path, what] of [
      ['--out', csv, 'the delivery'],
      ['--problems', map, 'the role map'],
      ['--out', join(copy, '.', 'repairs.roles.yaml'), 'the role map'],
    ]) {
      const run = await nestready('audit', csv, '-r', map, option, path, '-f', 'json');
      expect(run.code, run.stderr).toBe(2);
      expect(run.stdout).toBe('');
      expect(run.stderr).toBe(`nestready: ${path}: ${option} would overwrite ${what}; choose another file\n`);
    }
    expect(readFileSync(csv).equals(before[0])).toBe(true);
    expect(readFileSync(map).equals(before[1])).toBe(true);
    expect(readdirSync(copy).sort()).toEqual(['repairs.csv', 'repairs.roles.yaml']);
  });
});
