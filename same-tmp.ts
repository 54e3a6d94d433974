const root = process.argv[2];
const { constrainedPartitionSampler } = await import(root + '/src/core/partitions/constrained/plan.js');
const { sampleSource } = await import(root + '/src/core/seeding.js');
import { createHash } from 'node:crypto';
const fams: any[] = [
  { n: 100000, minPart: 7 }, { n: 1000000, minPart: 7 }, { n: 1000000, minPart: 100 }, { n: 1000000, maxPart: 250 },
  { n: 1000000, length: 250 }, { n: 10000000, maxLength: 791 }, { n: 1000000, minPart: 7, maxPart: 1000 }, { n: 30000, minPart: 3 },
];
const N = Number(process.argv[3] ?? 1500);
for (const f of fams) {
  const fam = { kind: 'partition', ...f };
  const s = constrainedPartitionSampler(fam);
  const h = createHash('sha1');
  const c0 = process.cpuUsage();
  for (let i = 0; i < N; i++) h.update(JSON.stringify(s.sample(sampleSource('same', i, 'k'))));
  const c = process.cpuUsage(c0);
  console.log(JSON.stringify(f).padEnd(40), s.method.padEnd(34), h.digest('hex').slice(0, 12), ((c.user + c.system) / 1000 / N).toFixed(3), 'ms');
}
