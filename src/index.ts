/**
 * partsmith as a library: the core's front door, synchronous, in this process.
 *
 * `partitionFamily(constraints)`, `compositionFamily(constraints)` and
 * `setPartitionFamily(constraints)` check their constraints with the zod schema of the API's
 * count endpoint (the same rules and messages, thrown as PartsmithError) and call the core's
 * samplers, counts and rankers directly: no app, no Request, no JSON in between. A seed gives
 * exactly the samples the HTTP API gives for the same family, and rank, unrank and list give
 * the answers of its rank endpoints, since the API serves from these same family objects.
 *
 * Since 0.3.0 this replaces the asynchronous functions of 0.2 (partitions, compositions, count,
 * streamPartitions, streamCompositions, createPartsmith), which went through the HTTP app; the
 * API's documents are the HTTP app's business (GET in-process with `partsmith` the CLI, or over
 * the network with partsmith/client).
 */
export { compositionFamily, type Compositions, type CompositionConstraints } from './library/compositions.js';
export { partitionFamily, type Partitions, type PartitionConstraints } from './library/partitions.js';
export { setPartitionFamily, type SetPartitions, type SetPartitionConstraints } from './library/set-partitions.js';
export { blocksOfRgs, rgsOfBlocks } from './library/set-partition-forms.js';
export type { RankedFamily, SampledFamily } from './library/sampled-family.js';
export { PartsmithError, type ProblemParamError } from './client/errors.js';
export { ALGORITHM_VERSION } from './core/seeding.js';
