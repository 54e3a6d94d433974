/**
 * The core as the library uses it (planners, counts, rankers, random streams, the member forms,
 * membership and errors): the baseline of the import-time row. Importing it evaluates exactly
 * the core modules the library entry evaluates (an esbuild metafile of each lists the same
 * src/core inputs); the library adds its own modules, the schemas and zod.
 */
export { countCompositions, planCompositionSampler } from '../../../src/core/compositions/plan.js';
export { countPartitions } from '../../../src/core/counting/partition-counts.js';
export { LimitExceededError, NotAMemberError } from '../../../src/core/errors.js';
export { canonicalFamily } from '../../../src/core/family.js';
export { partsOf } from '../../../src/core/partition.js';
export { planPartitionSampler } from '../../../src/core/partitions/plan.js';
export { compositionRanker, compositionRankTableSize } from '../../../src/core/ranks/composition-ranker.js';
export { partitionRanker, partitionRankTableSize } from '../../../src/core/ranks/partition-ranker.js';
export { SampleStreams, SEED_PATTERN } from '../../../src/core/seeding.js';
export { countSetPartitions } from '../../../src/core/set-partitions/counts.js';
export { planSetPartitionSampler } from '../../../src/core/set-partitions/plan.js';
export { setPartitionRanker } from '../../../src/core/set-partitions/ranker.js';
export { contradiction, ContradictoryConstraintError } from '../../../src/core/set-partitions/resolve.js';
export { blocksOf, rgsProblem } from '../../../src/core/set-partitions/set-partition.js';
