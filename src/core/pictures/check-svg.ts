import type { BoundaryReport, LargestPartReport, PartitionCheckReport } from './check.js';
import { onesShortQuantity } from './ones.js';
import type { ExactLawReport } from './statistics.js';
import { el, escapeXml, FONT, num, PALETTE, svgRoot } from './svg.js';

const W = 560;
const H = 340;
const M = { left: 58, right: 16, top: 44, bottom: 50 };

/** A distribution laid out for plotting: one bar per value (or per group of values). */
export interface HistogramInput {
  /** What is counted, for the axis and the accessible name, e.g. "largest part". */
  readonly quantity: string;
  readonly offset: number;
  readonly observed: readonly number[];
  /** Probability of each value under the law the samples are compared with. */
  readonly probabilities: readonly number[];
  readonly lawName: string;
  readonly verdict: string;
}

/** A statistic tested by chi-square against its exact law, as plot input. */
export function exactLawHistogram(quantity: string, report: ExactLawReport): HistogramInput {
  return {
    quantity,
    offset: report.offset,
    observed: report.observed,
    probabilities: report.expected,
    lawName: 'exact law',
    verdict: verdictText(report.test, report.statistic, report.pValue, report.degreesOfFreedom),
  };
}

/**
 * The histograms of a partition check, the verdict's first: the largest part where its exact
 * law is tabulated; above that the ones statistic (its exact law gives the verdict), then the
 * largest part against its limit law.
 */
export function checkHistograms(report: PartitionCheckReport, distinct: boolean): HistogramInput[] {
  const largest = largestPartHistogram(report.largestPart);
  if (report.largestPart.law === 'exact' || !report.ones) return [largest];
  return [exactLawHistogram(onesShortQuantity(distinct), report.ones), largest];
}

/**
 * Turns a largest-part report into plot input. Against the Gumbel limit law (large n) the plot
 * shows its discretised density, and says that its p-value is asymptotic and not the verdict
 * (which then comes from the exact law of the ones statistic, plotted beside it).
 */
export function largestPartHistogram(report: LargestPartReport): HistogramInput {
  if (report.law === 'exact') return exactLawHistogram('largest part', report as LargestPartReport & ExactLawReport);
  return {
    quantity: 'largest part',
    offset: report.offset,
    observed: report.observed,
    probabilities: report.expected.map((cdfAbove, i) => cdfAbove - (i === 0 ? cdfBelow(report) : report.expected[i - 1])),
    lawName: 'Gumbel limit',
    verdict: `${verdictText(report.test, report.statistic, report.pValue, report.degreesOfFreedom)} (Erdős–Lehner limit law: asymptotic, not the verdict)`,
  };
}

function cdfBelow(report: LargestPartReport): number {
  const g = report.gumbel!;
  return Math.exp(-Math.exp(-(report.offset - 0.5 - g.location) / g.scale));
}

/** "chi-square = 12.3 on 14 df, p = 0.58". */
export function verdictText(test: string, statistic: number, pValue: number | null, dof?: number): string {
  const stat = test === 'chi-square' ? `χ² = ${statistic.toFixed(2)}${dof !== undefined ? ` on ${dof} df` : ''}` : `KS D = ${statistic.toFixed(4)}`;
  return pValue === null ? `${stat}, too few samples for a p-value` : `${stat}, p = ${formatP(pValue)}`;
}

export function formatP(p: number): string {
  if (p === 0) return '< 1e-300';
  return p >= 0.001 ? p.toFixed(3) : p.toExponential(1);
}

/**
 * Observed shares (bars) against the law's probabilities (dots joined by a line). More than 80
 * values are grouped into equal-width bins so bars stay visible.
 */
