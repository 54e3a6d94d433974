import { LogPartitionNumbers } from '../counting/log-partition-number.js';
import { MAX_N } from '../family.js';
import type { Partition } from '../partition.js';
import type { RandomSource } from '../random.js';
import type { PartitionSampler } from '../sampler.js';
import { uniformPartitionMeans } from './partition-means.js';
import { SelfSimilarEngine } from './self-similar.js';
import { RestrictedPartitionTable, TableRecursiveSampler } from './table-recursive.js';

/** Largest n for the service's unrestricted partitions. */
export const MAX_UNRESTRICTED_N = MAX_N;

/**
 * Up to this n the table method is used directly, and the self-similar recursion hands over to it
 * once a sub-problem is this small. Chosen by measurement (one sample, seeding included):
 * at n = 1000 the table method takes 2.8 µs against 4.4 µs for the recursion with a base at 500,
 * and a base at 1000 is no slower at larger n (n = 10^6: 112 vs 117 µs). The table then holds
 * 500,500 doubles (4 MB), built once per process in ~5 ms. (ALGORITHM_VERSION 1 used 500.)
 */
export const TABLE_METHOD_UP_TO = 1000;

/** The memo tables the unrestricted samplers share: filled lazily, owned by this object. */
export class UnrestrictedTables {
  readonly table = new RestrictedPartitionTable();
  readonly logP = new LogPartitionNumbers();
}

/** The tables used when the caller passes none (one instance per process; pure caches). */
const defaultTables = new UnrestrictedTables();

/**
 * Fills the process-wide tables now (the table method's triangle up to TABLE_METHOD_UP_TO, and
 * the exact log p(m)), instead of on the first request that needs them: a server calls this at
 * start (src/http/warm-up.ts). The tables are pure caches, so no sample changes.
 */
export function prepareDefaultTables(): void {
  defaultTables.table.ensure(TABLE_METHOD_UP_TO);
  defaultTables.logP.log(0);
}

export interface UnrestrictedOptions {
  readonly tables?: UnrestrictedTables;
}

/**
 * An exact uniform sampler of partitions of n, 0 <= n <= 10^9: the table method for
 * n <= TABLE_METHOD_UP_TO, the self-similar Boltzmann method above (self-similar.ts).
 */
export function unrestrictedPartitionSampler(n: number, options: UnrestrictedOptions = {}): PartitionSampler {
  if (!Number.isInteger(n) || n < 0 || n > MAX_UNRESTRICTED_N) {
    throw new RangeError(`n must be an integer from 0 to ${MAX_UNRESTRICTED_N}, got ${n}`);
  }
  const tables = options.tables ?? defaultTables;
  if (n <= TABLE_METHOD_UP_TO) return new TableRecursiveSampler(n, tables.table);
  return new SelfSimilarPlanned(n, tables);
}

class SelfSimilarPlanned implements PartitionSampler {
  readonly method = 'self-similar/1';
  readonly expectedLength: number;
  readonly expectedDistinct: number;
  readonly expectedWork: number;
  private readonly engine: SelfSimilarEngine;

  constructor(
    readonly n: number,
    tables: UnrestrictedTables,
  ) {
    this.engine = new SelfSimilarEngine({ baseThreshold: TABLE_METHOD_UP_TO, table: tables.table, logP: tables.logP });
    const s = Math.sqrt(6 * n) / Math.PI;
    ({ expectedLength: this.expectedLength, expectedDistinct: this.expectedDistinct } = uniformPartitionMeans(n));
    // Measured: the odd-size proposals of all levels visit about WORK_PER_S·s part sizes per
    // sample; the merge adds ~2 steps per distinct size, the table base case a bounded amount.
    this.expectedWork = WORK_PER_S * s + 2 * this.expectedDistinct + BASE_CASE_WORK;
  }

  sample(source: RandomSource): Partition {
    return this.engine.sample(source, this.n);
  }
}

/** Part sizes visited per sample, in units of √(6n)/π (measured 2.0–2.2 for n = 10^4..10^9). */
const WORK_PER_S = 2.3;
/** Upper estimate of the table method's steps on a sub-problem of size <= TABLE_METHOD_UP_TO. */
const BASE_CASE_WORK = 1000;
