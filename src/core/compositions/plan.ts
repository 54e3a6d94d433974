import { LimitExceededError } from '../errors.js';
import type { CompositionFamily } from '../family.js';
import type { CompositionSampler } from '../sampler.js';
import { countCompositions, countFixed, MAX_COUNT_WORK } from '../counting/composition-counts.js';
import { binomial, log2Binomial } from '../counting/binomial.js';
import { barsRejectSampler } from './bars-reject.js';
import { fixedCountTable, fixedTableSampler, freeCountTable, freeTableSampler } from './count-table.js';
import { fixedLengthSampler } from './fixed-length.js';
import { fixedCore, freeCore, type FixedCore, type FreeCore } from './reduce.js';
import { fitsInParts, isRepresentable } from './representable.js';
import { fixedTiltedSampler } from './fixed-tilted.js';
import { emptyFamily, partBounds, partCount, resolveCompositions, type ResolvedCompositions } from './resolve.js';
import { solveTilt } from './tilt.js';
import { tiltedRenewalSampler } from './tilted-renewal.js';
import { unrestrictedSampler } from './unrestricted.js';

export { countCompositions };

/**
 * Limits of the planner (all checked before any sample is drawn):
 *  - MAX_TABLE_BITS: exact BigInt count tables hold at most 2^25 bits (4 MiB) — built once per
 *    request, in well under a second;
 *  - MAX_TABLE_CELLS: and at most 2^21 entries (BigInt objects cost ~50 bytes each even when small);
 *  - MAX_SAMPLE_WORK: one sample may cost at most 2e9 expected steps (seconds of CPU): past it the
 *    family is refused rather than run. Response-size limits are the caller's, via expectedLength.
 * Free-length families use exact BigInt tables up to FREE_TABLE_BITS = 2^23 bits (n ~ 4000 at
 * one bit of growth per unit): there each part costs a BigInt draw, which is cheap; above it the
 * tilted renewal sampler costs O(1) per part.
 */
export const MAX_TABLE_BITS = 2 ** 25;
export const MAX_TABLE_CELLS = 2 ** 21;
export const FREE_TABLE_BITS = 2 ** 23;
export const MAX_SAMPLE_WORK = 2e9;
/** Rejection from weak compositions is used when at least this share of draws is accepted. */
export const MIN_BARS_ACCEPTANCE = 1e-3;

function single(parts: () => number[], length: number): CompositionSampler {
  return { method: 'single/1', expectedLength: length, expectedWork: length + 1, sample: () => parts() };
}

function checked(sampler: CompositionSampler): CompositionSampler {
  if (!(sampler.expectedWork <= MAX_SAMPLE_WORK)) {
    throw new LimitExceededError(
      `one sample would take about ${sampler.expectedWork.toExponential(1)} steps with ${sampler.method}, over the limit of ${MAX_SAMPLE_WORK.toExponential(0)}`,
      `work per sample <= ${MAX_SAMPLE_WORK}`,
    );
  }
  return sampler;
}

/**
 * The cheapest exact uniform sampler for a composition family. Throws RangeError for malformed or
 * contradictory parameters, EmptyFamilyError (with the reason) when the family has no member and
 * LimitExceededError when tables or expected work would be over the limits above.
 */
export function planCompositionSampler(family: CompositionFamily): CompositionSampler {
  const resolved = resolveCompositions(family);
  if (resolved.length === 0) return single(() => [], 0);
  if (resolved.length === undefined) {
    if (resolved.n === 0) return single(() => [], 0);
    return checked(planFree(resolved, freeCore(resolved)));
  }
  return checked(planFixed(resolved, fixedCore(resolved)));
}

