import { familyKey, type SetPartitionFamily } from '../../src/core/family.js';
import { planSetPartitionSampler } from '../../src/core/set-partitions/plan.js';
import type { SetPartition } from '../../src/core/set-partitions/set-partition.js';
import { SampleStreams } from '../../src/core/seeding.js';
import { setPartitionAsRgs } from '../../src/http/set-partition-encode.js';
import { fillUniformUrns, urnsPerWord } from '../../src/core/set-partitions/urns.js';
import type { RandomSource } from '../../src/core/random.js';
import { shuffleInPlace } from '../../src/core/shuffle.js';

/** The former assignSizes shuffle: Fisher–Yates with one word per index (modulo with rejection). */
function shuffleOneWordEach(source: RandomSource, values: Int32Array): void {
  for (let i = values.length - 1; i > 0; i--) {
    const bound = i + 1;
    const limit = 2 ** 32 - (2 ** 32 % bound);
    let word = source.nextUint32();
    while (word >= limit) word = source.nextUint32();
    const j = word % bound;
    const held = values[i];
    values[i] = values[j];
    values[j] = held;
  }
}

/** The former urns.ts draw, one word per urn by Lemire's multiply-and-shift with rejection: the baseline of the batched draw. */
function oneWordPerUrn(source: RandomSource, labels: Int32Array, urns: number): void {
  const threshold = (2 ** 32 - urns) % urns;
  for (let i = 0; i < labels.length; i++) {
    let product = source.nextUint32() * urns;
    let urn = Math.floor(product * 2 ** -32);
    while (product - urn * 2 ** 32 < threshold) {
      product = source.nextUint32() * urns;
      urn = Math.floor(product * 2 ** -32);
    }
    labels[i] = urn;
  }
}

/** One word per urn, the modulo of words below the largest multiple of `urns` under 2^32. */
function moduloPerUrn(source: RandomSource, labels: Int32Array, urns: number): void {
  const limit = 2 ** 32 - (2 ** 32 % urns);
  for (let i = 0; i < labels.length; i++) {
    let word = source.nextUint32();
    while (word >= limit) word = source.nextUint32();
    labels[i] = word % urns;
  }
}

/**
 * Milliseconds per set partition, after planning, beside the output-size floor: the time
 * JSON.stringify takes to write the same n numbers from a plain array (writing n numbers is
 * the least any sampler that returns them can cost). "sample" is drawing only; "+ JSON" adds
 * writing the restricted growth string as the API does (as=rgs). The target is <= 5x the
 * floor. All ratios are measured side by side in this run; each row runs ~0.5 s (>= 2 samples).
 */
const ROWS: [string, Omit<SetPartitionFamily, 'kind'>][] = [];
for (const n of [1e3, 1e4, 1e5, 1e6]) ROWS.push([`free n=${n.toExponential(0)}`, { n }]);
for (const n of [1e3, 1e4, 1e5, 1e6]) ROWS.push([`blocks=10 n=${n.toExponential(0)}`, { n, blocks: 10 }]);
for (const n of [1e3, 1e4, 1e5, 1e6]) ROWS.push([`blocks=1000 n=${n.toExponential(0)}`, { n, blocks: 1000 }]);
ROWS.push(
  ['minBlockSize=2 n=1e5', { n: 1e5, minBlockSize: 2 }],
  ['minBlockSize=2 n=1e6', { n: 1e6, minBlockSize: 2 }],
  ['maxBlockSize=8 n=1e6', { n: 1e6, maxBlockSize: 8 }],
  ['maxBlocks=10 n=1e6', { n: 1e6, maxBlocks: 10 }],
  ['blocks=100 min=5 max=20 n=1e3', { n: 1e3, blocks: 100, minBlockSize: 5, maxBlockSize: 20 }],
  ['free n=1e7', { n: 1e7 }],
);

function timeRow(run: (i: number) => void, budgetMs = 500): number {
  run(0); // warm-up
  let count = 0;
  const t0 = performance.now();
  while (count < 2 || (performance.now() - t0 < budgetMs && count < 2000)) run(++count);
  return (performance.now() - t0) / count;
}

