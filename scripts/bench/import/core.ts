/**
 * The core as the library uses it (planners, counts, random streams, the partition form): the
 * baseline of the import-time row. Importing it evaluates exactly the core modules the library
 * entry evaluates.
 */
export { countCompositions, planCompositionSampler } from '../../../src/core/compositions/plan.js';
export { countPartitions } from '../../../src/core/counting/partition-counts.js';
export { canonicalFamily } from '../../../src/core/family.js';
export { partsOf } from '../../../src/core/partition.js';
export { planPartitionSampler } from '../../../src/core/partitions/plan.js';
export { SampleStreams } from '../../../src/core/seeding.js';
