import nonNumericValues, { tokenKind } from '../../rules/non-numeric-values.js';
import sentinelValues from '../../rules/sentinel-values.js';
import type { Profile } from '../profile/types.js';
import type { Roles } from '../roles/types.js';
import type { AnyRule } from '../rules/define.js';
import { runRules } from '../rules/engine.js';
import type { Finding } from '../rules/types.js';
import type { Lookup, ValueCounts } from '../source/lookups/lookup.js';

/** A value that may stand for "missing", with where it was seen. */
export interface MissingCandidate {
  /** as written in the file */
  token: string;
  column: string;
  count: number;
  /** what the token looks like (non-numeric-values' kinds), or 'sentinel' for a number far outside the others */
  kind: string;
}

type Tokens = Awaited<ReturnType<Lookup['nonNumericTokens']>>;

/** The look-ups the two rules ask for, kept: the draft reads the tokens and counts from them. */
interface Kept {
  lookup: Lookup;
  tokens: Map<string, Promise<Tokens>>;
  counts: Map<string, { values: readonly number[]; result: Promise<ValueCounts> }>;
}

function keeping(lookup: Lookup): Kept {
  const tokens: Kept['tokens'] = new Map();
  const counts: Kept['counts'] = new Map();
  const kept: Lookup = {
    ...lookup,
    nonNumericTokens(column, limit) {
      const found = tokens.get(column) ?? lookup.nonNumericTokens(column, limit);
      tokens.set(column, found);
      return found;
    },
    valueCounts(column, values) {
      const result = lookup.valueCounts(column, values);
      counts.set(column, { values, result });
      return result;
    },
  };
  return { lookup: kept, tokens, counts };
}

/**
 * Missing-code candidates as the audit's own rules find them: the tokens non-numeric-values
 * finds in otherwise numeric columns and the codes sentinel-values finds far outside a column's
 * other values. The rules run on the draft's profile; their look-ups are kept, so the tokens and
 * counts are read from what the rules asked, not by scanning again.
 */
export async function missingCandidates(profile: Profile, roles: Roles, lookup: Lookup): Promise<MissingCandidate[]> {
  const kept = keeping(lookup);
  const rules: AnyRule[] = [nonNumericValues as AnyRule, sentinelValues as AnyRule];
  const findings = await runRules(rules, { profile, roles, outcomes: {}, lookup: kept.lookup }, { includeValues: true });
  const out: MissingCandidate[] = [];
  for (const f of findings) {
    if (f.column === undefined) continue;
    if (f.rule === nonNumericValues.meta.id) out.push(...(await tokensOf(f.column, kept)));
    else if (f.rule === sentinelValues.meta.id) out.push(...(await codesOf(f, f.column, kept)));
  }
  return out;
}

async function tokensOf(column: string, kept: Kept): Promise<MissingCandidate[]> {
  const found = (await kept.tokens.get(column)) ?? [];
  return found.map((t) => ({ token: t.token, column, count: t.count, kind: tokenKind(t.token) }));
}

async function codesOf(finding: Finding, column: string, kept: Kept): Promise<MissingCandidate[]> {
  const seen = kept.counts.get(column);
  const result = seen ? await seen.result : undefined;
  // the finding's `tokens`: each flagged code as written, JSON-quoted and comma-separated
  const flagged = JSON.parse(`[${finding.data.tokens}]`) as string[];
  return flagged.map((token) => {
    const i = seen ? seen.values.indexOf(Number(token)) : -1;
    return { token, column, count: i >= 0 && result ? result.counts[i] : 0, kind: 'sentinel' };
  });
}
