/**
 * Ranks: listing rate (members per second) of the core Ranker's `list` — what the library calls —
 * beside unranking every rank in turn (what `list` saves by stepping to the successor), the same
 * listings over HTTP as NDJSON (the app in-process, and the Node server on loopback), and the time
 * of one unrank and one rank at n = 100, 1000 and 5000 once the family's table is built (build
 * time reported apart). Each rate row runs for about a second.
 */
import { serve } from '@hono/node-server';
import type { AddressInfo } from 'node:net';
import type { CompositionFamily, PartitionFamily, SetPartitionFamily } from '../../src/core/family.js';
import { compositionRanker } from '../../src/core/ranks/composition-ranker.js';
import { partitionRanker } from '../../src/core/ranks/partition-ranker.js';
import type { Ranker } from '../../src/core/ranks/ranker.js';
import { setPartitionRanker } from '../../src/core/set-partitions/ranker.js';
import { createApp } from '../../src/http/app.js';

type Family = PartitionFamily | CompositionFamily | SetPartitionFamily;
const rankerOf = (f: Family): Ranker => (f.kind === 'partition' ? partitionRanker(f) : f.kind === 'composition' ? compositionRanker(f) : setPartitionRanker(f));

const LISTED: [string, Family, string][] = [
  ['partitions n=30', { kind: 'partition', n: 30 }, '/v1/partitions/list?n=30'],
  ['partitions n=30, distinct', { kind: 'partition', n: 30, distinct: true }, '/v1/partitions/list?n=30&distinct=true'],
  ['partitions n=30, at most 5 parts', { kind: 'partition', n: 30, maxLength: 5 }, '/v1/partitions/list?n=30&maxLength=5'],
  ['partitions n=30, parts in {1,2,5,10}', { kind: 'partition', n: 30, allowed: [1, 2, 5, 10] }, '/v1/partitions/list?n=30&allowed=1,2,5,10'],
  ['partitions n=60', { kind: 'partition', n: 60 }, '/v1/partitions/list?n=60'],
  ['compositions n=20', { kind: 'composition', n: 20 }, '/v1/compositions/list?n=20'],
  ['compositions n=25, parts in {1,2,3}', { kind: 'composition', n: 25, allowed: [1, 2, 3] }, '/v1/compositions/list?n=25&allowed=1,2,3'],
  ['compositions n=30, 5 parts', { kind: 'composition', n: 30, length: 5 }, '/v1/compositions/list?n=30&length=5'],
  ['set partitions n=12 (as=rgs)', { kind: 'set-partition', n: 12 }, '/v1/set-partitions/list?n=12&as=rgs'],
  ['set partitions n=14, 4 blocks (as=rgs)', { kind: 'set-partition', n: 14, blocks: 4 }, '/v1/set-partitions/list?n=14&blocks=4&as=rgs'],
  ['set partitions n=16, blocks of 2 to 4 (as=rgs)', { kind: 'set-partition', n: 16, minBlockSize: 2, maxBlockSize: 4 }, '/v1/set-partitions/list?n=16&minBlockSize=2&maxBlockSize=4&as=rgs'],
];

/** Members per second of `run(budget)`, which lists up to `budget` members and returns how many; about a second in all. */
function rate(run: (budget: number) => number): number {
  run(2000); // warm-up
  let members = 0;
  const t0 = performance.now();
  while (performance.now() - t0 < 1000) members += run(200_000);
  return members / ((performance.now() - t0) / 1000);
}

function listRate(ranker: Ranker): number {
  return rate((budget) => {
    let k = 0;
    const members = ranker.list(0n);
    for (let next = members.next(); !next.done && k < budget; next = members.next()) k++;
    return k;
  });
}

function unrankEachRate(ranker: Ranker): number {
  return rate((budget) => {
    const end = ranker.count < BigInt(budget) ? ranker.count : BigInt(budget);
    for (let r = 0n; r < end; r++) ranker.unrank(r);
    return Number(end);
  });
}

/** Members per second of NDJSON listings fetched page by page (10,000 a page) through `fetchText`. */
async function httpRate(fetchText: (path: string) => Promise<string>, path: string, total: bigint): Promise<number> {
  await fetchText(`${path}&format=ndjson&count=1000`);
  let members = 0;
  const t0 = performance.now();
  for (let start = 0n; performance.now() - t0 < 1000; start = start + 10_000n >= total ? 0n : start + 10_000n) {
    const body = await fetchText(`${path}&format=ndjson&count=10000&start=${start}`);
    for (let i = body.indexOf('\n'); i >= 0; i = body.indexOf('\n', i + 1)) members++;
  }
  return members / ((performance.now() - t0) / 1000);
}

