/**
 * `npm run bench -- costs`: the work-cost table (src/core/work-costs.ts) against the clock. For
 * each sampler method, families the planners choose it for are sampled as the service samples
 * them — the sample's stream from (seed, i, family), the sample, its JSON encoding — and the
 * measured time per sample is printed beside the table's estimate
 * (SEEDING_NS + expectedWork × ns/step + numbers × NS_PER_NUMBER), with their ratio and the
 * ns/step that would make the estimate exact for that family. Served families are timed as whole
 * NDJSON requests through the app (what the budget limits); the reference methods the service
 * does not serve are sampled and encoded directly.
 */
import type { PartitionFamily, SetPartitionFamily } from '../../src/core/family.js';
import { familyKey } from '../../src/core/family.js';
import { DivideAndConquerSampler } from '../../src/core/partitions/divide-and-conquer.js';
import { PlainRejectionSampler } from '../../src/core/partitions/plain-rejection.js';
import { RecursiveOracle } from '../../src/core/partitions/recursive-oracle.js';
import { planSetPartitionSampler } from '../../src/core/set-partitions/plan.js';
import type { RandomSource } from '../../src/core/random.js';
import { sampleSource } from '../../src/core/seeding.js';
import { NS_PER_NUMBER, NS_PER_STEP, SEEDING_NS, baseMethod, sampleTimeNs } from '../../src/core/work-costs.js';
import { createApp } from '../../src/http/app.js';
import { DEFAULT_LIMITS } from '../../src/http/limits.js';
import { compositionAsParts, partitionAsMultiplicities, partitionAsParts } from '../../src/http/encode.js';
import { setPartitionAsBlocks } from '../../src/http/set-partition-encode.js';
import { compositionFamily } from '../../src/library/compositions.js';
import { partitionFamily } from '../../src/library/partitions.js';
import { setPartitionFamily } from '../../src/library/set-partitions.js';

/**
 * Wall-clock per timing round (at least one sample); each case is timed in ROUNDS rounds and the
 * fastest kept, which filters out most of the noise of a shared machine.
 */
const ROUND_MS = 80;
const ROUNDS = 5;

/** One family to time: what is sampled, how it is written, and the numbers a sample writes. */
interface Case {
  readonly label: string;
  readonly method: string;
  readonly expectedWork: number;
  readonly numbers: number;
  /** Sample i, encoded (the encoded text is kept so the work is not optimised away). */
  readonly once: (i: number) => string;
  /** The request serving this family (path and query without count, seed, format); absent for methods the service does not serve. */
  readonly url?: string;
}

function query(params: Params): string {
  return Object.entries(params)
    .map(([key, value]) => `${key}=${Array.isArray(value) ? value.join(',') : String(value)}`)
    .join('&');
}

type Params = Record<string, unknown> & { n: number };

function partitions(params: Params, as: 'parts' | 'multiplicities' = 'parts'): Case {
  const family = partitionFamily(params as never);
  const { sampler, streams } = family;
  const encoder = as === 'multiplicities' ? partitionAsMultiplicities : partitionAsParts;
  return {
    label: `partitions ${JSON.stringify(params)}${as === 'multiplicities' ? ' as=multiplicities' : ''}`,
    method: sampler.method,
    expectedWork: sampler.expectedWork,
    numbers: as === 'multiplicities' ? 2 * sampler.expectedDistinct : sampler.expectedLength,
    once: (i) => encoder.json(sampler.sample(streams.source('costs', i))),
    url: `/v1/partitions?${query(params)}${as === 'multiplicities' ? '&as=multiplicities' : ''}`,
  };
}

function compositions(params: Params): Case {
  const { sampler, streams } = compositionFamily(params as never);
  return {
    label: `compositions ${JSON.stringify(params)}`,
    method: sampler.method,
    expectedWork: sampler.expectedWork,
    numbers: sampler.expectedLength,
    once: (i) => compositionAsParts.json(sampler.sample(streams.source('costs', i))),
    url: `/v1/compositions?${query(params)}`,
  };
}

