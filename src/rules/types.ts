import type { ProfileNeed } from '../profile/build.js';
import type { Profile } from '../profile/types.js';
import type { Roles, Severity } from '../roles/types.js';
import type { Lookup } from '../source/lookups/lookup.js';
import type { OutcomeStats } from '../stats/types.js';
import type { RowsPart } from './rows.js';

export type RuleLevel = 'data' | 'structure' | 'variance';

/** A message template and the fix to ask for; `{name}` placeholders are filled from `data`. */
export interface MessageTemplate {
  message: string;
  fix: string;
}

export interface RuleMeta {
  /** kebab-case, equal to the file name in rules/ */
  id: string;
  title: string;
  level: RuleLevel;
  defaultSeverity: Severity;
  /** one paragraph: what the rule catches and why it matters */
  description: string;
  /** JSON Schema of the params (an object with defaults and additionalProperties: false) */
  params: Record<string, unknown>;
  messages: Record<string, MessageTemplate>;
  /** where each threshold comes from, or "common practice" */
  sources: string[];
  /**
   * Look-ups over the whole delivery that the check will ask for when the role map gives what
   * they need ('unit-ids': lookup.unitIds of the unit column). The audit starts them as soon as
   * the profile has read the delivery, so they run while the profile's result is converted and
   * the rules compute, instead of after.
   */
  prefetch?: readonly 'unit-ids'[];
  /**
   * Statistics of the profiling pass the check reads beyond every column's own (ProfileNeed). The
   * pass computes them only when an enabled rule names them: each costs aggregates over every record.
   */
  profileNeeds?: readonly ProfileNeed[];
}

/** What a rule's check returns; the engine adds the rule id, severity and rendered text. */
export interface FindingDraft {
  /** a key of meta.messages */
  messageId: string;
  /** the template's placeholders but `{values}` (filled from `values`) */
  data?: Record<string, string | number>;
  /** overrides meta.defaultSeverity for this finding (graded rules) */
  severity?: Severity;
  column?: string;
  count?: number;
  groups?: string[];
  rows?: number[];
  /** raw values seen: left out of every output when the user asks for no values */
  values?: string[];
}

export interface Finding {
  rule: string;
  severity: Severity;
  column?: string;
  /** which of the rule's messages: stable, it never changes meaning once released */
  messageId: string;
  /** the message's placeholders as the rule gave them (stable keys); `{values}` comes from `values` */
  data: Record<string, string | number>;
  message: string;
  fix: string;
  count?: number;
  groups?: string[];
  rows?: number[];
  values?: string[];
  /** a change since the previous delivery (`compare`, `audit --baseline`), from the change checks in changes/ */
  change?: true;
}

export interface RuleContext<P> {
  profile: Profile;
  roles: Roles;
  params: P;
  outcomes: Record<string, OutcomeStats>;
  lookup: Lookup;
}

export interface Rule<P = Record<string, unknown>> {
  meta: RuleMeta;
  check(ctx: RuleContext<P>): FindingDraft[] | Promise<FindingDraft[]>;
  /** which records a finding covers and why, for the problem-rows file (see rows.ts) */
  rows?: RowsPart<P>;
}
