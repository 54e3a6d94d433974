/**
 * Throwaway scan (not a test): draws random constrained families as the property test does
 * (test/support/random-families.ts) under other seeds and lists the families refused for work
 * (LimitExceededError), those whose planning takes > 200 ms and those whose samples take > 50 ms.
 * Usage: npx tsx scripts/scan-families.ts <seedLabel> <trials> [out.jsonl]
 * Each line of the output: {family, outcome, method, planMs, firstMs, secondMs} in process CPU
 * time (wall-clock on a shared machine is several times that), flagged lines also on stdout.
 * A scan to find what to work on, not a benchmark (npm run bench is).
 */
import { appendFileSync, writeFileSync } from 'node:fs';
import { EmptyFamilyError, LimitExceededError } from '../src/core/errors.js';
import { planPartitionSampler } from '../src/core/partitions/plan.js';
import { sampleSource } from '../src/core/seeding.js';
import { drawFamily } from '../test/support/random-families.js';

const label = process.argv[2] ?? 'scan';
const trials = Number(process.argv[3] ?? 1000);
const out = process.argv[4];
if (out) writeFileSync(out, '');
const source = sampleSource(label, 0, 'test');
for (let trial = 0; trial < trials; trial++) {
  const f = drawFamily(source);
  const row: Record<string, unknown> = { trial, family: f };
  const cpu = () => {
    const u = process.cpuUsage();
    return (u.user + u.system) / 1000;
  };
  const t0 = cpu();
  try {
    const sampler = planPartitionSampler(f);
    const t1 = cpu();
    sampler.sample(sampleSource(label, trial, 'sample'));
    const t2 = cpu();
    sampler.sample(sampleSource(label, trial, 'sample2'));
    const t3 = cpu();
    Object.assign(row, { outcome: 'served', method: sampler.method, planMs: +(t1 - t0).toFixed(1), firstMs: +(t2 - t1).toFixed(1), secondMs: +(t3 - t2).toFixed(1) });
  } catch (error) {
    const ms = +(cpu() - t0).toFixed(1);
    if (error instanceof EmptyFamilyError) Object.assign(row, { outcome: 'empty', planMs: ms });
    else if (error instanceof LimitExceededError) Object.assign(row, { outcome: 'refused', planMs: ms, message: error.message });
    else Object.assign(row, { outcome: 'error', planMs: ms, message: String(error) });
  }
  const line = JSON.stringify(row);
  const flagged = row.outcome === 'refused' || row.outcome === 'error' || (row.planMs as number) > 200 || (row.firstMs as number) > 50 || (row.secondMs as number) > 50;
  if (out) appendFileSync(out, line + '\n');
  if (flagged) console.log(line);
}
