import { NotAMemberError, type NotAMemberReason } from '../errors.js';
import type { CompositionFamily, PartitionFamily } from '../family.js';

/**
 * Why a list of parts is not a member of a family, as a NotAMemberError, or null when it is one.
 * Checked from the family's definition as the user wrote it (not from a rank table), so the
 * message names the rule that fails: whole numbers, the family's order (partitions list their
 * parts largest first), the sum n, and every constraint. Every failing rule is reported;
 * `reason` is the first one's kind.
 */
type Problem = [NotAMemberReason, string];

export function partitionMembershipError(parts: readonly number[], family: PartitionFamily): NotAMemberError | null {
  const malformed = malformedPart(parts, 1);
  if (malformed) return malformed;
  const problems: Problem[] = [];
  const rise = parts.findIndex((p, i) => i > 0 && p > parts[i - 1]);
  if (rise >= 0) problems.push(['out-of-order', `the parts of a partition are listed largest first, but ${parts[rise]} follows ${parts[rise - 1]} (part ${rise + 1})`]);
  problems.push(...sumProblems(parts, family.n));
  if (family.distinct) {
    const seen = new Set<number>();
    const repeated = parts.find((p) => seen.has(p) || !seen.add(p));
    if (repeated !== undefined) problems.push(['not-in-family', `part ${repeated} occurs more than once, but the parts must be distinct`]);
  }
  problems.push(...sizeProblems(parts, family.minPart, family.maxPart, family.allowed, 'minPart'));
  problems.push(...lengthProblems(parts, family.length));
  if (family.maxLength !== undefined && parts.length > family.maxLength) problems.push(['not-in-family', `it has ${parts.length} parts, but the family has at most ${family.maxLength}`]);
  return asError(problems);
}

export function compositionMembershipError(parts: readonly number[], family: CompositionFamily): NotAMemberError | null {
  const malformed = malformedPart(parts, 0);
  if (malformed) return malformed;
  // The smallest part is 1 unless minPart says otherwise; an allowed list is not cut by that default.
  const min = family.minPart ?? (family.allowed === undefined ? 1 : undefined);
  const problems = [
    ...sumProblems(parts, family.n),
    ...sizeProblems(parts, min, family.maxPart, family.allowed, family.minPart === undefined ? 'the smallest part size' : 'minPart'),
    ...lengthProblems(parts, family.length),
  ];
  return asError(problems);
}

function malformedPart(parts: readonly number[], min: number): NotAMemberError | null {
  if (!Array.isArray(parts)) return new NotAMemberError('a member is a list of parts', 'malformed');
  const bad = parts.findIndex((p) => typeof p !== 'number' || !Number.isSafeInteger(p) || p < min);
  return bad < 0 ? null : new NotAMemberError(`part ${bad + 1} (${String(parts[bad])}) is not a whole number >= ${min}`, 'malformed');
}

function sumProblems(parts: readonly number[], n: number): Problem[] {
  let sum = 0;
  for (const p of parts) sum += p;
  return sum === n ? [] : [['wrong-sum', `the parts sum to ${sum}, not n = ${n}`]];
}

function sizeProblems(parts: readonly number[], min: number | undefined, max: number | undefined, allowed: readonly number[] | undefined, minName: string): Problem[] {
  const out: Problem[] = [];
  const small = min === undefined ? undefined : parts.find((p) => p < min);
  if (small !== undefined) out.push(['not-in-family', `part ${small} is below ${minName} = ${min}`]);
  const large = max === undefined ? undefined : parts.find((p) => p > max);
  if (large !== undefined) out.push(['not-in-family', `part ${large} is above maxPart = ${max}`]);
  if (allowed !== undefined) {
    const sizes = new Set(allowed);
    const other = parts.find((p) => !sizes.has(p));
    if (other !== undefined) out.push(['not-in-family', `part ${other} is not an allowed size (${listText([...sizes].sort((a, b) => a - b))})`]);
  }
  return out;
}

function lengthProblems(parts: readonly number[], length: number | undefined): Problem[] {
  return length === undefined || parts.length === length ? [] : [['not-in-family', `it has ${parts.length} parts, but the family has exactly ${length}`]];
}

function listText(values: readonly number[]): string {
  return values.length > 12 ? `${values.slice(0, 12).join(', ')}, …` : values.join(', ');
}

function asError(problems: readonly Problem[]): NotAMemberError | null {
  if (problems.length === 0) return null;
  return new NotAMemberError(`not a member of the family: ${problems.map(([, text]) => text).join('; ')}`, problems[0][0]);
}
