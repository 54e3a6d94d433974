import type { RandomSource } from '../random.js';
import { LOG_CUT } from './discrete-law.js';
import { logFactorial, logPoissonPmf, poissonMode } from './log-poisson.js';
import { PoissonVariate } from './poisson-variate.js';
import type { SetPartitionSampler } from './sampler.js';
import type { SetPartition } from './set-partition.js';
import type { SizeLaw } from './size-law.js';
import { assignSizes } from './urns.js';

/**
 * Boltzmann sampling of set partitions in multiplicity form, for families without an exact
 * number of blocks: in the labelled Boltzmann model at (x, y) the numbers c_s of blocks of each
 * size s are independent Poisson(y·x^s/s!) variables (the exponential formula: the model's
 * generating function exp(y·sum x^s/s!) is a product over s of Poisson generating functions;
 * Duchon et al. 2004, §4; Arratia, Barbour & Tavaré, Logarithmic Combinatorial Structures
 * 2003, §2.2). One size d — the most frequent — is left out and determined by the total:
 * c_d = (n − sum_(s≠d) s·c_s)/d, kept with probability P(c_d)/max P, the probabilistic
 * divide-and-conquer of Arratia & DeSalvo (2016) with the block count of one size as the
 * deterministic part. A kept draw of block counts c has probability proportional to
 *   prod_s (y·x^s/s!)^(c_s)/c_s!  =  y^k·x^n · prod_s 1/((s!)^(c_s)·c_s!),
 * and n!/prod_s ((s!)^(c_s)·c_s!) set partitions have these block counts, which urns.ts
 * makes equally likely; so each has probability ∝ y^k·x^n/n!, and keeping the draw with
 * probability y^(K − k) (when at most K blocks are asked for) makes it uniform. Sizes whose
 * Poisson mean is below e^-45 are left out (they would occur in under ~3e-20 of the draws).
 * One trial costs one uniform per allowed size in the window, whatever n: the method of choice
 * when blocks are many and their sizes few (e.g. maxBlockSize = 8 at n = 10^6).
 */
export interface SizesOptions {
  readonly n: number;
  readonly sizes: SizeLaw;
  readonly minSize: number;
  readonly maxSize: number;
  readonly maxBlocks?: number;
  readonly logY?: number;
  readonly expectedTrials: number;
  readonly expectedBlocks: number;
}

/** The sizes whose Poisson means are above e^-LOG_CUT, and the means' logs. */
export function sizeWindow(t: number, logY: number, minSize: number, maxSize: number, centre: number): { lo: number; logMeans: Float64Array } {
  const logMean = (s: number) => logY + s * t - logFactorial(s);
  let lo = centre;
  while (lo > minSize && logMean(lo - 1) > -LOG_CUT) lo--;
  let hi = centre;
  while (hi < maxSize && logMean(hi + 1) > -LOG_CUT) hi++;
  const logMeans = new Float64Array(hi - lo + 1);
  for (let s = lo; s <= hi; s++) logMeans[s - lo] = logMean(s);
  return { lo, logMeans };
}

export function poissonSizesSampler(options: SizesOptions): SetPartitionSampler {
  const { n, sizes } = options;
  const logY = options.logY ?? 0;
  const maxBlocks = options.maxBlocks ?? Infinity;
  const law = sizes.law;
  // The most frequent size is the mode of the size law.
  let d = law.lo;
  for (let i = 0; i < law.pmf.length; i++) if (law.pmf[i] === law.pmax) d = law.lo + i;
  const { lo, logMeans } = sizeWindow(sizes.t, logY, options.minSize, options.maxSize, d);
  const variates: PoissonVariate[] = [];
  for (let i = 0; i < logMeans.length; i++) variates.push(new PoissonVariate(Math.exp(logMeans[i])));
  const meanD = Math.exp(logMeans[d - lo]);
  const logTop = poissonMode(meanD).logPmf;
  const width = logMeans.length;
  return {
    method: 'poisson-sizes/1',
    expectedLength: n,
    expectedBlocks: options.expectedBlocks,
    // Per trial one Poisson variate per size (about two uniforms each); per kept sample the shuffle and numbering.
    expectedWork: options.expectedTrials * (2 + 2 * width) + 3 * n,
    sample(source: RandomSource): SetPartition {
      const counts = new Int32Array(width);
      for (;;) {
        let used = 0;
        let blocks = 0;
        let over = false;
        for (let i = 0; i < width; i++) {
          if (i === d - lo) continue;
          const c = variates[i].sample(source);
          counts[i] = c;
          used += c * (lo + i);
          blocks += c;
          if (used > n || blocks > maxBlocks) {
            over = true;
            break;
          }
        }
        if (over) continue;
        const rest = n - used;
        if (rest % d !== 0) continue;
        const cd = rest / d;
        if (blocks + cd > maxBlocks) continue;
        if (source.nextDouble() >= Math.exp(logPoissonPmf(cd, meanD) - logTop)) continue;
        blocks += cd;
        if (logY < 0 && blocks < maxBlocks && source.nextDouble() >= Math.exp(logY * (maxBlocks - blocks))) continue;
        counts[d - lo] = cd;
        const blockSizes = new Int32Array(blocks);
        let at = 0;
        for (let i = 0; i < width; i++) blockSizes.fill(lo + i, at, (at += counts[i]));
        return assignSizes(source, n, blockSizes, blocks);
      }
    },
  };
}
