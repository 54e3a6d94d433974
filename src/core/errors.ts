/**
 * Errors the core raises for requests that are well-formed but cannot be served. The HTTP layer
 * maps both to 422 problem details; their messages are written for the user who sent the request.
 * Plain RangeErrors from the core (contradictory bounds and the like) are also the caller's fault.
 */

/** The family has no member, e.g. "no partition of 7 has all parts in {2, 4}". */
export class EmptyFamilyError extends RangeError {
  override readonly name = 'EmptyFamilyError';
}

/** The request is valid but over a stated limit (work, table size, response size). */
export class LimitExceededError extends RangeError {
  override readonly name = 'LimitExceededError';
  /** Which limit, e.g. "n <= 1000000000" or "work <= 2e8"; also stated in the message. */
  readonly limit: string;
  constructor(message: string, limit: string) {
    super(message);
    this.limit = limit;
  }
}

/** Why a list of parts is not a member of a family (see NotAMemberError). */
export type NotAMemberReason = 'malformed' | 'out-of-order' | 'wrong-sum' | 'not-in-family';

/**
 * A list of parts given to `rank` is not a member of the family: not whole numbers, not in the
 * family's order (partitions list their parts largest first), not summing to n, or breaking a
 * constraint. The message says which, naming the offending part.
 */
export class NotAMemberError extends RangeError {
  override readonly name = 'NotAMemberError';
  readonly reason: NotAMemberReason;
  constructor(message: string, reason: NotAMemberReason) {
    super(message);
    this.reason = reason;
  }
}
