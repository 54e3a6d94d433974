import type { OrderWalk } from '../ranks/ranker.js';

/**
 * What a restricted-growth-string prefix needs from its ranker (ranker.ts): the block types of
 * the counting states, and the completions of a state.
 */
export interface CompletionCounts {
  /** Items in the family's members. */
  readonly n: number;
  /** Most blocks a member may have. */
  readonly kMax: number;
  /** Block types 1..types. */
  readonly types: number;
  /** The type of a block of `size` items. */
  typeOf(size: number): number;
  /** The type of a block of `size` items once one more joins it, or -1 if it is full. */
  typeAfter(size: number): number;
  /** Completions of a prefix whose blocks have these type counts, for r items left. */
  completions(r: number, counts: number[]): bigint;
}

/** The prefix of a restricted growth string being built: its blocks' sizes, and how many blocks have each type. */
export class Prefix {
  /** sizes[b]: items in block b. */
  readonly sizes: number[] = [];
  /** counts[t]: blocks of type t (counts[0] unused). */
  readonly counts: number[];

  constructor(private readonly ranker: CompletionCounts) {
    this.counts = new Array<number>(ranker.types + 1).fill(0);
  }

  /** Whether the next item may go to block v (v = number of blocks: a new one). */
  canJoin(v: number): boolean {
    if (v === this.sizes.length) return v < this.ranker.kMax;
    return this.ranker.typeAfter(this.sizes[v]) >= 0;
  }

  join(v: number): void {
    const { ranker, counts, sizes } = this;
    if (v === sizes.length) {
      sizes.push(1);
      counts[ranker.typeAfter(0)]++;
    } else {
      counts[ranker.typeOf(sizes[v])]--;
      sizes[v]++;
      counts[ranker.typeOf(sizes[v])]++;
    }
  }

  leave(v: number): void {
    const { ranker, counts, sizes } = this;
    counts[ranker.typeOf(sizes[v])]--;
    sizes[v]--;
    if (sizes[v] === 0) sizes.pop(); // only the last block can empty: it is the only one opened after the others
    else counts[ranker.typeOf(sizes[v])]++;
  }

  /** The completions after an item joins a block of type t (for r items after it), looked up once per type. */
  waysByType(r: number): (t: number) => bigint {
    const known: (bigint | undefined)[] = [];
    return (t) => {
      let ways = known[t];
      if (ways === undefined) {
        const { counts } = this;
        const to = this.ranker.typeAfter(t); // a type is read as a size: the type of its block with one more item
        counts[t]--;
        counts[to]++;
        ways = known[t] = this.ranker.completions(r, counts);
        counts[to]--;
        counts[t]++;
      }
      return ways;
    };
  }

  /** Completions of the prefix with item `v`'s choice added, for r items after it. */
  waysWith(v: number, r: number): bigint {
    this.join(v);
    const ways = this.ranker.completions(r, this.counts);
    this.leave(v);
    return ways;
  }
}

/**
 * The walk through the family in RGS order: the next member changes the rightmost entry that
 * can grow (to the next block with a completion, or a new block), then completes the string
 * with the smallest choice at each later item.
 */
export class RgsWalk implements OrderWalk {
  private readonly prefix: Prefix;

  constructor(
    private readonly ranker: CompletionCounts,
    private readonly rgs: number[],
  ) {
    this.prefix = new Prefix(ranker);
    for (const v of rgs) this.prefix.join(v);
  }

  current(): number[] {
    return this.rgs.slice();
  }

  advance(): boolean {
    const { rgs, prefix } = this;
    const n = this.ranker.n;
    for (let i = n - 1; i >= 0; i--) {
      const was = rgs[i];
      prefix.leave(was);
      for (let v = was + 1; v <= prefix.sizes.length; v++) {
        if (prefix.canJoin(v) && prefix.waysWith(v, n - i - 1) > 0n) {
          prefix.join(v);
          rgs[i] = v;
          this.complete(i + 1);
          return true;
        }
      }
    }
    for (const v of rgs) prefix.join(v); // the last member: the state is left as it was
    return false;
  }

  /** Fills items from..n−1 with the smallest choices that still have completions. */
  private complete(from: number): void {
    const { rgs, prefix } = this;
    const n = this.ranker.n;
    for (let i = from; i < n; i++) {
      let v = 0;
      while (!(prefix.canJoin(v) && prefix.waysWith(v, n - i - 1) > 0n)) v++;
      prefix.join(v);
      rgs[i] = v;
    }
  }
}
