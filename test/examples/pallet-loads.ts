/**
 * Worked example (the code under test): a warehouse ships identical pallets. Today's outbound
 * orders ask for some numbers of pallets each, and trucks carry at most `capacity` pallets.
 * `loadTrucks` plans the trucks: an order that fits in a truck travels whole on one truck; a
 * larger order fills whole trucks first and its remainder is treated as an order of its own.
 * Remaining orders go by first-fit decreasing: largest first, onto the first truck with room.
 */
export interface Truck {
  /** Pallets on the truck, one entry per (part of an) order. */
  readonly loads: number[];
  /** Sum of loads. */
  readonly pallets: number;
}

export function loadTrucks(orders: readonly number[], capacity: number): Truck[] {
  if (!Number.isInteger(capacity) || capacity < 1) throw new RangeError(`capacity must be a whole number >= 1, got ${capacity}`);
  const trucks: { loads: number[]; pallets: number }[] = [];
  const rest: number[] = [];
  for (const order of orders) {
    if (!Number.isInteger(order) || order < 1) throw new RangeError(`an order is a whole number of pallets >= 1, got ${order}`);
    for (let k = 0; k < Math.floor(order / capacity); k++) trucks.push({ loads: [capacity], pallets: capacity });
    if (order % capacity > 0) rest.push(order % capacity);
  }
  rest.sort((a, b) => b - a);
  const firstOpen = trucks.length;
  for (const order of rest) {
    let truck = trucks.slice(firstOpen).find((t) => t.pallets + order <= capacity);
    if (!truck) {
      truck = { loads: [], pallets: 0 };
      trucks.push(truck);
    }
    truck.loads.push(order);
    truck.pallets += order;
  }
  return trucks;
}
