/**
 * A small least-recently-used map, per isolate, for planned samplers: some samplers build
 * counting tables, and load tests repeat the same family many times. Entries are pure
 * functions of their key, so caching never changes an answer.
 */
export class LruCache<V> {
  private readonly entries = new Map<string, V>();

  constructor(private readonly capacity: number) {
    if (!Number.isInteger(capacity) || capacity < 1) throw new RangeError(`capacity must be a positive integer, got ${capacity}`);
  }

  getOrCreate(key: string, create: () => V): V {
    const found = this.entries.get(key);
    if (found !== undefined) {
      this.entries.delete(key);
      this.entries.set(key, found);
      return found;
    }
    const value = create();
    this.entries.set(key, value);
    if (this.entries.size > this.capacity) this.entries.delete(this.entries.keys().next().value!);
    return value;
  }

  get size(): number {
    return this.entries.size;
  }
}
