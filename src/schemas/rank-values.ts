import { rankParam } from './params.js';

/**
 * The rank parameters of the rank endpoints (the `start` of GET /v1/.../list, the `rank` of
 * GET /v1/.../unrank), which the library checks too (`family.list(start)`, `family.unrank(rank)`).
 * In a module of their own so that the library gets them without building the nine rank
 * endpoint schemas of ranks.ts, which it never uses (import time: bench library).
 */
export const rankValueFields = {
  start: rankParam('Rank of the first member listed (a decimal string; ranks run from 0 to the number of members - 1). start = the number of members gives an empty page. Default 0.').default('0'),
  rank: rankParam('The rank of the member (a decimal string, from 0 to the number of members - 1).'),
};
