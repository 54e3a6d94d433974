/**
 * Every constrained family shape — each constraint alone and every pair — at n = 1e3 .. 1e9:
 * milliseconds per exact sample of the planner's choice, and the ratio to one free Boltzmann
 * proposal of the same family (independent multiplicities at the family's tilts, no
 * conditioning: the unit of work), the two timed in alternating rounds so that load from other
 * processes hits both alike; the ratio is the median over rounds. Setup (planning, tilts,
 * tables) is reported apart. Then the requests of issue 13's table.
 *
 * `npm run bench -- shapes` (about two minutes; SHAPES_MATCH=maxLength runs the rows whose name contains it). Shapes scale with n: bounds near sqrt(n) so
 * that they bind; see SHAPES.
 */
import type { PartitionFamily } from '../../src/core/family.js';
import { nextOpenDouble, type RandomSource } from '../../src/core/random.js';
import { constrainedPartitionSampler } from '../../src/core/partitions/constrained/plan.js';
import { solveTiltNewton } from '../../src/core/partitions/constrained/length-law.js';
import { solveTwoTilts } from '../../src/core/partitions/constrained/allowed-length-boltzmann.js';
import { sumOverSizes } from '../../src/core/partitions/constrained/tilt.js';
import { toSpec, type SizeSet } from '../../src/core/partitions/constrained/spec.js';
import { visitThinned } from '../../src/core/partitions/constrained/thinning.js';
import type { PartitionSampler } from '../../src/core/sampler.js';
import { sampleSource } from '../../src/core/seeding.js';

type Shape = (n: number) => Omit<PartitionFamily, 'kind' | 'n'>;

const root = (n: number) => Math.ceil(Math.sqrt(n));
const COINS = [1, 2, 5, 10, 20, 50];
/** 1000 sizes 1 + floor(i d), d = max(1, 4n / 1e6): their sum (about 2n or 500500) reaches n with distinct parts. */
const spread = (n: number) => {
  const d = Math.max(1, (4 * n) / 1e6);
  return Array.from({ length: 1000 }, (_, i) => 1 + Math.floor(i * d));
};

/** 10 sizes 2√n + floor(4√n i / 9) + (i mod 3), i = 0..9: all large, gcd 1. */
const largeSizes = (n: number) => Array.from({ length: 10 }, (_, i) => 2 * root(n) + Math.floor((4 * root(n) * i) / 9) + (i % 3));