export function histogramSvg(input: HistogramInput): string {
  const total = input.observed.reduce((a, b) => a + b, 0) || 1;
  // Plot only where something is visible: values observed or with probability >= 1/1000 of the mode.
  const peak = Math.max(...input.probabilities);
  const visible = (v: number): boolean => input.observed[v] > 0 || input.probabilities[v] >= peak * 1e-3;
  let first = 0;
  let last = input.observed.length - 1;
  while (first < last && !visible(first)) first++;
  while (last > first && !visible(last)) last--;
  const values = last - first + 1;
  const group = Math.max(1, Math.ceil(values / 80));
  const bins: { from: number; to: number; share: number; probability: number }[] = [];
  for (let i = first; i <= last; i += group) {
    let count = 0;
    let probability = 0;
    for (let j = i; j < Math.min(last + 1, i + group); j++) {
      count += input.observed[j];
      probability += input.probabilities[j];
    }
    bins.push({ from: input.offset + i, to: input.offset + Math.min(last + 1, i + group) - 1, share: count / total, probability });
  }
  const top = niceCeiling(Math.max(1e-9, ...bins.map((b) => Math.max(b.share, b.probability))));
  const plotW = W - M.left - M.right;
  const plotH = H - M.top - M.bottom;
  const bw = plotW / Math.max(1, bins.length);
  const yOf = (v: number): number => M.top + plotH - (v / top) * plotH;
  const parts: string[] = [frame(plotW, plotH, top, (v) => `${Math.round(v * 1000) / 10}%`)];
  bins.forEach((b, i) => {
    const h = (b.share / top) * plotH;
    parts.push(el('rect', { x: M.left + i * bw + bw * 0.12, y: M.top + plotH - h, width: Math.max(0.5, bw * 0.76), height: h, fill: PALETTE.observed, 'fill-opacity': 0.85, class: 'bar' }));
  });
  const line = bins.map((b, i) => `${i === 0 ? 'M' : 'L'}${num(M.left + (i + 0.5) * bw)} ${num(yOf(b.probability))}`).join(' ');
  parts.push(el('path', { d: line, fill: 'none', stroke: PALETTE.expected, 'stroke-width': 2, 'stroke-linejoin': 'round', class: 'law' }));
  if (bins.length <= 60) {
    bins.forEach((b, i) => parts.push(el('circle', { cx: M.left + (i + 0.5) * bw, cy: yOf(b.probability), r: 3, fill: PALETTE.expected, class: 'law-dot' })));
  }
  // x tick labels: about six, at bin centres.
  const step = Math.max(1, Math.ceil(bins.length / 6));
  for (let i = 0; i < bins.length; i += step) {
    const b = bins[i];
    parts.push(text(M.left + (i + 0.5) * bw, M.top + plotH + 16, b.from === b.to ? String(b.from) : `${b.from}–${b.to}`, 'middle', 11));
  }
  parts.push(text(M.left + plotW / 2, H - 12, input.quantity, 'middle', 12));
  parts.push(text(M.left, 18, `${capitalise(input.quantity)}: ${total.toLocaleString('en-US')} samples vs ${input.lawName}`, 'start', 14, PALETTE.ink, 'bold'));
  parts.push(text(M.left, 36, input.verdict, 'start', 12));
  parts.push(legend(W - M.right - 170, M.top + 6, [
    { label: 'samples', kind: 'bar' },
    { label: input.lawName, kind: 'line' },
  ]));
  const label = `Histogram of the ${input.quantity} of ${total} samples against the ${input.lawName}; ${input.verdict}`;
  return svgRoot(W, H, label, parts.join(''), 'plot');
}

/** The mean scaled boundary (dots) against the limit curve (line). */
export function boundarySvg(report: BoundaryReport, samples: number): string {
  const plotW = W - M.left - M.right;
  const plotH = H - M.top - M.bottom;
  const xMax = report.points[report.points.length - 1].x;
  const yMax = niceCeiling(Math.max(...report.points.map((p) => Math.max(p.mean, p.limit))));
  const xOf = (x: number): number => M.left + (x / xMax) * plotW;
  const yOf = (y: number): number => M.top + plotH - (Math.min(y, yMax) / yMax) * plotH;
  const parts: string[] = [frame(plotW, plotH, yMax, (v) => num(v))];
  // The partitions curve is symmetric in x and y, so it enters the plot at x = y(yMax).
  const xStart = report.curve === 'partitions' ? limitY(report, yMax) : 0;
  const curve: string[] = [];
  for (let i = 0; i <= 120; i++) {
    const x = xStart + ((xMax - xStart) * i) / 120;
    curve.push(`${i === 0 ? 'M' : 'L'}${num(xOf(x))} ${num(yOf(limitY(report, x)))}`);
  }
  parts.push(el('path', { d: curve.join(' '), fill: 'none', stroke: PALETTE.expected, 'stroke-width': 2, class: 'law' }));
  for (const p of report.points) parts.push(el('circle', { cx: xOf(p.x), cy: yOf(p.mean), r: 3.2, fill: PALETTE.observed, class: 'mean-dot' }));
  const xStep = xMax > 6 ? 2 : xMax > 2.5 ? 1 : 0.5;
  for (let x = 0; x <= xMax + 1e-9; x += xStep) parts.push(text(xOf(x), M.top + plotH + 16, num(x), 'middle', 11));
  parts.push(text(M.left + plotW / 2, H - 12, 'column / √n', 'middle', 12));
  parts.push(text(M.left, 18, `Mean diagram boundary of ${samples.toLocaleString('en-US')} samples vs the limit shape`, 'start', 14, PALETTE.ink, 'bold'));
  parts.push(text(M.left, 36, `${report.equation}; largest gap ${report.maxDeviation.toFixed(3)}`, 'start', 12));
  parts.push(legend(W - M.right - 170, M.top + 6, [
    { label: 'mean of samples', kind: 'dot' },
    { label: 'limit curve', kind: 'line' },
  ]));
  parts.push(el('text', { x: 14, y: M.top + plotH / 2, transform: `rotate(-90 14 ${num(M.top + plotH / 2)})`, 'text-anchor': 'middle', 'font-size': 12, 'font-family': FONT, fill: PALETTE.muted }, 'rows reaching it / √n'));
  const label = `Mean scaled Ferrers diagram boundary of ${samples} samples against the limit curve ${report.equation}; largest gap ${report.maxDeviation.toFixed(3)}`;
  return svgRoot(W, H, label, parts.join(''), 'plot');
}

