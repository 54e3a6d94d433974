import { cellGrid, el, FONT, PALETTE, svgRoot } from './svg.js';

export interface CompositionSvgOptions {
  /** Accessible name; defaults to "Composition 3 + 1 + 2 (n = 6), one column per part in order". */
  readonly label?: string;
  /** Side of the drawing's longer dimension that cells are fitted into (pixels). */
  readonly fit?: number;
}

/**
 * A composition as a bargraph: one column per part, left to right in the composition's order,
 * bottom-aligned, part i a stack of parts[i] unit cells — one <rect> per unit, exactly n of them
 * (the usual picture of a composition as a column-convex polyomino; e.g. Bousquet-Mélou &
 * Rechnitzer 2003, "The site-perimeter of bargraphs" — reference from memory). Order matters for
 * a composition, so unlike a Ferrers diagram nothing is sorted. Consecutive columns alternate
 * two shades so equal neighbours stay distinct; a part 0 (weak compositions) is a mark on the
 * baseline. Part sizes are written under their columns when legible.
 */
export function compositionSvg(parts: readonly number[], options: CompositionSvgOptions = {}): string {
  const columns = parts.length;
  const tallest = Math.max(0, ...parts);
  const n = parts.reduce((a, b) => a + b, 0);
  const label = options.label ?? (columns > 0 ? `Composition ${shortSum(parts)} (n = ${n}), one column per part in order` : 'The empty composition (n = 0)');
  const { unit, gap, radius, labels, fontSize, pad } = cellGrid(Math.max(columns, tallest), options.fit ?? 320, columns > 0);
  const footer = labels ? Math.round(fontSize * 1.6) : 0;
  const baseline = pad + tallest * unit;
  const pieces: string[] = [];
  for (let i = 0; i < columns; i++) {
    const x = pad + i * unit;
    const shade = i % 2 === 0 ? PALETTE.cell : PALETTE.durfee;
    if (parts[i] === 0) {
      pieces.push(el('line', { x1: x, y1: baseline - gap, x2: x + unit - gap, y2: baseline - gap, stroke: PALETTE.muted, 'stroke-width': Math.max(1, gap), class: 'empty-part' }));
    }
    for (let j = 0; j < parts[i]; j++) {
      pieces.push(el('rect', { x, y: baseline - (j + 1) * unit, width: unit - gap, height: unit - gap, rx: radius, fill: shade, class: i % 2 === 0 ? 'cell' : 'cell alternate' }));
    }
    if (labels) {
      pieces.push(el('text', { x: x + (unit - gap) / 2, y: baseline + footer / 2, 'dominant-baseline': 'central', 'text-anchor': 'middle', 'font-size': fontSize, 'font-family': FONT, fill: PALETTE.muted, class: 'part-size' }, String(parts[i])));
    }
  }
  if (columns === 0) {
    pieces.push(el('text', { x: 8, y: 18, 'font-size': 13, 'font-family': FONT, fill: PALETTE.muted }, 'empty composition'));
  }
  const width = columns === 0 ? 140 : pad * 2 + columns * unit - gap;
  const height = columns === 0 ? 28 : baseline + footer + pad;
  return svgRoot(width, height, label, pieces.join(''), 'composition');
}

/** "3 + 1 + 2", or "3 + 1 + … (20 parts)" for long compositions (accessible names stay short). */
function shortSum(parts: readonly number[]): string {
  if (parts.length <= 12) return parts.join(' + ');
  return `${parts.slice(0, 8).join(' + ')} + … (${parts.length} parts)`;
}
