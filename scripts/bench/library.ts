/**
 * The library's costs, side by side in one run (the machine may be shared: read the ratios).
 *
 * 1. Per sample: `family.sample(seed, i)` of the synchronous library against the core sampler
 *    alone (`sampler.sample(streams.source(seed, i))`, the same planned sampler and streams), and
 *    the asynchronous path of 0.2 beside them (a Request through the HTTP app, its JSON parsed
 *    back), at n = 100, 1000 and 10^6. Short rounds alternate between the paths; each figure is
 *    the median of SAMPLE_ROUNDS rounds, in µs per sample.
 * 2. Import time of the library entry (src/index.ts) over the core it calls (import/core.ts),
 *    each in fresh processes, alternating, medians of ROUNDS: with Node and tsx (how the
 *    project's scripts load TypeScript), in vitest (one test file per import: how a user's test
 *    file pays it), and from esbuild bundles with the dependencies left as packages (what a
 *    compiled release would load: the floor without a TypeScript loader).
 */
import { execFileSync } from 'node:child_process';
import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { compositionFamily, partitionFamily, type SampledFamily } from '../../src/index.js';
import { createApp } from '../../src/http/app.js';
import { toQueryString } from '../../src/client/params.js';
import { partsOf, type Partition } from '../../src/core/partition.js';
import type { RandomSource } from '../../src/core/random.js';
import type { SampleStreams } from '../../src/core/seeding.js';

/** Fresh processes per entry for import times. */
const ROUNDS = 7;
/** Short interleaved rounds per path for per-sample costs: many, so that a shared machine's drift hits every path alike. */
const SAMPLE_ROUNDS = 101;
const ROOT = resolve(import.meta.dirname, '../..');

function median(values: number[]): number {
  const s = values.slice().sort((a, b) => a - b);
  return s[s.length >> 1];
}

/** Medians (µs per call) of interleaved rounds of each path, `calls` calls per round. */
async function interleaved(paths: Record<string, (i: number) => unknown>, calls: number): Promise<Record<string, number>> {
  const rounds: Record<string, number[]> = {};
  let i = 0;
  for (const [name, once] of Object.entries(paths)) {
    rounds[name] = [];
    for (let k = 0; k < Math.max(3, calls >> 2); k++) await once(i++); // warm-up
  }
  const entries = Object.entries(paths);
  for (let r = 0; r < SAMPLE_ROUNDS; r++) {
    // The order alternates (A B C, C B A, ...) so that no path always runs first.
    for (const [name, once] of r % 2 === 0 ? entries : [...entries].reverse()) {
      const t0 = performance.now();
      for (let k = 0; k < calls; k++) {
        const result = once(i++);
        if (result instanceof Promise) await result;
      }
      rounds[name].push(((performance.now() - t0) * 1000) / calls);
    }
  }
  return Object.fromEntries(Object.entries(rounds).map(([name, values]) => [name, median(values)]));
}

