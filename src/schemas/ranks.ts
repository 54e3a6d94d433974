import { z } from 'zod';
import { DEFAULT_MAX_COUNT, MAX_COUNT, MAX_N } from './bounds.js';
import { choiceParam, integerParam, partsParam, withThousands } from './params.js';
import { rankValueFields } from './rank-values.js';

export { rankValueFields } from './rank-values.js';
import { compositionConstraints, weakNeedsLength } from './compositions.js';
import { noLengthWithMaxLength, partitionConstraints } from './partitions.js';
import { noBlocksWithMaxBlocks, setPartitionConstraints } from './set-partitions.js';
import { MAX_SET_PARTITION_N } from '../core/set-partitions/resolve.js';

/**
 * The schemas of the rank endpoints: listing a family in its order, the rank of a member, and the
 * member at a rank, for partitions, compositions and set partitions (one schema per endpoint).
 * The families take the same constraint parameters as sampling.
 */

/** Default page of a listing: small families come whole in one answer. */
export const DEFAULT_LIST_COUNT = 1000;

/** Most parts a `parts` parameter may list (the query-string limit bounds it too). */
export const MAX_RANKED_PARTS = 2000;

const listFields = {
  n: integerParam(0, MAX_N, 'The size: every member sums to exactly n.'),
  start: rankValueFields.start,
  // The schema admits any count a server may be configured for; the configured limit is checked before listing.
  count: integerParam(1, MAX_COUNT, `How many members to list from start (fewer at the end of the family): at most ${withThousands(DEFAULT_MAX_COUNT)} unless the server is configured otherwise. Default ${withThousands(DEFAULT_LIST_COUNT)}.`).default(DEFAULT_LIST_COUNT),
  format: choiceParam(['json', 'ndjson', 'text'], 'json: one document; ndjson: one line {"rank": "...", "parts": [...]} per member, streamed; text: one member per line, its rank, a tab, then its parts separated by spaces.').default('json'),
};

const unrankFields = {
  n: integerParam(0, MAX_N, 'The size: the member sums to exactly n.'),
  rank: rankValueFields.rank,
};


const rankFields = {
  n: integerParam(0, MAX_N, 'The size of the family; defaults to the sum of the parts.').optional(),
};

/** GET /v1/partitions/list */
export const partitionsListQuery = z
  .strictObject({
    ...listFields,
    as: choiceParam(['parts', 'multiplicities'], 'parts: each member a list of parts, largest first; multiplicities: a list of [part, multiplicity] pairs, largest part first.').default('parts'),
    ...partitionConstraints,
  })
  .superRefine(noLengthWithMaxLength);

/** GET /v1/partitions/rank */
export const partitionsRankQuery = z
  .strictObject({
    parts: partsParam(1, MAX_N, MAX_RANKED_PARTS, 'The partition, its parts largest first, e.g. 5,4,1,1 (empty for the partition of 0).'),
    ...rankFields,
    ...partitionConstraints,
  })
  .superRefine(noLengthWithMaxLength);

/** GET /v1/partitions/unrank */
export const partitionsUnrankQuery = z
  .strictObject({
    ...unrankFields,
    as: choiceParam(['parts', 'multiplicities'], 'parts: the member as a list of parts, largest first; multiplicities: as [part, multiplicity] pairs, largest part first.').default('parts'),
    ...partitionConstraints,
  })
  .superRefine(noLengthWithMaxLength);

/** GET /v1/compositions/list */
export const compositionsListQuery = z
  .strictObject({
    ...listFields,
    as: choiceParam(['parts'], 'parts: each member a list of parts in order.').default('parts'),
    ...compositionConstraints,
  })
  .superRefine(weakNeedsLength);

/** GET /v1/compositions/rank */
export const compositionsRankQuery = z
  .strictObject({
    parts: partsParam(0, MAX_N, MAX_RANKED_PARTS, 'The composition, its parts in order, e.g. 1,3,1 (empty for the composition of 0).'),
    ...rankFields,
    ...compositionConstraints,
  })
  .superRefine(weakNeedsLength);

/** GET /v1/compositions/unrank */
export const compositionsUnrankQuery = z
  .strictObject({
    ...unrankFields,
    ...compositionConstraints,
  })
  .superRefine(weakNeedsLength);

const SET_N = MAX_SET_PARTITION_N;
const setPartitionForms = (what: string) =>
  choiceParam(['blocks', 'rgs'], `blocks: ${what} a list of blocks, each a list of items (increasing), blocks ordered by their smallest item; rgs: its restricted growth string (entry i the block of item i + 1, blocks numbered 0, 1, ... in order of first appearance).`).default('blocks');

/** GET /v1/set-partitions/list */
export const setPartitionsListQuery = z
  .strictObject({
    ...listFields,
    n: integerParam(0, SET_N, 'The number of items, numbered 1 to n: every member is a set partition of them.'),
    format: choiceParam(['json', 'ndjson', 'text'], 'json: one document; ndjson: one line {"rank": "...", "blocks": [...]} (or "rgs") per member, streamed; text: one member per line, its rank, a tab, then the member as sampling writes it (blocks: items separated by spaces, blocks by " | "; rgs: entries separated by spaces).').default('json'),
    as: setPartitionForms('each member'),
    ...setPartitionConstraints,
  })
  .superRefine(noBlocksWithMaxBlocks);

/** GET /v1/set-partitions/rank */
export const setPartitionsRankQuery = z
  .strictObject({
    rgs: partsParam(0, SET_N, MAX_RANKED_PARTS, 'The set partition as its restricted growth string, e.g. 0,1,0,2 for the blocks {1, 3}, {2}, {4} (empty for the set partition of 0 items).'),
    n: integerParam(0, SET_N, 'The number of items of the family; defaults to the length of rgs.').optional(),
    ...setPartitionConstraints,
  })
  .superRefine(noBlocksWithMaxBlocks);

/** GET /v1/set-partitions/unrank */
export const setPartitionsUnrankQuery = z
  .strictObject({
    n: integerParam(0, SET_N, 'The number of items: the member is a set partition of 1..n.'),
    rank: unrankFields.rank,
    as: setPartitionForms('the member as'),
    ...setPartitionConstraints,
  })
  .superRefine(noBlocksWithMaxBlocks);

export type PartitionsListQuery = z.output<typeof partitionsListQuery>;
export type PartitionsRankQuery = z.output<typeof partitionsRankQuery>;
export type PartitionsUnrankQuery = z.output<typeof partitionsUnrankQuery>;
export type CompositionsListQuery = z.output<typeof compositionsListQuery>;
export type CompositionsRankQuery = z.output<typeof compositionsRankQuery>;
export type CompositionsUnrankQuery = z.output<typeof compositionsUnrankQuery>;
export type SetPartitionsListQuery = z.output<typeof setPartitionsListQuery>;
export type SetPartitionsRankQuery = z.output<typeof setPartitionsRankQuery>;
export type SetPartitionsUnrankQuery = z.output<typeof setPartitionsUnrankQuery>;
