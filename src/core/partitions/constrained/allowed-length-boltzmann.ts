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
 * site Z_0 (P(Z_0 >= j) = y^j) counts the missing parts and the condition becomes "exactly K
 * sites' worth of parts from S ∪ {0}"; below, the sites are S (exactly k) or S ∪ {0} (at most K).
 *
 * Probabilistic divide-and-conquer with a deterministic last step (Arratia & DeSalvo 2016,
 * CPC 25, §3.3): the multiplicities of every site but three, a < b < c (the free sites), are
 * drawn; the residual count C = k - (their count) and size M = n - (their size) leave
 *   i + j + l = C,  a i + b j + c l = M,  i, j, l >= 0
 * for the three determined sites. With R = M - a C, beta = b - a, gamma = c - a this is
 * beta j + gamma l = R with j + l <= C: l runs over one residue class modulo beta / gcd(beta, gamma)
 * between max(0, ceil((R - beta C) / (gamma - beta))) and floor(R / gamma) (counted in closed form,
 * Nijenhuis & Wilf 1978, ch. 9). Every solution has the same weight q_a^i q_b^j q_c^l = y^C x^M,
 * so the proposal (free sites, then the residual) is accepted with probability
 * y^C x^M #solutions(C, M) / U and one solution is then taken uniformly.
 *
 * Exactness: a member with free multiplicities alpha is output with probability
 * P(free = alpha) (y^C x^M #sol / U) (1 / #sol) = prod_(free)(1 - q_s) y^k x^n / U, the same for
 * every member; the loop restarts otherwise, so the output is uniform provided
 * y^C x^M #solutions(C, M) <= U for every residual. The bound U: write m = M / C (in [a, c] when
 * a solution exists) and lambda(m) = -(ln y + m ln x) > 0 (linear in m and positive at a and c,
 * since q_a, q_c < 1), so y^C x^M = e^(-C lambda(m)) <= 1. The solutions are the lattice points of
 * one residue class (step gamma / g in j, g = gcd(beta, gamma)) on the real segment of the
 * triangle {i + j + l = C, a i + b j + c l = M, >= 0}, whose j-range is C h(m) with the tent
 * h(m) = (m - a) / (b - a) on [a, b], (c - m) / (c - b) on [b, c]; so
 * #sol <= 1 + C h(m) g / gamma. Then y^C x^M #sol <= 1 + (g / gamma) h(m) C e^(-C lambda(m)), and
 * C e^(-C lambda) <= 1 / (e lambda); h / lambda is a ratio of linear functions, monotone on each
 * piece and 0 at a and c, hence at most 1 / lambda(b). So U = 1 + g / (gamma e (-ln q_b)).
 * With no free site the residual is always (k, n) and no acceptance step is needed.
 *
 * The acceptance rate is P(N = n, L = k) / (prod over the three of (1 - q_s) U), estimated with
 * the two-dimensional local limit theorem, P(N = n, L = k) ~ span / (2 pi sqrt(det Cov)); the
 * three determined sites are the triple (among the most frequent sites and the two extreme ones)
 * minimising prod (1 - q_s) U, i.e. carrying the largest share of the covariance. With two sizes
 * and exactly k parts the member is unique (solved directly).
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
  /** The three determined sites a < b < c (a may be the size-0 site), or two sizes a < b (c = -1). */
  readonly determined: readonly number[];
  /** Free sites (possibly the size-0 site) and their ln q, drawn by inversion. */
  private readonly free: number[];
  private readonly logQ: number[];
  private readonly a: number;
  private readonly beta: number;
  private readonly gamma: number;
  /** ln U. */
  private readonly logBound: number;
  private readonly pair: PairSolutions;

  /**
   * `triple` forces the three determined sites (tests); by default the cheapest by the estimate.
   */
  constructor(
    values: readonly number[],
    readonly n: number,
    readonly parts: number,
    atMost: boolean,
    triple?: readonly [number, number, number],
  ) {
    if (values.length < 2) throw new RangeError('allowed-length-boltzmann needs at least two sizes');
    const tilt = solveTwoTilts(values, n, parts, atMost);
    this.t = tilt.t;
    this.u = tilt.u;
    const sites = atMost ? [0, ...values] : values.slice();
    const logQOf = (s: number) => this.u + this.t * s;
    const chosen = sites.length === 2 ? sites.slice() : (triple?.slice() ?? cheapestTriple(sites, logQOf));
    if (chosen.length === 3 && !(chosen[0] < chosen[1] && chosen[1] < chosen[2] && chosen.every((s) => sites.includes(s)))) {
      throw new RangeError('allowed-length-boltzmann: the determined sites must be three increasing sites');
    }
    this.determined = chosen;
    this.free = [];
    this.logQ = [];
    for (let i = sites.length - 1; i >= 0; i--) {
      if (chosen.includes(sites[i])) continue;
      this.free.push(sites[i]);
      this.logQ.push(logQOf(sites[i]));
    }
    this.a = chosen[0];
    this.beta = chosen[1] - chosen[0];
    this.gamma = chosen.length === 3 ? chosen[2] - chosen[0] : 0;
    // beta j + gamma l = R (unused with two sizes).
    this.pair = new PairSolutions(this.beta, chosen.length === 3 ? this.gamma : this.beta + 1);
    this.logBound = chosen.length === 3 ? tripleLogCost(chosen as [number, number, number], logQOf, false) : 0;
    // Estimates: 2-D local limit theorem for P(N = n, L = parts).
    const cov = covariance(values, this.t, this.u, atMost);
    const det = Math.max(cov.varN * cov.varL - cov.cov * cov.cov, 1e-300);
    let span = 0;
    for (const s of values) span = gcd(span, atMost ? s : s - values[0]);
    const hit = Math.min(1, span / (2 * Math.PI * Math.sqrt(det)));
    // P(accept) = P(N = n, L = parts) / (prod over the three of (1 - q_s) U).
    const logBlockMax = chosen.length === 3 ? tripleLogCost(chosen as [number, number, number], logQOf, true) : 0;
    this.expectedProposals = this.free.length === 0 ? 1 : Math.max(1, Math.exp(logBlockMax) / hit);
    this.expectedLength = atMost ? Math.min(parts, cov.meanL - cov.meanZero) : parts;
    this.expectedDistinct = Math.min(values.length, this.expectedLength);
    this.expectedWork = this.expectedProposals * (this.free.length + 3) + this.expectedDistinct;
  }

  sample(source: RandomSource): Partition {
    const { n, parts, free, logQ, a, beta, gamma } = this;
    if (gamma === 0) return this.pairMember();
    const [, b, c] = this.determined;
    for (;;) {
      const counts = new Map<number, number>();
      let total = 0;
      let count = 0;
      let alive = true;
      for (let f = 0; f < free.length; f++) {
        // Z = floor(ln U / ln q) has P(Z >= j) = q^j.
        const z = Math.floor(Math.log(nextOpenDouble(source)) / logQ[f]);
        if (z > 0) {
          if (free[f] > 0) counts.set(free[f], z);
          total += z * free[f];
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
      // beta j + gamma l = R, j + l <= C.
      const R = M - a * C;
      if (R < 0) continue;
      const first = Math.max(0, Math.ceil((R - beta * C) / (gamma - beta)));
      const last = Math.floor(R / gamma);
      const solutions = this.pair.countBetween(R, first, last);
      if (solutions === 0) continue;
      if (free.length > 0) {
        const logWeight = this.u * C + this.t * M + Math.log(solutions) - this.logBound;
        if (!(source.nextDouble() < Math.exp(logWeight))) continue;
      }
      const l = this.pair.nthBetween(R, first, solutions === 1 ? 0 : nextBelow(source, solutions));
      const j = (R - gamma * l) / beta;
      const i = C - j - l;
      if (i > 0 && a > 0) counts.set(a, i);
      if (j > 0) counts.set(b, j);
      if (l > 0) counts.set(c, l);
      return countsToPartition(counts);
    }
  }

  /** Two sizes a < b, exactly k parts: i + j = k, a i + b j = n (the caller guarantees a solution). */
  private pairMember(): Partition {
    const [a, b] = this.determined;
    const j = (this.n - a * this.parts) / (b - a);
    const counts = new Map<number, number>();
    if (this.parts - j > 0) counts.set(a, this.parts - j);
    if (j > 0) counts.set(b, j);
    return countsToPartition(counts);
  }
}

/** Sites tried for the determined triple: the most frequent ones and the two extreme sites. */
const TRIPLE_CANDIDATES = 12;

/**
 * ln U for the triple (withBlock false), or ln(prod over the three of (1 - q_s) U), the
 * quantity the acceptance rate is inversely proportional to (withBlock true).
 */
function tripleLogCost([a, b, c]: readonly [number, number, number], logQOf: (s: number) => number, withBlock: boolean): number {
  const g = gcd(b - a, c - a);
  const logBound = Math.log1p(g / ((c - a) * Math.E * -logQOf(b)));
  if (!withBlock) return logBound;
  return logBound + Math.log(-Math.expm1(logQOf(a))) + Math.log(-Math.expm1(logQOf(b))) + Math.log(-Math.expm1(logQOf(c)));
}

/** The triple of sites with the least estimated cost (sites increasing, at least three). */
function cheapestTriple(sites: readonly number[], logQOf: (s: number) => number): number[] {
  const byFrequency = sites.slice().sort((s, r) => logQOf(r) - logQOf(s));
  const pool = [...new Set([...byFrequency.slice(0, TRIPLE_CANDIDATES), sites[0], sites[sites.length - 1]])].sort((s, r) => s - r);
  let best: [number, number, number] = [pool[0], pool[1], pool[2]];
  let bestCost = Infinity;
  for (let x = 0; x < pool.length; x++) {
    for (let y = x + 1; y < pool.length; y++) {
      for (let z = y + 1; z < pool.length; z++) {
        const triple: [number, number, number] = [pool[x], pool[y], pool[z]];
        const cost = tripleLogCost(triple, logQOf, true);
        if (cost < bestCost) {
          bestCost = cost;
          best = triple;
        }
      }
    }
  }
  return best;
}

interface Moments {
  readonly meanN: number;
  readonly meanL: number;
  readonly varN: number;
  readonly varL: number;
  readonly cov: number;
  /** E Z_0, the missing parts (0 unless atMost). */
  readonly meanZero: number;
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
  const meanNonZero = meanL;
  if (atMost) add(0);
  return { meanN, meanL, varN, varL, cov, meanZero: meanL - meanNonZero };
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