async function perSample(): Promise<void> {
  const app = createApp();
  /** The 0.2 library: GET through the app in-process, the JSON document parsed back. */
  const oldAsync = (path: string, constraints: object) => async (i: number) => {
    const response = await app.fetch(new Request(`http://partsmith.local${path}${toQueryString({ ...constraints, seed: 'bench', start: i, count: 1 })}`));
    return ((await response.json()) as { samples: number[][] }).samples[0];
  };
  console.log('Per-sample cost, µs (median of interleaved rounds); library / core is the target ratio (<= 1.2)\n');
  console.log('"core + parts" also writes a partition in the parts form the library returns (partsOf: the core samplers return multiplicities).\n');
  console.log('| family | core sampler | core + parts | library sample() | library / core | library / (core + parts) | 0.2 async path | async / core |');
  console.log('|---|---:|---:|---:|---:|---:|---:|---:|');
  const rows: [string, SampledFamily<number[]>, string, object, number][] = [
    ['partitions n = 100', partitionFamily({ n: 100 }), '/v1/partitions', { n: 100 }, 250],
    ['partitions n = 1000', partitionFamily({ n: 1000 }), '/v1/partitions', { n: 1000 }, 120],
    ['partitions n = 10^6', partitionFamily({ n: 1e6 }), '/v1/partitions', { n: 1e6 }, 3],
    ['compositions n = 100', compositionFamily({ n: 100 }), '/v1/compositions', { n: 100 }, 250],
    ['compositions n = 1000', compositionFamily({ n: 1000 }), '/v1/compositions', { n: 1000 }, 120],
    ['compositions n = 10^6', compositionFamily({ n: 1e6 }), '/v1/compositions', { n: 1e6 }, 1],
  ];
  for (const [name, family, path, constraints, calls] of rows) {
    const { sampler, streams } = family as unknown as { sampler: { sample(source: RandomSource): unknown }; streams: SampleStreams };
    const partitions = family.kind === 'partition';
    const us = await interleaved(
      {
        core: (i) => sampler.sample(streams.source('bench', i)),
        parts: (i) => {
          const sample = sampler.sample(streams.source('bench', i));
          return partitions ? partsOf(sample as Partition) : sample;
        },
        library: (i) => family.sample('bench', i),
        async: oldAsync(path, constraints),
      },
      calls,
    );
    const cells = [us.core.toFixed(2), us.parts.toFixed(2), us.library.toFixed(2), (us.library / us.core).toFixed(2), (us.library / us.parts).toFixed(2), us.async.toFixed(1), (us.async / us.core).toFixed(1)];
    console.log(`| ${name} | ${cells.join(' | ')} |`);
  }
}

/** partsOf written by index into new Array(total) instead of pushed: the alternative partsOf's comment measures. */
function partsByIndex(partition: Partition): number[] {
  const { sizes, multiplicities } = partition;
  let total = 0;
  for (let i = 0; i < multiplicities.length; i++) total += multiplicities[i];
  const out = new Array<number>(total);
  let at = 0;
  for (let i = 0; i < sizes.length; i++) {
    const size = sizes[i] | 0;
    for (let j = 0; j < multiplicities[i]; j++) out[at++] = size;
  }
  return out;
}

/** The parts form pushed (partsOf) against preallocated (a holey array in V8), alone and then written by JSON.stringify. */
async function partsForms(): Promise<void> {
  console.log('\nParts form, µs per sample (median of interleaved rounds): partsOf pushes; "index" preallocates new Array(total)\n');
  console.log('| family | sample + partsOf | sample + index | + JSON.stringify, partsOf | + JSON.stringify, index |');
  console.log('|---|---:|---:|---:|---:|');
  for (const [n, calls] of [[100, 250], [1000, 120], [1e6, 3]]) {
    const family = partitionFamily({ n });
    const { sampler, streams } = family as unknown as { sampler: { sample(source: RandomSource): Partition }; streams: SampleStreams };
    const us = await interleaved(
      {
        push: (i) => partsOf(sampler.sample(streams.source('bench', i))),
        index: (i) => partsByIndex(sampler.sample(streams.source('bench', i))),
        pushJson: (i) => JSON.stringify(partsOf(sampler.sample(streams.source('bench', i)))),
        indexJson: (i) => JSON.stringify(partsByIndex(sampler.sample(streams.source('bench', i)))),
      },
      calls,
    );
    console.log(`| partitions n = ${n === 1e6 ? '10^6' : n} | ${us.push.toFixed(2)} | ${us.index.toFixed(2)} | ${us.pushJson.toFixed(2)} | ${us.indexJson.toFixed(2)} |`);
  }
}

/** Milliseconds to import `specifier` in a fresh `node [args]` process. */
function importTime(args: readonly string[], specifier: string, cwd = ROOT): number {
  const out = execFileSync(process.execPath, [...args, join(ROOT, 'scripts/bench/import/time-import.mjs'), specifier], { cwd, encoding: 'utf8', env: { ...process.env, TSX_DISABLE_CACHE: '' } });
  return Number(out.trim().split('\n').pop());
}

