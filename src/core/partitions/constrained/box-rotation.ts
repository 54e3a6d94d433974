import type { Partition } from '../../partition.js';
import type { RandomSource } from '../../random.js';
import type { Box } from './box-subset.js';
import { BLOCK, BlockSubset } from './block-subset.js';
import { conjugate } from './transforms.js';

/** Extra positions M - N tried for the cyclic group (see BoxRotation): the one with the best acceptance is kept. */
const MAX_PADDING = 12;

/**
 * Exact uniform partitions in a finite box near half full, by uniform subsets and a cyclic shift.
 *
 * After conjugating so that k = min(rows, cols) is the number of rows (Andrews 1976, §3.2), a
 * partition in the k x b box of size m is a k-subset T of [0, N), N = k + b, with sum
 * W = m + k(k-1)/2 (stars and bars: the i-th smallest element minus i is the i-th smallest part,
 * zeros included; see box-subset.ts). On k-subsets of the cyclic group Z_M (M >= N) the shift
 * by r, T -> T + r mod M, is a bijection that changes the sum by k r modulo M. A proposal draws a
 * uniform k-subset of Z_M (Floyd's algorithm: Bentley & Floyd, "A sample of brilliance", CACM 30
 * (1987) 754), finds the d = gcd(k, M) shifts r with k r = W - sum(T) (mod M) (none: reject),
 * takes one of them uniformly, and keeps the shifted set when it lies in [0, N) and its sum is W
 * exactly. Every k-subset T' of [0, N) with sum W is then produced from exactly the M pairs
 * (T' - r, r), each with probability 1 / (C(M, k) d): exactly uniform, whatever M. M - N (0 to
 * MAX_PADDING) is chosen for the best acceptance rate, (M / d) (C(N, k) / C(M, k)) P(sum = W)
 * for a uniform k-subset of [0, N), whose sum has mean k(N-1)/2 and variance k(N-k)(N+1)/12
 * (sampling without replacement): about M / (2.5 sd) near half full, i.e. of order
 * n^(-1/4) for sides near sqrt(n), with proposals of O(k) steps (and N/32 words cleared).
 *
 * It is the x = 1 case of a box's design: the tilted designs of box-subset.ts are not shift
 * invariant, so far from half full (where the uniform sum misses W by many sd) box-subset is used.
 *
 * Method id "box-rotation/1".
 */
/** The shape of a box's rotation sampler and its estimates (no tables built). */
export interface RotationEstimate {
  /** Rows and columns after conjugation (k <= b), positions N = k + b, cyclic group Z_M, d = gcd(k, M). */
  readonly k: number;
  readonly b: number;
  readonly conjugated: boolean;
  readonly N: number;
  readonly M: number;
  readonly d: number;
  /** Proposals per sample (normal approximation of the uniform sum; >= 1). */
  readonly expectedProposals: number;
  /** Random draws per proposal (block counts and their adjustment, internal sums, one placed block). */
  readonly proposalCost: number;
  /** Draws placing every block of the accepted proposal (once per sample). */
  readonly placeCost: number;
}

export class BoxRotation {
  readonly estimate: RotationEstimate;
  private readonly W: number;
  private readonly inverse: number;
  private readonly set: BlockSubset;

  /** The sampler's figures for a box, without building it. */
  static estimate(box: Box, padding?: number): RotationEstimate {
    const { rows, cols, size } = box;
    if (!(cols < Infinity) || !(size >= 0 && size <= rows * cols)) throw new RangeError(`no partition of ${size} fits in a ${rows} x ${cols} box`);
    const conjugated = cols < rows;
    const k = conjugated ? cols : rows;
    const b = conjugated ? rows : cols;
    const N = k + b;
    const W = size + (k * (k - 1)) / 2;
    // Acceptance for each padding: (M / d) * C(N, k) / C(M, k) * P(sum = W).
    let best = { M: N, d: gcd(k, N), rate: 0 };
    let ratio = 1; // C(N, k) / C(M, k)
    for (let M = N; M <= N + (padding ?? MAX_PADDING); M++) {
      if (M > N) ratio *= (M - k) / M;
      const d = gcd(k, M);
      const rate = (M / d) * ratio;
      if (rate > best.rate || padding === M - N) best = { M, d, rate };
    }
    const mean = (k * (N - 1)) / 2;
    const variance = (k * (N - k) * (N + 1)) / 12;
    const z = variance > 0 ? (W - mean) / Math.sqrt(variance) : 0;
    const density = variance > 0 ? Math.exp((-z * z) / 2) / Math.sqrt(2 * Math.PI * variance) : 1;
    const expectedProposals = Math.max(1, 1 / Math.min(1, best.rate * density));
    return {
      k,
      b,
      conjugated,
      N,
      M: best.M,
      d: best.d,
      expectedProposals,
      proposalCost: BlockSubset.expectedDraws(best.M, k) + BLOCK,
      placeCost: best.M + k,
    };
  }

