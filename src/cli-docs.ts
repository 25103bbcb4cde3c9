import type { Command, Option } from 'commander';

const cell = (s: string) => s.replace(/\|/g, '\\|').replace(/\n/g, ' ');

/** An option's flags with its choices in place of the argument's name: `-f, --format <text|json>`. */
function flagsOf(o: Option): string {
  return o.argChoices ? o.flags.replace(/<[^>]+>/, `<${o.argChoices.join('|')}>`) : o.flags;
}

/** The default a reader needs to know: none for switches, empty lists and negations (`--no-values`). */
function defaultOf(o: Option): string {
  if (o.negate || o.defaultValue === undefined || typeof o.defaultValue === 'boolean') return '';
  if (Array.isArray(o.defaultValue) && !o.defaultValue.length) return '';
  return `\`${o.defaultValueDescription ?? String(o.defaultValue)}\``;
}

/** One command's options as a Markdown table, in the order the CLI defines them (help and version left out). */
export function optionsTable(command: Command): string {
  const lines = ['| option | meaning | default |', '|---|---|---|'];
  for (const o of command.options as readonly Option[]) {
    if (o.hidden) continue;
    const meaning = o.mandatory ? `${o.description} (required)` : o.description;
    lines.push(`| \`${cell(flagsOf(o))}\` | ${cell(meaning)} | ${cell(defaultOf(o))} |`);
  }
  return lines.join('\n');
}

/**
 * The README's command and option tables, read from the commander program itself so they cannot
 * drift from `--help` (`npm run docs` writes them; test/readme.test.ts compares).
 */
export function cliMarkdown(program: Command): string {
  const out = ['| command | what it does |', '|---|---|'];
  for (const c of program.commands) {
    const args = c.registeredArguments
      .map((a) => ((n) => (a.required ? `<${n}>` : `[${n}]`))(`${a.name()}${a.variadic ? '...' : ''}`))
      .join(' ');
    out.push(`| \`${program.name()} ${c.name()}${args ? ` ${args}` : ''}\` | ${cell(c.description())} |`);
  }
  for (const c of program.commands) {
    if (!c.options.length) continue;
    out.push('', `\`${c.name()}\` options:`, '', optionsTable(c));
  }
  return `${out.join('\n')}\n`;
}