function ratioRow(label: string, core: number[], library: number[]): void {
  const c = median(core);
  const l = median(library);
  console.log(`| ${label} | ${c.toFixed(0)} | ${l.toFixed(0)} | ${(l / c).toFixed(2)} |`);
}

export function importTimes(): void {
  const coreEntry = join(ROOT, 'scripts/bench/import/core.ts');
  const libraryEntry = join(ROOT, 'src/index.ts');
  console.log(`\nImport time, ms (fresh processes, alternating, median of ${ROUNDS}); library / core is the target ratio (<= 2)\n`);
  console.log('| how the modules are loaded | core | library | library / core |');
  console.log('|---|---:|---:|---:|');

  // Node with tsx, as the project's scripts run (tsx's cache warmed by a first import of each).
  const tsx = ['--import', 'tsx'];
  importTime(tsx, coreEntry);
  importTime(tsx, libraryEntry);
  const tsxCore: number[] = [];
  const tsxLibrary: number[] = [];
  for (let r = 0; r < ROUNDS; r++) {
    tsxCore.push(importTime(tsx, coreEntry));
    tsxLibrary.push(importTime(tsx, libraryEntry));
  }
  ratioRow('Node + tsx', tsxCore, tsxLibrary);

  // Scratch files inside the project, so that bundles and test files resolve its packages.
  const dir = join(ROOT, '.bench-import');
  const work = join(dir, 'bundles');
  mkdirSync(work, { recursive: true });
  try {
    // vitest: one test file per import, each in its own worker (vitest's default isolation).
    {
      for (let r = 0; r < ROUNDS; r++) {
        for (const [what, entry] of [['core', coreEntry], ['library', libraryEntry]] as const) {
          writeFileSync(
            join(dir, `${what}-${r}.test.ts`),
            `import { it } from 'vitest';\nit('imports', async () => { const t0 = performance.now(); await import(${JSON.stringify(entry)}); console.log('IMPORT ${what} ' + (performance.now() - t0).toFixed(2)); });\n`,
          );
        }
      }
      writeFileSync(join(dir, 'vitest.config.ts'), `import { defineConfig } from 'vitest/config';\nexport default defineConfig({ test: { include: ['.bench-import/*.test.ts'], fileParallelism: false } });\n`);
      // A first run fills vite's transform cache, as in a user's repeated test runs.
      const run = () => execFileSync(process.execPath, [join(ROOT, 'node_modules/vitest/vitest.mjs'), 'run', '--config', join(dir, 'vitest.config.ts')], { cwd: ROOT, encoding: 'utf8' });
      run();
      const lines = run().split('\n');
      const times = (what: string) => lines.flatMap((line) => (line.includes(`IMPORT ${what} `) ? [Number(line.split(`IMPORT ${what} `)[1])] : []));
      ratioRow('vitest, one test file each', times('core'), times('library'));
    }

    // Bundles: our modules in one file each, the dependencies (zod, seedrandom) imported as packages.
    const esbuild = join(ROOT, 'node_modules/.bin/esbuild');
    for (const [what, entry] of [['core', coreEntry], ['library', libraryEntry]] as const) {
      execFileSync(esbuild, [entry, '--bundle', '--format=esm', '--platform=node', '--packages=external', `--outfile=${join(work, `${what}.mjs`)}`, '--log-level=warning'], { cwd: ROOT });
    }
    const bundleCore: number[] = [];
    const bundleLibrary: number[] = [];
    for (let r = 0; r < ROUNDS; r++) {
      bundleCore.push(importTime([], join(work, 'core.mjs'), ROOT));
      bundleLibrary.push(importTime([], join(work, 'library.mjs'), ROOT));
    }
    ratioRow('Node, bundled (deps as packages)', bundleCore, bundleLibrary);
    const zod: number[] = [];
    for (let r = 0; r < ROUNDS; r++) zod.push(importTime([], 'zod', ROOT));
    console.log(`\nFor reference: import('zod') alone, plain Node: ${median(zod).toFixed(0)} ms.`);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

export async function benchLibrary(): Promise<void> {
  await perSample();
  await partsForms();
  importTimes();
}
