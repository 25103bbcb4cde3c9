import { stringify } from 'yaml';
import { count } from './numbers.js';
import type { DraftPlan } from './plan.js';

/** A scalar as YAML writes it, on one line (names with `:`, `#`, quotes or leading digits are quoted). */
function scalar(value: string): string {
  // a line break would make a block scalar: a JSON string is a double-quoted YAML scalar on one line
  return /[\r\n]/.test(value) ? JSON.stringify(value) : stringify(value, { lineWidth: 0 }).trimEnd();
}

/** `text` with its comment, the comments of a block lined up. */
function lines(entries: [string, string | undefined][]): string[] {
  const width = Math.min(40, Math.max(0, ...entries.map(([text]) => text.length)));
  // a comment ends at the line's end: line breaks in names it quotes become spaces
  return entries.map(([text, comment]) => (comment ? `${text.padEnd(width)}  # ${comment.replace(/[\r\n]+/g, ' ')}` : text));
}

const HEADER = [
  '# nestready role map: a DRAFT to review, written by `nestready draft` from the data alone.',
  '# Each choice carries the evidence it was made on. The rules of thumb behind them (a level-2',
  '# column is constant within almost every group; an outcome is numeric and varies within',
  "# groups) are guidance, not decisions: where the study's analysis plan says otherwise, follow",
  '# the plan. Check every line before you audit with this file.',
];

/** The plan as a commented YAML role map. */
export function writeDraft(plan: DraftPlan): string {
  const out: string[] = [...HEADER, `# delivery: ${plan.input} (${count(plan.rows)} records)`, ''];
  out.push(...lines([[`group: ${scalar(plan.group.column)}`, plan.group.evidence]]));
  if (plan.otherGroups.length) {
    out.push('# other group candidates, by the same evidence:');
    out.push(...lines(plan.otherGroups.map((c) => [`#   ${scalar(c.column)}`, c.evidence])));
  }
  if (plan.unit) out.push(...lines([[`unit: ${scalar(plan.unit.column)}`, plan.unit.evidence]]));
  else out.push('# unit: no column holds a distinct value on (almost) every record');
  if (plan.parent) out.push(...lines([[`parent: ${scalar(plan.parent.column)}`, plan.parent.evidence]]));
  out.push('');
  out.push(...list('level2', plan.level2, 'level-2 variables: constant within (almost) every group'));
  out.push(...list('level1', plan.level1, 'level-1 variables: vary within groups'));
  out.push(...outcomes(plan));
  out.push(...modelPlan(plan));
  out.push(...types(plan));
  out.push(...missing(plan));
  if (plan.left.length) {
    out.push('', '# left out:');
    out.push(...lines(plan.left.map((c) => [`#   ${scalar(c.column)}`, c.evidence])));
  }
  return `${out.join('\n')}\n`;
}

function list(key: string, choices: DraftPlan['level1'], title: string): string[] {
  if (!choices.length) return [`# ${title}: none found`, `${key}: []`, ''];
  return [`# ${title}`, `${key}:`, ...lines(choices.map((c) => [`  - ${scalar(c.column)}`, c.evidence])), ''];
}

function outcomes(plan: DraftPlan): string[] {
  if (!plan.outcomes.length) return ['# outcomes: no numeric column varies within groups', ''];
  return [
    '# outcomes: the analyst chooses. Candidates (numeric, vary within groups); to choose one,',
    '# uncomment its line and take the column out of level1:',
    '# outcomes:',
    ...lines(plan.outcomes.map((c) => [`#   - ${scalar(c.column)}`, c.evidence])),
    '',
  ];
}

function types(plan: DraftPlan): string[] {
  // under a written `types:` a commented entry; without one, the whole block is a comment
  const indent = plan.types.length ? '  # ' : '#   ';
  const counts: [string, string][] = plan.counts.map((c) => [`${indent}${scalar(c.column)}: count`, c.evidence]);
  if (!plan.types.length && !counts.length) return [];
  const head = plan.types.length ? ['types:'] : ['# types:'];
  return [...head, ...lines([...plan.types.map((t): [string, string] => [`  ${scalar(t.column)}: ${t.type}`, t.evidence]), ...counts]), ''];
}

/** The model the analyst plans, as far as the data suggest it: time and weights, commented out. */
function modelPlan(plan: DraftPlan): string[] {
  const out: string[] = [];
  if (plan.time) {
    out.push('# The occasion of longitudinal data (the group being the person)? Uncomment the line below if it is one.');
    out.push(...lines([[`# time: ${scalar(plan.time.column)}`, plan.time.evidence]]), '');
  }
  if (plan.weights.length) {
    out.push('# Sampling weight candidates, kept out of level1/level2: uncomment the block, one column per level, if they are weights.');
    out.push('# weights:');
    out.push(...lines(plan.weights.map((w) => [`#   ${w.level}: ${scalar(w.column)}`, w.evidence])), '');
  }
  return out;
}

function missing(plan: DraftPlan): string[] {
  const { defaults, candidates } = plan.missing;
  // words such as "n/a" cannot be numbers and are taken; a number far outside the others might
  // still be a real value, and codes of other kinds ("<5", "1,234") are not missing: both stay comments
  const taken = candidates.filter((c) => c.kind === 'missing code');
  const taking = [...new Set(taken.map((c) => c.token))].filter((t) => !defaults.includes(t));
  const out = ['# missing: tokens read as missing (the defaults, and words found in otherwise numeric columns)', 'missing:'];
  out.push(...lines(defaults.map((t) => [`  - ${scalar(t)}`, undefined])));
  out.push(...lines(taking.map((t) => [`  - ${scalar(t)}`, seenIn(candidates.filter((c) => c.token === t))])));
  const sentinels = candidates.filter((c) => c.kind === 'sentinel');
  if (sentinels.length) {
    out.push("  # numbers far outside their column's other values: uncomment those that mean missing");
    const codes = [...new Set(sentinels.map((c) => c.token))];
    out.push(...lines(codes.map((t) => [`  # - ${scalar(t)}`, seenIn(sentinels.filter((c) => c.token === t))])));
  }
  const others = candidates.filter((c) => c.kind !== 'missing code' && c.kind !== 'sentinel');
  if (others.length) {
    out.push('  # other text in numeric columns, not missing codes (ask the sender for plain numbers):');
    out.push(...lines(others.map((c) => [`  #   ${scalar(c.token)}`, `${c.kind}: ${count(c.count)} in ${c.column}`])));
  }
  return out;
}

function seenIn(found: DraftPlan['missing']['candidates']): string {
  return found.map((c) => `${count(c.count)} in ${c.column}`).join(', ');
}
