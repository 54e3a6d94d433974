import { planCompositionSampler } from '../../core/compositions/plan.js';
import { familyKey } from '../../core/family.js';
import { partsOf } from '../../core/partition.js';
import { planPartitionSampler } from '../../core/partitions/plan.js';
import { CHECK_ALPHA } from '../../core/pictures/check.js';
import { boundarySvg, checkHistograms, formatP, histogramSvg } from '../../core/pictures/check-svg.js';
import { DIAGRAM_LIMITS } from '../../core/pictures/ferrers.js';
import { compositionSvg } from '../../core/pictures/composition-svg.js';
import { ferrersSvg } from '../../core/pictures/ferrers-svg.js';
import { sampleSource } from '../../core/seeding.js';
import type { AppContext } from '../endpoint.js';
import { ProblemError } from '../problem.js';
import { checkJobLimits } from '../sampling.js';
import { runPartitionCheck, type PartitionCheck } from '../routes/check.js';
import { runCompositionCheck, type CompositionCheck } from '../routes/composition-check.js';
import { compositionFamilyOf } from '../../library/compositions.js';
import { partitionFamilyOf } from '../../library/partitions.js';
import type { PartitionsQuery } from '../../schemas/partitions.js';
import { setPartitionFamilyOf } from '../../library/set-partitions.js';
import { rgsOfBlocks } from '../../library/set-partition-forms.js';
import type { SetPartitionsQuery } from '../../schemas/set-partitions.js';
import { planSetPartitionSampler } from '../../core/set-partitions/plan.js';
import { blocksOf } from '../../core/set-partitions/set-partition.js';
import { SET_PARTITION_DRAWING_LIMITS, setPartitionSvg, shortBlocks } from '../../core/pictures/set-partition-svg.js';
import { compositionCheckSection, isUnrestricted } from './composition-check.js';
import { PAGE_FAMILIES, PAGE_MAX_SHOWN, queryString, type FieldName, type FormState } from './form.js';
import { html, trusted, type Html } from './html.js';
import { listSection, modeFields, rankNote, sampleRanks } from './ranks.js';
import { snippetsFor } from './snippets.js';

/** The page's check may use this share of the request work budget (a page should answer quickly). */
const PAGE_CHECK_WORK_SHARE = 0.1;

interface Drawn {
  readonly seed: string;
  readonly seedDrawn: boolean;
  readonly method: string;
  /** Parts of each sample shown: largest first for partitions, in order for compositions. */
  readonly samples: number[][];
  /** Set partitions: the blocks of each sample shown (then `samples` is empty). */
  readonly blocks?: number[][][];
  readonly json: string;
}