/** [name, family] — the constraint values used at each n. */
export const SHAPES: Array<[string, Shape]> = [
  ['distinct', () => ({ distinct: true })],
  ['minPart=7', () => ({ minPart: 7 })],
  ['maxPart=sqrt(n)', (n) => ({ maxPart: root(n) })],
  ['length=sqrt(n)/4', (n) => ({ length: Math.ceil(root(n) / 4) })],
  ['maxLength=sqrt(n)/4', (n) => ({ maxLength: Math.ceil(root(n) / 4) })],
  ['allowed=1,2,5,10,20,50', () => ({ allowed: COINS })],
  ['distinct,minPart=7', () => ({ distinct: true, minPart: 7 })],
  ['distinct,minPart=500', () => ({ distinct: true, minPart: 500 })],
  ['distinct,minPart=sqrt(n)/8', (n) => ({ distinct: true, minPart: Math.ceil(root(n) / 8) })],
  ['distinct,maxPart=2sqrt(n)', (n) => ({ distinct: true, maxPart: 2 * root(n) })],
  // maxPart near the middle of its range (S = Σ sizes ≈ 2n at 2√n; n > S/2 at 1.5√n).
  ['distinct,maxPart=1.5sqrt(n)', (n) => ({ distinct: true, maxPart: Math.ceil(1.5 * root(n)) })],
  ['distinct,maxPart=3sqrt(n)', (n) => ({ distinct: true, maxPart: 3 * root(n) })],
  ['distinct,minPart=7,maxPart=2sqrt(n)', (n) => ({ distinct: true, minPart: 7, maxPart: 2 * root(n) })],
  ['distinct,length=sqrt(n)/4', (n) => ({ distinct: true, length: Math.ceil(root(n) / 4) })],
  ['distinct,maxLength=sqrt(n)/4', (n) => ({ distinct: true, maxLength: Math.ceil(root(n) / 4) })],
  ['distinct,allowed=1000 sizes', (n) => ({ distinct: true, allowed: spread(n) })],
  ['minPart=7,maxPart=sqrt(n)', (n) => ({ minPart: 7, maxPart: root(n) })],
  // A narrow range of large parts (few numbers of parts fit; narrow-range-mixture).
  ['narrow,minPart=1.9sqrt(n),maxPart=2.014sqrt(n)', (n) => ({ minPart: Math.round(1.9 * root(n)), maxPart: Math.round(2.014 * root(n)) })],
  // Distinct parts in a narrow range of large sizes (narrow-range-mixture through the staircase; as issue 13's 3.5e8 row).
  ['distinct,narrow,minPart=2.69sqrt(n),maxPart=3.74sqrt(n)', (n) => ({ distinct: true, minPart: Math.round(2.69 * root(n)), maxPart: Math.round(3.74 * root(n)) })],
  ['minPart=7,length=sqrt(n)/4', (n) => ({ minPart: 7, length: Math.ceil(root(n) / 4) })],
  ['minPart=7,maxLength=sqrt(n)/4', (n) => ({ minPart: 7, maxLength: Math.ceil(root(n) / 4) })],
  // A maxLength that binds hard (the free mean number of parts >= 7 is ~2e5 at 1e9): conjugate-mixture.
  ['minPart=7,maxLength=0.75sqrt(n)', (n) => ({ minPart: 7, maxLength: Math.ceil(0.75 * root(n)) })],
  ['minPart=2,allowed=coins', () => ({ minPart: 2, allowed: COINS })],
  ['maxPart=2sqrt(n),length=sqrt(n)', (n) => ({ maxPart: 2 * root(n), length: root(n) })],
  ['maxPart=2sqrt(n),maxLength=sqrt(n)', (n) => ({ maxPart: 2 * root(n), maxLength: root(n) })],
  ['maxPart=20,allowed=coins', () => ({ maxPart: 20, allowed: COINS })],
  ['length=n/20,allowed=coins', (n) => ({ length: Math.ceil(n / 20), allowed: COINS })],
  ['maxLength=n/30,allowed=coins', (n) => ({ maxLength: Math.ceil(n / 30), allowed: COINS })],
  // Shapes of scripts/scan-families.ts whose planning or sampling was slow (bounded-boltzmann).
  ['short:maxPart=6', () => ({ maxPart: 6 })],
  ['short:length=10', () => ({ length: 10 })],
  ['short:minPart=52,length=2', () => ({ minPart: 52, length: 2 })],
  ['short:minPart=n/1000,maxPart=n/1000+29', (n) => ({ minPart: Math.ceil(n / 1000), maxPart: Math.ceil(n / 1000) + 29 })],
  ['short:minPart=128,maxPart=2305', () => ({ minPart: 128, maxPart: 2305 })],
  // Large sizes only (minPart cuts the list): below Schur's bound, decided by the residue table (feasibility.ts).
  ['minPart=3sqrt(n),allowed=10 sizes in [2,6]sqrt(n)', (n) => ({ minPart: 3 * root(n), allowed: largeSizes(n) })],
];