const UNRANKED: [string, (n: number) => Family][] = [
  ['partitions', (n) => ({ kind: 'partition', n })],
  ['partitions, distinct', (n) => ({ kind: 'partition', n, distinct: true })],
  ['partitions, parts <= 100', (n) => ({ kind: 'partition', n, maxPart: 100 })],
  ['partitions, at most 10 parts', (n) => ({ kind: 'partition', n, maxLength: 10 })],
  ['compositions', (n) => ({ kind: 'composition', n })],
  ['compositions, parts in {1,2}', (n) => ({ kind: 'composition', n, allowed: [1, 2] })],
  ['compositions, 10 parts', (n) => ({ kind: 'composition', n, length: 10 })],
  ['set partitions', (n) => ({ kind: 'set-partition', n })],
  ['set partitions, 10 blocks', (n) => ({ kind: 'set-partition', n, blocks: 10 })],
  ['set partitions, blocks <= 3', (n) => ({ kind: 'set-partition', n, maxBlockSize: 3 })],
];

/** Median µs of `once(i)` over rounds of calls. */
function medianMicros(once: (i: number) => unknown, calls: number): number {
  const rounds: number[] = [];
  let i = 0;
  for (let r = 0; r < 7; r++) {
    const t0 = performance.now();
    for (let k = 0; k < calls; k++) once(i++);
    rounds.push(((performance.now() - t0) * 1000) / calls);
  }
  return rounds.sort((a, b) => a - b)[3];
}

export async function benchRanks(): Promise<void> {
  const app = createApp();
  const server = serve({ fetch: app.fetch, port: 0, hostname: '127.0.0.1' });
  await new Promise((resolve) => server.once('listening', resolve));
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const inProcess = async (path: string) => (await app.fetch(new Request(`http://bench${path}`))).text();
  const loopback = async (path: string) => (await fetch(`${base}${path}`)).text();

  console.log('listing: members per second (core list = the library\'s; "unrank each" = one unrank per rank; HTTP = NDJSON pages of 10,000)');
  console.log('| family | members | core list | unrank each | list / unrank | HTTP in-process | HTTP loopback |');
  console.log('|---|---:|---:|---:|---:|---:|---:|');
  for (const [name, family, path] of LISTED) {
    const ranker = rankerOf(family);
    const listed = listRate(ranker);
    const unranked = unrankEachRate(ranker);
    const viaApp = await httpRate(inProcess, path, ranker.count);
    const viaSocket = await httpRate(loopback, path, ranker.count);
    const fmt = (x: number) => `${(x / 1e6).toFixed(2)} M/s`;
    console.log(`| ${name} | ${ranker.count} | ${fmt(listed)} | ${fmt(unranked)} | ${(listed / unranked).toFixed(1)}x | ${fmt(viaApp)} | ${fmt(viaSocket)} |`);
  }
  server.close();

  console.log('\nunrank and rank: µs per call at random ranks once the table is built (build: one-off ms); "refused" = over the rank table limit');
  console.log('| family | n | build ms | unrank µs | rank µs |');
  console.log('|---|---:|---:|---:|---:|');
  for (const [name, make] of UNRANKED) {
    for (const n of name.startsWith('set partitions') ? [100, 500, 1000, 5000] : [100, 1000, 5000]) {
      const t0 = performance.now();
      let ranker: Ranker;
      try {
        ranker = rankerOf(make(n));
      } catch (error) {
        console.log(`| ${name} | ${n} | refused | — | — |`);
        continue;
      }
      const build = performance.now() - t0;
      // Ranks spread over the family: count * i / 997 for i = 0, 1, ...
      const at = (i: number) => (ranker.count * BigInt((i * 389) % 997)) / 997n;
      const members = Array.from({ length: 64 }, (_, i) => ranker.unrank(at(i)));
      const calls = n >= 5000 ? 20 : n >= 1000 ? 100 : 1000;
      const unrank = medianMicros((i) => ranker.unrank(at(i)), calls);
      const rank = medianMicros((i) => ranker.rank(members[i % 64]), calls);
      console.log(`| ${name} | ${n} | ${build.toFixed(1)} | ${unrank.toFixed(1)} | ${rank.toFixed(1)} |`);
    }
  }
}

if (import.meta.url === `file://${process.argv[1]}`) await benchRanks();
