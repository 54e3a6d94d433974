/**
 * Worked example (the code under test): first-fit decreasing bin packing. A courier packs
 * parcels of whole kilograms into vans that carry at most `capacity` kg; the parcels of a day
 * are a partition of the day's total weight. Items go in largest first, each into the first van
 * with room for it; when none has room, a new van is opened.
 */
export type Bins = number[][];

export function firstFitDecreasing(items: readonly number[], capacity: number): Bins {
  return pack(items, capacity, (load, item) => load + item <= capacity);
}

/**
 * The same packer with a deliberate off-by-one: "room" is tested with < instead of <=, so an
 * item that would fill a van exactly opens a new one. It still never overloads a van, so the
 * obvious property tests (every item packed, no van over capacity) pass; the first-fit property
 * catches it.
 */
export function firstFitDecreasingWrong(items: readonly number[], capacity: number): Bins {
  return pack(items, capacity, (load, item) => load + item < capacity);
}

function pack(items: readonly number[], capacity: number, fits: (load: number, item: number) => boolean): Bins {
  if (!Number.isInteger(capacity) || capacity < 1) throw new RangeError(`capacity must be a whole number >= 1, got ${capacity}`);
  const bins: Bins = [];
  const loads: number[] = [];
  for (const item of [...items].sort((a, b) => b - a)) {
    if (!Number.isInteger(item) || item < 1 || item > capacity) throw new RangeError(`an item is a whole number from 1 to ${capacity}, got ${item}`);
    let bin = loads.findIndex((load) => fits(load, item));
    if (bin < 0) {
      bin = bins.length;
      bins.push([]);
      loads.push(0);
    }
    bins[bin].push(item);
    loads[bin] += item;
  }
  return bins;
}
