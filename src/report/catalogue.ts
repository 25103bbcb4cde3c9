import type { RuleMeta } from '../rules/types.js';

/** What the catalogue's docs read of a rule or change check. */
type AnyRule = { meta: RuleMeta };

interface ParamDoc {
  name: string;
  type: string;
  default: unknown;
  description: string;
}

/** The params of a rule as documented rows, read from its JSON Schema. */
export function paramDocs(rule: AnyRule): ParamDoc[] {
  const props = (rule.meta.params.properties ?? {}) as Record<string, Record<string, unknown>>;
  return Object.entries(props).map(([name, p]) => ({
    name,
    type: String(p.type ?? ''),
    default: p.default,
    description: String(p.description ?? ''),
  }));
}

/** The catalogue as JSON: each rule's meta without the message templates' internals. */
export function catalogueJson(rules: readonly AnyRule[]): string {
  const list = rules.map((r) => ({
    id: r.meta.id,
    title: r.meta.title,
    level: r.meta.level,
    defaultSeverity: r.meta.defaultSeverity,
    description: r.meta.description,
    params: paramDocs(r),
    messages: r.meta.messages,
    sources: r.meta.sources,
  }));
  return `${JSON.stringify(list, null, 2)}\n`;
}

const cell = (s: string) => s.replace(/\|/g, '\\|').replace(/\n/g, ' ');

/** The catalogue as a Markdown table (the README's rule table is this, generated). */
export function catalogueMarkdown(rules: readonly AnyRule[]): string {
  const lines = ['| rule | level | default severity | what it catches | params (default) |', '|---|---|---|---|---|'];
  for (const r of rules) {
    const params = paramDocs(r)
      .map((p) => `\`${p.name}\` (${JSON.stringify(p.default)})`)
      .join(', ');
    lines.push(`| \`${r.meta.id}\` | ${r.meta.level} | ${r.meta.defaultSeverity} | ${cell(r.meta.description)} | ${params || '—'} |`);
  }
  return `${lines.join('\n')}\n`;
}

/** The catalogue for a terminal: one block per rule. */
export function catalogueText(rules: readonly AnyRule[]): string {
  const out: string[] = [];
  for (const r of rules) {
    out.push(`${r.meta.id}  [${r.meta.level}, default ${r.meta.defaultSeverity}]  ${r.meta.title}`);
    out.push(`    ${r.meta.description}`);
    for (const p of paramDocs(r)) out.push(`    ${p.name} = ${JSON.stringify(p.default)}  ${p.description}`);
    out.push('');
  }
  return `${out.join('\n')}`;
}
