import { z } from 'zod';
import { checkQuery } from '../../schemas/check.js';
import { compositionsQuery, type CompositionsQuery } from '../../schemas/compositions.js';
import { partitionsQuery, type PartitionsQuery } from '../../schemas/partitions.js';
import { setPartitionsQuery, type SetPartitionsQuery } from '../../schemas/set-partitions.js';

/**
 * The page's form: what the user typed (kept verbatim to show it back), the errors per field,
 * and, when valid, the API query it stands for. The page is forgiving where the API is strict:
 * blank fields are simply absent and unknown parameters are ignored.
 */

/** A family the page offers: one entry here, its sampler and drawing in render. */
export interface PageFamily {
  readonly value: 'partitions' | 'compositions' | 'set-partitions';
  readonly kind: 'partition' | 'composition' | 'set-partition';
  readonly label: string;
  /** Path of the sampling endpoint, e.g. /v1/partitions. */
  readonly apiPath: string;
  /** CLI sub-command for the snippets. */
  readonly command: string;
  /** The client's method for the snippets. */
  readonly clientMethod: string;
  /** Constraint fields the family accepts (the form shows only these). */
  readonly constraints: readonly ConstraintName[];
}

export type ConstraintName = (typeof CONSTRAINTS)[number];

const CONSTRAINTS = ['distinct', 'minPart', 'maxPart', 'length', 'maxLength', 'allowed', 'blocks', 'maxBlocks', 'minBlockSize', 'maxBlockSize'] as const;

export const PAGE_FAMILIES: readonly PageFamily[] = [
  { value: 'partitions', kind: 'partition', label: 'Partitions', apiPath: '/v1/partitions', command: 'partitions', clientMethod: 'partitions', constraints: ['distinct', 'minPart', 'maxPart', 'length', 'maxLength', 'allowed'] },
  { value: 'compositions', kind: 'composition', label: 'Compositions', apiPath: '/v1/compositions', command: 'compositions', clientMethod: 'compositions', constraints: ['minPart', 'maxPart', 'length', 'allowed'] },
  { value: 'set-partitions', kind: 'set-partition', label: 'Set partitions', apiPath: '/v1/set-partitions', command: 'set-partitions', clientMethod: 'setPartitions', constraints: ['blocks', 'maxBlocks', 'minBlockSize', 'maxBlockSize'] },
];

/** The sampling endpoint's query: the same schema, and so the same rules, as the API's. */
export type PageQuery = PartitionsQuery | CompositionsQuery | SetPartitionsQuery;

/** Every field of the form, in the order they appear in URLs and snippets. */
export const FIELD_NAMES = ['family', 'n', 'count', 'seed', ...CONSTRAINTS, 'check', 'samples', 'mode', 'start'] as const;
export type FieldName = (typeof FIELD_NAMES)[number];

/** The API parameters among the fields (the rest belong to the page). */
const API_FIELDS = ['n', 'count', 'seed', ...CONSTRAINTS] as const;

export const PAGE_DEFAULTS: Partial<Record<FieldName, string>> = { family: 'partitions', n: '24', count: '6', check: 'true', samples: '2000' };

/** Diagrams drawn and samples shown as JSON on the page (the API serves the rest). */
export const PAGE_MAX_SHOWN = 24;

export interface FormState {
  readonly values: Partial<Record<FieldName, string>>;
  readonly errors: Partial<Record<FieldName, string>>;
  readonly family: PageFamily;
  /** The API query of `family` (seed may still be absent) when the form is valid. */
  readonly query: PageQuery | null;
  /** The API parameters as typed, for URLs and snippets, in a fixed order. */
  readonly apiParams: [string, string][];
  readonly check: boolean;
  readonly samples: number;
  /** Draw random samples, or list the family in order from rank `start` (see ranks.ts). */
  readonly mode: 'draw' | 'list';
}

export function readForm(url: URL): FormState {
  const fresh = url.search === '';
  const values: Partial<Record<FieldName, string>> = {};
  for (const name of FIELD_NAMES) {
    const raw = fresh ? PAGE_DEFAULTS[name] : url.searchParams.get(name)?.trim();
    if (raw !== undefined && raw !== '') values[name] = raw;
  }
  // The first visit shows a worked example with a fixed seed.
  if (fresh) values.seed = 'demo';
  const errors: Partial<Record<FieldName, string>> = {};
  const family = PAGE_FAMILIES.find((f) => f.value === (values.family ?? 'partitions')) ?? PAGE_FAMILIES[0];
  if (values.family !== undefined && !PAGE_FAMILIES.some((f) => f.value === values.family)) errors.family = `must be one of: ${PAGE_FAMILIES.map((f) => f.value).join(', ')}`;
  if (values.n === undefined) errors.n = 'is required';
  const apiParams: [string, string][] = [];
  for (const name of API_FIELDS) {
    const value = values[name];
    if (value === undefined) continue;
    if (name === 'distinct' && value !== 'true') continue;
    // A constraint the family does not have is an error, not silently dropped: the samples
    // would otherwise not be what the form says.
    if (isConstraint(name) && !family.constraints.includes(name)) {
      errors[name] = `applies to ${PAGE_FAMILIES.filter((f) => f.constraints.includes(name)).map((f) => f.value).join(' and ')} only`;
      continue;
    }
    apiParams.push([name, value]);
  }
  const schema = family.kind === 'composition' ? compositionsQuery : family.kind === 'set-partition' ? setPartitionsQuery : partitionsQuery;
  const parsed = schema.safeParse(Object.fromEntries(apiParams));
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const field = String(issue.path[0] ?? 'n') as FieldName;
      if (!errors[field]) errors[field] = issue.message;
    }
  }
  const check = values.check === 'true';
  let samples = 0;
  if (check) {
    const s = checkQuery.shape.samples.safeParse(values.samples ?? '1000');
    if (s.success) samples = s.data;
    else errors.samples = z.prettifyError(s.error).replace(/^✖ /, '').split('\n')[0];
  }
  const mode = values.mode === 'list' ? 'list' : 'draw';
  if (values.mode !== undefined && values.mode !== 'list' && values.mode !== 'draw') errors.mode = 'must be draw or list';
  if (values.start !== undefined && !/^[0-9]+$/.test(values.start)) errors.start = 'must be a whole number (a rank: 0, 1, 2, ...)';
  const valid = Object.keys(errors).length === 0;
  return { values, errors, family, query: valid && parsed.success ? parsed.data : null, apiParams, check: check && mode === 'draw', samples, mode };
}

function isConstraint(name: string): name is ConstraintName {
  return (CONSTRAINTS as readonly string[]).includes(name);
}

/** A query string from ordered pairs (URL-encoded, ready to paste). */
export function queryString(params: readonly [string, string][]): string {
  return params.map(([k, v]) => `${encodeURIComponent(k)}=${encodeURIComponent(v).replace(/%2C/g, ',')}`).join('&');
}
