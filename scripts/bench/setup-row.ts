/**
 * One row of `npm run bench -- setup` in its own process (scripts/bench/setup.ts spawns it), so
 * that no count table or memo of an earlier row is reused: the compiler is first warmed on four
 * unrelated families (as a running server would be), then the row's family is planned, sampled
 * once (what the first sample builds lazily) and sampled SAMPLES more times with fresh seeds.
 * Prints one JSON line: {method, planMs, firstMs, sampleMs} in process CPU time.
 * Usage: npx tsx scripts/bench/setup-row.ts '<family JSON without kind>'
 */
import type { PartitionFamily } from '../../src/core/family.js';
import { planPartitionSampler } from '../../src/core/partitions/plan.js';
import { sampleSource } from '../../src/core/seeding.js';

const SAMPLES = 10;
const WARM: ReadonlyArray<Omit<PartitionFamily, 'kind'>> = [
  { n: 98_765_432, distinct: true, minPart: 77 },
  { n: 9_876_543, minPart: 77 },
  { n: 98_765_432, maxPart: 1234 },
  { n: 4_567_891, minPart: 777, maxPart: 999 },
];

const cpu = () => {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1000;
};
for (const f of WARM) planPartitionSampler({ kind: 'partition', ...f }).sample(sampleSource('setup-warm', 0, 'sample'));
const family = { kind: 'partition', ...JSON.parse(process.argv[2]) } as PartitionFamily;
const t0 = cpu();
const sampler = planPartitionSampler(family);
const t1 = cpu();
sampler.sample(sampleSource('setup-bench', 0, 'sample'));
const t2 = cpu();
for (let i = 1; i <= SAMPLES; i++) sampler.sample(sampleSource('setup-bench', i, 'sample'));
const t3 = cpu();
console.log(JSON.stringify({ method: sampler.method, planMs: t1 - t0, firstMs: t2 - t1, sampleMs: (t3 - t2) / SAMPLES }));
