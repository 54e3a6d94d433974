import fc from 'fast-check';
import { it } from 'vitest';
import { partitionArb, compositionArb } from 'partsmith/fast-check';
it('smoke', () => {
  for (const seed of [1, 2, 3]) {
    const r = fc.check(fc.property(partitionArb({ n: { min: 0, max: 60 } }), (p) => p.filter((x) => x === 3).length < 2), { seed });
    console.log('RANGE', r.failed, fc.stringify(r.counterexample), r.numShrinks);
    const r2 = fc.check(fc.property(partitionArb({ n: 40 }), (p) => p.filter((x) => x === 3).length < 2), { seed });
    console.log('FIXED', r2.failed, fc.stringify(r2.counterexample), r2.numShrinks);
    const r3 = fc.check(fc.property(compositionArb({ n: { min: 0, max: 100 } }), (p) => !p.includes(3) || p.length < 3), { seed });
    console.log('COMP', r3.failed, fc.stringify(r3.counterexample), r3.numShrinks);
  }
  console.log(fc.sample(partitionArb({ n: 12 }, { edgeCases: 1 }), 10).map((x) => JSON.stringify(x)).join(' '));
  console.log(fc.sample(compositionArb({ n: 12, length: 3, minPart: 0 }, { edgeCases: 1 }), 10).map((x) => JSON.stringify(x)).join(' '));
});
