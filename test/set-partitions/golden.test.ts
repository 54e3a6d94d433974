import { describe, expect, it } from 'vitest';
import { familyKey, type SetPartitionFamily } from '../../src/core/family.js';
import { planSetPartitionSampler } from '../../src/core/set-partitions/plan.js';
import { SampleStreams } from '../../src/core/seeding.js';

/**
 * Recorded samples 0..2 of seed "golden": restricted growth strings, or at large n the number
 * of blocks and the checksum sum_i i·rgs[i-1]; one family per method the planner picks. A change
 * here means seeds produce different samples: bump ALGORITHM_VERSION (src/core/seeding.ts) and
 * re-record.
 */
const GOLDEN: [Omit<SetPartitionFamily, 'kind'>, string, string[]][] = [
  [{"n":12}, 'stam/1', ["0,1,2,2,3,2,4,0,5,5,5,5","0,1,0,1,2,1,1,3,4,2,3,3","0,1,2,3,4,0,4,4,5,2,6,4"]],
  [{"n":12,"blocks":3}, 'uniform-maps/1', ["0,0,1,1,2,1,1,0,0,1,2,1","0,0,0,0,1,0,2,2,1,2,0,2","0,1,1,0,1,2,0,1,0,1,1,1"]],
  [{"n":12,"minBlockSize":2}, 'table/1', ["0,1,2,3,0,3,2,1,4,1,4,1","0,1,2,3,3,4,0,1,4,3,2,4","0,1,1,2,1,3,2,1,3,2,2,0"]],
  [{"n":12,"maxBlockSize":3,"maxBlocks":6}, 'table/1', ["0,1,2,3,1,2,1,4,4,5,0,4","0,1,2,0,3,3,4,0,5,4,2,4","0,1,2,2,3,1,2,0,4,4,5,1"]],
  [{"n":1000}, 'stam/1', ["190:47016240","179:45461712","188:46104891"]],
  [{"n":1000,"blocks":10}, 'uniform-maps/1', ["10:2221327","10:2261797","10:2195062"]],
  [{"n":3000,"blocks":1000}, 'poisson-urns/1', ["1000:2268366938","1000:2262463601","1000:2221844147"]],
  [{"n":3000,"minBlockSize":2}, 'poisson-sizes/1', ["486:1080007848","480:1077427274","479:1081691680"]],
  [{"n":3000,"maxBlocks":5}, 'poisson-urns/1', ["5:8865769","5:8949602","5:9063386"]],
];

describe('set-partition samples are stable for a seed (algorithm version 3)', () => {
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
