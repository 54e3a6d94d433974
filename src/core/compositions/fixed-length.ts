import { nextBelow, type RandomSource } from '../random.js';
import type { CompositionSampler } from '../sampler.js';

/**
 * Uniform weak composition of n into k parts (parts >= 0): a uniform (k-1)-subset of the
 * n+k-1 slots marks the bars, the rest are stars (stars and bars; Feller vol. 1, §II.5), so
 * each of the C(n+k-1, k-1) compositions is equally likely. The subset is drawn by Floyd's
 * algorithm (Bentley & Floyd, "A sample of brilliance", CACM 30(9), 1987) in O(m) draws for
 * m = min(k-1, n) chosen slots — bars when they are fewer, stars otherwise — then sorted, so the
 * cost is O(m log m + k) and never O(n) when k is small.
 */
export function sampleWeakComposition(source: RandomSource, n: number, k: number): number[] {
  if (k === 0) return [];
  if (k === 1) return [n];
  const slots = n + k - 1;
  if (k - 1 <= n) {
    const bars = floydSubset(source, slots, k - 1);
    const parts = new Array<number>(k);
    let previous = 0;
    for (let i = 0; i < k - 1; i++) {
      parts[i] = bars[i] - previous - 1;
      previous = bars[i];
    }
    parts[k - 1] = slots - previous;
    return parts;
  }
  // Fewer stars than bars: choose the n star slots; a star at slot s with rank i (1-based)
  // has s - i bars before it, so it lands in part s - i (0-based).
  const stars = floydSubset(source, slots, n);
  const parts = new Array<number>(k).fill(0);
  for (let i = 0; i < n; i++) parts[stars[i] - (i + 1)] += 1;
  return parts;
}

/** A uniform m-subset of {1..total}, sorted ascending (Floyd's algorithm). */
export function floydSubset(source: RandomSource, total: number, m: number): Float64Array {
  const chosen = new Set<number>();
  for (let j = total - m + 1; j <= total; j++) {
    const t = 1 + nextBelow(source, j);
    chosen.add(chosen.has(t) ? j : t);
  }
  const out = Float64Array.from(chosen);
  out.sort();
  return out;
}

/** Expected steps of sampleWeakComposition: one draw and one set insert per chosen slot, the sort, one step per part. */
export function weakCompositionWork(n: number, k: number): number {
  const m = Math.min(Math.max(0, k - 1), n);
  return 2 * m + m * Math.log2(m + 1) + k;
}

/**
 * Compositions of n into exactly k parts, each >= shift (shift 0: weak compositions; shift 1:
 * the ordinary case, a uniform (k-1)-subset of the n-1 gaps). Subtracting shift from every part
 * maps them onto weak compositions of n - k*shift. With `scale` d > 1 the parts are
 * shift + d*v for a weak composition v of (n - k*shift)/d: the members of a part list such as
 * {2, 7} (shift 2, d = 5) once its core (reduce.ts) is the full range {0..(n - k*shift)/d}.
 */
export function fixedLengthSampler(n: number, k: number, shift: number, scale = 1): CompositionSampler {
  const rest = (n - k * shift) / scale;
  if (!Number.isInteger(rest) || rest < 0) throw new RangeError(`n - k*shift = ${n - k * shift} must be a non-negative multiple of scale = ${scale}`);
  return {
    method: 'gap-subset/1',
    expectedLength: k,
    expectedWork: weakCompositionWork(rest, k),
    sample(source) {
      const parts = sampleWeakComposition(source, rest, k);
      if (scale !== 1) for (let i = 0; i < k; i++) parts[i] *= scale;
      if (shift !== 0) for (let i = 0; i < k; i++) parts[i] += shift;
      return parts;
    },
  };
}
