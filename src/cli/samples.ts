import type { ParsedFlag } from './flags.js';
import type { Progress, Sink } from './output.js';
import type { Source } from './source.js';
import type { EndpointSpec } from './spec.js';
import { DEFAULT_LIMITS } from '../http/limits.js';

/** How a sampling command's flags become one or more requests. */
export interface SamplesRun {
  readonly spec: EndpointSpec;
  /** API parameters in the order given (CLI-only flags removed). */
  readonly params: readonly ParsedFlag[];
  readonly source: Source;
  readonly sink: Sink;
  readonly makeProgress: (total: number) => Progress;
}

const DIGITS = /^[0-9]{1,16}$/;
/** Marks the end of the head of a JSON samples document: `{"family":...,"method":"...","samples":[`. */
const SAMPLES_KEY = '"samples":[';

export function queryOf(params: readonly ParsedFlag[]): string {
  const search = new URLSearchParams();
  for (const { name, value } of params) search.append(name, value);
  const text = search.toString();
  return text ? `?${text}` : '';
}

export function withValue(params: readonly ParsedFlag[], name: string, value: string): ParsedFlag[] {
  const out = params.filter((p) => p.name !== name);
  out.push({ name, value });
  return out;
}

/**
 * Runs a sampling request and writes the service's body. Up to the API's count limit this is one
 * request and the output is the API's bytes. Larger counts are split into pages with `start`
 * (sample i depends only on seed, i and the family, so pages join seamlessly): text and NDJSON
 * pages are concatenated; JSON pages are joined into the one document the API would return
 * without the limit. Output is written as it arrives, one page at a time.
 */
export async function runSamples(run: SamplesRun): Promise<void> {
  const { spec, params, source, sink } = run;
  const value = (name: string) => params.find((p) => p.name === name)?.value;
  // Pages of the default per-response limit: the schema's maximum is what a server may be
  // configured to allow, not what this one allows.
  const maxCount = Math.min(spec.params.find((p) => p.name === 'count')?.maximum ?? Infinity, DEFAULT_LIMITS.maxCount);
  const countText = value('count');
  const startText = value('start') ?? '0';
  const repeated = new Set(params.map((p) => p.name)).size !== params.length;
  const total = countText !== undefined && DIGITS.test(countText) ? Number(countText) : 1;
  const paged = total > maxCount && DIGITS.test(startText) && !repeated;
  const progress = run.makeProgress(total);
  const format = value('format') ?? spec.params.find((p) => p.name === 'format')?.default ?? 'json';

  if (!paged) {
    const answer = await source.get(spec.path + queryOf(params));
    await copy(answer.body, sink, format === 'json' ? undefined : progress);
    if (format === 'json') progress.advance(total);
    progress.finish();
    return;
  }

  const start = Number(startText);
  let pageParams = [...params];
  let written = 0;
  for (let page = 0; written < total; page++) {
    const count = Math.min(maxCount, total - written);
    pageParams = withValue(withValue(pageParams, 'start', String(start + written)), 'count', String(count));
    const answer = await source.get(spec.path + queryOf(pageParams));
    // Without a seed the service draws one; every further page must use that same seed.
    if (value('seed') === undefined && page === 0) pageParams = withValue(pageParams, 'seed', answer.header('partsmith-seed') ?? '');
    const last = written + count >= total;
    if (format === 'json') {
      await copyJsonPage(answer.body, sink, page === 0, last);
      progress.advance(count);
    } else {
      await copy(answer.body, sink, progress);
    }
    written += count;
  }
  progress.finish();
}

/** Copies a body to the sink; counts lines (one per sample in text and NDJSON) for the progress bar. */
export async function copy(body: AsyncIterable<Uint8Array>, sink: Sink, progress: Progress | undefined): Promise<void> {
  const decoder = new TextDecoder();
  for await (const chunk of body) {
    const text = decoder.decode(chunk, { stream: true });
    await sink.write(text);
    if (progress) {
      let lines = 0;
      for (let i = text.indexOf('\n'); i >= 0; i = text.indexOf('\n', i + 1)) lines++;
      progress.advance(lines);
    }
  }
  await sink.write(decoder.decode());
}

/**
 * One page of a joined JSON document: the first page keeps its head, later pages drop it and
 * continue the array (`"samples":[`, or another `key`) after a comma; every page but the last
 * holds back its closing `]}`.
 */
export async function copyJsonPage(body: AsyncIterable<Uint8Array>, sink: Sink, first: boolean, last: boolean, key: string = SAMPLES_KEY): Promise<void> {
  const decoder = new TextDecoder();
  let head = !first;
  let held = '';
  const emit = async (text: string) => {
    held += text;
    if (head) {
      const at = held.indexOf(key);
      if (at < 0) return;
      held = `,${held.slice(at + key.length)}`;
      head = false;
    }
    // Keep the last two characters back: they may be the closing "]}".
    if (held.length > 2) {
      await sink.write(held.slice(0, -2));
      held = held.slice(-2);
    }
  };
  for await (const chunk of body) await emit(decoder.decode(chunk, { stream: true }));
  await emit(decoder.decode());
  if (held !== ']}' || head) throw new Error('unexpected end of a JSON page from the service');
  if (last) await sink.write(held);
}
