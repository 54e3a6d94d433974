import { DEFAULT_LIMITS } from '../http/limits.js';
import type { ParsedFlag } from './flags.js';
import { copy, copyJsonPage, queryOf, withValue, type SamplesRun } from './samples.js';

const DIGITS = /^[0-9]{1,16}$/;
const RANK = /^[0-9]+$/;
/** Marks the end of the head of a JSON listing: `{"family":...,"start":"...","members":[`. */
const MEMBERS_KEY = '"members":[';

/**
 * `partsmith list`: every member of a family from --start on (all of them unless --count says
 * how many), written as it arrives. The API lists at most its count limit per answer, so longer
 * listings are pages joined with start (a listing is a pure function of its query, so pages join
 * seamlessly): text and NDJSON pages are concatenated, JSON pages joined into the one document
 * the API would return without the limit. The first page's Partsmith-Total header says how many
 * members there are, for the progress bar. A query the API refuses is sent as given, so its
 * problem is reported as the API words it.
 */
export async function runListing(run: SamplesRun): Promise<void> {
  const { spec, params, source, sink } = run;
  const value = (name: string) => params.find((p) => p.name === name)?.value;
  const pageMax = Math.min(spec.params.find((p) => p.name === 'count')?.maximum ?? Infinity, DEFAULT_LIMITS.maxCount);
  const countText = value('count');
  const startText = value('start') ?? '0';
  const repeated = new Set(params.map((p) => p.name)).size !== params.length;
  const format = value('format') ?? 'json';
  if (repeated || (countText !== undefined && !DIGITS.test(countText)) || !RANK.test(startText)) {
    const answer = await source.get(spec.path + queryOf(params));
    await copy(answer.body, sink, undefined);
    return;
  }
  const wanted = countText === undefined ? undefined : BigInt(countText);
  let start = BigInt(startText);
  const pageOf = (todo: bigint | undefined): bigint => (todo === undefined || todo > BigInt(pageMax) ? BigInt(pageMax) : todo);
  const page = (from: bigint, count: bigint): ParsedFlag[] => withValue(withValue(params, 'start', String(from)), 'count', String(count));

  let count = pageOf(wanted);
  let answer = await source.get(spec.path + queryOf(wanted !== undefined && wanted <= BigInt(pageMax) ? params : page(start, count)));
  const total = BigInt(answer.header('partsmith-total') ?? '0');
  const left = total > start ? total - start : 0n;
  const todo = wanted === undefined || wanted > left ? left : wanted;
  const progress = run.makeProgress(Number(todo));
  let written = 0n;
  for (let first = true; ; first = false) {
    const listed = count < todo - written ? count : todo - written;
    const last = written + listed >= todo;
    if (format === 'json') {
      await copyJsonPage(answer.body, sink, first, last, MEMBERS_KEY);
      progress.advance(Number(listed));
    } else {
      await copy(answer.body, sink, progress);
    }
    written += listed;
    start += listed;
    if (last) break;
    count = pageOf(todo - written);
    answer = await source.get(spec.path + queryOf(page(start, count)));
  }
  progress.finish();
}
