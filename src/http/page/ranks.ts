import { PartsmithError } from '../../client/errors.js';
import { compositionRankTableSize } from '../../core/ranks/composition-ranker.js';
import { partitionRankTableSize } from '../../core/ranks/partition-ranker.js';
import type { Ranker } from '../../core/ranks/ranker.js';
import { DIAGRAM_LIMITS } from '../../core/pictures/ferrers.js';
import { compositionSvg } from '../../core/pictures/composition-svg.js';
import { ferrersSvg } from '../../core/pictures/ferrers-svg.js';
import { SET_PARTITION_DRAWING_LIMITS, setPartitionSvg, shortBlocks } from '../../core/pictures/set-partition-svg.js';
import type { AppContext } from '../endpoint.js';
import { rankedFamilyOf } from '../routes/ranks.js';
import { compositionFamilyOf } from '../../library/compositions.js';
import { partitionFamilyOf } from '../../library/partitions.js';
import type { FamilyQuery } from '../../library/sampled-family.js';
import { blocksOfValidRgs } from '../../library/set-partition-forms.js';
import type { CompositionsQuery } from '../../schemas/compositions.js';
import type { PartitionsQuery } from '../../schemas/partitions.js';
import { queryString, type FormState } from './form.js';
import { html, trusted, type Html } from './html.js';
import { flagOf } from './snippets.js';

/**
 * The page's rank features, kept apart from the drawing of samples: the "list" mode (every
 * member of a small family in order, as small diagrams, a page at a time) and the rank of each
 * random sample beside it. Both use the API's rankers (the same cache as /v1/.../list), and
 * only for families whose counting table is small enough to build while a page is rendered.
 */

/** Members drawn on one page of the list mode. */
export const PAGE_LIST_MAX = 48;

/** The page ranks a family only when its table is at most this large (quick to build: well under 0.1 s). */
export const PAGE_RANK_BYTES = 4 * 2 ** 20;

/**
 * Set partitions have no table estimate before their counting states are built, so the page
 * ranks them up to this many items (every constraint shape builds in milliseconds there).
 */
export const PAGE_SET_PARTITION_RANK_N = 24;

/** The ranker of the form's family (members in the ranker's form: set partitions as restricted growth strings), or the reason there is none on this page. */
export function pageRanker(form: FormState, context: AppContext): { ranker: Ranker } | { reason: string } {
  const query = form.query!;
  const kind = form.family.kind;
  try {
    if (kind === 'partition' && partitionRankTableSize(partitionFamilyOf(query as PartitionsQuery)).bytes > PAGE_RANK_BYTES) return { reason: tooLarge(query.n, 'its counting table would be over 4 MiB') };
    if (kind === 'composition' && compositionRankTableSize(compositionFamilyOf(query as CompositionsQuery)).bytes > PAGE_RANK_BYTES) return { reason: tooLarge(query.n, 'its counting table would be over 4 MiB') };
    if (kind === 'set-partition' && query.n > PAGE_SET_PARTITION_RANK_N) return { reason: tooLarge(query.n, `this page ranks set partitions of up to ${PAGE_SET_PARTITION_RANK_N} items`) };
    return { ranker: rankedFamilyOf(kind, context, query as unknown as FamilyQuery).ranker };
  } catch (error) {
    if (error instanceof PartsmithError) return { reason: error.detail };
    if (error instanceof RangeError) return { reason: error.message };
    throw error;
  }
}

function tooLarge(n: number, why: string): string {
  return `This family of ${n} is too large to rank on this page (${why}); the API ranks larger families (see its limits).`;
}

/** The rank of each drawn sample (parts, or a set partition's restricted growth string), as decimal strings, or null when the family is too large to rank here. */
export function sampleRanks(form: FormState, context: AppContext, samples: readonly (readonly number[])[]): string[] | null {
  const found = pageRanker(form, context);
  if (!('ranker' in found)) return null;
  return samples.map((member) => String(found.ranker.rank(member)));
}

/** The caption's rank note for sample i (nothing when there are no ranks); ranks of over 24 digits are shortened. */
export function rankNote(ranks: readonly string[] | null, i: number): Html | null {
  if (!ranks) return null;
  const rank = ranks[i];
  return html` <span class="rank">rank ${rank.length > 24 ? `${rank.slice(0, 12)}… (${rank.length} digits)` : rank}</span>`;
}

/** The form's choice between drawing random samples and listing the family in order, and the listing's start. */
export function modeFields(form: FormState): Html {
  const list = form.mode === 'list';
  return html`<fieldset>
      <legend>Mode</legend>
      <div class="check"><input type="radio" id="mode-draw" name="mode" value="draw"${list ? null : html` checked`}><label for="mode-draw">Draw uniformly random samples</label></div>
      <div class="check"><input type="radio" id="mode-list" name="mode" value="list"${list ? html` checked` : null}><label for="mode-list">List every member in order, with its rank</label></div>
      <div class="field">
        <label for="start">First rank listed</label>
        <p class="hint" id="start-hint">List mode: members from this rank on (0 is the first); “Samples” is how many, up to ${PAGE_LIST_MAX}.</p>
        <input id="start" name="start" type="text" inputmode="numeric" value="${form.values.start ?? ''}" placeholder="0" aria-describedby="start-hint${form.errors.start ? ' start-error' : ''}"${form.errors.start ? html` aria-invalid="true"` : null} autocomplete="off">
        ${form.errors.start ? html`<p class="error" id="start-error">First rank listed ${form.errors.start}.</p>` : null}
      </div>
    </fieldset>`;
}