/** The requests of issue 13's table (each must cost at most 50 ms per sample). */
export const ISSUE_ROWS: PartitionFamily[] = [
  { kind: 'partition', n: 3000, length: 40, maxPart: 200 },
  { kind: 'partition', n: 100_000, length: 50, maxPart: 3000 },
  { kind: 'partition', n: 1_000_000_000, length: 1000, maxPart: 2_000_000 },
  { kind: 'partition', n: 100_000, distinct: true, maxLength: 100 },
  { kind: 'partition', n: 10_000_000, distinct: true, maxLength: 1000 },
  { kind: 'partition', n: 1_000_000_000, minPart: 2 },
  { kind: 'partition', n: 1_000_000_000, minPart: 100 },
  { kind: 'partition', n: 100_000_000, distinct: true },
  { kind: 'partition', n: 1_000_000_000, distinct: true },
  { kind: 'partition', n: 10_000, allowed: [3, 7, 11], length: 1000 },
  { kind: 'partition', n: 1_000_000, maxPart: 1000, maxLength: 2000 },
  { kind: 'partition', n: 1_000_000, minPart: 10, maxLength: 500 },
  { kind: 'partition', n: 100_000, distinct: true, allowed: Array.from({ length: 500 }, (_, i) => 2 * i + 1) },
  { kind: 'partition', n: 1_000_000, distinct: true, minPart: 50, maxPart: 5000 },
  { kind: 'partition', n: 26_977_122, minPart: 4226, maxPart: 105_077, maxLength: 2835 },
  { kind: 'partition', n: 840_000_000, minPart: 55_093, maxPart: 58_395 },
  // Length-constrained families with many parts (scans; conjugate-mixture/2's block of small sizes).
  { kind: 'partition', n: 904_000_000, minPart: 187, maxLength: 23_013 },
  { kind: 'partition', n: 942_808_405, minPart: 1218, maxLength: 52_671 },
  { kind: 'partition', n: 91_216_410, minPart: 31, maxLength: 6330 },
  // Boxes with both sides large (box-subset's ~k^1.5 work; the first is refused).
  { kind: 'partition', n: 963_007_124, minPart: 16_800, maxPart: 111_605, length: 29_954 },
  { kind: 'partition', n: 1_000_000_000, distinct: true, minPart: 4939, maxPart: 110_341, length: 17_255 },
  { kind: 'partition', n: 350_000_000, minPart: 206, maxPart: 80_725, maxLength: 5431 },
  { kind: 'partition', n: 350_000_000, distinct: true, minPart: 50_318, maxPart: 69_965 },
];

/** A fixed list of `count` distinct sizes in [1, max] (Park–Miller minimal standard, seed 99). */
const scattered = (count: number, max: number): number[] => {
  let s = 99;
  const out = new Set<number>();
  while (out.size < count) {
    s = (s * 48271) % 2147483647;
    out.add(1 + (s % max));
  }
  return [...out].sort((a, b) => a - b);
};

/** Distinct parts from allowed lists of 100-1000 sizes at n = 1e4-1e8 (`npx tsx scripts/bench/shapes.ts distinct-allowed` alone). */
export const DISTINCT_ALLOWED_ROWS: PartitionFamily[] = [
  { kind: 'partition', n: 100_000, distinct: true, allowed: Array.from({ length: 500 }, (_, i) => 2 * i + 1) },
  { kind: 'partition', n: 200_000, distinct: true, allowed: Array.from({ length: 500 }, (_, i) => 2 * i + 1) },
  { kind: 'partition', n: 1_000_000, distinct: true, allowed: Array.from({ length: 1000 }, (_, i) => 1000 + 7 * i) },
  { kind: 'partition', n: 300_000, distinct: true, allowed: Array.from({ length: 1000 }, (_, i) => i + 1) },
  { kind: 'partition', n: 10_000, distinct: true, allowed: Array.from({ length: 100 }, (_, i) => 3 * i + 2) },
  { kind: 'partition', n: 1_000_000, distinct: true, allowed: scattered(1000, 10_000) },
  { kind: 'partition', n: 10_000_000, distinct: true, allowed: scattered(1000, 1_000_000) },
  { kind: 'partition', n: 100_000_000, distinct: true, allowed: scattered(1000, 1_000_000) },
  // With a binding maxLength (allowed-subset-mixture).
  { kind: 'partition', n: 100_000, distinct: true, allowed: Array.from({ length: 500 }, (_, i) => 2 * i + 1), maxLength: 120 },
  { kind: 'partition', n: 1_000_000, distinct: true, allowed: Array.from({ length: 1000 }, (_, i) => 1000 + 7 * i), maxLength: 150 },
  { kind: 'partition', n: 300_000, distinct: true, allowed: Array.from({ length: 1000 }, (_, i) => i + 1), maxLength: 400 },
  { kind: 'partition', n: 1_000_000, distinct: true, allowed: scattered(1000, 10_000), maxLength: 150 },
];