export async function benchSetPartitions(): Promise<void> {
  const out: string[] = [];
  out.push('set partitions: ms per sample; floor = JSON.stringify of the same n numbers from a plain array');
  out.push(`${'family'.padEnd(32)}${'method'.padEnd(18)}${'plan ms'.padStart(9)}${'sample'.padStart(10)}${'+ JSON'.padStart(10)}${'floor'.padStart(9)}${'x floor'.padStart(9)}${'blocks'.padStart(9)}${'exp. work'.padStart(11)}`);
  for (const [name, shape] of ROWS) {
    const family: SetPartitionFamily = { kind: 'set-partition', ...shape };
    const t0 = performance.now();
    const sampler = planSetPartitionSampler(family);
    const plan = performance.now() - t0;
    const streams = new SampleStreams(familyKey(family));
    let last: SetPartition = sampler.sample(streams.source('bench', 0));
    let blocks = 0;
    let samples = 0;
    const sample = timeRow((i) => {
      last = sampler.sample(streams.source('bench', i));
      blocks += last.blocks;
      samples++;
    });
    const withJson = timeRow((i) => {
      setPartitionAsRgs.json(sampler.sample(streams.source('bench', i)));
    });
    const plain = Array.from(last.rgs);
    const floor = timeRow(() => {
      JSON.stringify(plain);
    });
    out.push(
      `${name.padEnd(32)}${sampler.method.padEnd(18)}${plan.toFixed(1).padStart(9)}${sample.toFixed(3).padStart(10)}${withJson.toFixed(3).padStart(10)}${floor.toFixed(3).padStart(9)}${(withJson / floor).toFixed(1).padStart(9)}${(blocks / samples).toFixed(0).padStart(9)}${sampler.expectedWork.toExponential(1).padStart(11)}`,
    );
  }
  // The ASCII-bytes encoder (set-partition-encode.ts) against plain string concatenation.
  const big = planSetPartitionSampler({ kind: 'set-partition', n: 1e6 }).sample(new SampleStreams('encoder').source('bench', 0));
  const bytes = timeRow(() => setPartitionAsRgs.json(big));
  const concat = timeRow(() => {
    let text = '[';
    for (let i = 0; i < big.rgs.length; i++) text += i === 0 ? `${big.rgs[i]}` : `,${big.rgs[i]}`;
    new TextEncoder().encode(`${text}]`); // the response writer encodes the string; a rope is flattened here
  });
  out.push('');
  out.push(`encoder, RGS of 10^6 items as JSON: ASCII bytes ${bytes.toFixed(1)} ms, string concatenation ${concat.toFixed(1)} ms (${(concat / bytes).toFixed(1)}x)`);
  // Uniform urns (urns.ts): several urns per 32-bit word (batched multiply-and-shift) against
  // one word per urn (multiply-and-shift) and against the plain modulo, 10^6 items; 10 and 1000
  // urns are the blocks=10 and blocks=1000 rows, ~190 and ~88,000 the urns Stam's algorithm uses
  // at n = 10^3 and 10^6. Interleaved rounds, median ratio.
  const labels = new Int32Array(1e6);
  for (const urns of [10, 190, 1000, 87_828]) {
    const perWord: number[] = [];
    const modulo: number[] = [];
    let batchedMs = 0;
    for (let round = 0; round < 5; round++) {
      const source = new SampleStreams('urns').source('bench', round);
      const batched = timeRow(() => fillUniformUrns(source, labels, urns), 100);
      const single = timeRow(() => oneWordPerUrn(source, labels, urns), 100);
      const mod = timeRow(() => moduloPerUrn(source, labels, urns), 100);
      batchedMs += batched / 5;
      perWord.push(single / batched);
      modulo.push(mod / batched);
    }
    perWord.sort((a, b) => a - b);
    modulo.sort((a, b) => a - b);
    out.push(
      `uniform urns, 10^6 items into ${String(urns).padEnd(6)} urns (${urnsPerWord(urns)} per word): batched ${batchedMs.toFixed(2)} ms; ` +
        `one word per urn / batched ${perWord[2].toFixed(2)} (range ${perWord[0].toFixed(2)}-${perWord[4].toFixed(2)}), modulo / batched ${modulo[2].toFixed(2)}`,
    );
  }
  // Fisher–Yates (shuffle.ts): several indices per word against one word per index (modulo with
  // rejection, the former assignSizes loop), 10^3 and 10^5 items; interleaved rounds, median ratio.
  for (const n of [1e3, 1e5]) {
    const values = new Int32Array(n);
    const ratios: number[] = [];
    let batchedMs = 0;
    for (let round = 0; round < 5; round++) {
      const source = new SampleStreams('shuffle').source('bench', round);
      const batched = timeRow(() => shuffleInPlace(source, values), 100);
      const single = timeRow(() => shuffleOneWordEach(source, values), 100);
      batchedMs += batched / 5;
      ratios.push(single / batched);
    }
    ratios.sort((a, b) => a - b);
    out.push(`shuffle, ${n} items: batched ${batchedMs.toFixed(3)} ms; one word per index / batched ${ratios[2].toFixed(2)} (range ${ratios[0].toFixed(2)}-${ratios[4].toFixed(2)})`);
  }
  console.log(out.join('\n'));
}

if (import.meta.url === `file://${process.argv[1]}`) await benchSetPartitions();
