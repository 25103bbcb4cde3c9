import type { CST, Document } from 'yaml';
import { isCollection, isMap, Lexer, LineCounter, Parser, parseDocument, visit } from 'yaml';
import { InputError } from '../errors.js';

/**
 * What a role map may hold. A real map is a few kilobytes; these bounds keep a hostile one (a
 * generated 10 MB list of missing tokens, 20,000 nested brackets) from costing seconds, gigabytes
 * or the parser's stack, and each is said in the user's words.
 */
export const ROLE_MAP_LIMITS = {
  /** the file's size in bytes */
  bytes: 2 ** 20,
  /** the YAML lexer's tokens (a list item is about four) */
  tokens: 150_000,
  /** collections nested in one another */
  depth: 64,
  /** names in one list (outcomes, level1, level2, slopes) */
  names: 10_000,
  /** missing tokens */
  missing: 1_000,
} as const;

/** `file:line:col` of an offset in the text. */
export type At = (offset: number) => string;

/** `file:line:col` of an offset, by the line counter of the text's parse. */
export function positionIn(lines: LineCounter, file: string): At {
  return (offset) => {
    const { line, col } = lines.linePos(offset);
    return `${file}:${line}:${col}`;
  };
}

/** The role map's size in bytes, refused beyond the limit before it is read or parsed. */
export function checkRoleMapBytes(bytes: number, file: string): void {
  if (bytes > ROLE_MAP_LIMITS.bytes) {
    throw new InputError(
      `${file}: the role map is ${bytes.toLocaleString('en')} bytes; the limit is 1 MiB (${ROLE_MAP_LIMITS.bytes} bytes)`,
    );
  }
}

function utf8Bytes(text: string): number {
  // a UTF-16 unit is at least one UTF-8 byte and at most three: count exactly only near the limit
  if (text.length > ROLE_MAP_LIMITS.bytes || text.length * 3 <= ROLE_MAP_LIMITS.bytes) return text.length;
  return new TextEncoder().encode(text).length;
}

/** Refuse more lexer tokens than the limit, before any node is built (the lexer is a cheap loop). */
function checkTokens(text: string, file: string): void {
  let n = 0;
  for (const _ of new Lexer().lex(text)) {
    if (++n > ROLE_MAP_LIMITS.tokens) {
      throw new InputError(`${file}: the role map has more than ${ROLE_MAP_LIMITS.tokens.toLocaleString('en')} YAML tokens, the limit`);
    }
  }
}

/** The offset of the first collection nested deeper than the limit, found without recursion. */
function tooDeep(root: CST.Token): number | undefined {
  const stack: [CST.Token, number][] = [[root, 0]];
  while (stack.length) {
    const [token, depth] = stack.pop() as [CST.Token, number];
    if (token.type === 'document' && token.value) stack.push([token.value, depth]);
    if (token.type !== 'block-map' && token.type !== 'block-seq' && token.type !== 'flow-collection') continue;
    if (depth + 1 > ROLE_MAP_LIMITS.depth) return token.offset;
    for (const item of token.items as CST.CollectionItem[]) {
      if (item.key) stack.push([item.key, depth + 1]);
      if (item.value) stack.push([item.value, depth + 1]);
    }
  }
  return undefined;
}

/**
 * The shape of the text before it is composed (the composer recurses, once per level): more than
 * one document, or collections nested deeper than the limit, are refused at their line:column.
 */
function checkShape(text: string, file: string): void {
  const lines = new LineCounter();
  const at = positionIn(lines, file);
  let documents = 0;
  for (const token of new Parser(lines.addNewLine).parse(text)) {
    if (token.type !== 'document') continue;
    if (++documents > 1) throw new InputError(`${at(token.offset)}: a second YAML document; a role map is one document`);
    const deep = tooDeep(token);
    if (deep !== undefined) throw new InputError(`${at(deep)}: nested deeper than ${ROLE_MAP_LIMITS.depth} levels`);
  }
}

/** A key that is itself a list or a map (`? [a, b]`) cannot name anything in a role map. */
function checkKeys(doc: Document, at: At): void {
  visit(doc, {
    Pair(_, pair) {
      const key = pair.key;
      if (isCollection(key)) {
        const where = key.range ? at(key.range[0]) : at(0);
        throw new InputError(`${where}: a key that is a ${isMap(key) ? 'map' : 'list'}; keys are names`);
      }
    },
  });
}

/**
 * Parse role-map text within the limits: its size, its tokens, its depth, one document, keys that
 * are names. The yaml package is told to log nothing (`logLevel: 'error'`): a warning it would
 * print to stderr is one of our one-line errors instead.
 */
export function parseYaml(text: string, file: string, lineCounter: LineCounter): Document {
  const at = positionIn(lineCounter, file);
  checkRoleMapBytes(utf8Bytes(text), file);
  checkTokens(text, file);
  checkShape(text, file);
  const doc = parseDocument(text, { lineCounter, prettyErrors: false, uniqueKeys: true, logLevel: 'error' });
  if (!doc.errors.length) checkKeys(doc, at);
  return doc;
}

/**
 * The lists of a parsed role map within their limits: at most 1,000 missing tokens, at most 10,000
 * names in any other list. Checked before the schema, whose validator would walk them all.
 */
export function checkRoleMapSize(raw: unknown, locate: (path: (string | number)[]) => string): void {
  if (raw === null || typeof raw !== 'object' || Array.isArray(raw)) return;
  for (const [key, value] of Object.entries(raw as Record<string, unknown>)) {
    if (!Array.isArray(value)) continue;
    const limit = key === 'missing' ? ROLE_MAP_LIMITS.missing : ROLE_MAP_LIMITS.names;
    if (value.length > limit) {
      const what = key === 'missing' ? 'missing tokens' : 'names';
      throw new InputError(`${locate([key])}: ${value.length.toLocaleString('en')} ${what}; at most ${limit.toLocaleString('en')}`);
    }
  }
}
