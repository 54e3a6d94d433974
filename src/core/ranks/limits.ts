import { LimitExceededError } from '../errors.js';
import { canonicalFamily, type Family } from '../family.js';

/**
 * The limit of ranking: a family is ranked with its exact counting table in BigInt, built once and
 * kept with the ranker, so the table's memory is the limit. A table may hold about
 * RANK_TABLE_BYTES (32 MiB) of counts; past it the family is refused with LimitExceededError,
 * naming the largest n that fits with the same constraints.
 *
 * The size is estimated before anything is built: `cells` counts, each costing
 * bigintCellBytes(bits) — a V8 BigInt is a 16-byte header plus 8 bytes per 64-bit digit, and
 * its slot in the array another 8 (measured: 39 bytes per count for the 500,500 counts of the
 * unrestricted table at n = 1000, whose counts have up to 105 bits; the formula gives 40).
 * `bits` is an upper bound on the family's count, so the estimate errs on the large side.
 */
export const RANK_TABLE_BYTES = 32 * 2 ** 20;

/** Estimated bytes of one BigInt count of at most `bits` bits in a table (see above). */
export function bigintCellBytes(bits: number): number {
  return 24 + 8 * Math.ceil(Math.max(1, bits) / 64);
}

/** A table estimate: its counts and bytes (both Infinity when the estimate stopped past the limit). */
export interface TableSize {
  readonly cells: number;
  readonly bytes: number;
}

export function fitsRankLimit(size: TableSize): boolean {
  return size.bytes <= RANK_TABLE_BYTES;
}

/**
 * The largest n' <= n for which `sizeAt(n')` fits the limit, by bisection (table sizes grow with
 * n for a fixed set of constraints); -1 when not even n' = 0 fits.
 */
export function largestFittingN(n: number, sizeAt: (n: number) => TableSize): number {
  if (!fitsRankLimit(sizeAt(0))) return -1;
  let lo = 0;
  let hi = n;
  while (lo < hi) {
    const mid = lo + Math.ceil((hi - lo) / 2);
    if (fitsRankLimit(sizeAt(mid))) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}

const MIB = 2 ** 20;

/** The constraints of a family in the API's terms, in the canonical order, e.g. "distinct = true, maxLength = 10". */
export function constraintsText(family: Family): string {
  return Object.entries(canonicalFamily(family) as unknown as Record<string, unknown>)
    .filter(([key, value]) => key !== 'kind' && key !== 'n' && value !== undefined && value !== false)
    .map(([key, value]) => `${key} = ${Array.isArray(value) ? value.join(',') : String(value)}`)
    .join(', ');
}

/**
 * The LimitExceededError of a family whose table is over the limit, naming its constraints and
 * the largest n that fits with them.
 */
export function rankLimitError(kind: string, family: Family, size: TableSize, fits: number): LimitExceededError {
  const constraints = constraintsText(family);
  const table = Number.isFinite(size.bytes) ? `a counting table of about ${Math.round(size.cells).toLocaleString('en-US')} counts (~${Math.ceil(size.bytes / MIB).toLocaleString('en-US')} MiB)` : 'a counting table';
  const what = `${kind} of ${family.n}${constraints ? ` with ${constraints}` : ''}`;
  const advice = fits >= 0 ? `; ${constraints ? `with ${constraints}` : 'without constraints'}, n <= ${fits.toLocaleString('en-US')} fits` : '';
  return new LimitExceededError(
    `ranking ${what} needs ${table}, over the limit of ${RANK_TABLE_BYTES / MIB} MiB per table${advice}`,
    `rank table <= ${RANK_TABLE_BYTES / MIB} MiB`,
  );
}
