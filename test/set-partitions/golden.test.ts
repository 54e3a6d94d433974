import { describe, expect, it } from 'vitest';
import { familyKey, type SetPartitionFamily } from '../../src/core/family.js';
import { planSetPartitionSampler } from '../../src/core/set-partitions/plan.js';
import { SampleStreams } from '../../src/core/seeding.js';

/**
 * Recorded samples 0..2 of seed "golden": restricted growth strings, or at large n the number
 * of blocks and the checksum sum_i i·rgs[i-1]; one family per method the planner picks. A change
 * here means seeds produce different samples: bump ALGORITHM_VERSION (src/core/seeding.ts) and
 * re-record. (Version 4, unreleased: the stam/1 and uniform-maps/1 rows were re-recorded when
 * urns.ts began drawing several urns from one 32-bit word, the poisson-urns/1 and
 * poisson-sizes/1 rows when the shuffle (shuffle.ts) began drawing several indices per word.)
 */
const GOLDEN: [Omit<SetPartitionFamily, 'kind'>, string, string[]][] = [
  [{"n":12}, 'stam/1', ['0,1,2,3,0,0,4,3,3,1,4,5', '0,1,0,0,1,2,3,1,0,1,0,1', '0,1,0,0,0,2,0,2,2,1,3,4']],
  [{"n":12,"blocks":3}, 'uniform-maps/1', ['0,1,2,2,1,2,1,1,2,0,1,2', '0,0,1,2,1,1,0,2,1,0,1,0', '0,0,0,0,1,0,0,1,1,0,0,2']],
  [{"n":12,"minBlockSize":2}, 'table/1', ['0,1,1,0,0,2,1,1,2,2,1,1', '0,1,2,3,2,0,3,3,3,1,3,3', '0,0,1,1,1,1,2,1,1,1,2,1']],
  [{"n":12,"maxBlockSize":3,"maxBlocks":6}, 'table/1', ['0,1,2,3,1,3,4,1,2,5,5,3', '0,1,0,2,3,2,4,2,0,1,5,4', '0,1,2,3,4,0,5,5,1,0,3,4']],
  [{"n":1000}, 'stam/1', ['197:50842561', '195:50314014', '189:44816321']],
  [{"n":1000,"blocks":10}, 'uniform-maps/1', ['10:2239446', '10:2238756', '10:2303981']],
  [{"n":3000,"blocks":1000}, 'poisson-urns/1', ['1000:2243878266', '1000:2249868840', '1000:2283942415']],
  [{"n":3000,"minBlockSize":2}, 'poisson-sizes/1', ['484:1088714717', '478:1069871051', '476:1064681225']],
  [{"n":3000,"maxBlocks":5}, 'poisson-urns/1', ['5:8649185', '5:9049761', '5:8841108']],
];

describe('set-partition samples are stable for a seed (algorithm version 4)', () => {
  for (const [shape, method, expected] of GOLDEN) {
    it(`${JSON.stringify(shape)} (${method})`, () => {
      const family: SetPartitionFamily = { kind: 'set-partition', ...shape };
      const sampler = planSetPartitionSampler(family);
      expect(sampler.method).toBe(method);
      const streams = new SampleStreams(familyKey(family));
      const got = [0, 1, 2].map((i) => {
        const p = sampler.sample(streams.source('golden', i));
        let checksum = 0;
        p.rgs.forEach((v, j) => {
          checksum += (j + 1) * v;
        });
        return shape.n > 20 ? `${p.blocks}:${checksum}` : Array.from(p.rgs).join(',');
      });
      expect(got).toEqual(expected);
    });
  }
});
