import { planCompositionSampler } from '../../src/core/compositions/plan.js';
import { familyKey, type CompositionFamily } from '../../src/core/family.js';
import { sampleSource } from '../../src/core/seeding.js';

/**
 * Milliseconds per composition for each method, after planning (tables are built once per
 * family and reported separately). Each row runs for at most ~1 s (at least 2 samples).
 */
const ROWS: [string, Omit<CompositionFamily, 'kind'>][] = [
  ['unrestricted n=1e3', { n: 1e3 }],
  ['unrestricted n=1e6', { n: 1e6 }],
  ['unrestricted n=2e7', { n: 2e7 }],
  ['k=10 n=1e3', { n: 1e3, length: 10 }],
  ['k=10 n=1e6', { n: 1e6, length: 10 }],
  ['k=10 n=1e8', { n: 1e8, length: 10 }],
  ['k=1000 n=1e3', { n: 1e3, length: 1000 }],
  ['k=1000 n=1e6', { n: 1e6, length: 1000 }],
  ['k=1000 n=1e8', { n: 1e8, length: 1000 }],
  ['weak k=1000 n=1e8', { n: 1e8, length: 1000, minPart: 0 }],
  ['parts [2,5] n=1e3', { n: 1e3, minPart: 2, maxPart: 5 }],
  ['parts [2,5] n=1e6', { n: 1e6, minPart: 2, maxPart: 5 }],
  ['parts >=3 n=1e6', { n: 1e6, minPart: 3 }],
  ['allowed {1,3,4} n=1e3', { n: 1e3, allowed: [1, 3, 4] }],
  ['allowed {1,3,4} n=1e6', { n: 1e6, allowed: [1, 3, 4] }],
  ['allowed {6,10,15} n=1e6', { n: 1e6, allowed: [6, 10, 15] }],
  ['k=10 parts<=150 n=1e3', { n: 1e3, length: 10, maxPart: 150 }],
  ['k=1000 parts<=2000 n=1e6', { n: 1e6, length: 1000, maxPart: 2000 }],
  ['k=1000 parts<=1e6 n=1e8', { n: 1e8, length: 1000, minPart: 0, maxPart: 1e6 }],
  ['k=1000 from {50,100,150} n=1e5', { n: 1e5, length: 1000, allowed: [50, 100, 150] }],
];

export async function benchCompositions(): Promise<void> {
  const out: string[] = [];
  out.push('compositions: ms per sample (plan = one-off planning/table time)');
  out.push(`${'family'.padEnd(34)}${'method'.padEnd(20)}${'plan ms'.padStart(9)}${'ms/sample'.padStart(11)}${'samples'.padStart(9)}${'mean len'.padStart(12)}${'exp. work'.padStart(11)}`);
  for (const [name, f] of ROWS) {
    const family: CompositionFamily = { kind: 'composition', ...f };
    const t0 = performance.now();
    const sampler = planCompositionSampler(family);
    const plan = performance.now() - t0;
    const key = familyKey(family);
    let samples = 0;
    let parts = 0;
    const t1 = performance.now();
    while (samples < 2000 && (samples < 2 || performance.now() - t1 < 1000)) {
      parts += sampler.sample(sampleSource('bench', samples, key)).length;
      samples++;
    }
    const per = (performance.now() - t1) / samples;
    out.push(
      `${name.padEnd(34)}${sampler.method.padEnd(20)}${plan.toFixed(1).padStart(9)}${per.toFixed(4).padStart(11)}${String(samples).padStart(9)}${(parts / samples).toFixed(0).padStart(12)}${sampler.expectedWork.toExponential(1).padStart(11)}`,
    );
  }
  console.log(out.join('\n'));
}

if (import.meta.url === `file://${process.argv[1]}`) await benchCompositions();