const SIZES = [1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9];
const ROUNDS = 5;
const ROUND_MS = 40;
/** Untimed sampling before the rounds (sampler and proposal alike). */
const WARM_MS = 150;

/**
 * One free Boltzmann proposal of the family: every allowed size s gets an independent
 * multiplicity, geometric with P(Z >= j) = q^j or Bernoulli(q / (1 + q)) for distinct parts,
 * q = y x^s, at the family's tilts (x for the size; y for the number of parts when the family
 * has a length constraint, else y = 1). Sizes with q >= 1/4 are drawn one by one, the sparse
 * tail by thinning (only the sizes that occur). Returns the size drawn.
 */
function freeProposal(family: PartitionFamily): (source: RandomSource) => number {
  const spec = toSpec(family);
  const { sizes, distinct, n } = spec;
  const parts = spec.length ?? spec.maxLength;
  let t: number;
  let u = 0;
  if (parts === undefined) t = solveTiltNewton(sizes, n, distinct);
  else if (sizes.kind === 'list' && !distinct) ({ t, u } = solveTwoTilts(sizes.values, n, parts, spec.length === undefined));
  else ({ t, u } = intervalTwoTilts(sizes, n, parts, distinct));
  const q = (s: number) => Math.exp(u + t * s);
  const draw = (s: number, source: RandomSource): number => {
    const lq = u + t * s;
    if (distinct) return source.nextDouble() < 1 / (1 + Math.exp(-lq)) ? 1 : 0;
    return Math.floor(Math.log(nextOpenDouble(source)) / lq);
  };
  return (source) => {
    let total = 0;
    if (sizes.kind === 'list') {
      for (const s of sizes.values) total += s * draw(s, source);
      return total;
    }
    let s = sizes.lo;
    for (; s <= sizes.hi && q(s) >= 0.25; s++) total += s * draw(s, source);
    if (s <= sizes.hi) {
      const p = distinct ? (k: number) => 1 / (1 + 1 / q(k)) : q;
      visitThinned(source, s, sizes.hi, p, (k) => {
        // Occurs: 1, or 1 + geometric for multisets (memorylessness).
        total += k * (distinct ? 1 : 1 + Math.floor(Math.log(nextOpenDouble(source)) / (u + t * k)));
        return true;
      });
    }
    return total;
  };
}

