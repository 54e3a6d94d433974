import type { Partition } from '../../partition.js';
import type { RandomSource } from '../../random.js';
import type { PartitionSampler } from '../../sampler.js';
import { gcd } from './spec.js';
import { solveSubsetTilt } from './allowed-subset.js';

/**
 * Exact uniform partitions of n into at most K distinct parts from an allowed list
 * s_1 < ... < s_r: the subsets T of S with 1 <= |T| <= K and sum n.
 *
 * One subset design over S for every number of parts k at once: with x = e^(-s) <= 1 and the
 * elementary symmetric functions e_j of the x^(s_i) over suffixes of S (the table of
 * allowed-subset.ts, r x K numbers), a proposal draws k, then a (k-1)-subset S' with probability
 * x^(sum S') / e_(k-1) (sequential method, Nijenhuis & Wilf 1978, ch. 10), and determines the last
 * part w = n - sum S' (probabilistic divide-and-conquer, Arratia & DeSalvo 2016, §3.3); it is kept
 * when w is an allowed size not in S', with probability x^(w - s_(q+1)), q the number of parts of
 * S' below w. A k-subset T is proposed through each of its k elements as the last one, so
 *   P(T | k) = sum_(q=1..k) x^(n - w_q) x^(w_q - s_q) / e_(k-1) = x^n R_k / e_(k-1),
 *   R_k = x^(-s_1) + ... + x^(-s_k).
 * Drawing k with probability proportional to e_(k-1) / R_k (again after every failed proposal,
 * so that the trials are independent) makes P(T) = x^n / sum_k (e_(k-1) / R_k): the same for every
 * member whatever its number of parts — exactly uniform, without counting the family (the union
 * over k with each k's proposal weighted by the inverse of its known success rate per member, as
 * box-mixture.ts). A count tilt y^k would only add a rejection (y^k / max y^k): at a fixed x the
 * acceptance is largest at y = 1, so x is the one parameter, chosen among a few tilts by the
 * estimated acceptance (only speed depends on it). Where a binding K leaves few members with
 * fewer parts, the weights e_(k-1) / R_k grow with k and the proposals sit near K.
 *
 * x must be <= 1 for the last step's probability; where the tilt that serves n is above 1 (n above
 * the middle of the sums), the sampler works on complements: T <-> S \ T, with sum (sum S) - n and
 * r - |T| parts, which flips x to 1/x.
 *
 * Method id "allowed-subset-mixture/1". The caller guarantees the family is not empty.
 */
export class AllowedSubsetMixture implements PartitionSampler {
  readonly method = 'allowed-subset-mixture/1';
  readonly expectedLength: number;
  readonly expectedDistinct: number;
  readonly expectedWork: number;
  readonly expectedProposals: number;
  /** Table cells built (r x width). */
  readonly setupWork: number;
  private readonly sizes: readonly number[];
  private readonly target: number;
  private readonly complement: boolean;
  private readonly s: number;
  private readonly width: number;
  private readonly table: Float64Array;
  /** Numbers of parts k (ascending) and the cumulative weights of e_(k-1) / R_k. */
  private readonly ks: Int32Array;
  private readonly cumulative: Float64Array;
  private readonly allowed: Set<number>;
  private readonly chosen: Float64Array;

