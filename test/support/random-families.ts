import type { PartitionFamily } from '../../src/core/family.js';
import { nextBelow, type RandomSource } from '../../src/core/random.js';

type Mutable = { -readonly [K in keyof PartitionFamily]: PartitionFamily[K] };

const logUniform = (source: RandomSource, lo: number, hi: number) =>
  Math.floor(Math.exp(Math.log(lo) + source.nextDouble() * (Math.log(hi) - Math.log(lo))));

/** A random partition family with any of the six constraints (see combinations-property.test.ts). */
export function drawFamily(source: RandomSource): PartitionFamily {
  const n = logUniform(source, 1, 1e9 + 1);
  const f: Mutable = { kind: 'partition', n };
  // The scale of a typical part: √n for unrestricted and distinct partitions.
  const scale = Math.max(2, Math.sqrt(n));
  if (nextBelow(source, 2)) f.distinct = true;
  if (nextBelow(source, 2)) f.minPart = logUniform(source, 1, 4 * scale);
  if (nextBelow(source, 2)) f.maxPart = (f.minPart ?? 1) + logUniform(source, 1, Math.min(n, 20 * scale) + 1);
  if (nextBelow(source, 4) === 0) {
    const size = logUniform(source, 1, 200);
    const top = logUniform(source, 2, Math.max(3, Math.min(n, 4 * scale)));
    const allowed = new Set<number>();
    for (let i = 0; i < size; i++) allowed.add(1 + nextBelow(source, top));
    f.allowed = [...allowed];
  }
  const which = nextBelow(source, 3);
  if (which > 0) {
    const parts = logUniform(source, 1, Math.min(n, 4 * scale) + 1);
    if (which === 1) f.length = parts;
    else f.maxLength = parts;
  }
  return f;
}

