import type { ErrorObject } from 'ajv';
import type { Document } from 'yaml';
import { isNode, LineCounter } from 'yaml';
import { InputError, quoteName } from '../errors.js';
import type { PresetName } from '../presets/index.js';
import { mergeRuleSettings, PRESETS } from '../presets/index.js';
import type { RuleMeta } from '../rules/types.js';

/** What the loader reads of a rule or change check: its id and params schema. */
type Checked = { meta: RuleMeta };

import { createAjv, describeAjvError, pointerToPath } from '../util/ajv.js';
import { closestName } from './did-you-mean.js';
import { modelPlan } from './model-plan.js';
import { validate as untypedValidate } from './role-map-validator.generated.js';
import { DEFAULT_MISSING, roleMapSchema } from './schema.js';
import type { Roles, RuleSetting, ValueType } from './types.js';
import { checkRoleMapSize, parseYaml, positionIn } from './yaml-guards.js';

const validateRoleMap = untypedValidate as ((data: unknown) => boolean) & { errors?: ErrorObject[] | null };

/** A parsed role map plus a way to point at any of its keys (for later errors). */
export interface LoadedRoles {
  roles: Roles;
  file: string;
  /** `file:line:col` of the key at `path` (or of the file when it cannot be found). */
  locate(path: (string | number)[]): string;
}

/** Options of loadRoles / parseRoles. */
export interface RoleOptions {
  /** a named preset (src/presets) whose rule settings are merged under the role map's own */
  preset?: PresetName;
}

/** Validate and normalise role-map text; `file` is only used in messages. */
export function parseRoles(text: string, file: string, catalogue: readonly Checked[], options: RoleOptions = {}): LoadedRoles {
  const lineCounter = new LineCounter();
  const doc = parseYaml(text, file, lineCounter);
  const at = positionIn(lineCounter, file);
  // a single `outcome: y` is normalised to outcomes: [y]; errors about outcomes[0] point at it
  let singleOutcome = false;
  const locate = (path: (string | number)[]) => locateIn(doc, singleOutcome && path[0] === 'outcomes' ? ['outcome'] : path, at, file);

  const yamlError = doc.errors[0];
  if (yamlError) {
    const detail = yamlError.message.split('\n')[0].replace(/ at line \d+, column \d+:?$/, '');
    throw new InputError(`${at(yamlError.pos[0])}: invalid YAML: ${detail}`);
  }
  let raw: unknown;
  try {
    raw = doc.toJS();
  } catch (e) {
    // the yaml package refuses an alias bomb (aliases that expand exponentially) while building
    // the value: that is bad input, not a bug
    const detail = String((e as Error).message ?? e).split('\n')[0];
    throw new InputError(`${file}: invalid YAML: ${detail.charAt(0).toLowerCase()}${detail.slice(1)}`);
  }
  if (raw === null || raw === undefined) throw new InputError(`${file}: the role map is empty`);
  checkRoleMapSize(raw, locate);

  // compiled ahead of time from roleMapSchema (src/roles/validator-source.ts)
  if (!validateRoleMap(raw)) throw schemaError(validateRoleMap.errors ?? [], locate, [], Object.keys(roleMapSchema.properties));

  const map = raw as unknown as Record<string, unknown>;
  if (map.outcome !== undefined && map.outcomes !== undefined) {
    throw new InputError(`${locate(['outcome'])}: give either outcome or outcomes, not both`);
  }
  singleOutcome = map.outcome !== undefined;
  const own = (map.rules ?? {}) as Record<string, RuleSetting>;
  const settings = options.preset ? mergeRuleSettings(presetRules(options.preset), own) : own;
  const rules = validateRuleSettings(settings, catalogue, locate);
  const roles: Roles = {
    group: map.group as string,
    ...(map.unit !== undefined && { unit: map.unit as string }),
    ...(map.parent !== undefined && { parent: map.parent as string }),
    outcomes: toList(map.outcomes ?? map.outcome),
    level1: toList(map.level1),
    level2: toList(map.level2),
    missing: map.missing === undefined ? [...DEFAULT_MISSING] : (map.missing as unknown[]).map(String),
    ...valueTypes(map.types),
    rules,
  };
  checkRoleOverlap(roles, locate, map.outcome !== undefined);
  Object.assign(roles, modelPlan(map, roles, locate));
  return { roles, file, locate };
}

type TypeEntry = ValueType | { binary: { one: string | boolean } } | { bounded: { lower?: number; upper?: number } };

/** `types` as column → type; the words named as 1 of binary variables (binaryOne) and the bounds of bounded ones apart. */
function valueTypes(raw: unknown): Pick<Roles, 'types' | 'binaryOne' | 'bounds'> {
  const types: Record<string, ValueType> = {};
  const binaryOne: Record<string, string> = {};
  const bounds: NonNullable<Roles['bounds']> = {};
  for (const [column, t] of Object.entries((raw ?? {}) as Record<string, TypeEntry>)) {
    if (typeof t === 'string') types[column] = t;
    else if ('binary' in t) {
      types[column] = 'binary';
      binaryOne[column] = String(t.binary.one);
    } else {
      types[column] = 'bounded';
      bounds[column] = { ...t.bounded };
    }
  }
  return { types, ...(Object.keys(binaryOne).length && { binaryOne }), ...(Object.keys(bounds).length && { bounds }) };
}

