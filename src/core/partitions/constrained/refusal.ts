import { LimitExceededError } from '../../errors.js';
import type { PartitionFamily } from '../../family.js';
import { familyClauses } from './spec.js';

/** What the planner knows about the cheapest method when none fits. */
export interface RefusalFacts {
  readonly setupWork: number;
  readonly sampleWork: number;
  /** What would fit, in the family's own terms ("at most about 24000 parts"), if known. */
  readonly hint?: string;
}

/**
 * The refusal for a family no exact method samples within the limits, written for the user: the
 * family in words, the work it would take against the limit, and what would fit — never a
 * method's name or a table's size.
 */
export function refusal(family: PartitionFamily, facts: RefusalFacts, setupLimit: number, sampleLimit: number): LimitExceededError {
  const clauses = familyClauses(family);
  const what = `partitions of ${family.n}${clauses.length > 0 ? ` with ${clauses.join(' and ')}` : ''}`;
  const overSample = !(facts.sampleWork <= sampleLimit);
  const cost = overSample
    ? `about ${round(facts.sampleWork)} steps per sample, over the limit of ${round(sampleLimit)} steps per sample`
    : `about ${round(facts.setupWork)} steps to prepare, over the limit of ${round(setupLimit)}`;
  const fits = facts.hint ?? 'a smaller n or looser constraints fit';
  return new LimitExceededError(
    `${what} take too much work to sample exactly: ${cost}; ${fits}`,
    overSample ? `work per sample <= ${round(sampleLimit)}` : `preparation <= ${round(setupLimit)} steps`,
  );
}

/** 23456789 -> "2.3e+7"; 999 -> "999". */
function round(x: number): string {
  if (!Number.isFinite(x)) return 'unbounded';
  return x < 1e4 ? String(Math.round(x)) : x.toExponential(1);
}

/** A count rounded down to two significant digits, for "at most about ..." hints. */
export function about(x: number): string {
  if (!(x >= 1)) return '1';
  const digits = Math.floor(Math.log10(x)) - 1;
  const unit = digits > 0 ? 10 ** digits : 1;
  return String(Math.floor(x / unit) * unit);
}

/**
 * The hint for distinct parts from an allowed list when whether any subset of the sizes sums to
 * n could not be decided within the work limit (subset-sum-reach.ts): the n that are decided for
 * this list.
 */
export function undecidedSubsetHint(sizes: number, range: { upTo: number; from: number; total: number }): string {
  const low = about(range.upTo);
  const high = range.from > range.upTo ? ` or within about ${low} below their sum (${range.total})` : '';
  return `deciding whether some of these ${sizes} sizes sum to n takes too long here; with these sizes n up to about ${low}${high} fits`;
}