/** (t, u) with mean size n and mean length `parts` over an interval of sizes (Newton, bracketed by halving). */
function intervalTwoTilts(sizes: SizeSet, n: number, parts: number, distinct: boolean): { t: number; u: number } {
  const moments = (t: number, u: number) => {
    const terms = (k: number) => {
      const lq = u + t * k;
      if (distinct) {
        const p = 1 / (1 + Math.exp(-lq));
        return [p, p * (1 - p)];
      }
      const d = -Math.expm1(lq);
      return [Math.exp(lq) / d, Math.exp(lq) / (d * d)];
    };
    return {
      N: sumOverSizes(sizes, t, (k) => k * terms(k)[0]),
      L: sumOverSizes(sizes, t, (k) => terms(k)[0]),
      vN: sumOverSizes(sizes, t, (k) => k * k * terms(k)[1]),
      vL: sumOverSizes(sizes, t, (k) => terms(k)[1]),
      c: sumOverSizes(sizes, t, (k) => k * terms(k)[1]),
    };
  };
  const lo = sizes.kind === 'interval' ? sizes.lo : sizes.values[0];
  let t = -1 / Math.max(1, n / parts - lo + 1);
  let u = distinct ? 0 : -1e-3 - t * lo;
  for (let i = 0; i < 40; i++) {
    const m = moments(t, u);
    const gN = m.N - n;
    const gL = m.L - parts;
    if (Math.abs(gN) < 1e-6 * n && Math.abs(gL) < 1e-6 * parts) break;
    const det = m.vN * m.vL - m.c * m.c;
    if (!(det > 0)) break;
    let dt = -(m.vL * gN - m.c * gL) / det;
    let du = -(m.vN * gL - m.c * gN) / det;
    // Keep every q < 1 for multisets (t < 0 and u + t lo < 0).
    while (!distinct && !(t + dt < 0 && u + du + (t + dt) * lo < 0)) {
      dt /= 2;
      du /= 2;
    }
    t += dt;
    u += du;
  }
  return { t, u };
}

function median(values: number[]): number {
  const s = values.slice().sort((a, b) => a - b);
  const mid = s.length >> 1;
  return s.length % 2 ? s[mid] : (s[mid - 1] + s[mid]) / 2;
}

function fmt(ms: number): string {
  if (ms >= 100) return ms.toFixed(0);
  if (ms >= 1) return ms.toFixed(2);
  if (ms >= 0.01) return ms.toFixed(3);
  return ms.toExponential(1);
}

/** Times `once` for about ROUND_MS; returns ms per call. */
function timeRound(once: (i: number) => void, start: number, roundMs = ROUND_MS): { ms: number; next: number } {
  const t0 = performance.now();
  let i = start;
  do once(i++);
  while (performance.now() - t0 < roundMs && i - start < 100_000);
  return { ms: (performance.now() - t0) / (i - start), next: i };
}

interface Cell {
  readonly method: string;
  readonly setupMs: number;
  readonly sampleMs: number;
  readonly proposalMs: number;
  readonly ratio: number;
}

function measure(family: PartitionFamily): Cell | string {
  let sampler: PartitionSampler;
  const t0 = performance.now();
  try {
    sampler = constrainedPartitionSampler(family);
  } catch (error) {
    return `refused (${(error as Error).name === 'EmptyFamilyError' ? 'empty' : 'limit'})`;
  }
  const setupMs = performance.now() - t0;
  const proposal = freeProposal(family);
  const key = JSON.stringify(family);
  let i = 0;
  let j = 0;
  // Warm-up, untimed, of both: the compiler's first passes and the counts a method fills lazily
  // and keeps for later requests (shared tables, remembered counts), so the rounds time the
  // steady state a serving process is in.
  i = timeRound((k) => sampler.sample(sampleSource('bench', k, key)), i, WARM_MS).next;
  j = timeRound((k) => proposal(sampleSource('free', k, key)), j, WARM_MS).next;
  const samples: number[] = [];
  const proposals: number[] = [];
  const ratios: number[] = [];
  for (let r = 0; r < ROUNDS; r++) {
    const a = timeRound((k) => sampler.sample(sampleSource('bench', k, key)), i);
    i = a.next;
    const b = timeRound((k) => proposal(sampleSource('free', k, key)), j);
    j = b.next;
    samples.push(a.ms);
    proposals.push(b.ms);
    ratios.push(a.ms / b.ms);
  }
  return { method: sampler.method, setupMs, sampleMs: median(samples), proposalMs: median(proposals), ratio: median(ratios) };
}

function row(cells: string[], widths: number[]): string {
  return cells.map((c, i) => (i === 0 ? c.padEnd(widths[i]) : c.padStart(widths[i]))).join('  ');
}

