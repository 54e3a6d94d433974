export { planPartitionSampler } from '../src/core/partitions/plan.js';
export { planCompositionSampler, countCompositions } from '../src/core/compositions/plan.js';
export { countPartitions } from '../src/core/counting/partition-counts.js';
export { SampleStreams } from '../src/core/seeding.js';
export { partsOf } from '../src/core/partition.js';
