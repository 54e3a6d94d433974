import type { PartitionFamily } from '../../src/core/family.js';
import { constrainedPartitionSampler } from '../../src/core/partitions/constrained/plan.js';
import { planPartitionSampler } from '../../src/core/partitions/plan.js';
import type { PartitionSampler } from '../../src/core/sampler.js';
import { sampleSource } from '../../src/core/seeding.js';

/**
 * Milliseconds per sample of the constrained partition planner's choice, for each constraint
 * kind at n = 1e3, 1e5, 1e6, plus the one-off setup (tilt solving, tables). Each cell samples for
 * about 250 ms (at least 3 samples), so the whole table takes well under 40 s.
 */
const KINDS: Array<[string, (n: number) => Omit<PartitionFamily, 'kind' | 'n'>]> = [
  ['distinct', () => ({ distinct: true })],
  ['maxPart=100', () => ({ maxPart: 100 })],
  ['minPart=7', () => ({ minPart: 7 })],
  ['length=50', () => ({ length: 50 })],
  ['maxLength=50', () => ({ maxLength: 50 })],
  ['allowed=1,2,5,10,20,50', () => ({ allowed: [1, 2, 5, 10, 20, 50] })],
  ['distinct,maxPart=n/10', (n) => ({ distinct: true, maxPart: Math.max(50, n / 10) })],
  ['distinct,length=20,minPart=3', () => ({ distinct: true, length: 20, minPart: 3 })],
];
const SIZES = [1_000, 100_000, 1_000_000];
const CELL_MS = 250;

export async function benchConstrained(): Promise<void> {
  const rows: string[] = [];
  rows.push(['family', ...SIZES.map((n) => `n=${n.toExponential(0)}`)].join(' | '));
  for (const [name, make] of KINDS) {
    const cells: string[] = [name];
    for (const n of SIZES) {
      const family = { kind: 'partition', n, ...make(n) } as PartitionFamily;
      try {
        const t0 = performance.now();
        const sampler = constrainedPartitionSampler(family);
        const t1 = performance.now();
        let count = 0;
        while (count < 3 || performance.now() - t1 < CELL_MS) {
          sampler.sample(sampleSource('bench', count, 'bench'));
          count++;
        }
        const perSample = (performance.now() - t1) / count;
        cells.push(`${perSample.toFixed(3)} ms (${sampler.method}, setup ${(t1 - t0).toFixed(0)} ms)`);
      } catch (error) {
        cells.push(`refused: ${(error as Error).name}`);
      }
    }
    rows.push(cells.join(' | '));
  }
  console.log('constrained partitions: ms per sample (planner choice)');
  for (const row of rows) console.log(row);
  benchDistinctBeside();
  benchMinPartBeside();
}

const BESIDE_SIZES = [1e6, 1e8, 1e9];
const BESIDE_ROUNDS = 5;
const BESIDE_ROUND_MS = 100;

/**
 * Partitions into distinct parts beside unrestricted partitions at the same n (both the
 * planner's choice: distinct-self-similar and self-similar), timed in alternating rounds so that
 * outside load hits both alike. Also ns per estimated step (ms per sample / expectedWork).
 */
function benchDistinctBeside(): void {
  console.log('\ndistinct parts beside unrestricted: ms per sample (setup = planning + first sample)');
  console.log(['n', 'distinct', 'unrestricted', 'ratio', 'distinct ns/step'].join(' | '));
  for (const n of BESIDE_SIZES) benchBeside(n, { distinct: true });
}

/**
 * Parts >= a (minpart-self-similar) beside unrestricted partitions, as above. The setup of the
 * first row for an a includes filling its count tables (shared by later rows with the same a).
 */
export function benchMinPartBeside(): void {
  console.log('\nminPart beside unrestricted: ms per sample (setup = planning + first sample)');
  console.log(['n', 'minPart', 'unrestricted', 'ratio', 'minPart ns/step'].join(' | '));
  for (const a of [2, 7, 100]) for (const n of BESIDE_SIZES) benchBeside(n, { minPart: a });
}

function benchBeside(n: number, constraint: Omit<PartitionFamily, 'kind' | 'n'>): void {
  const make = (constrained: boolean): { sampler: PartitionSampler; setup: number } => {
    const t0 = performance.now();
    const sampler = planPartitionSampler({ kind: 'partition', n, ...(constrained ? constraint : {}) } as PartitionFamily);
    sampler.sample(sampleSource('bench', 0, 'setup'));
    return { sampler, setup: performance.now() - t0 };
  };
  const d = make(true);
  const u = make(false);
  const time = { d: 0, u: 0 };
  const count = { d: 0, u: 0 };
  const round = (key: 'd' | 'u', sampler: PartitionSampler) => {
    const t0 = performance.now();
    let i = 0;
    while (i < 2 || performance.now() - t0 < BESIDE_ROUND_MS) sampler.sample(sampleSource('bench', count[key] + i++, 'beside'));
    time[key] += performance.now() - t0;
    count[key] += i;
  };
  for (let r = 0; r < BESIDE_ROUNDS; r++) {
    round('d', d.sampler);
    round('u', u.sampler);
  }
  const dm = time.d / count.d;
  const um = time.u / count.u;
  console.log(
    [
      `n=${n.toExponential(0)}${'minPart' in constraint ? `, minPart=${constraint.minPart}` : ''}`,
      `${dm.toFixed(3)} ms (${d.sampler.method}, setup ${d.setup.toFixed(0)} ms)`,
      `${um.toFixed(3)} ms (${u.sampler.method}, setup ${u.setup.toFixed(0)} ms)`,
      (dm / um).toFixed(2),
      ((dm * 1e6) / d.sampler.expectedWork).toFixed(1),
    ].join(' | '),
  );
}

if (process.argv[1] !== undefined && import.meta.url.endsWith(process.argv[1].split('/').pop()!)) {
  await benchConstrained();
}
