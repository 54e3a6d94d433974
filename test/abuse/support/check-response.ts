import { compositionProblems, constraintsOf, multiplicityProblems, partitionProblems, setPartitionProblems, type Constraints } from './family-checks.js';
import type { EndpointSpec } from './fuzz-queries.js';
import { listingViolations, rankViolations } from './rank-checks.js';

/**
 * The contract every response must keep, whatever was asked (issue 7): a 2xx, 3xx or 4xx
 * status; 4xx bodies are problem details naming a parameter or a limit; 2xx samples belong to
 * the requested family; nothing internal ever appears in a body.
 */

/** Traces of internals that must never reach a client: stack frames, source paths, runtime names. */
const LEAKS = /(\n\s+at\s|\bat\s+\S+\s+\(|node_modules|\/src\/|\/work\/|\.ts:\d|\.js:\d|file:\/\/|Error:|TypeError|ReferenceError|RangeError)/;

export interface Checked {
  readonly status: number;
  readonly violations: string[];
}

function problemViolations(status: number, contentType: string, text: string, params: URLSearchParams): string[] {
  const out: string[] = [];
  if (!contentType.startsWith('application/problem+json')) out.push(`content-type ${contentType} is not application/problem+json`);
  let body: Record<string, unknown>;
  try {
    body = JSON.parse(text);
  } catch {
    return [...out, 'problem body is not JSON'];
  }
  for (const field of ['type', 'title', 'detail'] as const) {
    if (typeof body[field] !== 'string' || (body[field] as string).length === 0) out.push(`problem lacks a ${field}`);
  }
  if (body.status !== status) out.push(`problem status ${String(body.status)} differs from HTTP ${status}`);
  const errors = body.errors;
  const namesParam = Array.isArray(errors) && errors.length > 0 && errors.every((e) => typeof e?.param === 'string' && e.param.length > 0 && typeof e?.message === 'string');
  const namesLimit = /limit/i.test(String(body.detail));
  if (!namesParam && !namesLimit) out.push(`problem names neither a parameter nor a limit: ${String(body.detail).slice(0, 200)}`);
  if (Array.isArray(errors)) {
    for (const e of errors) {
      // A parameter that was given is never reported missing.
      if (e?.message === 'is required' && params.has(e.param)) out.push(`${e.param} reported as required although it was given`);
    }
  }
  return out;
}

/** Samples of a 2xx sampling response, in whichever format it came. */
function samplesOf(format: string, text: string, field: string): { samples: unknown[]; violations: string[]; indices?: number[] } {
  if (format === 'json') {
    const body = JSON.parse(text);
    return { samples: body.samples, violations: Array.isArray(body.samples) ? [] : ['json body has no samples array'] };
  }
  const lines = text.split('\n');
  if (lines.pop() !== '') return { samples: [], violations: ['body does not end with a newline'] };
  if (format === 'ndjson') {
    const rows = lines.map((line) => JSON.parse(line));
    return { samples: rows.map((r) => r[field]), indices: rows.map((r) => r.index), violations: [] };
  }
  // Set partitions: "1 3 | 2 | 4" (blocks) or "0 1 0 2" (rgs).
  if (field === 'blocks') return { samples: lines.map((line) => (line === '' ? [] : line.split(' | ').map((block) => block.split(' ').map(Number)))), violations: [] };
  if (field === 'rgs') return { samples: lines.map((line) => (line === '' ? [] : line.split(' ').map(Number))), violations: [] };
  // text: "5 4 1" or, for multiplicities, "5 4 1^3"
  return {
    samples: lines.map((line) =>
      line === ''
        ? []
        : line.split(' ').map((token) => {
            const [size, multiplicity] = token.split('^');
            return field === 'multiplicities' ? [Number(size), multiplicity === undefined ? 1 : Number(multiplicity)] : Number(token);
          }),
    ),
    violations: [],
  };
}

function sampleViolations(path: string, params: URLSearchParams, contentType: string, text: string): string[] {
  const format = params.get('format') ?? 'json';
  const expectedType = { json: 'application/json', ndjson: 'application/x-ndjson', text: 'text/plain' }[format];
  if (!expectedType || !contentType.startsWith(expectedType)) return [`format ${format} answered with ${contentType}`];
  const count = Number(params.get('count') ?? 1);
  const start = Number(params.get('start') ?? 0);
  const multiplicities = params.get('as') === 'multiplicities';
  const family: Constraints = constraintsOf(params);
  const composition = path.includes('composition');
  const setPartition = path.includes('set-partitions');
  const setForm = params.get('as') === 'rgs' ? 'rgs' : 'blocks';
  let parsed;
  try {
    parsed = samplesOf(format, text, setPartition ? setForm : multiplicities ? 'multiplicities' : 'parts');
  } catch {
    return ['body does not parse in its format'];
  }
  const out = [...parsed.violations];
  if (parsed.samples.length !== count) out.push(`${parsed.samples.length} samples, not count = ${count}`);
  if (parsed.indices && parsed.indices.some((index, i) => index !== start + i)) out.push('ndjson indices do not run from start');
  for (const sample of parsed.samples) {
    const problems = setPartition
      ? setPartitionProblems(sample, params, setForm)
      : multiplicities
      ? multiplicityProblems(sample, family)
      : !Array.isArray(sample)
        ? ['sample is not a list']
        : composition
          ? compositionProblems(sample, family)
          : partitionProblems(sample, family);
    if (problems.length > 0) {
      out.push(...problems);
      break;
    }
  }
  return out;
}

/** Checks one response to `GET path?query` against the contract; returns what is wrong. */
export async function checkResponse(endpoint: EndpointSpec, query: string, response: Response): Promise<Checked> {
  const status = response.status;
  const text = await response.text();
  const contentType = response.headers.get('content-type') ?? '';
  const params = new URLSearchParams(query);
  const violations: string[] = [];
  if (status < 200 || status > 499) violations.push(`status ${status}`);
  if (response.headers.get('x-content-type-options') !== 'nosniff') violations.push('no nosniff header');
  if (response.headers.get('access-control-allow-origin') !== '*') violations.push('no CORS header');
  if (LEAKS.test(text.slice(0, 100_000)) && !(status === 200 && endpoint.path === '/openapi.json')) violations.push(`body leaks internals: ${text.slice(0, 200)}`);

  const keys = [...params.keys()];
  const unknown = keys.filter((k) => !endpoint.params.includes(k));
  const repeated = keys.filter((k, i) => keys.indexOf(k) !== i);
  if (status < 300 && (unknown.length > 0 || repeated.length > 0)) {
    violations.push(`accepted unknown ${JSON.stringify(unknown)} or repeated ${JSON.stringify(repeated)} parameters`);
  }

  if (status >= 400 && status <= 499) violations.push(...problemViolations(status, contentType, text, params));
  else if (status >= 200 && status < 300) {
    if (endpoint.path.endsWith('/diagram')) violations.push(...diagramViolations(params, contentType, text));
    else if (endpoint.path.endsWith('/check')) violations.push(...checkViolations(params, contentType, text));
    else if (endpoint.path.endsWith('/list')) violations.push(...listingViolations(endpoint.path, params, contentType, text, response.headers.get('partsmith-total')));
    else if (endpoint.path.endsWith('/rank') || endpoint.path.endsWith('/unrank')) violations.push(...rankViolations(endpoint.path, params, contentType, text));
    else if (endpoint.params.includes('format')) violations.push(...sampleViolations(endpoint.path, params, contentType, text));
    else {
      try {
        const body = JSON.parse(text);
        if (endpoint.path.endsWith('/count') && !/^[0-9]+$/.test(String(body.count))) violations.push(`count ${String(body.count)} is not a decimal string`);
      } catch {
        violations.push('2xx body is not JSON');
      }
    }
  }
  return { status, violations };
}

/** A Ferrers diagram: SVG with one cell per unit, or rows of '#', one row per part. */
function diagramViolations(params: URLSearchParams, contentType: string, text: string): string[] {
  const size = params.has('parts') ? params.get('parts')!.split(',').reduce((a, b) => a + Number(b), 0) : Number(params.get('n'));
  if ((params.get('style') ?? 'svg') === 'text') {
    if (!contentType.startsWith('text/plain')) return [`text diagram answered with ${contentType}`];
    const cells = (text.match(/#/g) ?? []).length;
    return cells === size ? [] : [`text diagram has ${cells} cells, not ${size}`];
  }
  if (!contentType.startsWith('image/svg+xml')) return [`diagram answered with ${contentType}`];
  if (!/^(<\?xml[^>]*>\s*)?<svg[\s>]/.test(text) || !text.trimEnd().endsWith('</svg>')) return ['diagram is not an SVG document'];
  return [];
}

/** A distribution check: the statistics as JSON, or their plot as SVG. */
function checkViolations(params: URLSearchParams, contentType: string, text: string): string[] {
  if ((params.get('format') ?? 'json') === 'svg') {
    return contentType.startsWith('image/svg+xml') && text.includes('<svg') ? [] : [`check plot answered with ${contentType}`];
  }
  try {
    const body = JSON.parse(text);
    // A family with one possible largest part leaves nothing to test: pValue and passed are null.
    const degenerate = body.pValue === null && body.passed === null;
    const ok = typeof body.statistic === 'number' && (degenerate || (typeof body.pValue === 'number' && body.pValue >= 0 && body.pValue <= 1)) && typeof body.test === 'string';
    return ok ? [] : ['check body lacks statistic, pValue in [0, 1] or test'];
  } catch {
    return ['check body is not JSON'];
  }
}
