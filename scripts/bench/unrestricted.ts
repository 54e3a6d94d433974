/**
 * Speed of exact uniform partitions of n, 10^2 .. 10^9: the planner's method against one free-size
 * Boltzmann proposal (the unit of work) and the two classical exact methods, all measured in the
 * same run on the same machine. Times are medians of per-sample wall-clock times.
 */
import { LogPartitionNumbers } from '../../src/core/counting/log-partition-number.js';
import { BoltzmannProposal, boltzmannLogX } from '../../src/core/partitions/boltzmann-proposal.js';
import { DivideAndConquerSampler } from '../../src/core/partitions/divide-and-conquer.js';
import { PlainRejectionSampler } from '../../src/core/partitions/plain-rejection.js';
import { SelfSimilarSampler, type SelfSimilarStats } from '../../src/core/partitions/self-similar.js';
import { RestrictedPartitionTable, TableRecursiveSampler } from '../../src/core/partitions/table-recursive.js';
import { TABLE_METHOD_UP_TO, unrestrictedPartitionSampler } from '../../src/core/partitions/unrestricted.js';
import type { RandomSource } from '../../src/core/random.js';
import { sampleSource } from '../../src/core/seeding.js';

/** Wall-clock per method and size (the whole bench must stay under ~3 minutes). */
const BUDGET_MS = 1500;
/** Alternating timing rounds per size for the proposal and the planner's method. */
const ROUNDS = 5;
/** A baseline whose single sample is predicted to take longer than this is skipped. */
const SKIP_OVER_MS = 20_000;

let peakRss = 0;
function notePeak(): void {
  peakRss = Math.max(peakRss, process.memoryUsage().rss);
}

function median(values: number[]): number {
  const s = values.slice().sort((a, b) => a - b);
  const mid = s.length >> 1;
  return s.length % 2 ? s[mid] : (s[mid - 1] + s[mid]) / 2;
}

/** Runs `once` `warmUp` times, then repeatedly within the budget (at least minReps times); returns median ms. */
function timeIt(once: () => void, budgetMs: number, minReps = 3, maxReps = 20_000, warmUp = 5): { ms: number; reps: number } {
  for (let i = 0; i < warmUp; i++) once();
  const times: number[] = [];
  const start = performance.now();
  while (times.length < maxReps && (times.length < minReps || performance.now() - start < budgetMs)) {
    const t0 = performance.now();
    once();
    times.push(performance.now() - t0);
  }
  notePeak();
  return { ms: median(times), reps: times.length };
}

function fmt(ms: number): string {
  if (ms >= 100) return ms.toFixed(0);
  if (ms >= 1) return ms.toFixed(2);
  if (ms >= 0.01) return ms.toFixed(4);
  return ms.toExponential(2);
}

function pad(cells: string[], widths: number[]): string {
  return cells.map((c, i) => c.padStart(widths[i])).join('  ');
}

