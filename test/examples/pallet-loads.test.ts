import { describe, expect, it } from 'vitest';
import { partitionFamily } from 'partsmith';
import { loadTrucks } from './pallet-loads.js';

/**
 * Property test of loadTrucks with partsmith fixtures. A day's orders are a multiset of
 * order sizes summing to the pallets on the dock: a partition of n. The warehouse takes no
 * order larger than a truck, so a day is a partition of n with largest part at most the
 * capacity (`maxPart: CAPACITY`): the fixtures are exactly the days that can happen, nothing
 * is filtered or clipped afterwards. Drawing them exactly uniformly (seeded, so a failure
 * replays) exercises the typical days and, because every such partition is equally likely, the
 * odd ones too: all single pallets, many orders of exactly the capacity. The fixtures come from
 * the synchronous library, so the same seed gives the same days as
 * `GET /v1/partitions?n=...&maxPart=26&seed=...` or `partsmith partitions --max-part 26 ...`.
 * (Orders over the capacity, which loadTrucks also splits, are covered by the fixed cases.)
 */
const CAPACITY = 26;

function fixture(n: number, count: number, seed: string): number[][] {
  return [...partitionFamily({ n, maxPart: CAPACITY }).samples(seed, 0, count)];
}

describe('loadTrucks on uniformly random days of orders', () => {
  it('ships every pallet, never overloads a truck, keeps every order whole, and wastes at most one half-empty truck', () => {
    const days = [...fixture(60, 200, 'pallets-60'), ...fixture(250, 100, 'pallets-250'), ...fixture(7, 15, 'pallets-7')];
    expect(days).toHaveLength(315);
    for (const orders of days) {
      const n = orders.reduce((a, b) => a + b, 0);
      const trucks = loadTrucks(orders, CAPACITY);
      const where = `orders ${orders.join(' ')}`;
      // The fixture family: no order exceeds a truck.
      expect(Math.max(0, ...orders), where).toBeLessThanOrEqual(CAPACITY);
      // Conservation: every pallet leaves, on exactly one truck.
      expect(trucks.reduce((a, t) => a + t.pallets, 0), where).toBe(n);
      for (const truck of trucks) {
        expect(truck.pallets, where).toBeLessThanOrEqual(CAPACITY);
        expect(truck.loads.reduce((a, b) => a + b, 0), where).toBe(truck.pallets);
      }
      // Every order fits a truck, so every order travels whole: the loads are the orders.
      expect(trucks.flatMap((t) => t.loads).sort((a, b) => a - b), where).toEqual([...orders].sort((a, b) => a - b));
      // Lower bound: no plan uses fewer than ceil(n / capacity) trucks.
      expect(trucks.length, where).toBeGreaterThanOrEqual(Math.ceil(n / CAPACITY));
      // First fit never leaves two trucks each at most half full: the later truck's first
      // load would have fitted on the earlier one (the standard first-fit argument).
      expect(trucks.filter((t) => 2 * t.pallets <= CAPACITY).length, where).toBeLessThanOrEqual(1);
    }
  });

  it('handles the extreme days every uniform draw eventually produces', () => {
    // One order over the capacity (outside the fixture family: loadTrucks splits it into full
    // trucks and a remainder), and the other extreme, sixty single pallets.
    expect(loadTrucks([60], CAPACITY).map((t) => t.pallets)).toEqual([26, 26, 8]);
    expect(loadTrucks([60, 30, 5], CAPACITY).flatMap((t) => t.loads)).toEqual([26, 26, 26, 8, 5, 4]);
    expect(loadTrucks(Array(60).fill(1), CAPACITY).map((t) => t.pallets)).toEqual([26, 26, 8]);
    // The empty partition of 0: no orders, no trucks.
    expect(loadTrucks([], CAPACITY)).toEqual([]);
  });

  it('the fixtures replay: the same seed gives the same days', () => {
    expect(fixture(60, 5, 'pallets-60')).toEqual(fixture(60, 200, 'pallets-60').slice(0, 5));
  });
});
