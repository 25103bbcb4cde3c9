// @ts-check
// What the bench runs and judges: its files, the foundation's rule set and the targets.
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

export const SCRIPTS = join(dirname(fileURLToPath(import.meta.url)), '..');
export const ROOT = join(SCRIPTS, '..');
export const BASELINE = join(SCRIPTS, 'bench-groupby.js');
export const CHILD = join(SCRIPTS, 'bench-child.js');
export const CLI = join(ROOT, 'dist/bundle/cli.js');
// the command as a user runs it: the bundle only exports main(), which this calls
export const BIN = join(ROOT, 'bin/nestready.js');
export const WORK = join(tmpdir(), 'nestready-bench');
export const OUT_DIR = join(ROOT, 'bench-output');

// the foundation's rules: the five it asked for, and the report of unreadable lines it came with
export const CORE_RULES = ['missing-group-id', 'level2-varies', 'few-groups', 'singleton-groups', 'low-icc', 'unreadable-lines'];
/** @type {Record<string, number>} */
export const TARGET_RATIO = { core: 2, full: 2.5 };
export const TARGET_RSS_MB = 300;
export const RATIO_AT_ROWS = 1_000_000;
export const JUDGED_AT_GROUPS = 5_000;
// and the scaling issue's: ten million rows audited within ten seconds
export const WALL_AT_ROWS = 10_000_000;
export const TARGET_WALL_MS = 10_000;

export const ROLES_YAML = `# nestready role map for scripts/synth.js deliveries (written by scripts/bench.js)
group: site_code
unit: record_id
parent: region_code
outcomes: [wait_minutes]
level1: [age_band, visits, distance_km]
level2: [site_type, staff, opened_year]
`;

/** @param {number} n */
export const fmtInt = (n) => n.toLocaleString('en-US');
