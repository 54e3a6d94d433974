import { describe, expect, it } from 'vitest';
import { partitions, type PartitionsDocument } from 'partsmith';
import { loadTrucks } from './pallet-loads.js';

/**
 * Property test of loadTrucks with partsmith fixtures. A day's orders are a multiset of
 * order sizes summing to the pallets on the dock: a partition of n. Drawing the partitions
 * exactly uniformly (seeded, so a failure replays) exercises the typical days and, because
 * every partition is equally likely, the odd ones too: one huge order, all single pallets,
 * orders of exactly the capacity. The fixtures come from the in-process library, so the same
 * seed gives the same days as `GET /v1/partitions?n=...&seed=...` or `partsmith partitions`.
 */
const CAPACITY = 26;

async function fixture(n: number, count: number, seed: string): Promise<number[][]> {
  const doc: PartitionsDocument = await partitions({ n, count, seed });
  return doc.samples as number[][];
}

describe('loadTrucks on uniformly random days of orders', () => {
  it('ships every pallet, never overloads a truck, keeps orders that fit whole, and wastes at most one half-empty truck', async () => {
    const days = [...(await fixture(60, 200, 'pallets-60')), ...(await fixture(250, 100, 'pallets-250')), ...(await fixture(7, 15, 'pallets-7'))];
    expect(days).toHaveLength(315);
    for (const orders of days) {
      const n = orders.reduce((a, b) => a + b, 0);
      const trucks = loadTrucks(orders, CAPACITY);
      const where = `orders ${orders.join(' ')}`;
      // Conservation: every pallet leaves, on exactly one truck.
      expect(trucks.reduce((a, t) => a + t.pallets, 0), where).toBe(n);
      for (const truck of trucks) {
        expect(truck.pallets, where).toBeLessThanOrEqual(CAPACITY);
        expect(truck.loads.reduce((a, b) => a + b, 0), where).toBe(truck.pallets);
      }
      // Orders that fit travel whole: the multiset of loads of size < capacity equals the
      // remainders order % capacity (an order > capacity fills whole trucks first).
      const remainders = orders.map((o) => o % CAPACITY).filter((r) => r > 0).sort((a, b) => a - b);
      const partial = trucks.flatMap((t) => t.loads).filter((l) => l < CAPACITY).sort((a, b) => a - b);
      expect(partial, where).toEqual(remainders);
      // Lower bound: no plan uses fewer than ceil(n / capacity) trucks.
      expect(trucks.length, where).toBeGreaterThanOrEqual(Math.ceil(n / CAPACITY));
      // First fit never leaves two trucks each at most half full: the later truck's first
      // load would have fitted on the earlier one (the standard first-fit argument).
      expect(trucks.filter((t) => 2 * t.pallets <= CAPACITY).length, where).toBeLessThanOrEqual(1);
    }
  });

  it('handles the extreme days every uniform draw eventually produces', () => {
    // The two extreme partitions of 60: one order of 60, and sixty single pallets.
    expect(loadTrucks([60], CAPACITY).map((t) => t.pallets)).toEqual([26, 26, 8]);
    expect(loadTrucks(Array(60).fill(1), CAPACITY).map((t) => t.pallets)).toEqual([26, 26, 8]);
    // The empty partition of 0: no orders, no trucks.
    expect(loadTrucks([], CAPACITY)).toEqual([]);
  });

  it('the fixtures replay: the same seed gives the same days', async () => {
    expect(await fixture(60, 5, 'pallets-60')).toEqual((await fixture(60, 200, 'pallets-60')).slice(0, 5));
  });
});