/** The distinct-allowed rows: a list's length, its range and n in the label. */
function benchDistinctAllowed(widths: number[]): void {
  console.log('\n## Distinct parts from allowed lists: ms per exact sample and ratio to one free proposal, same run');
  console.log(row(['list', 'n', 'method', 'setup ms', 'ms/sample', 'proposal ms', 'ratio'], widths));
  for (const family of DISTINCT_ALLOWED_ROWS) {
    const list = family.allowed!;
    const name = `${list.length} sizes in [${list[0]}, ${list[list.length - 1]}]${family.maxLength === undefined ? '' : `, <= ${family.maxLength} parts`}`;
    const cell = measure(family);
    const label = family.n.toExponential(0).replace('+', '');
    if (typeof cell === 'string') console.log(row([name, label, cell, '', '', '', ''], widths));
    else console.log(row([name, label, cell.method, fmt(cell.setupMs), fmt(cell.sampleMs), fmt(cell.proposalMs), cell.ratio.toFixed(1)], widths));
  }
}

/**
 * SHAPES_MATCH=<substring> (or SHAPES_FILTER) keeps only the shapes and issue rows whose name
 * contains it; SHAPES_SIZES=1e6,1e9 keeps only those n. For local subsets.
 */
export async function benchShapes(): Promise<void> {
  const sizes = process.env.SHAPES_SIZES ? process.env.SHAPES_SIZES.split(',').map(Number) : SIZES;
  if (process.argv.includes('distinct-allowed')) {
    benchDistinctAllowed([48, 6, 34, 9, 10, 11, 7]);
    return;
  }
  console.log('\n## Constrained family shapes: ms per exact sample (planner choice) and ratio to one free proposal, same run');
  console.log(`(${WARM_MS} ms untimed warm-up, then ${ROUNDS} alternating rounds of ~${ROUND_MS} ms per cell; setup = planning, tilts and tables, once per family)`);
  const widths = [36, 6, 34, 9, 10, 11, 7];
  console.log(row(['family', 'n', 'method', 'setup ms', 'ms/sample', 'proposal ms', 'ratio'], widths));
  // SHAPES_MATCH=text runs only the shapes (and issue rows) whose name contains it.
  const match = process.env.SHAPES_MATCH ?? process.env.SHAPES_FILTER ?? '';
  for (const [name, shape] of SHAPES) {
    if (!name.includes(match)) continue;
    for (const n of sizes) {
      const family = { kind: 'partition', n, ...shape(n) } as PartitionFamily;
      const cell = measure(family);
      const label = n.toExponential(0).replace('+', '');
      if (typeof cell === 'string') console.log(row([name, label, cell, '', '', '', ''], widths));
      else console.log(row([name, label, cell.method, fmt(cell.setupMs), fmt(cell.sampleMs), fmt(cell.proposalMs), cell.ratio.toFixed(1)], widths));
    }
  }
  console.log('\n## Issue 13 requests: ms per exact sample and ratio to one free proposal, same run');
  console.log(row(['family', 'n', 'method', 'setup ms', 'ms/sample', 'proposal ms', 'ratio'], widths));
  for (const family of ISSUE_ROWS) {
    const { kind: _kind, n, ...rest } = family;
    const name = JSON.stringify(rest)
      .replace(/"allowed":\[[^\]]{40,}\]/, '"allowed":[…]')
      .replace(/[{}"]/g, '');
    if (!name.includes(match)) continue;
    const cell = measure(family);
    const label = n.toExponential(0).replace('+', '');
    if (typeof cell === 'string') console.log(row([name, label, cell, '', '', '', ''], widths));
    else console.log(row([name, label, cell.method, fmt(cell.setupMs), fmt(cell.sampleMs), fmt(cell.proposalMs), cell.ratio.toFixed(1)], widths));
  }
  benchDistinctAllowed(widths);
}

if (process.argv[1] !== undefined && import.meta.url.endsWith(process.argv[1].split('/').pop()!)) {
  await benchShapes();
}
