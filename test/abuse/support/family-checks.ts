/**
 * Membership checks for samples returned over HTTP: does a list of parts belong to the family
 * the query asked for? Written from the definitions (a partition of n is a non-increasing list
 * of positive integers summing to n; a composition is an ordered list summing to n — Andrews,
 * "The Theory of Partitions", 1976, ch. 1 and 4), independently of the service's code.
 */

export interface Constraints {
  readonly n: number;
  readonly distinct?: boolean;
  readonly minPart?: number;
  readonly maxPart?: number;
  readonly length?: number;
  readonly maxLength?: number;
  readonly allowed?: readonly number[];
}

/** Reads constraints from a query that the service accepted (so every present value is clean). */
export function constraintsOf(params: URLSearchParams): Constraints {
  const num = (key: string): number | undefined => (params.has(key) ? Number(params.get(key)) : undefined);
  return {
    n: Number(params.get('n')),
    distinct: params.get('distinct') === 'true',
    minPart: num('minPart'),
    maxPart: num('maxPart'),
    length: num('length'),
    maxLength: num('maxLength'),
    allowed: params.has('allowed') ? params.get('allowed')!.split(',').map(Number) : undefined,
  };
}

const isWhole = (x: unknown, min: number): x is number => typeof x === 'number' && Number.isSafeInteger(x) && x >= min;

/** What is wrong with `parts` as a member of the family (empty when nothing is). */
function commonProblems(parts: readonly unknown[], family: Constraints, minAllowed: number): string[] {
  const problems: string[] = [];
  if (!parts.every((p) => isWhole(p, minAllowed))) return [`parts must be whole numbers >= ${minAllowed}: ${JSON.stringify(parts).slice(0, 200)}`];
  const xs = parts as number[];
  const sum = xs.reduce((a, b) => a + b, 0);
  if (sum !== family.n) problems.push(`parts sum to ${sum}, not n = ${family.n}`);
  if (family.minPart !== undefined && xs.some((p) => p < family.minPart!)) problems.push(`a part is below minPart ${family.minPart}`);
  if (family.maxPart !== undefined && xs.some((p) => p > family.maxPart!)) problems.push(`a part is above maxPart ${family.maxPart}`);
  if (family.length !== undefined && xs.length !== family.length) problems.push(`${xs.length} parts, not length ${family.length}`);
  if (family.maxLength !== undefined && xs.length > family.maxLength) problems.push(`${xs.length} parts, over maxLength ${family.maxLength}`);
  if (family.allowed !== undefined) {
    const allowed = new Set(family.allowed);
    if (xs.some((p) => !allowed.has(p))) problems.push(`a part is not in allowed ${JSON.stringify(family.allowed)}`);
  }
  return problems;
}

export function partitionProblems(parts: readonly unknown[], family: Constraints): string[] {
  const problems = commonProblems(parts, family, 1);
  const xs = parts as number[];
  for (let i = 1; i < xs.length; i++) {
    if (xs[i] > xs[i - 1]) problems.push('parts are not in non-increasing order');
    else if (family.distinct && xs[i] === xs[i - 1]) problems.push('a part repeats although distinct=true');
    else continue;
    break;
  }
  return problems;
}

/** Multiplicity form: [[size, multiplicity], ...], sizes strictly decreasing, multiplicities >= 1. */
export function multiplicityProblems(pairs: unknown, family: Constraints): string[] {
  if (!Array.isArray(pairs) || !pairs.every((p) => Array.isArray(p) && p.length === 2 && isWhole(p[0], 1) && isWhole(p[1], 1))) {
    return [`not a list of [part, multiplicity] pairs: ${JSON.stringify(pairs).slice(0, 200)}`];
  }
  for (let i = 1; i < pairs.length; i++) if (pairs[i][0] >= pairs[i - 1][0]) return ['sizes are not strictly decreasing'];
  const parts = pairs.flatMap(([size, multiplicity]: number[]) => Array<number>(multiplicity).fill(size));
  return partitionProblems(parts, family);
}

export function compositionProblems(parts: readonly unknown[], family: Constraints): string[] {
  // Weak compositions (minPart = 0) are allowed only with a length; parts are >= 1 otherwise.
  return commonProblems(parts, family, family.minPart === 0 ? 0 : 1);
}

/**
 * A set partition of 1..n as blocks (lists of items, each increasing, blocks by smallest item)
 * or as its restricted growth string, checked against the constraints of the query (definitions:
 * Stanley, Enumerative Combinatorics vol. 1, §1.9; Knuth TAOCP vol. 4A, §7.2.1.5).
 */
export function setPartitionProblems(sample: unknown, params: URLSearchParams, form: 'blocks' | 'rgs'): string[] {
  const n = Number(params.get('n'));
  const num = (key: string): number | undefined => (params.has(key) ? Number(params.get(key)) : undefined);
  let sizes: number[];
  if (form === 'rgs') {
    if (!Array.isArray(sample) || sample.length !== n || !sample.every((v) => isWhole(v, 0))) return [`not a restricted growth string of ${n} entries: ${JSON.stringify(sample).slice(0, 200)}`];
    sizes = [];
    let max = -1;
    for (const v of sample as number[]) {
      if (v > max + 1) return ['an entry is more than one above the largest before it'];
      max = Math.max(max, v);
      sizes[v] = (sizes[v] ?? 0) + 1;
    }
  } else {
    if (!Array.isArray(sample) || !sample.every((b) => Array.isArray(b) && b.length > 0 && b.every((x: unknown) => isWhole(x, 1)))) return [`not a list of non-empty blocks of items: ${JSON.stringify(sample).slice(0, 200)}`];
    const blocks = sample as number[][];
    const seen = new Set<number>();
    for (let b = 0; b < blocks.length; b++) {
      if (b > 0 && blocks[b][0] <= blocks[b - 1][0]) return ['blocks are not ordered by their smallest item'];
      for (let i = 0; i < blocks[b].length; i++) {
        const item = blocks[b][i];
        if (i > 0 && item <= blocks[b][i - 1]) return ['a block is not increasing'];
        if (item > n || seen.has(item)) return [`item ${item} is repeated or not one of 1..${n}`];
        seen.add(item);
      }
    }
    if (seen.size !== n) return [`the blocks hold ${seen.size} items, not n = ${n}`];
    sizes = blocks.map((b) => b.length);
  }
  const problems: string[] = [];
  const blocks = num('blocks');
  const maxBlocks = num('maxBlocks');
  if (blocks !== undefined && sizes.length !== blocks) problems.push(`${sizes.length} blocks, not blocks = ${blocks}`);
  if (maxBlocks !== undefined && sizes.length > maxBlocks) problems.push(`${sizes.length} blocks, over maxBlocks = ${maxBlocks}`);
  const min = num('minBlockSize');
  const max = num('maxBlockSize');
  if (min !== undefined && sizes.some((s) => s < min)) problems.push(`a block is smaller than minBlockSize = ${min}`);
  if (max !== undefined && sizes.some((s) => s > max)) problems.push(`a block is larger than maxBlockSize = ${max}`);
  return problems;
}