  /** `padding`: M - N forced (tests; default the best of 0..MAX_PADDING). */
  constructor(readonly box: Box, padding?: number) {
    this.estimate = BoxRotation.estimate(box, padding);
    const { k, M, d } = this.estimate;
    this.W = box.size + (k * (k - 1)) / 2;
    const Md = M / d;
    this.inverse = k === 0 ? 0 : modInverse((k / d) % Md, Md);
    this.set = new BlockSubset(M, k);
  }

  get expectedProposals(): number {
    return this.estimate.expectedProposals;
  }

  /** The box partition's parts (its nonzero rows), largest first, in multiplicity form. */
  sample(source: RandomSource): Partition {
    let result: Partition | null = null;
    while (result === null) result = this.propose(source);
    return result;
  }

  /** One proposal: the box partition, or null when rejected. */
  propose(source: RandomSource): Partition | null {
    const { k, M, N, d } = this.estimate;
    const W = this.W;
    if (k === 0) return { sizes: [], multiplicities: [] };
    const set = this.set;
    const sum = set.draw(source);
    // Shifts r with k r = W - sum (mod M).
    const c = mod(W - sum, M);
    if (c % d !== 0) return null;
    const Md = M / d;
    let r = mulMod(c / d, this.inverse, Md);
    if (d > 1) r += Md * Math.floor(source.nextDouble() * d);
    // Shifted by r, the elements >= M - r wrap: sum' = sum + k r - M wrapped.
    const wrapped = (sum + k * r - W) / M;
    if (!(wrapped >= 0 && wrapped <= Math.min(k, r))) return null;
    if (set.countRange(source, M - r, M) !== wrapped) return null;
    // Nothing may land in [N, M): the preimage [N - r, M - r) mod M must be empty.
    if (M > N) {
      const from = mod(N - r, M);
      const to = from + (M - N);
      const hit = to <= M ? set.countRange(source, from, to) : set.countRange(source, from, M) + set.countRange(source, 0, to - M);
      if (hit !== 0) return null;
    }
    // The shifted set in ascending order: the wrapped elements first.
    const values = new Float64Array(k);
    let i = 0;
    set.forEach(source, M - r, M, (e) => {
      values[i] = e + r - M - i;
      i++;
    });
    set.forEach(source, 0, M - r, (e) => {
      values[i] = e + r - i;
      i++;
    });
    return this.toPartition(values);
  }

  /** Ascending parts (zeros included) of the sampled k x b partition -> the box partition. */
  private toPartition(values: Float64Array): Partition {
    const sizes: number[] = [];
    const multiplicities: number[] = [];
    for (let i = values.length - 1; i >= 0; i--) {
      const part = values[i];
      if (part === 0) break;
      const last = sizes.length - 1;
      if (last >= 0 && sizes[last] === part) multiplicities[last]++;
      else {
        sizes.push(part);
        multiplicities.push(1);
      }
    }
    const partition = { sizes, multiplicities };
    return this.estimate.conjugated ? conjugate(partition) : partition;
  }
}

function gcd(a: number, b: number): number {
  while (b !== 0) [a, b] = [b, a % b];
  return Math.abs(a);
}

function mod(a: number, m: number): number {
  const r = a % m;
  return r < 0 ? r + m : r;
}

/** a b mod m for a, b < m <= 2^32 (exact: split b into 16-bit halves). */
function mulMod(a: number, b: number, m: number): number {
  const high = Math.floor(b / 65536);
  const low = b - high * 65536;
  return mod(mod(a * high, m) * 65536 + a * low, m);
}

/** The inverse of a modulo m (gcd(a, m) = 1), by the extended Euclidean algorithm. */
function modInverse(a: number, m: number): number {
  if (m === 1) return 0;
  let [oldR, r] = [a, m];
  let [oldS, s] = [1, 0];
  while (r !== 0) {
    const q = Math.floor(oldR / r);
    [oldR, r] = [r, oldR - q * r];
    [oldS, s] = [s, oldS - q * s];
  }
  return mod(oldS, m);
}
