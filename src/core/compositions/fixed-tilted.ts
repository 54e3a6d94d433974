import { nextBelow, type RandomSource } from '../random.js';
import type { CompositionSampler } from '../sampler.js';
import type { FixedCore } from './reduce.js';
import { partBounds } from './resolve.js';

/**
 * k parts from S (smallest member 0 after the shift) summing to n, for large n and k: the first
 * k-1 parts are drawn i.i.d. with P(v) = e^{-vt} / Z on S, the tilt t chosen so the mean part is
 * n/k; the last part is forced to w = n - (sum of the others) and kept with probability
 * e^{-wt} / max_{v in S} e^{-vt} (0 when w is not in S). A composition is then produced with
 * probability e^{-nt} / (Z^{k-1} max e^{-vt}) — the same for all, so the law is exactly
 * uniform (up to double rounding); with k fixed the normaliser Z cancels. Acceptance is
 * P(sum of k parts = n) / max P(v) ~ 1 / (sqrt(2 pi k) sigma max P(v)) by the local limit theorem
 * (Petrov, Sums of Independent Random Variables 1975, ch. VII), i.e. O(1/sqrt k), so a sample
 * costs O(k^1.5). A draw stops early once the running sum exceeds n.
 */

interface Law {
  readonly t: number;
  readonly mean: number;
  readonly variance: number;
  /** Largest point probability. */
  readonly peak: number;
}

function lawOf(values: readonly number[] | null, top: number, t: number): Law {
  if (values === null) {
    const len = top + 1;
    if (Math.abs(t) * len < 1e-7) {
      return { t, mean: top / 2 - (t * top * (top + 2)) / 12, variance: (top * (top + 2)) / 12, peak: 1 / len };
    }
    // Truncated geometric on 0..L with ratio e^{-t} (t > 0).
    const g = 1 / Math.expm1(t);
    const tail = len * t > 700 ? 0 : len / Math.expm1(len * t);
    const mean = g - tail;
    const variance = Math.exp(t) * g * g - (len * t > 700 ? 0 : Math.exp(len * t) * tail * tail);
    return { t, mean, variance, peak: -Math.expm1(-t) / -Math.expm1(-len * t) };
  }
  // Weights relative to the largest one, so nothing overflows whatever the sign of t.
  const logs = values.map((v) => -v * t);
  const high = Math.max(...logs);
  let z = 0;
  let m1 = 0;
  let m2 = 0;
  for (let i = 0; i < values.length; i++) {
    const w = Math.exp(logs[i] - high);
    z += w;
    m1 += w * values[i];
    m2 += w * values[i] * values[i];
  }
  const mean = m1 / z;
  return { t, mean, variance: Math.max(0, m2 / z - mean * mean), peak: 1 / z };
}

/** Solves mean(t) = target by bisection (the mean falls as t grows). */
function solve(values: readonly number[] | null, top: number, target: number): Law {
  let lo = values === null ? 0 : -700 / top;
  let hi = 700 / Math.max(1, values === null ? 1 : top);
  if (values === null) hi = 60;
  for (let i = 0; i < 200; i++) {
    const mid = (lo + hi) / 2;
    if (lawOf(values, top, mid).mean > target) lo = mid;
    else hi = mid;
  }
  return lawOf(values, top, (lo + hi) / 2);
}

export function fixedTiltedSampler(core: FixedCore): CompositionSampler {
  const { k, shift, scale } = core;
  const top = partBounds(core.parts).max;
  const values = core.parts.kind === 'list' ? core.parts.values : null;
  // Ranges are flipped (v -> L - v) so that the mean is at most L/2 and t >= 0.
  const flipped = values === null && 2 * core.n > k * top;
  const n = flipped ? k * top - core.n : core.n;
  const law = solve(values, top, n / k);
  const t = law.t;
  let draw: (source: RandomSource) => number;
  let keep: (w: number) => number;
  if (values === null) {
    const len = top + 1;
    const q = -Math.expm1(-len * t);
    draw = t === 0 || q === 0
      ? (source) => nextBelow(source, len)
      : (source) => Math.min(top, Math.floor(-Math.log1p(-source.nextDouble() * q) / t));
    keep = (w) => Math.exp(-w * t);
  } else {
    const logs = values.map((v) => -v * t);
    const high = Math.max(...logs);
    const cumulative: number[] = [];
    let total = 0;
    for (const l of logs) cumulative.push((total += Math.exp(l - high)));
    const member = new Set(values);
    draw = (source) => {
      const y = source.nextDouble() * total;
      let lo = 0;
      let hi = values.length - 1;
      while (lo < hi) {
        const mid = (lo + hi) >> 1;
        if (cumulative[mid] > y) hi = mid;
        else lo = mid + 1;
      }
      return values[lo];
    };
    keep = (w) => (member.has(w) ? Math.exp(-w * t - high) : 0);
  }
  const acceptance = Math.min(1, 1 / (Math.sqrt(2 * Math.PI * k * Math.max(law.variance, 1e-12)) * law.peak));
  return {
    method: 'tilted-last-part/1',
    expectedLength: k,
    expectedWork: k / acceptance,
    sample(source: RandomSource) {
      const parts = new Array<number>(k);
      for (;;) {
        let sum = 0;
        let i = 0;
        for (; i < k - 1 && sum <= n; i++) sum += parts[i] = draw(source);
        if (sum > n) continue;
        const last = n - sum;
        if (values === null && last > top) continue;
        if (!(source.nextDouble() < keep(last))) continue;
        parts[k - 1] = last;
        for (let j = 0; j < k; j++) parts[j] = shift + scale * (flipped ? top - parts[j] : parts[j]);
        return parts;
      }
    },
  };
}