  constructor(
    values: readonly number[],
    readonly n: number,
    kMin: number,
    kMax: number,
  ) {
    const r = values.length;
    // The numbers of parts a member can have: the k largest sum to >= n, the k smallest to <= n.
    let low = 0;
    let high = 0;
    let kFrom = Infinity;
    let kTo = 0;
    // k parts sum to k s_1 modulo g, the gcd of the differences: only those k can have members.
    let g = 0;
    for (const v of values) g = gcd(g, v - values[0]);
    const fitsResidue = (k: number) => g <= 1 || (n - k * values[0]) % g === 0;
    for (let k = 1; k <= Math.min(kMax, r); k++) {
      low += values[k - 1];
      high += values[r - k];
      if (low > n) break;
      if (high >= n && k >= kMin && fitsResidue(k)) {
        kFrom = Math.min(kFrom, k);
        kTo = k;
      }
    }
    if (kTo === 0) throw new RangeError('allowed-subset-mixture needs a family with members');
    // Complements need at least one part drawn (a member with all r sizes would have none).
    if (kTo >= r) throw new RangeError('allowed-subset-mixture needs fewer parts than sizes');
    let total = 0;
    for (const v of values) total += v;
    // Candidate tilts: the two-tilt model with kTo parts, the size tilt alone (count tilt 1) when
    // it has at most kTo parts on average, and two between; each judged by its estimated acceptance.
    const tilts = [solveSubsetTilt(values, n, kTo)];
    const free = freeTilt(values, n);
    if (free !== null && Math.abs(free - tilts[0]) > 1e-12 && freeCount(values, free) < kTo) tilts.push(free, (tilts[0] + free) / 2);
    let best: Setup | null = null;
    for (const t of tilts) {
      const setup = build(values, n, total, kFrom, kTo, t, fitsResidue);
      if (best === null || setup.acceptance > best.acceptance) best = setup;
    }
    const b = best!;
    this.complement = b.complement;
    this.sizes = b.sizes;
    this.target = b.target;
    this.s = b.s;
    this.width = b.width;
    this.table = b.table;
    this.ks = b.ks;
    this.cumulative = b.cumulative;
    this.allowed = new Set(b.sizes);
    this.chosen = new Float64Array(Math.max(1, b.width));
    this.setupWork = tilts.length * r * b.width;
    this.expectedProposals = Math.max(1, 1 / Math.min(1, b.acceptance));
    this.expectedLength = b.meanLength;
    this.expectedDistinct = b.meanLength;
    this.expectedWork = this.expectedProposals * (r + Math.log2(b.ks.length + 1)) + b.meanLength;
  }

  sample(source: RandomSource): Partition {
    return this.search(source, Infinity)!;
  }

  /**
   * The sampler's proposals, at most `proposals` of them: the member accepted, or null. A member
   * found proves the family is not empty (length-feasibility.ts uses it as a witness search).
   */
  search(source: RandomSource, proposals: number): Partition | null {
    const { target, sizes, s, width, table, chosen, ks, cumulative } = this;
    const r = sizes.length;
    const last = cumulative.length - 1;
    for (let trial = 0; trial < proposals; trial++) {
      // k by its cumulative weight (binary search).
      const u = source.nextDouble() * cumulative[last];
      let lo = 0;
      let hi = last;
      while (lo < hi) {
        const mid = (lo + hi) >> 1;
        if (cumulative[mid] > u) hi = mid;
        else lo = mid + 1;
      }
      const k = ks[lo];
      // A (k-1)-subset from the design, ascending. Each next element by inversion with one
      // uniform V: position i is taken the first time V >= S (1 - p_i), S the probability of
      // having skipped the positions since the last element (p_i = take / here); a fresh V and
      // S = 1 once S < 2^-20 (given no element yet, the rest is independent of the past), so the
      // walk costs one random number per element instead of one per position.
      let j = k - 1;
      let count = 0;
      let sum = 0;
      let v = j > 0 ? source.nextDouble() : 0;
      let survive = 1;
      for (let i = 0; i < r && j > 0; i++) {
        const stay = survive * (1 - table[(i + 1) * width + j - 1] / table[i * width + j]);
        if (v >= stay) {
          chosen[count++] = sizes[i];
          sum += sizes[i];
          j--;
          if (j > 0) v = source.nextDouble();
          survive = 1;
        } else if (stay < 9.5367431640625e-7) {
          v = source.nextDouble();
          survive = 1;
        } else survive = stay;
      }
      const w = target - sum;
      if (!this.allowed.has(w)) continue;
      let rank = 0;
      let duplicate = false;
      for (let q = 0; q < count; q++) {
        if (chosen[q] < w) rank++;
        else if (chosen[q] === w) duplicate = true;
      }
      if (duplicate) continue;
      if (s > 0 && !(source.nextDouble() < Math.exp(-s * (w - sizes[rank])))) continue;
      const parts: number[] = [];
      if (this.complement) {
        // The member is S minus the drawn k-subset.
        const taken = new Set<number>();
        for (let q = 0; q < count; q++) taken.add(chosen[q]);
        taken.add(w);
        for (let i = r - 1; i >= 0; i--) if (!taken.has(sizes[i])) parts.push(sizes[i]);
      } else {
        for (let q = 0; q < count; q++) parts.push(chosen[q]);
        parts.push(w);
        parts.sort((a, b) => b - a);
      }
      return { sizes: parts, multiplicities: parts.map(() => 1) };
    }
    return null;
  }
}