function setPartitions(params: Params): Case {
  const { sampler, streams } = setPartitionFamily(params as never);
  return {
    label: `set partitions ${JSON.stringify(params)}`,
    method: sampler.method,
    expectedWork: sampler.expectedWork,
    numbers: sampler.expectedLength,
    once: (i) => setPartitionAsBlocks.json(sampler.sample(streams.source('costs', i))),
    url: `/v1/set-partitions?${query(params)}`,
  };
}

/** A core sampler the service does not serve (reference methods, forced plans), sampled the same way. */
function direct<S>(label: string, sampler: { method: string; expectedWork: number; expectedLength: number; sample(source: RandomSource): S }, key: string, encode: (sample: S) => string): Case {
  return {
    label,
    method: sampler.method,
    expectedWork: sampler.expectedWork,
    numbers: sampler.expectedLength,
    once: (i) => encode(sampler.sample(sampleSource('costs', i, key))),
  };
}

const ALLOWED_THOUSANDS = Array.from({ length: 40 }, (_, i) => 1000 * (i + 1));

/** Families covering every method of the cost table, two sizes where the method spans a range. */
function cases(): Case[] {
  const forcedTable: SetPartitionFamily = { kind: 'set-partition', n: 200, blocks: 20 };
  const unrestricted = (n: number): PartitionFamily => ({ kind: 'partition', n });
  return [
    partitions({ n: 0 }),
    partitions({ n: 100 }),
    partitions({ n: 1000 }),
    partitions({ n: 10_000 }),
    partitions({ n: 1_000_000 }),
    partitions({ n: 1_000_000 }, 'multiplicities'),
    partitions({ n: 100_000_000 }, 'multiplicities'),
    direct('plain rejection n=1e4', new PlainRejectionSampler(10_000), familyKey(unrestricted(10_000)), (p) => partitionAsParts.json(p)),
    direct('divide and conquer n=1e5', new DivideAndConquerSampler(100_000), familyKey(unrestricted(100_000)), (p) => partitionAsParts.json(p)),
    direct('recursive oracle n=300', new RecursiveOracle(300), familyKey(unrestricted(300)), (p) => partitionAsParts.json(p)),
    partitions({ n: 0, maxPart: 5 }),
    partitions({ n: 1_000_000, length: 1_000_000 }),
    partitions({ n: 300, maxPart: 20 }),
    partitions({ n: 300, length: 10 }),
    partitions({ n: 300, maxPart: 20, length: 20 }),
    partitions({ n: 100_000, maxPart: 100 }),
    partitions({ n: 100_000, minPart: 7 }),
    partitions({ n: 100_000_000, maxPart: 10_000 }, 'multiplicities'),
    partitions({ n: 1_000_000_000, minPart: 7, maxPart: 31_623 }, 'multiplicities'),
    partitions({ n: 1_000_000_000, maxLength: 7906 }, 'multiplicities'),
    partitions({ n: 100_000, length: 50 }),
    partitions({ n: 1_000_000, length: 1000 }),
    partitions({ n: 100_000, allowed: [1, 2, 5, 10, 20, 50] }),
    partitions({ n: 1_000_000, allowed: [1, 2, 5, 10, 20, 50] }, 'multiplicities'),
    partitions({ n: 1_000_000, distinct: true }),
    partitions({ n: 100_000_000, distinct: true }, 'multiplicities'),
    partitions({ n: 100_000, distinct: true, maxPart: 10_000 }),
    partitions({ n: 1_000_000, distinct: true, minPart: 7 }),
    partitions({ n: 100_000_000, distinct: true, minPart: 50 }, 'multiplicities'),
    partitions({ n: 1_000_000, distinct: true, maxPart: 10_000 }),
    partitions({ n: 1_000_000, maxPart: 1000, length: 2000 }),
    partitions({ n: 1_000_000, length: 100, maxPart: 20_000 }),
    partitions({ n: 1_000_000, distinct: true, maxLength: 100 }),
    partitions({ n: 1_000_000, minPart: 10, maxLength: 2000 }),
    partitions({ n: 1_000_000, allowed: [1000, 2000, 3000, 5000, 7000, 11000], length: 300 }),
    partitions({ n: 100_000, allowed: ALLOWED_THOUSANDS, distinct: true, length: 5 }),
    compositions({ n: 0 }),
    compositions({ n: 1000 }),
    compositions({ n: 1_000_000 }),
    compositions({ n: 100, length: 10 }),
    compositions({ n: 1_000_000, length: 1000 }),
    compositions({ n: 1000, allowed: [3, 7, 11], length: 100 }),
    compositions({ n: 100, maxPart: 5 }),
    compositions({ n: 1_000_000, maxPart: 5000, length: 2000 }),
    compositions({ n: 100_000, maxPart: 5 }),
    compositions({ n: 1_000_000, allowed: [3, 7, 11] }),
    compositions({ n: 1_000_000, minPart: 1000 }),
    compositions({ n: 100_000, maxPart: 100, length: 2000 }),
    compositions({ n: 100_000, minPart: 2, maxPart: 9, length: 20_000 }),
    compositions({ n: 1_000_000, allowed: [3, 7, 11], length: 100_000 }),
    setPartitions({ n: 0 }),
    setPartitions({ n: 1000 }),
    setPartitions({ n: 100_000 }),
    setPartitions({ n: 1000, blocks: 10 }),
    setPartitions({ n: 100_000, blocks: 10 }),
    setPartitions({ n: 10_000, maxBlocks: 10 }),
    setPartitions({ n: 100_000, minBlockSize: 2 }),
    setPartitions({ n: 1000, minBlockSize: 100 }),
    setPartitions({ n: 100_000, blocks: 100, minBlockSize: 1000, maxBlockSize: 1000 }),
    setPartitions({ n: 1000, blocks: 1000 }),
    direct('set partitions n=200 blocks=20 (table, forced)', planSetPartitionSampler(forcedTable, { method: 'table' }), familyKey(forcedTable), (s) => setPartitionAsBlocks.json(s)),
  ];
}

