import { CHECK_ALPHA } from '../../core/pictures/check.js';
import { exactLawHistogram, formatP, histogramSvg } from '../../core/pictures/check-svg.js';
import type { CompositionCheck } from '../routes/composition-check.js';
import type { FormState, PageQuery } from './form.js';
import { queryString } from './form.js';
import { html, trusted, type Html } from './html.js';

/**
 * The page's distribution check for compositions: the numbers of parts of samples 0..samples−1
 * against their exact law, as GET /v1/compositions/check computes it. That law is tabulated for
 * unrestricted compositions only, so with constraints the section says so instead of guessing.
 */
export function isUnrestricted(query: PageQuery): boolean {
  const fields = query as Readonly<Record<string, unknown>>;
  return ['length', 'maxPart', 'allowed', 'distinct', 'maxLength'].every((k) => fields[k] === undefined) && (fields.minPart === undefined || fields.minPart === 1);
}

export function compositionCheckSection(form: FormState, seed: string, check: CompositionCheck | null, problem: string | null): Html {
  const title = html`<h2 id="check-title">Distribution check</h2>`;
  if (!check) {
    const text = problem ?? 'The exact law of the number of parts is available for compositions without constraints; clear the constraints to check the samples against it.';
    return html`<section class="card" aria-labelledby="check-title">${title}<div class="${problem ? 'problem' : 'note'}"${problem ? html` role="alert"` : null}><p>${text}</p></div></section>`;
  }
  const api = `/v1/compositions/check?${queryString([['n', String(check.family.n)], ['samples', String(form.samples)], ['seed', seed]])}`;
  const report = check.report;
  const passed = report.pValue === null ? null : report.pValue >= CHECK_ALPHA;
  const law = 'the exact law of the number of parts, 1 + Binomial(n − 1, ½)';
  return html`<section class="card" aria-labelledby="check-title">
  ${title}
  <div class="verdict ${passed === false ? 'fail' : 'pass'}">
    <span class="mark" aria-hidden="true">${passed === false ? '✗' : '✓'}</span>
    <p>${passed === null
      ? 'Every composition of 1 has one part: nothing to test.'
      : passed
        ? html`<strong>Consistent with uniform.</strong> ${report.samples.toLocaleString('en-US')} samples against ${law}: p = ${formatP(report.pValue!)} (a uniform sampler falls below α = ${CHECK_ALPHA} once in ${1 / CHECK_ALPHA} checks).`
        : html`<strong>Not consistent with uniform.</strong> ${report.samples.toLocaleString('en-US')} samples against ${law}: p = ${formatP(report.pValue!)} &lt; α = ${CHECK_ALPHA}.`}</p>
  </div>
  <div class="plots"><figure>${trusted(histogramSvg(exactLawHistogram('number of parts', report)))}</figure></div>
  <table class="stats">
    <tr><th scope="row">Test</th><td>Pearson chi-square on ${report.degreesOfFreedom} degrees of freedom</td></tr>
    <tr><th scope="row">Statistic</th><td>${report.statistic.toFixed(4)}</td></tr>
    <tr><th scope="row">p-value</th><td>${report.pValue === null ? '—' : formatP(report.pValue)}</td></tr>
    <tr><th scope="row">Why this law</th><td>A uniform composition of n cuts each of the n − 1 gaps between units with probability ½.</td></tr>
  </table>
  <p class="note">The check uses samples 0 to ${report.samples - 1} of seed <code>${seed}</code>, the very ones the API returns. <a href="${api}">JSON</a> · <a href="${api}&amp;format=svg">SVG</a></p>
</section>`;
}
