import type { Partition } from '../../partition.js';
import { nextBelow, nextOpenDouble, type RandomSource } from '../../random.js';
import type { PartitionSampler } from '../../sampler.js';
import { PairSolutions } from './multiset-boltzmann.js';
import { countsToPartition } from './size-table.js';
import { gcd } from './spec.js';

/**
 * Exact uniform partitions of n with parts from an allowed list S (any multiplicities) and
 * exactly k parts, or at most K parts.
 *
 * Multiparametric Boltzmann model (Bendkowski, Bodini & Dovgal 2018, "Polynomial tuning of
 * multiparametric combinatorial samplers"): the multiplicities Z_s, s in S, are independent
 * geometric with P(Z_s >= j) = q_s^j, q_s = y x^s, so a partition with L parts and size N has
 * probability proportional to y^L x^N; given (N, L) = (n, k) it is uniform whatever (x, y). The
 * two tilts are solved numerically so that (n, k) is the mean (Newton's method on the convex
 * cumulant function; its Hessian is the covariance of (N, L)). For "at most K parts" a size-0
 * site Z_0 (P(Z_0 >= j) = y^j) counts the missing parts and the condition becomes L + Z_0 = K.
 *
 * Probabilistic divide-and-conquer with a deterministic last step (Arratia & DeSalvo 2016,
 * CPC 25, §3.3): all multiplicities are drawn except those of two sizes a < b (the two most
 * frequent under the tilt); the residual count C and size M fix them:
 * - exactly k: i + j = C, a i + b j = M has at most one solution; its probability is
 *   (1 - q_a)(1 - q_b) q_a^i q_b^j, accepted with probability q_a^i q_b^j (the ratio to its
 *   maximum, at i = j = 0). Every member then has probability prod_(s != a,b)(1 - q_s) y^k x^n.
 * - at most K: the solutions (z, i, j) of z + i + j = C, a i + b j = M all have weight
 *   y^C x^M; they are counted in closed form (j runs over one residue class, Nijenhuis & Wilf
 *   1978, ch. 9) and accepted with probability y^C x^M #solutions / U, then one is taken
 *   uniformly. U bounds y^C x^M #solutions: any solution has C >= M / b and at most
 *   M / lcm(a, b) + 1 of them exist, so U = max over M >= 0 of (x y^(1/b))^M (M / lcm + 1).
 * The acceptance rate is P(N = n, L = k) / U-normalised, estimated by the two-dimensional local
 * limit theorem: gcd / (2 pi sqrt(det Cov)).
 *
 * Method id "allowed-length-boltzmann/1". The caller guarantees the family is not empty.
 */
export class AllowedLengthBoltzmann implements PartitionSampler {
  readonly method = 'allowed-length-boltzmann/1';
  readonly expectedLength: number;
  readonly expectedDistinct: number;
  readonly expectedWork: number;
  readonly expectedProposals: number;
  /** ln x and ln y. */
  readonly t: number;
  readonly u: number;
  private readonly sizes: readonly number[];
  /** ln q_s for the sizes other than a and b, drawn by inversion. */
  private readonly others: number[];
  private readonly logQ: number[];
  private readonly a: number;
  private readonly b: number;
  private readonly logQa: number;
  private readonly logQb: number;
  /** ln U (at most K only). */
  private readonly logBound: number;
  private readonly atMost: boolean;
  private readonly pair: PairSolutions;

  constructor(
    values: readonly number[],
    readonly n: number,
    readonly parts: number,
    atMost: boolean,
  ) {
    if (values.length < 2) throw new RangeError('allowed-length-boltzmann needs at least two sizes');
    this.sizes = values.slice();
    this.atMost = atMost;
    const tilt = solveTwoTilts(values, n, parts, atMost);
    this.t = tilt.t;
    this.u = tilt.u;
    const logQ = values.map((s) => this.u + this.t * s);
    // The pair: the two sizes with the largest q (most frequent).
    const order = values.map((_, i) => i).sort((i, j) => logQ[j] - logQ[i]);
    const [ia, ib] = order[0] < order[1] ? [order[0], order[1]] : [order[1], order[0]];
    this.a = values[ia];
    this.b = values[ib];
    this.logQa = logQ[ia];
    this.logQb = logQ[ib];
    this.others = [];
    this.logQ = [];
    for (let i = values.length - 1; i >= 0; i--) {
      if (i === ia || i === ib) continue;
      this.others.push(values[i]);
      this.logQ.push(logQ[i]);
    }
    this.pair = new PairSolutions(this.a, this.b);
    if (atMost) {
      // max over 0 <= M <= n of tau M + ln(M / lcm + 1), tau = ln(x y^(1/b)).
      const tau = this.t + this.u / this.b;
      const lcm = (this.a / gcd(this.a, this.b)) * this.b;
      const peak = tau < 0 ? Math.min(n, Math.max(0, -1 / tau - lcm)) : n;
      this.logBound = tau * peak + Math.log(peak / lcm + 1);
    } else {
      this.logBound = 0;
    }
    // Estimates: 2-D local limit theorem for P(N = n, L = parts).
    const cov = covariance(values, this.t, this.u, atMost);
    const det = Math.max(cov.varN * cov.varL - cov.cov * cov.cov, 1e-300);
    let span = 0;
    for (const s of values) span = gcd(span, atMost ? s : s - values[0]);
    const hit = Math.min(1, span / (2 * Math.PI * Math.sqrt(det)));
    // P(accept) = P(N = n, L = parts) / (block maximum): (1 - q_a)(1 - q_b) for exactly k, times
    // (1 - y) U for at most K.
    let logBlockMax = Math.log(-Math.expm1(this.logQa)) + Math.log(-Math.expm1(this.logQb));
    if (atMost) logBlockMax += Math.log(-Math.expm1(this.u)) + this.logBound;
    this.expectedProposals = this.others.length === 0 ? 1 : Math.max(1, Math.exp(logBlockMax) / hit);
    this.expectedLength = atMost ? Math.min(parts, cov.meanL) : parts;
    this.expectedDistinct = Math.min(values.length, this.expectedLength);
    this.expectedWork = this.expectedProposals * (this.others.length + 3) + this.expectedDistinct;
  }

