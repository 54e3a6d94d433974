/**
 * A small least-recently-used map, per isolate: planned samplers (some build counting tables)
 * and parsed queries, which load tests and sampling clients repeat many times. Entries are pure
 * functions of their key, so caching never changes an answer.
 */
export class LruCache<V> {
  private readonly entries = new Map<string, V>();
  /** The most recently used key (the last one in `entries`). */
  private newest: string | undefined;

  constructor(private readonly capacity: number) {
    if (!Number.isInteger(capacity) || capacity < 1) throw new RangeError(`capacity must be a positive integer, got ${capacity}`);
  }

  /** The value for `key`, now the most recently used; undefined if there is none. */
  get(key: string): V | undefined {
    const found = this.entries.get(key);
    // Re-inserting moves the key to the most recent end; a load test asks for one key over
    // and over, and a delete + set per request on a small Map makes V8 shrink and regrow it.
    if (found !== undefined && key !== this.newest) {
      this.entries.delete(key);
      this.entries.set(key, found);
      this.newest = key;
    }
    return found;
  }

  /** Stores `value` as the most recently used, evicting the least recently used beyond capacity. */
  set(key: string, value: V): V {
    this.entries.delete(key);
    this.entries.set(key, value);
    this.newest = key;
    if (this.entries.size > this.capacity) this.entries.delete(this.entries.keys().next().value!);
    return value;
  }

  getOrCreate(key: string, create: () => V): V {
    return this.get(key) ?? this.set(key, create());
  }

  get size(): number {
    return this.entries.size;
  }
}
