/**
 * Values that may be numbers written another way (a decimal comma, a thousands separator, a unit,
 * a censoring sign: the kinds of src/rules/token-kind.ts that mean the column was meant to be
 * numeric). The profiling pass counts the text values that match, per column it is asked for, so
 * that a rule needs no scan of its own to learn that a categorical column ("18-29", "fixed") holds
 * none. The pattern is looser than the kinds (a match only means "look closer"); it must never
 * miss a value one of those kinds would take (test/profile/number-like.test.ts checks that).
 * Written for both engines' regular expressions (RE2 in DuckDB, ARE in PostgreSQL): no bounded
 * repetition, no class escapes inside brackets, and unanchored, so that edge spaces of any kind
 * need no trimming.
 */
export const NUMBER_LIKE_PATTERN = '[<>]|[0-9],[0-9]|[0-9][^0-9a-zA-Z%µμΜ]*[a-zA-Z%µμΜ]';
