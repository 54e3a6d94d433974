/**
 * `npm run bench -- plan-fit` (or `npx tsx scripts/bench/plan-fit.ts [shape-substring] [n...]`):
 * the planner's estimates against the clock. For every shape of shapes.ts and n, every
 * eligible method (planCandidates with all candidates asked for) is built and timed with the
 * planner's `method` option bypassed (the candidate's own build), and printed beside its
 * estimate: setup ns (setupWork × nsPerSetupUnit) and per-sample ns (sampleWork × nsPerStep).
 * The column `meas/est` is the measured per-sample time over the estimate: a method whose
 * ratio is systematically far from 1 has a misestimated cost model or work-costs.ts row. The
 * planner's choice (among the candidates it lists when no method is forced) is marked `*`,
 * the fastest measured `+`.
 */
import type { PartitionFamily } from '../../src/core/family.js';
import { planCandidates, planCostNs } from '../../src/core/partitions/constrained/plan.js';
import { sampleSource } from '../../src/core/seeding.js';
import { nsPerSetupUnit, nsPerStep } from '../../src/core/work-costs.js';
import { SHAPES } from './shapes.js';

const SIZES = [1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9];
const ROUNDS = 3;
const ROUND_MS = 25;
/** Untimed sampling before the rounds (steady state is what the rows price). */
const WARM_MS = 150;
/** Candidates estimated above this per sample are not timed (they would take too long). */
const SKIP_ABOVE_NS = 60e6;

function fmt(ms: number): string {
  if (ms >= 100) return ms.toFixed(0);
  if (ms >= 1) return ms.toFixed(2);
  if (ms >= 0.01) return ms.toFixed(3);
  return ms.toExponential(1);
}

/** Process CPU ms per call of `once` (best of ROUNDS rounds of ~ROUND_MS wall-clock): load from other processes hardly changes it. */
function timeMs(once: (i: number) => void): number {
  const best: number[] = [];
  let i = 0;
  // Warm-up (not timed): lazily filled count tables and the compiler's first passes.
  const w0 = performance.now();
  do once(i++);
  while (performance.now() - w0 < WARM_MS && i < 20_000);
  for (let r = 0; r < ROUNDS; r++) {
    const t0 = performance.now();
    const c0 = process.cpuUsage();
    const start = i;
    do once(i++);
    while (performance.now() - t0 < ROUND_MS && i - start < 50_000);
    const c = process.cpuUsage(c0);
    best.push((c.user + c.system) / 1000 / (i - start));
  }
  return Math.min(...best);
}

export async function benchPlanFit(filter?: string, sizes: number[] = SIZES): Promise<void> {
  console.log('\n## Planner estimates against measured time (process CPU time after a warm-up, best of 3 rounds)');
  const w = [34, 6, 44, 10, 10, 10, 10, 8];
  const row = (c: string[]) => c.map((s, i) => (i === 0 || i === 2 ? s.padEnd(w[i]) : s.padStart(w[i]))).join(' ');
  console.log(row(['family', 'n', 'method', 'est setup', 'meas setup', 'est ms', 'meas ms', 'meas/est']));
  for (const [name, shape] of SHAPES) {
    if (filter !== undefined && !name.includes(filter)) continue;
    for (const n of sizes) {
      const family = { kind: 'partition', n, ...shape(n) } as PartitionFamily;
      const label = n.toExponential(0).replace('+', '');
      let candidates;
      try {
        candidates = planCandidates(family, true);
      } catch (error) {
        console.log(row([name, label, `(${(error as Error).name})`, '', '', '', '', '']));
        continue;
      }
      // The planner's own choice: among the candidates it lists without `method` (Boltzmann
      // methods are skipped where a table is estimated cheap; some are listed only when all are
      // asked for), not over all of them.
      const fitting = planCandidates(family, false).filter((c) => c.fits);
      const best = fitting.length === 0 ? undefined : fitting.reduce((a, b) => (planCostNs(b) < planCostNs(a) ? b : a));
      const chosen = best === undefined ? undefined : candidates.find((c) => c.method === best.method);
      const lines: Array<{ cells: string[]; ms: number }> = [];
      for (const c of candidates) {
        const estSetup = c.setupWork * nsPerSetupUnit(c.method);
        const estSample = c.sampleWork * nsPerStep(c.method);
        const mark = c === chosen ? '*' : ' ';
        if (!c.fits || estSample > SKIP_ABOVE_NS) {
          lines.push({ cells: [name, label, `${mark}${c.method}${c.fits ? ' (slow)' : ' (no fit)'}`, fmt(estSetup / 1e6), '', fmt(estSample / 1e6), '', ''], ms: Infinity });
          continue;
        }
        const t0 = performance.now();
        const sampler = c.build();
        const setupMs = performance.now() - t0;
        const key = JSON.stringify(family);
        const ms = timeMs((i) => sampler.sample(sampleSource('fit', i, key)));
        lines.push({
          cells: [name, label, `${mark}${c.method}`, fmt(estSetup / 1e6), fmt(setupMs), fmt(estSample / 1e6), fmt(ms), (ms / (estSample / 1e6)).toFixed(2)],
          ms,
        });
      }
      const fastest = Math.min(...lines.map((l) => l.ms));
      for (const l of lines) {
        if (l.ms === fastest && Number.isFinite(fastest)) l.cells[2] = `${l.cells[2]} +`;
        console.log(row(l.cells));
      }
    }
  }
}

if (process.argv[1] !== undefined && import.meta.url.endsWith(process.argv[1].split('/').pop()!)) {
  const [filter, ...ns] = process.argv.slice(2);
  await benchPlanFit(filter === undefined || filter === '' ? undefined : filter, ns.length > 0 ? ns.map(Number) : undefined);
}