/** The list mode's results: one page of members in order, as small diagrams with their ranks, and links to the neighbouring pages. */
export function listSection(form: FormState, context: AppContext): Html {
  const query = form.query!;
  const kind = form.family.kind;
  const noun = kind === 'partition' ? 'partition' : kind === 'composition' ? 'composition' : 'set partition';
  const found = pageRanker(form, context);
  const title = html`<h2 id="list-title">${form.family.label} of ${query.n}${kind === 'set-partition' ? ' items' : ''}, in order</h2>`;
  if (!('ranker' in found)) {
    return html`<section class="card" aria-labelledby="list-title">${title}<div class="problem" role="alert"><p>${found.reason}</p></div></section>`;
  }
  const { ranker } = found;
  const start = BigInt(form.values.start ?? '0');
  if (start > ranker.count) {
    return html`<section class="card" aria-labelledby="list-title">${title}<div class="problem" role="alert"><p>The family has ${ranker.count} members, so the first rank listed must be at most ${ranker.count}.</p></div></section>`;
  }
  const size = Math.min(query.count, PAGE_LIST_MAX);
  const members: number[][] = [];
  const iterator = ranker.list(start);
  for (let next = iterator.next(); !next.done && members.length < size; next = iterator.next()) members.push(next.value);
  const base: [string, string][] = [['family', form.family.value], ['mode', 'list'], ...form.apiParams.filter(([k]) => k !== 'seed' && k !== 'count'), ['count', String(size)]];
  const pageLink = (from: bigint) => `/?${queryString([...base, ['start', String(from)]])}`;
  const previous = start > 0n ? (start > BigInt(size) ? start - BigInt(size) : 0n) : null;
  const next = start + BigInt(members.length) < ranker.count ? start + BigInt(members.length) : null;
  const apiParams = form.apiParams.filter(([k]) => k !== 'seed' && k !== 'count');
  const api = `${form.family.apiPath}/list?${queryString([...apiParams, ['start', String(start)], ['count', String(size)]])}`;
  const cli = `partsmith list ${form.family.command} ${apiParams.map(([k, v]) => (k === 'distinct' ? flagOf(k) : `${flagOf(k)} ${v}`)).join(' ')}`;
  const figures = members.map((member, i) => html`<li><figure>
  ${memberDrawing(member, kind)}
  <figcaption><strong>rank ${String(start + BigInt(i))}</strong> ${member.length === 0 ? `the empty ${noun}` : memberCaption(member, kind)}</figcaption>
</figure></li>`);
  const last = start + BigInt(members.length) - 1n;
  return html`<section class="card" aria-labelledby="list-title">
  ${title}
  <p class="summary"><span class="pill">${ranker.count === 1n ? `1 ${noun}` : `${ranker.count} ${noun}s`}</span>${members.length > 0 ? html`<span class="pill">ranks ${String(start)} to ${String(last)}</span>` : null}</p>
  <p class="note">${ORDERS[kind]}</p>
  ${members.length === 0 ? html`<p class="note">No member to list from rank ${String(start)}.</p>` : html`<ul class="diagrams members" aria-label="Members ${String(start)} to ${String(last)}">${figures}</ul>`}
  <nav class="pager" aria-label="Pages of the listing">${previous !== null ? html`<a href="${pageLink(previous)}" rel="prev">← Previous ${size}</a>` : null}${next !== null ? html`<a href="${pageLink(next)}" rel="next">Next ${size} →</a>` : null}</nav>
  <p class="note">The same page from the API: <a href="${api}">${api}</a>; every member from the command line: <code>${cli}</code></p>
</section>`;
}

const ORDERS = {
  partition: 'Parts largest first; members in reverse lexicographic order (n first, 1 + … + 1 last).',
  composition: 'Members in lexicographic order of their parts (1 + … + 1 first, n last).',
  'set-partition': 'Blocks by their smallest item; members in lexicographic order of their restricted growth strings (item i → its block’s number): one block first, all singletons last.',
} as const;

function memberCaption(member: readonly number[], kind: FormState['family']['kind']): string {
  if (kind === 'set-partition') return shortBlocks(blocksOfValidRgs(member));
  return member.length <= 16 ? member.join(' + ') : `${member.slice(0, 12).join(' + ')} + … (${member.length} parts)`;
}

/** A small diagram of a member: Ferrers diagram (partitions), bar graph (compositions) or blocks (set partitions, from their restricted growth strings). */
function memberDrawing(member: readonly number[], kind: FormState['family']['kind']): Html {
  if (kind === 'set-partition') {
    const blocks = blocksOfValidRgs(member);
    const widest = Math.max(0, ...blocks.map((b) => b.length));
    if (blocks.length > SET_PARTITION_DRAWING_LIMITS.maxBlocks || widest > SET_PARTITION_DRAWING_LIMITS.maxBlockSize) return html`<p class="too-large">${blocks.length} blocks: too large to draw here.</p>`;
    return html`<div class="drawing">${trusted(setPartitionSvg(blocks, { fit: 120 }))}</div>`;
  }
  const parts = member;
  const partitions = kind === 'partition';
  const across = partitions ? (parts[0] ?? 0) : parts.length;
  const down = partitions ? parts.length : Math.max(0, ...parts);
  if (down > DIAGRAM_LIMITS.maxRows || across > DIAGRAM_LIMITS.maxColumns) return html`<p class="too-large">${down} rows × ${across} columns: too large to draw here.</p>`;
  return html`<div class="drawing">${trusted(partitions ? ferrersSvg([...parts], { fit: 120 }) : compositionSvg([...parts], { fit: 120 }))}</div>`;
}
