import { nextBelow, type RandomSource } from '../random.js';
import type { CompositionSampler } from '../sampler.js';
import type { FreeCore } from './reduce.js';
import { partBounds } from './resolve.js';
import { solveTilt, type Tilt } from './tilt.js';

/**
 * Uniform compositions of large n with parts in a set S (no length), in three steps:
 *
 * 1. Parts are drawn i.i.d. with P(v) = x^v, where sum_{v in S} x^v = 1 (the Boltzmann tilt),
 *    until the remainder r first drops to T or below. A prefix with sum n - r has probability
 *    x^(n-r), whatever its number of parts.
 * 2. The prefix is kept with probability u(r) / U, where u(r) = c(r) x^r is the probability that
 *    the renewal process hits r (c(r) = compositions of r; u(r) -> 1/mu, Feller vol. 1 XIII.11)
 *    and U bounds u over the landing window. Remainders below 0 are rejected (u = 0).
 * 3. The last r units are a uniform composition of r, by sequential choice with
 *    P(first part v) = x^v u(r - v) / u(r).
 * A composition of n is output with probability x^(n-r) * u(r)/U * 1/c(r) = x^n / U: the same
 * for all, so the law is exactly uniform up to double rounding (a probabilistic divide-and-
 * conquer in the sense of Arratia & DeSalvo, "Probabilistic divide-and-conquer", Combin. Probab.
 * Comput. 2016). Acceptance is u(n)/U ~ 1/(mu U), close to 1 when the parts are bounded by T.
 * The only inexactness is the double-precision root x (sum x^v = 1 to ~1e-16, so a sample with
 * j parts is weighted by (1 +- 1e-16)^j) and the rounding of u.
 */

/** Table of u(0..T) in doubles: u(0) = 1, u(r) = sum_{v in S} x^v u(r - v). */
export function renewalTable(core: FreeCore, tilt: Tilt, size: number): Float64Array {
  const u = new Float64Array(size + 1);
  u[0] = 1;
  const { parts } = core;
  if (parts.kind === 'range') {
    // H(s) = sum_{j=0}^{L-1} x^j u(s - j) = u(s) + x H(s-1) - x^L u(s - L); u(r) = x^a H(r - a).
    const a = parts.min;
    const len = parts.max - parts.min + 1;
    const xa = Math.exp(-a * tilt.t);
    const xl = Math.exp(-len * tilt.t);
    const h = new Float64Array(size + 1);
    for (let r = 0; r <= size; r++) {
      if (r > 0) u[r] = r >= a ? xa * h[r - a] : 0;
      const drop = r >= len ? xl * u[r - len] : 0;
      h[r] = Math.max(0, u[r] + (r > 0 ? tilt.x * h[r - 1] : 0) - drop);
    }
  } else {
    const weights = parts.values.map((v) => Math.exp(-v * tilt.t));
    for (let r = 1; r <= size; r++) {
      let s = 0;
      for (let i = 0; i < parts.values.length; i++) {
        const v = parts.values[i];
        if (v > r) break;
        s += weights[i] * u[r - v];
      }
      u[r] = s;
    }
  }
  return u;
}

/** Vose's alias method (Vose, IEEE TSE 17(9), 1991): O(1) draws from a finite law. */
function aliasTable(weights: number[]): { prob: Float64Array; alias: Int32Array } {
  const m = weights.length;
  const total = weights.reduce((s, w) => s + w, 0);
  const scaled = weights.map((w) => (w * m) / total);
  const prob = new Float64Array(m);
  const alias = new Int32Array(m);
  const small: number[] = [];
  const large: number[] = [];
  scaled.forEach((p, i) => (p < 1 ? small : large).push(i));
  while (small.length > 0 && large.length > 0) {
    const s = small.pop()!;
    const l = large.pop()!;
    prob[s] = scaled[s];
    alias[s] = l;
    scaled[l] = scaled[l] + scaled[s] - 1;
    (scaled[l] < 1 ? small : large).push(l);
  }
  for (const i of [...small, ...large]) { prob[i] = 1; alias[i] = i; }
  return { prob, alias };
}

