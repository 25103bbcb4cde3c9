import type { Roles, Severity } from '../roles/types.js';
import { SEVERITY_ORDER } from '../severity.js';
import { createAjv } from '../util/ajv.js';
import type { AnyRule } from './define.js';
import type { Finding, FindingDraft, RuleContext, RuleMeta } from './types.js';

export interface EngineOptions {
  /** leave raw data values out of findings (IDs and record numbers stay: they are the fix) */
  includeValues: boolean;
}

/** The params a rule runs with: its schema defaults, overlaid with the role map's settings. */
export function resolveParams(rule: { meta: RuleMeta }, roles: Roles): Record<string, unknown> | 'off' {
  const setting = roles.rules[rule.meta.id];
  if (setting === 'off') return 'off';
  const { severity: _severity, ...given } = setting ?? {};
  // a rule the role map leaves alone runs with its schema's defaults: no validator is compiled
  // for it, since compiling validators was most of what ajv cost an audit (docs/performance.md)
  if (Object.keys(given).length === 0) return schemaDefaults(rule);
  const params = structuredClone(given);
  const validate = validatorOf(rule);
  if (!validate(params)) {
    // roles are validated on load; reaching this is a programming error, not bad input
    throw new Error(`${rule.meta.id}: params rejected after validation`);
  }
  return params;
}

/** The `default` of each top-level property of a rule's params schema (the catalogue test requires one for each). */
function schemaDefaults(rule: { meta: RuleMeta }): Record<string, unknown> {
  const properties = (rule.meta.params as { properties?: Record<string, { default?: unknown }> }).properties ?? {};
  return Object.fromEntries(
    Object.entries(properties)
      .filter(([, p]) => p.default !== undefined)
      .map(([name, p]) => [name, structuredClone(p.default)]),
  );
}

// one Ajv and one compiled validator per rule, not one per call: compiling is the expensive part
const validators = new WeakMap<{ meta: RuleMeta }, ReturnType<ReturnType<typeof createAjv>['compile']>>();
let sharedAjv: ReturnType<typeof createAjv> | null = null;
function validatorOf(rule: { meta: RuleMeta }) {
  let validate = validators.get(rule);
  if (!validate) {
    sharedAjv ??= createAjv();
    validate = sharedAjv.compile(rule.meta.params);
    validators.set(rule, validate);
  }
  return validate;
}

/** Run every enabled rule of the catalogue and return the findings in report order. */
export async function runRules(
  catalogue: readonly AnyRule[],
  base: Omit<RuleContext<unknown>, 'params'>,
  options: EngineOptions,
): Promise<Finding[]> {
  const enabled = catalogue.flatMap((rule) => {
    const params = resolveParams(rule, base.roles);
    return params === 'off' ? [] : [{ rule, params }];
  });
  // the rules run at once: while one waits for a look-up that scans the delivery, another
  // computes, or scans beside it (the look-ups' connection pool bounds how many). Every rule
  // is let finish before an error is passed on, so none is left querying a closed source
  const settled = await Promise.allSettled(enabled.map(({ rule, params }) => rule.check({ ...base, params })));
  const failed = settled.find((s): s is PromiseRejectedResult => s.status === 'rejected');
  if (failed) throw failed.reason;
  const findings: Finding[] = [];
  enabled.forEach(({ rule }, i) => {
    const setting = base.roles.rules[rule.meta.id];
    const forced = setting && setting !== 'off' ? setting.severity : undefined;
    for (const d of (settled[i] as PromiseFulfilledResult<FindingDraft[]>).value) findings.push(render(rule, d, forced, options));
  });
  return sortFindings(findings);
}

/** A rule's draft as a finding: severity, filled message and fix, lists cut to 20, values withheld when asked. */
export function render(rule: { meta: RuleMeta }, d: FindingDraft, forced: Severity | undefined, options: EngineOptions): Finding {
  const template = rule.meta.messages[d.messageId];
  if (!template) {
    const known = Object.keys(rule.meta.messages).join(', ');
    throw new Error(`${rule.meta.id}: unknown messageId "${d.messageId}" (declared: ${known})`);
  }
  // `{values}` is filled from the draft's values, never carried in `data`: so `data` holds no raw
  // value the user asked to withhold
  const filled = { ...d.data, values: options.includeValues ? (d.values ?? []).join(', ') : '(values withheld)' };
  const f: Finding = {
    rule: rule.meta.id,
    severity: forced ?? d.severity ?? rule.meta.defaultSeverity,
    ...(d.column !== undefined && { column: d.column }),
    messageId: d.messageId,
    data: { ...d.data },
    message: fill(template.message, filled, rule.meta.id),
    fix: fill(template.fix, filled, rule.meta.id),
  };
  if (d.count !== undefined) f.count = d.count;
  if (d.groups) f.groups = d.groups.slice(0, 20);
  if (d.rows) f.rows = d.rows.slice(0, 20);
  if (d.values && options.includeValues) f.values = d.values.slice(0, 20);
  return f;
}

/** Fill `{name}` placeholders; a placeholder without data is a bug in the rule. */
export function fill(template: string, data: Record<string, string | number>, ruleId: string): string {
  return template.replace(/\{(\w+)\}/g, (_, name: string) => {
    if (!(name in data)) throw new Error(`${ruleId}: message needs "${name}"`);
    return String(data[name]);
  });
}

/** Report order: severity, then rule id, then column, then message (deterministic). */
export function sortFindings(findings: Finding[]): Finding[] {
  const cmp = (a: string, b: string) => (a < b ? -1 : a > b ? 1 : 0);
  return findings.sort(
    (a, b) =>
      SEVERITY_ORDER[a.severity] - SEVERITY_ORDER[b.severity] ||
      cmp(a.rule, b.rule) ||
      cmp(a.column ?? '', b.column ?? '') ||
      cmp(a.message, b.message),
  );
}