/** An app without limits in the way: the bench times what the budget estimates. */
const app = createApp({ limits: { workBudgetMs: 3_600_000, deadlineMs: 3_600_000, maxCount: 1_000_000, maxNumbers: 1e12 } });

/**
 * Nanoseconds per sample of a case, the fastest of ROUNDS rounds. A served family is timed as a
 * whole NDJSON request (planned and warmed up by a first request) of as many samples as the
 * estimate puts at ROUND_MS; a method the service does not serve is sampled and encoded
 * directly, for ROUND_MS.
 */
async function timeCase(c: Case): Promise<Timing> {
  const rounds: Timing[] = [];
  if (c.url !== undefined) {
    const count = Math.max(1, Math.min(1_000_000, Math.round((ROUND_MS * 1e6) / sampleTimeNs(c, c.numbers))));
    await (await app.fetch(new Request(`http://bench${c.url}&count=1&seed=warm&format=ndjson`))).arrayBuffer();
    for (let round = 0; round < ROUNDS; round++) {
      const t0 = performance.now();
      const cpu0 = process.cpuUsage();
      const response = await app.fetch(new Request(`http://bench${c.url}&count=${count}&start=${round * count}&seed=costs&format=ndjson`));
      await response.arrayBuffer();
      rounds.push(timing(t0, cpu0, count));
      if (response.status !== 200) throw new Error(`${c.url}: status ${response.status}`);
    }
  } else {
    let sink = c.once(1_000_000).length;
    let i = 0;
    for (let round = 0; round < ROUNDS; round++) {
      let samples = 0;
      const t0 = performance.now();
      const cpu0 = process.cpuUsage();
      while (samples < 1 || performance.now() - t0 < ROUND_MS) {
        sink += c.once(i++).length;
        samples++;
      }
      rounds.push(timing(t0, cpu0, samples));
    }
    if (sink < 0) console.log(sink);
  }
  return { ns: Math.min(...rounds.map((r) => r.ns)), cpuNs: Math.min(...rounds.map((r) => r.cpuNs)), samples: rounds[0].samples };
}

