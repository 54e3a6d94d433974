import fc from 'fast-check';
import { expect, it } from 'vitest';
import { compositionArb, partitionArb } from 'partsmith/fast-check';

/** Shrinking from samples of large n ends on the small minimum (the moves halve long members). */
it('a failure found at n up to 10^6 shrinks to the minimal member: [1000] for "no part of 1000 or more"', () => {
  const result = fc.check(fc.property(partitionArb({ n: { min: 0, max: 1_000_000 } }), (parts) => parts.every((p) => p < 1000)), { seed: 5 });
  expect(result.failed).toBe(true);
  expect(result.counterexample![0]).toEqual([1000]);
});

it('compositions of up to 2·10^5: "fewer than 100 parts" shrinks to 100 parts of 1', () => {
  const result = fc.check(fc.property(compositionArb({ n: { min: 0, max: 200_000 } }), (parts) => parts.length < 100), { seed: 6 });
  expect(result.failed).toBe(true);
  expect(result.counterexample![0]).toEqual(new Array(100).fill(1));
});