function planFree(resolved: ResolvedCompositions, core: FreeCore): CompositionSampler {
  const { n, parts, scale } = core;
  const { min, max } = partBounds(parts);
  if (max === 1) return single(() => new Array<number>(n).fill(scale), n);
  // Every composition of the core: all compositions of n (n·d with parts d·v when the list scaled by d, e.g. {3, 6}).
  if (parts.kind === 'range' && min === 1 && max >= n) return unrestrictedSampler(n, scale);
  if (parts.kind === 'range' && Math.ceil(n / max) * min > n) {
    throw emptyFamily(resolved, `${Math.ceil(n / max)} parts are needed and they sum to at least ${Math.ceil(n / max) * min * scale}`);
  }
  const tilt = solveTilt(parts);
  const growthBits = tilt.t / Math.LN2;
  const tableBits = (n * n * growthBits) / 2 + 64 * n;
  const width = parts.kind === 'list' ? parts.values.length : 3;
  if (tableBits <= FREE_TABLE_BITS && n * width <= MAX_TABLE_CELLS) {
    const counts = freeCountTable(core);
    if (counts[n] === 0n) throw emptyFamily(resolved);
    const scan = parts.kind === 'range' ? tilt.mean - min + 1 : Math.min(width, tilt.mean);
    return freeTableSampler(core, counts, {
      expectedLength: n / tilt.mean,
      expectedWork: (n / tilt.mean) * scan * (1 + (n * growthBits) / 32),
    });
  }
  if (parts.kind === 'list' && !isRepresentable(parts.values, n)) throw emptyFamily(resolved);
  return tiltedRenewalSampler(core);
}

function planFixed(resolved: ResolvedCompositions, core: FixedCore): CompositionSampler {
  const { n, k, parts, shift } = core;
  const top = partBounds(parts).max;
  if (top === 0) return single(() => new Array<number>(k).fill(shift), k);
  if (parts.kind === 'range' && top >= n) return fixedLengthSampler(resolved.n, k, shift, core.scale);
  const cells = (k + 1) * (n + 1);
  const countBits = log2Binomial(n + k - 1, k - 1) + 1;
  const width = partCount(parts);
  const scan = Math.min(width, n / k + 1);
  const buildWork = cells * (parts.kind === 'range' ? 2 : width) * (1 + countBits / 64);
  if (cells <= MAX_TABLE_CELLS && (cells * countBits) / 2 <= MAX_TABLE_BITS && buildWork <= MAX_COUNT_WORK) {
    const rows = fixedCountTable(core);
    if (rows[k][n] === 0n) throw emptyFamily(resolved);
    return fixedTableSampler(core, rows, { expectedLength: k, expectedWork: k * scan * (1 + countBits / 32) });
  }
  const tilted = fixedTiltedSampler(core);
  if (parts.kind === 'range') {
    let rejection: CompositionSampler | undefined;
    // Parts of a uniform weak composition with mean mu = m/k are near geometric, so all k stay
    // <= L with probability about exp(-k (mu/(mu+1))^(L+1)); skip the exact count (which can take
    // a large share of a second) when even this rough figure is far below the threshold.
    const m0 = Math.min(n, k * top - n);
    const mu = m0 / k;
    const rough = Math.exp(-k * Math.exp((top + 1) * Math.log(mu / (mu + 1))));
    if (rough >= MIN_BARS_ACCEPTANCE / 100) try {
      const count = countFixed(core);
      const m = Math.min(n, k * top - n);
      const acceptance = ratio(count, binomial(m + k - 1, k - 1));
      if (acceptance >= MIN_BARS_ACCEPTANCE) rejection = barsRejectSampler(core, acceptance);
    } catch (error) {
      if (!(error instanceof LimitExceededError)) throw error;
    }
    return rejection && rejection.expectedWork < tilted.expectedWork ? rejection : tilted;
  }
  if (!fitsInParts(parts.values, n, k)) throw emptyFamily(resolved);
  return tilted;
}

/** a / b as a double, for BigInts of any size. */
function ratio(a: bigint, b: bigint): number {
  const shift = Math.max(0, b.toString(2).length - 60);
  return Number(a >> BigInt(shift)) / Number(b >> BigInt(shift));
}
