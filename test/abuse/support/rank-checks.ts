import { compositionProblems, constraintsOf, multiplicityProblems, partitionProblems, setPartitionProblems, type Constraints } from './family-checks.js';

/**
 * The contract of the rank endpoints' 2xx answers (listing, rank, unrank): every member belongs
 * to the family, ranks are decimal strings running from start without gaps, the page is as long
 * as asked (or ends with the family), and consecutive members are in the documented order —
 * partitions in strictly decreasing, compositions and set partitions (their restricted growth
 * strings) in strictly increasing lexicographic order.
 */

/** The member's form: parts, multiplicities, or a set partition's blocks or restricted growth string. */
type Form = 'parts' | 'multiplicities' | 'blocks' | 'rgs';

function formOf(path: string, params: URLSearchParams): Form {
  if (path.includes('set-partitions')) return params.get('as') === 'rgs' ? 'rgs' : 'blocks';
  return params.get('as') === 'multiplicities' ? 'multiplicities' : 'parts';
}

/** -1, 0 or 1 as a is lexicographically below, equal to or above b. */
function compareLex(a: readonly number[], b: readonly number[]): number {
  for (let i = 0; i < Math.min(a.length, b.length); i++) if (a[i] !== b[i]) return a[i] < b[i] ? -1 : 1;
  return a.length === b.length ? 0 : a.length < b.length ? -1 : 1;
}

function memberProblems(path: string, member: unknown, form: Form, family: Constraints, params: URLSearchParams): string[] {
  if (form === 'blocks' || form === 'rgs') return setPartitionProblems(member, withN(params, family.n), form);
  if (form === 'multiplicities') return multiplicityProblems(member, family);
  if (!Array.isArray(member)) return ['member is not a list'];
  return path.includes('composition') ? compositionProblems(member, family) : partitionProblems(member, family);
}

function withN(params: URLSearchParams, n: number): URLSearchParams {
  const out = new URLSearchParams(params);
  out.set('n', String(n));
  return out;
}

/** The list the order compares: parts, or a set partition's restricted growth string. */
function partsOf(member: unknown, form: Form): number[] {
  if (form === 'multiplicities') return (member as number[][]).flatMap(([size, multiplicity]) => Array<number>(multiplicity).fill(size));
  if (form === 'blocks') {
    const rgs: number[] = [];
    (member as number[][]).forEach((block, b) => block.forEach((item) => (rgs[item - 1] = b)));
    return rgs;
  }
  return member as number[];
}

/** Members of a listing body, in whichever format it came: [rank, member] pairs. */
function rowsOf(format: string, text: string, field: string): [string, unknown][] {
  if (format === 'json') return (JSON.parse(text).members as Record<string, unknown>[]).map((m) => [String(m.rank), m[field]]);
  const lines = text.split('\n');
  if (lines.pop() !== '') throw new Error('body does not end with a newline');
  if (format === 'ndjson') return lines.map((line) => JSON.parse(line)).map((m) => [String(m.rank), m[field]]);
  return lines.map((line) => {
    const [rank, parts = ''] = line.split('\t');
    if (field === 'blocks') return [rank, parts === '' ? [] : parts.split(' | ').map((block) => block.split(' ').map(Number))];
    const tokens = parts === '' ? [] : parts.split(' ');
    return [rank, field === 'multiplicities' ? tokens.map((t) => t.split('^').map(Number)).map(([s, m]) => [s, m ?? 1]) : tokens.map(Number)];
  });
}

export function listingViolations(path: string, params: URLSearchParams, contentType: string, text: string, total: string | null): string[] {
  const format = params.get('format') ?? 'json';
  const expectedType = { json: 'application/json', ndjson: 'application/x-ndjson', text: 'text/plain' }[format];
  if (!expectedType || !contentType.startsWith(expectedType)) return [`format ${format} answered with ${contentType}`];
  if (total === null || !/^[0-9]+$/.test(total)) return ['listing without a Partsmith-Total header'];
  const form = formOf(path, params);
  let rows: [string, unknown][];
  try {
    rows = rowsOf(format, text, form);
  } catch {
    return ['body does not parse in its format'];
  }
  const start = BigInt(params.get('start') ?? '0');
  const count = BigInt(params.get('count') ?? '1000');
  const expected = BigInt(total) - start < count ? BigInt(total) - start : count;
  const out: string[] = [];
  if (BigInt(rows.length) !== expected) out.push(`${rows.length} members, expected ${expected} (count ${count}, start ${start}, total ${total})`);
  const family = constraintsOf(params);
  const direction = path.includes('/v1/partitions') ? 1 : -1; // each member must be above (partitions) or below (compositions, set partitions) the next
  let previous: number[] | undefined;
  rows.forEach(([rank, member], i) => {
    if (rank !== String(start + BigInt(i))) out.push(`member ${i} has rank ${rank}, not ${start + BigInt(i)}`);
    const problems = memberProblems(path, member, form, family, params);
    if (problems.length > 0) out.push(...problems);
    else {
      const parts = partsOf(member, form);
      if (previous && compareLex(previous, parts) !== direction) out.push(`members ${i - 1} and ${i} are not in the documented order`);
      previous = parts;
    }
  });
  return out.slice(0, 5);
}

/** GET .../rank and .../unrank: a rank below the total, of a member of the family. */
export function rankViolations(path: string, params: URLSearchParams, contentType: string, text: string): string[] {
  if (!contentType.startsWith('application/json')) return [`rank answered with ${contentType}`];
  let body: Record<string, unknown>;
  try {
    body = JSON.parse(text);
  } catch {
    return ['rank body is not JSON'];
  }
  if (typeof body.rank !== 'string' || !/^[0-9]+$/.test(body.rank) || typeof body.total !== 'string' || !/^[0-9]+$/.test(body.total)) return ['rank or total is not a decimal string'];
  if (BigInt(body.rank) >= BigInt(body.total)) return [`rank ${body.rank} is not below the total ${body.total}`];
  const form = path.endsWith('/rank') && path.includes('set-partitions') ? 'rgs' : formOf(path, params);
  const member = body[form];
  if (!Array.isArray(member)) return [`the answer has no ${form}`];
  // rank without n: n is the sum of the parts, or the length of the restricted growth string.
  const family = path.endsWith('/rank') && !params.has('n') ? { ...constraintsOf(params), n: form === 'rgs' ? member.length : (member as number[]).reduce((a, b) => a + b, 0) } : constraintsOf(params);
  if (path.endsWith('/unrank') && body.rank !== params.get('rank')?.replace(/^0+(?=[0-9])/, '')) return [`unrank answered rank ${body.rank} for ${params.get('rank')}`];
  return memberProblems(path, member, form, family, params);
}