interface Setup {
  complement: boolean;
  sizes: readonly number[];
  target: number;
  s: number;
  width: number;
  table: Float64Array;
  ks: Int32Array;
  cumulative: Float64Array;
  acceptance: number;
  meanLength: number;
}

/**
 * The table and the weights over k for the tilt ln x = t (complements when t > 0), with the
 * estimated acceptance sum_k N_k x^n / sum_k (e_(k-1) / R_k), N_k x^n ~ e_k P(design sum = n) by the
 * local limit of the k-design (Gaussian, the Bernoulli model's conditional moments at a grid of k).
 */
function build(values: readonly number[], n: number, total: number, kFrom: number, kTo: number, t: number, fitsResidue: (k: number) => boolean): Setup {
  const r = values.length;
  const complement = t > 0;
  const sizes = values;
  const target = complement ? total - n : n;
  const from = complement ? r - kTo : kFrom;
  const to = complement ? r - kFrom : kTo;
  const s = Math.abs(t);
  // table[i * width + j] = e_j(i) / x^(sum of the j smallest sizes from i), j < width = to + 1.
  const width = to + 1;
  const table = new Float64Array((r + 1) * width);
  // step[m] = x^(s_m - s_(m-1)): x^(s_(i+j) - s_i) as a running product along j (one multiply a
  // cell instead of an exponential; products that underflow are below 1e-308 and stay 0).
  const step = new Float64Array(r);
  for (let m = 1; m < r; m++) step[m] = Math.exp(-s * (sizes[m] - sizes[m - 1]));
  for (let i = r; i >= 0; i--) {
    table[i * width] = 1;
    const top = Math.min(width - 1, r - i);
    let factor = 1;
    for (let j = 1; j <= top; j++) {
      let skip = 0;
      if (j <= r - i - 1) {
        factor *= step[i + j];
        skip = table[(i + 1) * width + j] * factor;
      }
      table[i * width + j] = skip + table[(i + 1) * width + j - 1];
    }
  }
  // ln(e_(k-1) / R_k) = ln table[k-1] - s P_k - ln rho_k, P_k = s_1 + ... + s_k,
  // rho_k = sum_(q<=k) x^(s_k - s_q) (in [1, k]); the weights relative to their largest.
  const count = Math.max(0, to - from + 1);
  const logWeight = new Float64Array(count);
  let prefix = 0;
  let rho = 0;
  let maxLog = -Infinity;
  for (let k = 1; k <= to; k++) {
    prefix += sizes[k - 1];
    rho = k === 1 ? 1 : rho * Math.exp(-s * (sizes[k - 1] - sizes[k - 2])) + 1;
    if (k < from) continue;
    // Numbers of parts whose sums miss n's residue have no members: weight 0.
    const lw = fitsResidue(complement ? r - k : k) ? Math.log(table[k - 1]) - s * prefix - Math.log(rho) : -Infinity;
    logWeight[k - from] = lw;
    if (lw > maxLog) maxLog = lw;
  }
  const ks = new Int32Array(count);
  const cumulative = new Float64Array(count);
  let acc = 0;
  let meanLength = 0;
  for (let q = 0; q < count; q++) {
    ks[q] = from + q;
    const w = Math.exp(logWeight[q] - maxLog);
    acc += w;
    cumulative[q] = acc;
    meanLength += w * (complement ? r - ks[q] : ks[q]);
  }
  meanLength /= acc;
  // Estimated acceptance: sum_k e_k(x) P_k(sum = target) / W, at up to 16 values of k spread
  // over those with weight above e^-30 of the largest (each standing for its stretch).
  const heavy: number[] = [];
  for (let q = 0; q < count; q++) if (logWeight[q] - maxLog > -30) heavy.push(q);
  // (-Infinity weights are left out above and have cumulative steps of 0: never drawn.)
  const stride = Math.max(1, Math.ceil(heavy.length / 16));
  const prefixes = new Float64Array(to + 2);
  for (let k = 1; k <= Math.min(to + 1, r); k++) prefixes[k] = prefixes[k - 1] + sizes[k - 1];
  let span = 0;
  for (const v of sizes) span = gcd(span, v - sizes[0]);
  span = Math.max(span, 1);
  let hits = 0;
  let u = 0;
  for (let h = 0; h < heavy.length; h += stride) {
    const k = from + heavy[h];
    const moments = countMoments(sizes, s, k, u);
    u = moments.u;
    // ln e_k = ln table[0][k] - s P_k.
    const lek = Math.log(table[k]) - s * prefixes[k];
    const variance = Math.max(moments.variance, 1e-300);
    const local = Math.min(1, (span / Math.sqrt(2 * Math.PI * variance)) * Math.exp(-((target - moments.mean) ** 2) / (2 * variance)));
    hits += Math.min(stride, heavy.length - h) * Math.exp(lek - maxLog) * local;
  }
  return { complement, sizes, target, s, width, table, ks, cumulative, acceptance: hits / acc, meanLength };
}

