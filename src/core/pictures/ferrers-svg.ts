import { durfeeSide } from './ferrers.js';
import { cellGrid, el, FONT, PALETTE, svgRoot } from './svg.js';

export interface FerrersSvgOptions {
  /** Accessible name; defaults to "Ferrers diagram of 5 + 4 + 1 + 1 (n = 11)". */
  readonly label?: string;
  /** Side of the drawing's longer dimension that cells are fitted into (pixels). */
  readonly fit?: number;
}

/**
 * A Ferrers diagram as SVG: one <rect> per cell (exactly n of them), rows = parts largest first,
 * the Durfee square in the accent colour, part sizes written left of their rows when legible.
 * `parts` must already be sorted largest first and within the drawing limits.
 */
export function ferrersSvg(parts: readonly number[], options: FerrersSvgOptions = {}): string {
  const rows = parts.length;
  const columns = rows > 0 ? parts[0] : 0;
  const n = parts.reduce((a, b) => a + b, 0);
  const label = options.label ?? (rows > 0 ? `Ferrers diagram of ${shortSum(parts)} (n = ${n})` : 'Ferrers diagram of the empty partition (n = 0)');
  const { unit, gap, radius, labels, fontSize, pad } = cellGrid(Math.max(rows, columns), options.fit ?? 320, rows > 0);
  const gutter = labels ? Math.ceil(String(columns).length * fontSize * 0.62) + Math.round(unit * 0.5) : 0;
  const durfee = durfeeSide(parts);
  const pieces: string[] = [];
  for (let i = 0; i < rows; i++) {
    const y = pad + i * unit;
    if (labels) {
      pieces.push(
        el('text', { x: pad + gutter - Math.round(unit * 0.4), y: y + (unit - gap) / 2, 'dominant-baseline': 'central', 'text-anchor': 'end', 'font-size': fontSize, 'font-family': FONT, fill: PALETTE.muted, class: 'part-size' }, String(parts[i])),
      );
    }
    for (let j = 0; j < parts[i]; j++) {
      const inSquare = i < durfee && j < durfee;
      pieces.push(
        el('rect', {
          x: pad + gutter + j * unit,
          y,
          width: unit - gap,
          height: unit - gap,
          rx: radius,
          fill: inSquare ? PALETTE.durfee : PALETTE.cell,
          class: inSquare ? 'cell durfee' : 'cell',
        }),
      );
    }
  }
  if (rows === 0) {
    pieces.push(el('text', { x: 8, y: 18, 'font-size': 13, 'font-family': FONT, fill: PALETTE.muted }, 'empty partition'));
  }
  const width = rows === 0 ? 120 : pad * 2 + gutter + columns * unit - gap;
  const height = rows === 0 ? 28 : pad * 2 + rows * unit - gap;
  return svgRoot(width, height, label, pieces.join(''), 'ferrers');
}

/** "5 + 4 + 1 + 1", or "5 + 4 + … (12 parts)" for long partitions (accessible names stay short). */
function shortSum(parts: readonly number[]): string {
  if (parts.length <= 12) return parts.join(' + ');
  return `${parts.slice(0, 8).join(' + ')} + … (${parts.length} parts)`;
}