/** Per sample: wall-clock and CPU nanoseconds (CPU time of this process, which other processes' load hardly changes). */
interface Timing {
  readonly ns: number;
  readonly cpuNs: number;
  readonly samples: number;
}

function timing(t0: number, cpu0: NodeJS.CpuUsage, samples: number): Timing {
  const cpu = process.cpuUsage(cpu0);
  return { ns: ((performance.now() - t0) * 1e6) / samples, cpuNs: ((cpu.user + cpu.system) * 1e3) / samples, samples };
}

function fmtNs(ns: number): string {
  if (ns >= 1e6) return `${(ns / 1e6).toPrecision(3)} ms`;
  if (ns >= 1e3) return `${(ns / 1e3).toPrecision(3)} µs`;
  return `${ns.toPrecision(3)} ns`;
}

export async function benchCosts(): Promise<void> {
  console.log(`work costs: time per sample, measured vs estimated (${SEEDING_NS} ns seeding + steps × ns/step + ${NS_PER_NUMBER} ns per number written)`);
  console.log('Best of rounds. "wall" is elapsed time (what the deadline sees, inflated when the machine is shared); "cpu" is this process\'s CPU time.');
  console.log('method | family | steps | numbers | wall | cpu | estimate | wall/estimate | cpu/estimate | ns/step fitted to cpu (table)');
  const wallRatios: number[] = [];
  const cpuRatios: number[] = [];
  const seen = new Set<string>();
  for (const c of cases()) {
    const { ns, cpuNs, samples } = await timeCase(c);
    const estimate = sampleTimeNs(c, c.numbers);
    const ratio = ns / estimate;
    wallRatios.push(ratio);
    cpuRatios.push(cpuNs / estimate);
    seen.add(baseMethod(c.method));
    const fitted = (cpuNs - SEEDING_NS - c.numbers * NS_PER_NUMBER) / c.expectedWork;
    const table = NS_PER_STEP[baseMethod(c.method)];
    console.log(`${c.method} | ${c.label}${c.url ? ` (request, count=${samples}, best of ${ROUNDS})` : ` (direct, best of ${ROUNDS})`} | ${c.expectedWork.toExponential(2)} | ${Math.round(c.numbers)} | ${fmtNs(ns)} | ${fmtNs(cpuNs)} | ${fmtNs(estimate)} | ${ratio.toFixed(2)} | ${(cpuNs / estimate).toFixed(2)} | ${fitted.toFixed(0)} (${table ?? 'missing'})`);
  }
  const missing = Object.keys(NS_PER_STEP).filter((m) => !seen.has(m));
  const range = (r: number[]) => `${Math.min(...r).toFixed(2)} to ${Math.max(...r).toFixed(2)}`;
  const sorted = cpuRatios.slice().sort((a, b) => a - b);
  const middle = sorted.slice(Math.floor(sorted.length * 0.1), Math.ceil(sorted.length * 0.9));
  console.log(`over all rows: wall/estimate ${range(wallRatios)}, cpu/estimate ${range(cpuRatios)} (middle 80% of rows: ${range(middle)})${missing.length ? `; table rows not timed here: ${missing.join(', ')}` : ''}`);
  console.log('the issue\'s request, /v1/partitions?n=1000000&count=5000&as=multiplicities&format=ndjson:');
  const issue = partitions({ n: 1_000_000 }, 'multiplicities');
  const t0 = performance.now();
  const cpu0 = process.cpuUsage();
  await (await app.fetch(new Request('http://bench/v1/partitions?n=1000000&count=5000&as=multiplicities&format=ndjson&seed=abort'))).arrayBuffer();
  const { ns, cpuNs } = timing(t0, cpu0, 1);
  console.log(`  wall ${(ns / 1e6).toFixed(0)} ms, cpu ${(cpuNs / 1e6).toFixed(0)} ms, estimate ${((5000 * sampleTimeNs(issue, issue.numbers)) / 1e6).toFixed(0)} ms (budget ${DEFAULT_LIMITS.workBudgetMs} ms)`);
}

if (process.argv[1] !== undefined && import.meta.url.endsWith(process.argv[1].split('/').pop()!)) {
  await benchCosts();
}
