import { NotAMemberError } from '../core/errors.js';
import { rgsProblem } from '../core/set-partitions/set-partition.js';
import { invalidParam } from './validate.js';

/**
 * The two forms of a set partition of the items 1..n: its blocks (each a list of items in
 * increasing order, blocks ordered by their smallest item: how the library writes members, the
 * API's as=blocks) and its restricted growth string (entry i the block of item i + 1, blocks
 * numbered 0, 1, ... in order of first appearance: the API's as=rgs, the form ranks are taken in).
 */

const PATH = '/v1/set-partitions';

/** The blocks of a restricted growth string already known to be one (a ranker's output). */
export function blocksOfValidRgs(rgs: readonly number[]): number[][] {
  const blocks: number[][] = [];
  for (let i = 0; i < rgs.length; i++) (blocks[rgs[i]] ??= []).push(i + 1);
  return blocks;
}

/**
 * The restricted growth string of blocks written as the library writes them; NotAMemberError
 * (malformed, or out of order) saying what is wrong otherwise. The items must be 1..m for some m
 * (whether m is the family's n is for the ranker to say).
 */
export function rgsOfMember(value: unknown): number[] {
  const fail = (why: string, reason: 'malformed' | 'out-of-order'): never => {
    throw new NotAMemberError(`not a member of the family: ${why}`, reason);
  };
  if (!Array.isArray(value)) fail('a set partition is a list of blocks, each a list of items', 'malformed');
  const blocks = value as unknown[];
  let m = 0;
  for (const [b, block] of blocks.entries()) {
    if (!Array.isArray(block) || block.length === 0) fail(`block ${b + 1} is ${Array.isArray(block) ? 'empty' : 'not a list of items'}: blocks are non-empty lists`, 'malformed');
    for (const item of block as unknown[]) if (typeof item !== 'number' || !Number.isSafeInteger(item) || item < 1) fail(`block ${b + 1} holds ${String(item)}, not an item (a whole number >= 1)`, 'malformed');
    m += (block as number[]).length;
  }
  const rgs = new Array<number>(m).fill(-1);
  let previousFirst = 0;
  for (const [b, block] of (blocks as number[][]).entries()) {
    if (block[0] < previousFirst) fail(`block ${b + 1} starts with ${block[0]}, after a block starting with ${previousFirst}: blocks are ordered by their smallest item`, 'out-of-order');
    previousFirst = block[0];
    for (const [j, item] of block.entries()) {
      if (j > 0 && item <= block[j - 1]) fail(`block ${b + 1} lists ${item} after ${block[j - 1]}: the items of a block are listed in increasing order`, 'out-of-order');
      if (item > m) fail(`item ${item} is more than the ${m} items the blocks hold: the items are 1 to ${m}, each in one block`, 'malformed');
      if (rgs[item - 1] >= 0) fail(`item ${item} is in two blocks`, 'malformed');
      rgs[item - 1] = b;
    }
  }
  return rgs;
}

/**
 * The restricted growth string of a set partition given as its blocks (as the library writes
 * members); PartsmithError (400, naming `blocks`) when they are not the blocks of one.
 */
export function rgsOfBlocks(blocks: readonly (readonly number[])[]): number[] {
  try {
    return rgsOfMember(blocks);
  } catch (error) {
    if (error instanceof NotAMemberError) throw invalidParam('blocks', error.message.replace('not a member of the family: ', 'are not a set partition: '), PATH, blocks);
    throw error;
  }
}

/** The blocks of a restricted growth string; PartsmithError (400, naming `rgs`) when it is not one. */
export function blocksOfRgs(rgs: readonly number[]): number[][] {
  const problem = Array.isArray(rgs) ? rgsProblem(rgs) : 'a restricted growth string is a list of whole numbers';
  if (problem) throw invalidParam('rgs', `is not a restricted growth string: ${problem}`, PATH, rgs);
  return blocksOfValidRgs(rgs);
}