/** The whole page for a form state: form, samples, snippets and check. */
export function renderPage(url: URL, form: FormState, context: AppContext): string {
  let drawn: Drawn | null = null;
  let problem: string | null = null;
  let check: PartitionCheck | CompositionCheck | null = null;
  let checkProblem: string | null = null;
  const listing = form.query !== null && form.mode === 'list';
  if (form.query && !listing) {
    try {
      drawn = draw(form, context);
    } catch (error) {
      problem = messageOf(error);
    }
    if (drawn && form.check) {
      const limits = { ...context.limits, workBudgetMs: context.limits.workBudgetMs * PAGE_CHECK_WORK_SHARE };
      try {
        if (form.family.kind === 'partition') check = runPartitionCheck(form.query as PartitionsQuery, form.samples, drawn.seed, limits);
        else if (isUnrestricted(form.query)) check = runCompositionCheck(form.query.n, form.samples, drawn.seed, limits);
      } catch (error) {
        checkProblem = messageOf(error);
      }
    }
  }
  const body = html`
<a class="skip" href="#results">Skip to the results</a>
<header class="masthead"><div class="masthead-inner">
  <a class="brand" href="/" aria-label="partsmith, start over">${logo()}<span class="wordmark">partsmith</span></a>
  <p class="tagline">Exactly uniform random partitions and compositions of n, and set partitions of n items — seeded, replayable, drawn.</p>
  <nav aria-label="Service"><a href="/openapi.json">OpenAPI</a><a href="/healthz">Status</a></nav>
</div></header>
<div class="layout">
  ${formPanel(form)}
  <main id="results" class="results" tabindex="-1">
    ${form.query === null ? errorSummary(form) : null}
    ${problem ? html`<section class="card" aria-labelledby="problem-title"><h2 id="problem-title">This request cannot be served</h2><div class="problem" role="alert"><p>${problem}</p></div></section>` : null}
    ${listing ? listSection(form, context) : null}
    ${drawn ? samplesSection(url, form, drawn, sampleRanks(form, context, drawn.blocks ? drawn.blocks.map(rgsOfBlocks) : drawn.samples)) : null}
    ${drawn ? snippetsSection(url, form, drawn) : null}
    ${drawn ? jsonSection(form, drawn) : null}
    ${drawn && form.check && form.family.kind === 'set-partition' ? html`<section class="card" aria-labelledby="check-title"><h2 id="check-title">Distribution check</h2><div class="note"><p>The page checks partitions and compositions against exact laws. For set partitions, the exact number of members is at <a href="/v1/set-partitions/count?${queryString(form.apiParams.filter(([k]) => k !== 'count' && k !== 'seed'))}">/v1/set-partitions/count</a>, and the test suite checks every sampler against enumerations and the exact law of the number of blocks.</p></div></section>` : null}
    ${drawn && form.check && form.family.kind !== 'set-partition' ? (form.family.kind === 'partition' ? checkSection(form, drawn, check as PartitionCheck | null, checkProblem) : compositionCheckSection(form, drawn.seed, check as CompositionCheck | null, checkProblem)) : null}
  </main>
</div>
<footer><p>Sample i of a seed is the same on every run and runtime. Diagrams are drawn up to ${DIAGRAM_LIMITS.maxRows} rows × ${DIAGRAM_LIMITS.maxColumns} columns; this page draws the first ${PAGE_MAX_SHOWN} samples and the API serves the rest.</p></footer>`;
  const title = form.query ? `${form.family.label} of ${form.query.n} · partsmith` : 'partsmith';
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>${html`${title}`}</title>
<meta name="description" content="Draw exactly uniform random integer partitions and compositions, see them drawn and check their distribution.">
<link rel="icon" href="/favicon.ico" type="image/svg+xml">
<link rel="stylesheet" href="/assets/page.css">
<script src="/assets/page.js" defer></script>
</head>
<body>${body}</body>
</html>
`;
}

function draw(form: FormState, context: AppContext): Drawn {
  const query = form.query!;
  const seedDrawn = query.seed === undefined;
  const seed = query.seed ?? context.drawSeed();
  const shown = Math.min(query.count, PAGE_MAX_SHOWN);
  let head: Record<string, unknown>;
  let samples: number[][] = [];
  let blocks: number[][][] | undefined;
  let method: string;
  // The same sampler and sample sources as GET /v1/partitions, /v1/compositions and /v1/set-partitions.
  if (form.family.kind === 'set-partition') {
    const family = setPartitionFamilyOf(query as SetPartitionsQuery);
    const sampler = planSetPartitionSampler(family);
    checkJobLimits({ sampler, numbersPerSample: sampler.expectedLength, start: 0, count: query.count }, context.limits);
    const key = familyKey(family);
    blocks = Array.from({ length: shown }, (_, i) => blocksOf(sampler.sample(sampleSource(seed, i, key))));
    head = { family, seed, start: 0, method: sampler.method };
    method = sampler.method;
  } else if (form.family.kind === 'partition') {
    const family = partitionFamilyOf(query as PartitionsQuery);
    const sampler = planPartitionSampler(family);
    checkJobLimits({ sampler, numbersPerSample: sampler.expectedLength, start: 0, count: query.count }, context.limits);
    const key = familyKey(family);
    for (let i = 0; i < shown; i++) samples.push(partsOf(sampler.sample(sampleSource(seed, i, key))));
    head = { family, seed, start: 0, method: sampler.method };
    method = sampler.method;
  } else {
    const family = compositionFamilyOf(query);
    const sampler = planCompositionSampler(family);
    checkJobLimits({ sampler, numbersPerSample: sampler.expectedLength, start: 0, count: query.count }, context.limits);
    const key = familyKey(family);
    samples = Array.from({ length: shown }, (_, i) => sampler.sample(sampleSource(seed, i, key)));
    head = { family, seed, start: 0, method: sampler.method };
    method = sampler.method;
  }
  // The same document the API returns (one sample per line for reading).
  const lines = (blocks ?? samples).map((s) => `    ${JSON.stringify(s)}`);
  const more = query.count > shown ? `\n    … ${query.count - shown} more in the API response` : '';
  const json = `${JSON.stringify(head).slice(0, -1).replace(/^\{/, '{\n  ').replace(/,"(seed|start|method)"/g, ',\n  "$1"')},\n  "samples": [\n${lines.join(',\n')}${more}\n  ]\n}`;
  return { seed, seedDrawn, method, samples, blocks, json };
}

function messageOf(error: unknown): string {
  if (error instanceof ProblemError) return error.detail;
  if (error instanceof RangeError) return error.message.charAt(0).toUpperCase() + error.message.slice(1) + (error.message.endsWith('.') ? '' : '.');
  throw error;
}

function field(form: FormState, name: FieldName, label: string, options: { type?: 'number' | 'text'; hint?: string; placeholder?: string; min?: number; inputmode?: string } = {}): Html {
  const error = form.errors[name];
  const describedBy = [options.hint ? `${name}-hint` : '', error ? `${name}-error` : ''].filter(Boolean).join(' ');
  return html`<div class="field">
  <label for="${name}">${label}</label>
  ${options.hint ? html`<p class="hint" id="${name}-hint">${options.hint}</p>` : null}
  <input id="${name}" name="${name}" type="${options.type ?? 'text'}" value="${form.values[name] ?? ''}"${options.min !== undefined ? html` min="${options.min}"` : null}${options.inputmode ? html` inputmode="${options.inputmode}"` : null}${options.placeholder ? html` placeholder="${options.placeholder}"` : null}${describedBy ? html` aria-describedby="${describedBy}"` : null}${error ? html` aria-invalid="true"` : null} autocomplete="off">
  ${error ? html`<p class="error" id="${name}-error">${label} ${error}.</p>` : null}
</div>`;
}

function formPanel(form: FormState): Html {
  const constraintsSet = ['distinct', 'minPart', 'maxPart', 'length', 'maxLength', 'allowed', 'blocks', 'maxBlocks', 'minBlockSize', 'maxBlockSize'].some((k) => form.values[k as FieldName] !== undefined);
  return html`<section class="controls card" aria-labelledby="form-title">
  <h1 id="form-title">Draw samples</h1>
  <form id="draw-form" method="get" action="/" novalidate>
    <fieldset>
      <legend>What to draw</legend>
      <div class="field">
        <label for="family">Family</label>
        <p class="hint" id="family-hint">Partitions: the order of parts does not matter. Compositions: it does (1 + 2 and 2 + 1 differ). Set partitions: which of the items 1…n go together.</p>
        <select id="family" name="family" aria-describedby="family-hint">${PAGE_FAMILIES.map((f) => html`<option value="${f.value}"${f.value === form.family.value ? html` selected` : null}>${f.label}</option>`)}</select>
      </div>
      <div class="row">
        ${field(form, 'n', 'Size n', { min: 0, inputmode: 'numeric' })}
        ${field(form, 'count', 'Samples', { min: 1, inputmode: 'numeric' })}
      </div>
      ${field(form, 'seed', 'Seed', { hint: 'Same seed, same samples. Leave empty for a fresh one.', placeholder: 'e.g. demo' })}
    </fieldset>
    ${modeFields(form)}
    <details class="constraints"${constraintsSet ? html` open` : null}>
      <summary>Constraints <span class="hint">optional</span></summary>
      <div class="check"><input type="checkbox" id="distinct" name="distinct" value="true"${form.values.distinct === 'true' ? html` checked` : null}${form.errors.distinct ? html` aria-invalid="true" aria-describedby="distinct-error"` : null}><label for="distinct">All parts different <span class="hint">(partitions)</span></label></div>
      ${form.errors.distinct ? html`<p class="error" id="distinct-error">All parts different ${form.errors.distinct}.</p>` : null}
      <div class="row">
        ${field(form, 'minPart', 'Smallest part ≥', { min: 0, inputmode: 'numeric', hint: '0 allows empty parts (compositions with exactly k parts).' })}
        ${field(form, 'maxPart', 'Largest part ≤', { min: 1, inputmode: 'numeric' })}
      </div>
      <div class="row">
        ${field(form, 'length', 'Exactly k parts', { min: 0, inputmode: 'numeric' })}
        ${field(form, 'maxLength', 'At most k parts', { min: 0, inputmode: 'numeric', hint: 'Partitions only.' })}
      </div>
      ${field(form, 'allowed', 'Allowed part sizes', { hint: 'Comma-separated, e.g. 1,2,5,10.', inputmode: 'numeric' })}
      <div class="row">
        ${field(form, 'blocks', 'Exactly k blocks', { min: 0, inputmode: 'numeric', hint: 'Set partitions only, as are the three below.' })}
        ${field(form, 'maxBlocks', 'At most k blocks', { min: 0, inputmode: 'numeric' })}
      </div>
      <div class="row">
        ${field(form, 'minBlockSize', 'Smallest block ≥', { min: 1, inputmode: 'numeric' })}
        ${field(form, 'maxBlockSize', 'Largest block ≤', { min: 1, inputmode: 'numeric' })}
      </div>
    </details>
    <fieldset>
      <legend>Distribution check</legend>
      <div class="check"><input type="checkbox" id="check" name="check" value="true"${form.check ? html` checked` : null}><label for="check">Compare many samples with the exact law</label></div>
      ${field(form, 'samples', 'Samples to check', { min: 1, inputmode: 'numeric', hint: 'Up to 20,000; large n allows fewer.' })}
    </fieldset>
    <button type="submit" class="submit">Draw</button>
  </form>
</section>`;
}

function errorSummary(form: FormState): Html {
  const entries = Object.entries(form.errors) as [FieldName, string][];
  return html`<section class="card error-summary" aria-labelledby="errors-title">
  <h2 id="errors-title">Please correct the form</h2>
  <div class="problem" role="alert"><ul>${entries.map(([name, message]) => html`<li><a href="#${name}">${name}</a> ${message}</li>`)}</ul></div>
</section>`;
}

function samplesSection(url: URL, form: FormState, drawn: Drawn, ranks: readonly string[] | null): Html {
  if (drawn.blocks) return setPartitionsSection(form, drawn, drawn.blocks, ranks);
  const query = form.query!;
  const partitions = form.family.kind === 'partition';
  const noun = partitions ? 'partition' : 'composition';
  const diagramParams = form.apiParams.filter(([k]) => k !== 'count' && k !== 'seed');
  const figures = drawn.samples.map((parts, i) => {
    const link = `/v1/partitions/diagram?${queryString([...diagramParams, ['seed', drawn.seed], ['index', String(i)]])}`;
    // Partitions: rows = parts, columns = largest part. Compositions: columns = parts, rows = largest part.
    const across = partitions ? (parts[0] ?? 0) : parts.length;
    const down = partitions ? parts.length : Math.max(0, ...parts);
    const tooLarge = down > DIAGRAM_LIMITS.maxRows || across > DIAGRAM_LIMITS.maxColumns;
    const caption = parts.length <= 16 ? parts.join(' + ') : `${parts.slice(0, 12).join(' + ')} + … (${parts.length} parts)`;
    let drawing: Html;
    if (tooLarge) drawing = html`<p class="too-large">${down} rows × ${across} columns: too large to draw here.</p>`;
    else if (partitions) drawing = html`<a class="drawing" href="${link}" aria-label="Sample ${i} as an SVG file">${trusted(ferrersSvg(parts, { fit: 200 }))}</a>`;
    else drawing = html`<div class="drawing">${trusted(compositionSvg(parts, { fit: 200 }))}</div>`;
    return html`<li><figure>
  ${drawing}
  <figcaption><strong>#${i}</strong> ${parts.length === 0 ? `the empty ${noun}` : caption}${rankNote(ranks, i)}</figcaption>
</figure></li>`;
  });
  return html`<section class="card" aria-labelledby="samples-title">
  <h2 id="samples-title">${query.count === 1 ? `One ${noun}` : `${query.count} ${noun}s`} of ${query.n}</h2>
  ${samplesSummary(form, drawn)}
  <ul class="diagrams" aria-label="${partitions ? 'Ferrers diagrams' : 'Bargraphs'}, one per sample">${figures}</ul>
  ${shownNote(query.count, drawn.samples.length)}
  ${partitions
    ? html`<p class="note">One row per part, largest first; the highlighted square is the Durfee square. Each diagram links to its SVG.</p>`
    : html`<p class="note">One column per part, in the composition's order, the part's size written below it; neighbouring parts alternate colours. A part 0 is a mark on the baseline.</p>`}
</section>`;
}

/** Seed, method and permalink of the samples shown. */
function samplesSummary(form: FormState, drawn: Drawn): Html {
  return html`<p class="summary">
    <span class="pill">seed <code>${drawn.seed}</code>${drawn.seedDrawn ? ' (drawn for you)' : ''}</span>
    <span class="pill">method <code>${drawn.method}</code></span>
    <a href="${permalinkOf(form, drawn.seed)}">Permalink</a>
  </p>`;
}

function shownNote(count: number, shown: number): Html | null {
  return count > shown ? html`<p class="note">The first ${shown} of ${count} samples are drawn; the snippets below fetch them all.</p>` : null;
}

/** The permalink of the page's current request, with the seed the samples used. */
function permalinkOf(form: FormState, seed: string): string {
  return `/?${queryString([['family', form.family.value], ...form.apiParams.filter(([k]) => k !== 'seed'), ['seed', seed], ...(form.check ? ([['check', 'true'], ['samples', String(form.samples)]] as [string, string][]) : [])])}`;
}

function setPartitionsSection(form: FormState, drawn: Drawn, samples: number[][][], ranks: readonly string[] | null): Html {
  const query = form.query!;
  const limits = SET_PARTITION_DRAWING_LIMITS;
  const figures = samples.map((blocks, i) => {
    const widest = Math.max(0, ...blocks.map((b) => b.length));
    const drawing =
      blocks.length > limits.maxBlocks || widest > limits.maxBlockSize
        ? html`<p class="too-large">${blocks.length} blocks, the largest of ${widest} items: too large to draw here.</p>`
        : html`<div class="drawing">${trusted(setPartitionSvg(blocks, { fit: 200 }))}</div>`;
    return html`<li><figure>
  ${drawing}
  <figcaption><strong>#${i}</strong> ${blocks.length === 0 ? 'the empty set partition' : shortBlocks(blocks)}${rankNote(ranks, i)}</figcaption>
</figure></li>`;
  });
  return html`<section class="card" aria-labelledby="samples-title">
  <h2 id="samples-title">${query.count === 1 ? 'One set partition' : `${query.count} set partitions`} of ${query.n} items</h2>
  ${samplesSummary(form, drawn)}
  <ul class="diagrams" aria-label="Set partitions, one drawing per sample">${figures}</ul>
  ${shownNote(query.count, samples.length)}
  <p class="note">One row per block (group), its items in increasing order; blocks from top to bottom by their smallest item, the numbering of the restricted growth string (as=rgs).</p>
</section>`;
}

function snippetsSection(url: URL, form: FormState, drawn: Drawn): Html {
  const params = form.apiParams.filter(([k]) => k !== 'seed');
  params.push(['seed', drawn.seed]);
  const snippets = snippetsFor(url.origin, form.family, params);
  return html`<section class="card" aria-labelledby="snippets-title">
  <h2 id="snippets-title">The same request, elsewhere</h2>
  <div class="snippets">${snippets.map(
    (s) => html`<div>
    <div class="snippet-head"><h3 id="${s.id}-title">${s.title}</h3><button type="button" class="quiet" data-copy="${s.id}" data-label="${s.title}" hidden>Copy</button></div>
    <pre tabindex="0" aria-labelledby="${s.id}-title"><code id="${s.id}">${s.code}</code></pre>
  </div>`,
  )}</div>
  <p class="status" id="copy-status" role="status" aria-live="polite"></p>
</section>`;
}

function jsonSection(form: FormState, drawn: Drawn): Html {
  return html`<section class="card" aria-labelledby="json-title">
  <div class="snippet-head"><h2 id="json-title">As JSON</h2><button type="button" class="quiet" data-copy="json-body" data-label="JSON" hidden>Copy</button></div>
  <pre tabindex="0" aria-labelledby="json-title"><code id="json-body">${drawn.json}</code></pre>
</section>`;
}

function checkSection(form: FormState, drawn: Drawn, check: PartitionCheck | null, problem: string | null): Html {
  const params: [string, string][] = [...form.apiParams.filter(([k]) => k !== 'count' && k !== 'seed'), ['samples', String(form.samples)], ['seed', drawn.seed]];
  const api = `/v1/partitions/check?${queryString(params)}`;
  if (!check) {
    return html`<section class="card" aria-labelledby="check-title"><h2 id="check-title">Distribution check</h2><div class="problem" role="alert"><p>${problem}</p></div></section>`;
  }
  const lp = check.report.largestPart;
  const v = check.report.verdict;
  const passed = v.pValue === null ? null : v.pValue >= CHECK_ALPHA;
  const lawText = v.quantity === 'largest part' ? 'the exact law of the largest part (from counting tables)' : `the exact law of the ${v.quantity}`;
  const testText = `Pearson chi-square on ${v.degreesOfFreedom} degrees of freedom`;
  return html`<section class="card" aria-labelledby="check-title">
  <h2 id="check-title">Distribution check</h2>
  <div class="verdict ${passed === false ? 'fail' : 'pass'}">
    <span class="mark" aria-hidden="true">${passed === false ? '✗' : '✓'}</span>
    <p>${passed === null
      ? 'Too few samples for a p-value: ask for more.'
      : passed
        ? html`<strong>Consistent with uniform.</strong> ${check.report.samples.toLocaleString('en-US')} samples against ${lawText}: p = ${formatP(v.pValue!)} (a uniform sampler falls below α = ${CHECK_ALPHA} once in ${1 / CHECK_ALPHA} checks).`
        : html`<strong>Not consistent with uniform.</strong> ${check.report.samples.toLocaleString('en-US')} samples against ${lawText}: p = ${formatP(v.pValue!)} &lt; α = ${CHECK_ALPHA}.`}</p>
  </div>
  <div class="plots">
    ${checkHistograms(check.report, check.family.distinct === true).map((h) => html`<figure>${trusted(histogramSvg(h))}</figure>`)}
    ${check.report.boundary ? html`<figure>${trusted(boundarySvg(check.report.boundary, check.report.samples))}</figure>` : null}
  </div>
  <table class="stats">
    <tr><th scope="row">Test</th><td>${testText}</td></tr>
    <tr><th scope="row">Statistic</th><td>${v.statistic.toFixed(4)}</td></tr>
    <tr><th scope="row">p-value</th><td>${v.pValue === null ? '—' : formatP(v.pValue)}</td></tr>
    ${lp.asymptotic ? html`<tr><th scope="row">Largest part</th><td>Against the Erdős–Lehner Gumbel limit law (Kolmogorov–Smirnov): p = ${lp.pValue === null ? '—' : formatP(lp.pValue)}; asymptotic, not used for the verdict.</td></tr>` : null}
    ${check.report.boundary ? html`<tr><th scope="row">Limit shape</th><td>${check.report.boundary.equation}; largest gap of the mean boundary ${check.report.boundary.maxDeviation.toFixed(3)}</td></tr>` : html`<tr><th scope="row">Limit shape</th><td>None known for these constraints.</td></tr>`}
  </table>
  <p class="note">The check uses samples 0 to ${check.report.samples - 1} of seed <code>${drawn.seed}</code>, the very ones the API returns. <a href="${api}">JSON</a> · <a href="${api}&amp;format=svg">SVG</a></p>
</section>`;
}

/** The mark: a small Ferrers diagram of 4 + 3 + 1 with its Durfee square (also the favicon). */
function logoCells(): string {
  const cells: string[] = [];
  const parts = [4, 3, 1];
  parts.forEach((p, i) => {
    for (let j = 0; j < p; j++) cells.push(`<rect x="${1 + j * 8}" y="${5 + i * 8}" width="7" height="7" rx="1.5" class="${i < 2 && j < 2 ? 'cell durfee' : 'cell'}" fill="${i < 2 && j < 2 ? '#b5461b' : '#17676c'}"/>`);
  });
  return cells.join('');
}

function logo(): Html {
  return trusted(`<svg viewBox="0 0 34 34" aria-hidden="true" focusable="false">${logoCells()}</svg>`);
}

export const FAVICON_SVG = `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 34 34">${logoCells()}</svg>`;
