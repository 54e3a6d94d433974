/**
 * A small least-recently-used map, per isolate, for planned samplers: some samplers build
 * counting tables, and load tests repeat the same family many times. Entries are pure
 * functions of their key, so caching never changes an answer.
 */
export class LruCache<V> {
  private readonly entries = new Map<string, V>();
  /** The most recently used key (the last one in `entries`). */
  private newest: string | undefined;

  constructor(private readonly capacity: number) {
    if (!Number.isInteger(capacity) || capacity < 1) throw new RangeError(`capacity must be a positive integer, got ${capacity}`);
  }

  getOrCreate(key: string, create: () => V): V {
    const found = this.entries.get(key);
    if (found !== undefined) {
      // Re-inserting moves the key to the most recent end; a load test asks for one family over
      // and over, and a delete + set per request on a small Map makes V8 shrink and regrow it.
      if (key !== this.newest) {
        this.entries.delete(key);
        this.entries.set(key, found);
        this.newest = key;
      }
      return found;
    }
    const value = create();
    this.entries.set(key, value);
    this.newest = key;
    if (this.entries.size > this.capacity) this.entries.delete(this.entries.keys().next().value!);
    return value;
  }

  get size(): number {
    return this.entries.size;
  }
}