/** A draw from P(v) = x^v on S (normalised): truncated geometric for ranges, alias table for lists. */
function partDrawer(core: FreeCore, tilt: Tilt): (source: RandomSource) => number {
  const { parts } = core;
  if (parts.kind === 'range') {
    const a = parts.min;
    const len = parts.max - parts.min + 1;
    // Inversion: v = a + floor(ln(1 - U (1 - x^L)) / ln x), in [a, b].
    const q = -Math.expm1(-len * tilt.t);
    const t = tilt.t;
    return (source) => a + Math.min(len - 1, Math.floor(-Math.log1p(-source.nextDouble() * q) / t));
  }
  const values = parts.values;
  const { prob, alias } = aliasTable(values.map((v) => Math.exp(-v * tilt.t)));
  return (source) => {
    const i = nextBelow(source, values.length);
    return values[source.nextDouble() < prob[i] ? i : alias[i]];
  };
}

/** Largest table size: O(T) doubles for ranges, O(T |S|) work for lists. */
export const MAX_RENEWAL_TABLE = 2 ** 21;
export const MAX_RENEWAL_TABLE_WORK = 2 ** 25;

/** `tableSize` overrides T (tests use a small T so that all three steps run at small n). */
export function tiltedRenewalSampler(core: FreeCore, tableSize?: number): CompositionSampler {
  const tilt = solveTilt(core.parts);
  const { n, parts, scale } = core;
  const { min, max } = partBounds(parts);
  const width = parts.kind === 'list' ? parts.values.length : 2;
  // T covers one largest part plus a margin over which u(r) settles near 1/mu.
  const cap = Math.max(64, Math.min(MAX_RENEWAL_TABLE, Math.floor(MAX_RENEWAL_TABLE_WORK / width)));
  const size = Math.min(n, tableSize ?? Math.min(cap, Math.max(4096, max + 1024)));
  const u = renewalTable(core, tilt, size);
  if (n <= size && u[n] === 0) throw new Error('unreachable n passed feasibility checks (bug)');
  let bound = 0;
  if (n > size) for (let r = Math.max(0, size - max + 1); r <= size; r++) bound = Math.max(bound, u[r]);
  const draw = partDrawer(core, tilt);
  const xs = parts.kind === 'list' ? parts.values.map((v) => Math.exp(-v * tilt.t)) : [];

  // Phase 3: sequential choice over the table.
  const finish = (source: RandomSource, r: number, out: number[]): void => {
    while (r > 0) {
      let y = source.nextDouble() * u[r];
      let chosen = -1;
      if (parts.kind === 'range') {
        let xv = Math.exp(-min * tilt.t);
        for (let v = min; v <= Math.min(max, r); v++, xv *= tilt.x) {
          const w = xv * u[r - v];
          if (w > 0) chosen = v; // rounding fallback: the last part with positive weight
          if (y < w) break;
          y -= w;
        }
      } else {
        for (let i = 0; i < parts.values.length; i++) {
          const v = parts.values[i];
          if (v > r) break;
          const w = xs[i] * u[r - v];
          if (w > 0) chosen = v;
          if (y < w) break;
          y -= w;
        }
      }
      out.push(chosen * scale);
      r -= chosen;
    }
  };

  const mu = tilt.mean;
  const acceptance = n > size ? 1 / (mu * bound) : 1;
  const scan = parts.kind === 'range' ? mu - min + 1 : Math.min(width, mu);
  return {
    method: 'tilted-renewal/1',
    expectedLength: n / mu,
    expectedWork: (n > size ? ((n - size) / mu + 2) / Math.min(1, acceptance) : 0) + (Math.min(n, size) / mu) * (scan + 1),
    sample(source: RandomSource) {
      const out: number[] = [];
      let r = n;
      if (n > size) {
        for (;;) {
          out.length = 0;
          r = n;
          while (r > size) {
            const v = draw(source);
            out.push(v * scale);
            r -= v;
          }
          if (r >= 0 && source.nextDouble() * bound < u[r]) break;
        }
      }
      finish(source, r, out);
      return out;
    },
  };
}