function limitY(report: BoundaryReport, x: number): number {
  const e = Math.exp(-report.c * x);
  return report.curve === 'partitions' ? -Math.log1p(-e) / report.c : Math.log1p(e) / report.c;
}

/** Both plots stacked in one SVG (the check endpoint's format=svg). */
export function stackedSvg(label: string, drawings: readonly string[]): string {
  const inner = drawings.map((svg, i) => svg.replace('<svg ', `<svg x="0" y="${i * H}" `)).join('');
  return svgRoot(W, H * drawings.length, label, inner, 'plots');
}

function frame(plotW: number, plotH: number, top: number, format: (v: number) => string): string {
  const parts: string[] = [];
  for (let i = 0; i <= 4; i++) {
    const y = M.top + plotH - (plotH * i) / 4;
    parts.push(el('line', { x1: M.left, x2: M.left + plotW, y1: y, y2: y, stroke: PALETTE.grid, 'stroke-width': 1, class: 'grid' }));
    parts.push(text(M.left - 6, y + 4, format((top * i) / 4), 'end', 11));
  }
  parts.push(el('line', { x1: M.left, x2: M.left, y1: M.top, y2: M.top + plotH, stroke: PALETTE.muted, 'stroke-width': 1, class: 'axis' }));
  return parts.join('');
}

function legend(x: number, y: number, items: { label: string; kind: 'bar' | 'line' | 'dot' }[]): string {
  const parts: string[] = [el('rect', { x: x - 8, y: y - 6, width: 178, height: items.length * 20 + 6, rx: 6, fill: PALETTE.paper, 'fill-opacity': 0.92, stroke: PALETTE.grid, class: 'legend' })];
  items.forEach((item, i) => {
    const cy = y + 6 + i * 20;
    if (item.kind === 'bar') parts.push(el('rect', { x, y: cy - 6, width: 16, height: 12, rx: 2, fill: PALETTE.observed, class: 'bar' }));
    if (item.kind === 'dot') parts.push(el('circle', { cx: x + 8, cy, r: 4, fill: PALETTE.observed, class: 'mean-dot' }));
    if (item.kind === 'line') parts.push(el('line', { x1: x, x2: x + 16, y1: cy, y2: cy, stroke: PALETTE.expected, 'stroke-width': 2.5, class: 'law' }));
    parts.push(text(x + 24, cy + 4, item.label, 'start', 12, PALETTE.ink));
  });
  return parts.join('');
}

function text(x: number, y: number, content: string, anchor: 'start' | 'middle' | 'end', size: number, fill: string = PALETTE.muted, weight?: string): string {
  return el('text', { x, y, 'text-anchor': anchor, 'font-size': size, 'font-family': FONT, fill, 'font-weight': weight, class: 'label' }, escapeXml(content));
}

/** A round number at or above v (1, 2, 2.5 or 5 times a power of ten). */
function niceCeiling(v: number): number {
  const power = 10 ** Math.floor(Math.log10(v));
  for (const m of [1, 2, 2.5, 5, 10]) if (m * power >= v) return m * power;
  return 10 * power;
}

function capitalise(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}
