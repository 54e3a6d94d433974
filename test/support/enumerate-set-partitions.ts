/**
 * Every set partition of 1..n with the given constraints, by brute force from the definition:
 * all restricted growth strings of length n (rgs[0] = 0, each entry at most one more than the
 * largest before it; Knuth TAOCP vol. 4A, §7.2.1.5), kept when the block count and every
 * block's size fit. Independent of the service's counting code, for small n only.
 */
export interface SetPartitionConstraints {
  readonly n: number;
  readonly blocks?: number;
  readonly maxBlocks?: number;
  readonly minBlockSize?: number;
  readonly maxBlockSize?: number;
}

export function enumerateSetPartitions(c: SetPartitionConstraints): number[][] {
  const out: number[][] = [];
  const rgs: number[] = [];
  const visit = (max: number) => {
    if (rgs.length === c.n) {
      if (isMember(rgs, c)) out.push(rgs.slice());
      return;
    }
    for (let v = 0; v <= max + 1; v++) {
      rgs.push(v);
      visit(Math.max(max, v));
      rgs.pop();
    }
  };
  visit(-1);
  return out;
}

export function isMember(rgs: readonly number[], c: SetPartitionConstraints): boolean {
  const sizes: number[] = [];
  let max = -1;
  for (const v of rgs) {
    if (!Number.isInteger(v) || v < 0 || v > max + 1) return false;
    max = Math.max(max, v);
    sizes[v] = (sizes[v] ?? 0) + 1;
  }
  if (rgs.length !== c.n) return false;
  const k = sizes.length;
  if (c.blocks !== undefined && k !== c.blocks) return false;
  if (c.maxBlocks !== undefined && k > c.maxBlocks) return false;
  return sizes.every((s) => s >= (c.minBlockSize ?? 1) && s <= (c.maxBlockSize ?? Infinity));
}
