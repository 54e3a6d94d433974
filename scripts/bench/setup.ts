/**
 * `npm run bench -- setup`: setup cost (planning + the first sample, which fills the lazy count
 * tables) and the per-sample cost after it, for the self-similar families with a smallest part
 * or a largest part (issue 13 asks setup <= 200 ms and <= 50 ms per sample up to n = 1e9). Each
 * row runs in a fresh process (scripts/bench/setup-row.ts) after a warm-up on other families;
 * process CPU ms, median of ROUNDS runs (rows of the family scan, scripts/scan-families.ts).
 * SETUP_MATCH=text runs the rows whose family contains it.
 */
import { execFileSync } from 'node:child_process';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const ROWS: ReadonlyArray<Record<string, number | boolean>> = [
  { n: 414_781_530, distinct: true, minPart: 1572 },
  { n: 167_393_785, distinct: true, minPart: 147, maxPart: 35_611 },
  { n: 30_897_792, distinct: true, minPart: 540 },
  { n: 349_786_589, distinct: true, minPart: 18 },
  { n: 202_404_053, distinct: true, minPart: 300 },
  { n: 810_000_000, distinct: true, minPart: 4918 },
  { n: 1_000_000_000, distinct: true, minPart: 3953 },
  { n: 129_600_544, distinct: true, minPart: 4918 },
  { n: 37_226_772, minPart: 531 },
  { n: 652_235, minPart: 198 },
  { n: 2_127_855, minPart: 323 },
  { n: 506_717_384, maxPart: 3453 },
  { n: 7_385_522, minPart: 1930, maxPart: 2295 },
];
const ROUNDS = 3;
const here = dirname(fileURLToPath(import.meta.url));

export async function benchSetup(): Promise<void> {
  console.log('\n## Setup of the self-similar families: plan + first sample, then ms per sample (process CPU, fresh process per row, median of 3)');
  const match = process.env.SETUP_MATCH ?? '';
  console.log(['family'.padEnd(58), 'method'.padEnd(34), 'plan', 'first', 'setup', 'ms/sample'].join(' '));
  for (const family of ROWS) {
    const key = JSON.stringify(family);
    if (!key.includes(match)) continue;
    const runs: Array<{ method: string; planMs: number; firstMs: number; sampleMs: number }> = [];
    for (let r = 0; r < ROUNDS; r++) {
      const out = execFileSync(process.execPath, ['--import', 'tsx', join(here, 'setup-row.ts'), key], { encoding: 'utf8' });
      runs.push(JSON.parse(out.trim().split('\n').pop()!));
    }
    const median = (f: (x: (typeof runs)[number]) => number) => runs.map(f).sort((a, b) => a - b)[Math.floor(runs.length / 2)];
    const setup = median((x) => x.planMs + x.firstMs);
    console.log([key.padEnd(58), runs[0].method.padEnd(34), median((x) => x.planMs).toFixed(0).padStart(4), median((x) => x.firstMs).toFixed(0).padStart(5), setup.toFixed(0).padStart(5), median((x) => x.sampleMs).toFixed(1).padStart(9)].join(' '));
  }
}
