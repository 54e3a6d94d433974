import { z } from 'zod';
import { MAX_SET_PARTITION_N } from '../core/set-partitions/resolve.js';
import { choiceParam, integerParam } from './params.js';
import { samplingFields } from './common.js';

const MAX = MAX_SET_PARTITION_N;

/** Constraints on a set partition; all optional and combinable (except blocks with maxBlocks). */
export const setPartitionConstraints = {
  blocks: integerParam(0, MAX, 'Exactly this many blocks (groups); at most n.').optional(),
  maxBlocks: integerParam(0, MAX, 'At most this many blocks.').optional(),
  minBlockSize: integerParam(1, MAX, 'Every block has at least this many items (default 1).').optional(),
  maxBlockSize: integerParam(1, MAX, 'Every block has at most this many items.').optional(),
};

const itemsParam = (description: string) => integerParam(0, MAX, description);

export function noBlocksWithMaxBlocks(query: { blocks?: number; maxBlocks?: number }, ctx: z.RefinementCtx): void {
  if (query.blocks !== undefined && query.maxBlocks !== undefined) {
    ctx.addIssue({ code: 'custom', path: ['maxBlocks'], message: 'cannot be combined with blocks: give one of them' });
  }
}

/** GET /v1/set-partitions */
export const setPartitionsQuery = z
  .strictObject({
    ...samplingFields,
    n: itemsParam(`The number of items, numbered 1 to n (0 to ${MAX.toLocaleString('en-US')}): every sample is a set partition of them.`),
    format: choiceParam(['json', 'ndjson', 'text'], 'json: one document; ndjson: one line per sample, streamed; text: one sample per line (blocks: items separated by spaces, blocks by " | "; rgs: the string\'s entries separated by spaces).').default('json'),
    as: choiceParam(['blocks', 'rgs'], 'blocks: each sample a list of blocks, each a list of items (increasing), blocks ordered by their smallest item; rgs: the restricted growth string, entry i the block (0, 1, ... in order of first appearance) of item i + 1 — the compact form.').default('blocks'),
    ...setPartitionConstraints,
  })
  .superRefine(noBlocksWithMaxBlocks);

/** GET /v1/set-partitions/count */
export const setPartitionsCountQuery = z
  .strictObject({ n: itemsParam('The number of items.'), ...setPartitionConstraints })
  .superRefine(noBlocksWithMaxBlocks);

export type SetPartitionsQuery = z.output<typeof setPartitionsQuery>;
export type SetPartitionsCountQuery = z.output<typeof setPartitionsCountQuery>;