/** ln x of the size tilt alone (count tilt 1: mean of the sum of the Bernoulli model = n), or null beyond the sizes. */
function freeTilt(values: readonly number[], n: number): number | null {
  let total = 0;
  for (const v of values) total += v;
  if (!(n > 0 && n < total)) return null;
  // The mean sum_i s_i / (1 + x^-s_i) increases with t = ln x: bisection.
  let lo = -50 / values[0];
  let hi = 50 / values[0];
  const mean = (t: number) => {
    let m = 0;
    for (const v of values) m += v / (1 + Math.exp(-t * v));
    return m;
  };
  for (let i = 0; i < 80; i++) {
    const mid = (lo + hi) / 2;
    if (mean(mid) < n) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

/**
 * The Bernoulli model over the sizes with P(s_i in T) = 1 / (1 + e^(-(u - s s_i))), u solved (Newton
 * from `start`) so that the mean count is k: the mean size and its variance given the count
 * (Gaussian regression), for the local-limit estimate of P(k-design sum = target).
 */
function countMoments(sizes: readonly number[], s: number, k: number, start: number): { u: number; mean: number; variance: number } {
  let u = start;
  let mN = 0;
  let vN = 0;
  let vL = 0;
  let c = 0;
  for (let iter = 0; iter < 60; iter++) {
    let mL = 0;
    mN = 0;
    vN = 0;
    vL = 0;
    c = 0;
    for (const v of sizes) {
      const z = u - s * v;
      const p = z > 0 ? 1 / (1 + Math.exp(-z)) : Math.exp(z) / (1 + Math.exp(z));
      const q = p * (1 - p);
      mL += p;
      mN += v * p;
      vN += v * v * q;
      vL += q;
      c += v * q;
    }
    const g = mL - k;
    if (Math.abs(g) <= 1e-6 || !(vL > 0)) break;
    // Newton on the increasing mean count, steps capped (its log-odds scale).
    u -= Math.max(-4, Math.min(4, g / vL));
  }
  return { u, mean: mN, variance: vL > 0 ? vN - (c * c) / vL : vN };
}

/** Mean count of the size tilt alone at ln x = t. */
function freeCount(values: readonly number[], t: number): number {
  let m = 0;
  for (const v of values) m += 1 / (1 + Math.exp(-t * v));
  return m;
}