function presetRules(name: string): Record<string, RuleSetting> {
  const preset = (PRESETS as Record<string, { rules: Record<string, RuleSetting> }>)[name];
  if (!preset) throw new InputError(`unknown preset "${name}" (known: ${Object.keys(PRESETS).join(', ')})`);
  return structuredClone(preset.rules);
}

function toList(v: unknown): string[] {
  if (v === undefined || v === null) return [];
  return Array.isArray(v) ? v.map(String) : [String(v)];
}

/** Each rule setting is checked against that rule's own params schema (defaults filled in). */
function validateRuleSettings(
  settings: Record<string, RuleSetting>,
  catalogue: readonly Checked[],
  locate: LoadedRoles['locate'],
): Record<string, RuleSetting> {
  const out: Record<string, RuleSetting> = {};
  let ajv: ReturnType<typeof createAjv> | undefined;
  for (const [id, setting] of Object.entries(settings)) {
    const rule = catalogue.find((r) => r.meta.id === id);
    if (!rule) {
      const ids = catalogue.map((r) => r.meta.id);
      const near = closestName(id, ids);
      const hint = near ? `; did you mean ${quoteName(near)}?` : '';
      throw new InputError(`${locate(['rules', id])}: unknown rule ${quoteName(id)}${hint} (known: ${ids.join(', ')})`);
    }
    if (setting === 'off') {
      out[id] = 'off';
      continue;
    }
    const { severity, ...params } = setting;
    ajv ??= createAjv();
    const validate = ajv.compile(rule.meta.params);
    const names = Object.keys((rule.meta.params.properties ?? {}) as object);
    if (!validate(params)) throw schemaError(validate.errors ?? [], locate, ['rules', id], names);
    out[id] = { ...(severity && { severity }), ...params };
  }
  return out;
}

function schemaError(errors: ErrorObject[], locate: LoadedRoles['locate'], prefix: string[], keys: readonly string[]): InputError {
  // the most specific error first: the deepest instance path (e.g. a bad `severity` inside a rule
  // setting, not the `off` branch of its anyOf); at equal depth a failed constraint (`uniqueItems`
  // on a list) before a type mismatch with another anyOf branch (`must be string`); an unknown key
  // before a missing required one (`gruop: g` is the misspelt `group`)
  const rank = (e: ErrorObject) =>
    2 * pointerToPath(e.instancePath).length + (e.keyword === 'type' ? 0 : 1) + (e.keyword === 'additionalProperties' ? 0.5 : 0);
  const specific = errors.filter((e) => e.keyword !== 'anyOf');
  const first = specific.reduce<ErrorObject | undefined>((best, e) => (!best || rank(e) > rank(best) ? e : best), undefined) ?? errors[0];
  const path = [...prefix, ...pointerToPath(first.instancePath)];
  let hint = '';
  if (first.keyword === 'additionalProperties') {
    const extra = (first.params as { additionalProperty: string }).additionalProperty;
    path.push(extra);
    // a misspelt key of the role map or of a rule's params (not a column under `types`)
    const near = path.length === prefix.length + 1 ? closestName(extra, keys) : undefined;
    if (near) hint = ` (did you mean ${quoteName(near)}?)`;
  }
  return new InputError(`${locate(path)}: ${describeAjvError(first, prefix)}${hint}`);
}

/** A column may play one role only: a level-2 variable that is also level-1 is a contradiction. */
function checkRoleOverlap(roles: Roles, locate: LoadedRoles['locate'], singleOutcome: boolean): void {
  const seen = new Map<string, string>();
  const single: [string, string | undefined][] = [
    ['group', roles.group],
    ['unit', roles.unit],
    ['parent', roles.parent],
  ];
  const listed: [string, string[]][] = [
    ['outcomes', roles.outcomes],
    ['level1', roles.level1],
    ['level2', roles.level2],
  ];
  const claim = (role: string, column: string, path: (string | number)[]) => {
    const before = seen.get(column);
    if (before) {
      throw new InputError(`${locate(path)}: column ${quoteName(column)} is both ${before} and ${role}`);
    }
    seen.set(column, role);
  };
  for (const [role, column] of single) if (column) claim(role, column, [role]);
  for (const [role, columns] of listed) {
    for (const [i, column] of columns.entries()) claim(role, column, role === 'outcomes' && singleOutcome ? ['outcome'] : [role, i]);
  }
}

function locateIn(doc: Document, path: (string | number)[], at: (offset: number) => string, file: string): string {
  // walk down as far as the path exists; point at the key when there is one
  for (let depth = path.length; depth > 0; depth--) {
    const parent = doc.getIn(path.slice(0, depth - 1), true) as unknown;
    const pair = findPair(parent, path[depth - 1]);
    if (pair !== undefined) return at(pair);
    // a sequence item has no key: point at the item itself
    const node = doc.getIn(path.slice(0, depth), true);
    if (isNode(node) && node.range) return at(node.range[0]);
  }
  const contents = doc.contents;
  return isNode(contents) && contents.range ? at(contents.range[0]) : file;
}

function findPair(parent: unknown, key: string | number): number | undefined {
  const items = (parent as { items?: { key?: { value?: unknown; range?: [number, number, number] } }[] })?.items;
  if (!Array.isArray(items)) return undefined;
  const pair = items.find((p) => p.key && p.key.value === key);
  return pair?.key?.range?.[0];
}