  sample(source: RandomSource): Partition {
    const { n, parts, a, b, others, logQ } = this;
    for (;;) {
      const counts = new Map<number, number>();
      let total = 0;
      let count = 0;
      let alive = true;
      for (let i = 0; i < others.length; i++) {
        // Z = floor(ln U / ln q) has P(Z >= j) = q^j.
        const z = Math.floor(Math.log(nextOpenDouble(source)) / logQ[i]);
        if (z > 0) {
          counts.set(others[i], z);
          total += z * others[i];
          count += z;
          if (total > n || count > parts) {
            alive = false;
            break;
          }
        }
      }
      if (!alive) continue;
      const C = parts - count;
      const M = n - total;
      let i: number;
      let j: number;
      if (!this.atMost) {
        // i + j = C, a i + b j = M.
        const jNum = M - a * C;
        if (jNum < 0 || jNum % (b - a) !== 0) continue;
        j = jNum / (b - a);
        i = C - j;
        if (i < 0) continue;
        // With no other size the residual is always the same: the acceptance is a constant.
        if (others.length > 0 && !(source.nextDouble() < Math.exp(i * this.logQa + j * this.logQb))) continue;
      } else {
        // z + i + j = C, a i + b j = M: j in the residue class, M / b >= j >= (M - a C) / (b - a).
        const first = Math.max(0, Math.ceil((M - a * C) / (b - a)));
        const last = Math.floor(M / b);
        const solutions = this.pair.countBetween(M, first, last);
        if (solutions === 0) continue;
        const logWeight = this.u * C + this.t * M + Math.log(solutions) - this.logBound;
        if (others.length > 0 && !(source.nextDouble() < Math.exp(logWeight))) continue;
        j = this.pair.nthBetween(M, first, solutions === 1 ? 0 : nextBelow(source, solutions));
        i = (M - b * j) / a;
      }
      if (i > 0) counts.set(a, i);
      if (j > 0) counts.set(b, j);
      return countsToPartition(counts);
    }
  }
}

interface Moments {
  readonly meanN: number;
  readonly meanL: number;
  readonly varN: number;
  readonly varL: number;
  readonly cov: number;
}

/** Means and covariance of (N, L) under the tilts (L includes the size-0 site when atMost). */
function covariance(values: readonly number[], t: number, u: number, atMost: boolean): Moments {
  let meanN = 0;
  let meanL = 0;
  let varN = 0;
  let varL = 0;
  let cov = 0;
  const add = (s: number) => {
    const lq = u + t * s;
    const q = Math.exp(lq);
    const d = -Math.expm1(lq);
    const mean = q / d;
    const v = mean / d;
    meanN += s * mean;
    meanL += mean;
    varN += s * s * v;
    varL += v;
    cov += s * v;
  };
  for (const s of values) add(s);
  if (atMost) add(0);
  return { meanN, meanL, varN, varL, cov };
}

/**
 * (t, u) = (ln x, ln y) with E N = n and E L = parts, by damped Newton steps on the convex
 * function sum ln(1/(1 - q_s)) - t n - u parts (its gradient is the mean error, its Hessian the
 * covariance), keeping every q_s < 1. Only speed depends on the result.
 */
export function solveTwoTilts(values: readonly number[], n: number, parts: number, atMost: boolean): { t: number; u: number } {
  const smallest = values[0];
  const largest = values[values.length - 1];
  // Start: mean part n / parts between the smallest and the largest size.
  const meanPart = n / parts;
  let t = -1 / Math.max(1, meanPart - smallest + 1);
  if (meanPart > (smallest + largest) / 2) t = 1 / Math.max(1, largest - meanPart + 1);
  let u = -Math.max(t * smallest, t * largest) - Math.log1p(parts / values.length);
  // A feasible start: every q_s < 1 (and y < 1 with the size-0 site).
  u = Math.min(u, -Math.max(t * smallest, t * largest) - 1e-3, atMost ? -1e-3 : Infinity);
  const objective = (tt: number, uu: number): number => {
    let f = -tt * n - uu * parts;
    for (const s of values) {
      const lq = uu + tt * s;
      if (lq >= 0) return Infinity;
      f -= Math.log(-Math.expm1(lq));
    }
    if (atMost) {
      if (uu >= 0) return Infinity;
      f -= Math.log(-Math.expm1(uu));
    }
    return f;
  };
  let f = objective(t, u);
  for (let iter = 0; iter < 100; iter++) {
    const m = covariance(values, t, u, atMost);
    const gN = m.meanN - n;
    const gL = m.meanL - parts;
    if (Math.abs(gN) <= 1e-9 * n && Math.abs(gL) <= 1e-9 * Math.max(parts, 1)) break;
    const det = m.varN * m.varL - m.cov * m.cov;
    if (!(det > 0)) break;
    // Newton direction: -H^-1 g.
    const dt = -(m.varL * gN - m.cov * gL) / det;
    const du = -(m.varN * gL - m.cov * gN) / det;
    let step = 1;
    let improved = false;
    for (let back = 0; back < 60; back++) {
      const nt = t + step * dt;
      const nu = u + step * du;
      const nf = objective(nt, nu);
      if (nf < f) {
        t = nt;
        u = nu;
        f = nf;
        improved = true;
        break;
      }
      step /= 2;
    }
    if (!improved) break;
  }
  return { t, u };
}