export async function benchUnrestricted(): Promise<void> {
  const sizes = [1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9];
  const source: RandomSource = sampleSource('bench', 0, 'bench-unrestricted');
  const table = new RestrictedPartitionTable();
  const logP = new LogPartitionNumbers();
  const proposal = new BoltzmannProposal();
  const t0 = performance.now();
  table.ensure(TABLE_METHOD_UP_TO);
  logP.log(1);
  const setupMs = performance.now() - t0;

  console.log('\n## Unrestricted partitions of n: median ms per exact sample (planner set-up included in every call)');
  console.log(`shared tables built once per process: ${fmt(setupMs)} ms (p(m, <=k) for m <= ${TABLE_METHOD_UP_TO}; exact p(m) for m <= ${LogPartitionNumbers.EXACT_UP_TO})`);
  const head = ['n', 'proposal ms', 'method', 'exact ms', 'proposals', 'ratio', 'visits', 'plain ms', 'plain props', 'plain ratio', 'D&C-1s ms', 'D&C props', 'D&C ratio', 'rss MB'];
  const widths = [6, 11, 17, 9, 9, 6, 6, 9, 11, 11, 9, 9, 9, 6];
  console.log(pad(head, widths));

  for (const n of sizes) {
    // One free-size proposal (all sizes k >= 1 at x = exp(−π/√(6n)), no budget) and the
    // planner's method, set-up included (a sampler is planned for every call), timed in
    // alternating rounds so that load from other processes hits both alike; the ratio is the
    // median over rounds of (exact ms / proposal ms) within a round.
    const logX = boltzmannLogX(n);
    const unitRounds: number[] = [];
    const fastRounds: number[] = [];
    const ratios: number[] = [];
    for (let round = 0; round < ROUNDS; round++) {
      const u = timeIt(() => proposal.draw(source, logX, 1, 1, Infinity), BUDGET_MS / (2 * ROUNDS), 5).ms;
      const f = timeIt(() => unrestrictedPartitionSampler(n).sample(source), BUDGET_MS / ROUNDS, 5).ms;
      unitRounds.push(u);
      fastRounds.push(f);
      ratios.push(f / u);
    }
    const unit = median(unitRounds);
    const fast = median(fastRounds);
    const ratio = median(ratios);
    const planned = unrestrictedPartitionSampler(n);
    let proposals = '-';
    let visitRatio = '-';
    if (planned.method.startsWith('self-similar')) {
      const stats: SelfSimilarStats = { topProposals: 0, proposals: 0, visited: 0 };
      const counted = new SelfSimilarSampler(n, { baseThreshold: TABLE_METHOD_UP_TO, table, logP });
      const reps = Math.max(20, Math.min(2000, Math.round(2e5 / Math.sqrt(n))));
      for (let i = 0; i < reps; i++) counted.sample(source, stats);
      proposals = `${(stats.topProposals / reps).toFixed(2)}/${(stats.proposals / reps).toFixed(1)}`;
      // Load-independent work ratio: part sizes visited per exact sample / per free proposal.
      let freeVisited = 0;
      const freeReps = Math.max(20, Math.round(reps / 2));
      for (let i = 0; i < freeReps; i++) {
        proposal.draw(source, logX, 1, 1, Infinity);
        freeVisited += proposal.visited;
      }
      visitRatio = `${(stats.visited / reps / (freeVisited / freeReps)).toFixed(2)}x`;
    } else if (planned instanceof TableRecursiveSampler) proposals = 'table';

    const baseline = (make: () => { sample(s: RandomSource): unknown; proposals: number }, predictedProposals: number): string[] => {
      const predictedMs = predictedProposals * unit;
      if (predictedMs > SKIP_OVER_MS) return [`skipped`, `(~${predictedProposals.toExponential(1)})`, `~${(predictedProposals).toExponential(1)}x`];
      const sampler = make();
      const expensive = predictedMs > 200;
      const reps = predictedMs > BUDGET_MS ? 1 : 3;
      const warmUp = expensive ? 0 : 3;
      const timed = timeIt(() => sampler.sample(source), BUDGET_MS * 2, reps, 20_000, warmUp);
      // The counter includes the warm-up samples: divide by all samples drawn.
      const drawn = timed.reps + warmUp;
      return [fmt(timed.ms), (sampler.proposals / drawn).toFixed(1), `${(timed.ms / unit).toFixed(1)}x`];
    };
    const plain = baseline(() => new PlainRejectionSampler(n), 3.13 * n ** 0.75);
    const dc = baseline(() => new DivideAndConquerSampler(n), 4.0 * n ** 0.25);
    notePeak();
    console.log(pad([n.toExponential(0), fmt(unit), planned.method, fmt(fast), proposals, `${ratio.toFixed(2)}x`, visitRatio, ...plain, ...dc, (process.memoryUsage().rss / 2 ** 20).toFixed(0)], widths));
  }
  console.log(`proposals = odd-size proposals per sample at the top level / at all levels of the recursion; ratio = median over rounds of exact ms / one free-size proposal ms, timed alternately; visits = part sizes visited per exact sample / per free-size proposal (load-independent); skipped baselines show the predicted proposals (plain ~3.13·n^{3/4}, D&C ~4.0·n^{1/4}).`);
  console.log(`peak rss ${(peakRss / 2 ** 20).toFixed(0)} MB; bench section took ${((performance.now() - t0) / 1000).toFixed(1)} s`);
}
