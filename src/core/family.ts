/** The largest n of any family: one billion (samplers and counts are validated against it). */
export const MAX_N = 1_000_000_000;

/**
 * The families partsmith samples from. A family is a plain, normalised description of a set of
 * partitions or compositions of n, or of set partitions of n items; its canonical key seeds the
 * random streams, so two requests for the same family (however their parameters were spelled)
 * get the same samples.
 */
export interface PartitionFamily {
  readonly kind: 'partition';
  readonly n: number;
  /** All parts different. */
  readonly distinct?: boolean;
  /** Every part >= minPart (>= 1). */
  readonly minPart?: number;
  /** Every part <= maxPart. */
  readonly maxPart?: number;
  /** Exactly this many parts. */
  readonly length?: number;
  /** At most this many parts. */
  readonly maxLength?: number;
  /** Every part is one of these sizes (sorted ascending, no repeats). */
  readonly allowed?: readonly number[];
}

export interface CompositionFamily {
  readonly kind: 'composition';
  readonly n: number;
  /** Exactly this many parts. */
  readonly length?: number;
  /** Every part >= minPart; 0 (weak compositions) only together with length. Default 1. */
  readonly minPart?: number;
  readonly maxPart?: number;
  /** Every part is one of these sizes (sorted ascending, no repeats). */
  readonly allowed?: readonly number[];
}

/**
 * Set partitions of the n labelled items 1..n: ways to split them into non-empty blocks (groups),
 * the order of blocks and of items within a block not mattering.
 */
export interface SetPartitionFamily {
  readonly kind: 'set-partition';
  readonly n: number;
  /** Exactly this many blocks. */
  readonly blocks?: number;
  /** At most this many blocks (not together with blocks). */
  readonly maxBlocks?: number;
  /** Every block has at least this many items (>= 1; default 1). */
  readonly minBlockSize?: number;
  /** Every block has at most this many items. */
  readonly maxBlockSize?: number;
}

export type Family = PartitionFamily | CompositionFamily | SetPartitionFamily;

// New fields go at the end: a family's key (and so its random streams) must not change when
// fields it does not have are added.
const FIELD_ORDER = ['kind', 'n', 'distinct', 'minPart', 'maxPart', 'length', 'maxLength', 'allowed', 'blocks', 'maxBlocks', 'minBlockSize', 'maxBlockSize'] as const;

/**
 * The family with its fields in a fixed order and absent fields dropped: the form echoed in
 * responses and hashed into the random streams.
 */
export function canonicalFamily<F extends Family>(family: F): F {
  const out: Record<string, unknown> = {};
  const source = family as unknown as Record<string, unknown>;
  for (const key of FIELD_ORDER) {
    const value = source[key];
    if (value === undefined || value === false) continue;
    out[key] = key === 'allowed' ? [...new Set(value as number[])].sort((a, b) => a - b) : value;
  }
  return out as unknown as F;
}

/** A stable string naming the family, part of every sample's stream derivation. */
export function familyKey(family: Family): string {
  return JSON.stringify(canonicalFamily(family));
}
