import { catalogue } from '../../rules/index.js';
import { InputError } from '../errors.js';
import type { PresetName } from '../presets/index.js';
import { problemsCsv } from '../problems/csv.js';
import { renderHtml } from '../report/html.js';
import { renderJson } from '../report/json.js';
import type { LoadedRoles } from '../roles/load.js';
import { parseRoles } from '../roles/load.js';
import type { WasmDatabase } from '../source/engines/wasm/types.js';
import type { Phase } from './audit-file.js';
import { auditPicked } from './audit-file.js';
import { startDatabase } from './engine.js';
import type { PageSettings } from './settings.js';
import { SETTINGS_ID } from './settings.js';

// The sender's page: pick a delivery, read it with DuckDB-WASM in this tab, show the command
// line's HTML report, offer its problem rows and JSON report for download.

const $ = <T extends HTMLElement>(id: string) => document.getElementById(id) as T;
const settings = JSON.parse($(SETTINGS_ID).textContent ?? '{}') as PageSettings;
let roles: LoadedRoles = parseRoles(settings.roles.text, settings.roles.file, catalogue, preset());
let database: Promise<WasmDatabase> | undefined;
let busy = false;

const PHASE_WORDS: Record<Phase, string> = {
  reading: 'Reading the file',
  checking: 'Checking the records',
  'problem rows': 'Listing the problem rows',
};

function preset(): { preset?: PresetName } {
  return settings.preset ? { preset: settings.preset as PresetName } : {};
}

function say(text: string, kind: 'progress' | 'error' | 'done' = 'progress'): void {
  const line = $('nr-status');
  line.textContent = text;
  line.dataset.kind = kind;
}

function download(id: string, name: string, type: string, text: string): void {
  const link = $<HTMLAnchorElement>(id);
  if (link.href.startsWith('blob:')) URL.revokeObjectURL(link.href);
  link.href = URL.createObjectURL(new Blob([text], { type }));
  link.download = name;
  link.hidden = false;
}

function baseName(name: string): string {
  return name.replace(/\.(gz)$/i, '').replace(/\.[^.]*$/, '') || 'delivery';
}

async function check(file: File): Promise<void> {
  if (busy) return;
  busy = true;
  const started = performance.now();
  const seconds = () => `${((performance.now() - started) / 1000).toFixed(1)} s`;
  document.body.dataset.state = 'working';
  for (const id of ['nr-get-rows', 'nr-get-json']) $(id).hidden = true;
  try {
    say(`Starting the checker… (${file.name}, ${(file.size / 1e6).toFixed(1)} MB)`);
    database ??= startDatabase(new URL('./', document.baseURI));
    const db = await database;
    const bytes = new Uint8Array(await file.arrayBuffer());
    const { report, rows } = await auditPicked(db, { name: file.name, bytes }, roles, settings, (phase) =>
      say(`${PHASE_WORDS[phase]}… ${seconds()}`),
    );
    $<HTMLIFrameElement>('nr-report').srcdoc = await renderHtml(report);
    $('nr-verdict').textContent = `${report.verdict} · grade ${report.grade} · ${report.input.rows} records read`;
    $('nr-verdict').dataset.verdict = report.verdict;
    download('nr-get-rows', `${baseName(file.name)}.problems.csv`, 'text/csv', problemsCsv(rows));
    download('nr-get-json', `${baseName(file.name)}.report.json`, 'application/json', renderJson(report));
    say(`Checked ${report.input.rows} records in ${seconds()}.`, 'done');
    document.body.dataset.state = 'done';
  } catch (e) {
    say(
      e instanceof InputError ? e.message : `Something went wrong in the checker: ${String((e as Error)?.message ?? e).split('\n')[0]}`,
      'error',
    );
    document.body.dataset.state = 'error';
  } finally {
    busy = false;
  }
}

function useRoleMap(text: string, name: string): void {
  const out = $('nr-roles-status');
  try {
    roles = parseRoles(text, name, catalogue, preset());
    const { group, outcomes } = roles.roles;
    out.textContent = `Using ${name}: group ${group}${outcomes.length ? `, outcomes ${outcomes.join(', ')}` : ''}.`;
    out.dataset.kind = 'done';
  } catch (e) {
    out.textContent = e instanceof InputError ? e.message : String(e);
    out.dataset.kind = 'error';
  }
}

function wire(): void {
  const input = $<HTMLInputElement>('nr-file');
  input.addEventListener('change', () => {
    const file = input.files?.[0];
    if (file) void check(file);
    input.value = '';
  });
  const drop = $('nr-drop');
  drop.addEventListener('dragover', (e) => {
    e.preventDefault();
    drop.dataset.over = 'yes';
  });
  drop.addEventListener('dragleave', () => delete drop.dataset.over);
  drop.addEventListener('drop', (e) => {
    e.preventDefault();
    delete drop.dataset.over;
    const file = e.dataTransfer?.files[0];
    if (file) void check(file);
  });
  const mapText = $<HTMLTextAreaElement>('nr-roles-text');
  mapText.value = settings.roles.text;
  $('nr-roles-file-name').textContent = settings.roles.file;
  $('nr-roles-use').addEventListener('click', () => useRoleMap(mapText.value, 'role map'));
  const mapFile = $<HTMLInputElement>('nr-roles-file');
  mapFile.addEventListener('change', async () => {
    const file = mapFile.files?.[0];
    if (!file) return;
    mapText.value = await file.text();
    useRoleMap(mapText.value, file.name);
    mapFile.value = '';
  });
  document.body.dataset.state = 'ready';
}

wire();
