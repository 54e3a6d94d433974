import { el, FONT, PALETTE, svgRoot } from './svg.js';

/** Largest set partition drawn: blocks (rows) and items in one block (columns). */
export const SET_PARTITION_DRAWING_LIMITS = { maxBlocks: 60, maxBlockSize: 60 } as const;

export interface SetPartitionSvgOptions {
  readonly label?: string;
  /** Pixels the drawing's longer side is fitted into. */
  readonly fit?: number;
}

/**
 * A set partition as one row per block: each block a rounded tray holding its items as
 * numbered discs in increasing order, blocks from top to bottom by their smallest item (the
 * order the restricted growth string numbers them in). Trays alternate two shades so
 * neighbouring blocks stay distinct. Items are labelled when the discs are large enough.
 */
export function setPartitionSvg(blocks: readonly (readonly number[])[], options: SetPartitionSvgOptions = {}): string {
  const n = blocks.reduce((s, b) => s + b.length, 0);
  const widest = Math.max(1, ...blocks.map((b) => b.length));
  const label = options.label ?? (blocks.length > 0 ? `Set partition of ${n} items into ${blocks.length} block${blocks.length === 1 ? '' : 's'}: ${shortBlocks(blocks)}` : 'The empty set partition (n = 0)');
  if (blocks.length === 0) {
    return svgRoot(160, 28, label, el('text', { x: 8, y: 18, 'font-size': 13, 'font-family': FONT, fill: PALETTE.muted }, 'empty set partition'), 'set-partition');
  }
  const fit = options.fit ?? 320;
  const cell = Math.max(6, Math.min(28, Math.floor(fit / Math.max(widest + 1, blocks.length))));
  const gap = Math.max(2, Math.round(cell * 0.25));
  const pad = Math.max(2, Math.round(cell * 0.2));
  const labels = cell >= 16;
  const digits = String(n).length;
  const fontSize = Math.max(6, Math.round(cell * (digits >= 3 ? 0.38 : 0.5)));
  const rowHeight = cell + 2 * pad;
  const pieces: string[] = [];
  blocks.forEach((block, row) => {
    const y = row * (rowHeight + gap);
    const shade = row % 2 === 0 ? PALETTE.cell : PALETTE.durfee;
    pieces.push(el('rect', { x: 0, y, width: 2 * pad + block.length * cell, height: rowHeight, rx: rowHeight / 2, fill: PALETTE.paper, stroke: shade, 'stroke-width': Math.max(1, cell / 12), class: 'block' }));
    block.forEach((item, i) => {
      const cx = pad + i * cell + cell / 2;
      const cy = y + pad + cell / 2;
      pieces.push(el('circle', { cx, cy, r: cell * 0.42, fill: shade, class: 'item' }));
      if (labels) pieces.push(el('text', { x: cx, y: cy, 'dominant-baseline': 'central', 'text-anchor': 'middle', 'font-size': fontSize, 'font-family': FONT, fill: PALETTE.paper, class: 'item-label' }, String(item)));
    });
  });
  const width = 2 * pad + widest * cell;
  const height = blocks.length * (rowHeight + gap) - gap;
  return svgRoot(width, height, label, pieces.join(''), 'set-partition');
}

/** "{1, 3} {2} {4, 5}", shortened for long partitions (accessible names stay short). */
export function shortBlocks(blocks: readonly (readonly number[])[]): string {
  const shown = blocks.slice(0, 8).map((b) => `{${b.length <= 8 ? b.join(', ') : `${b.slice(0, 6).join(', ')}, … (${b.length} items)`}}`);
  return shown.join(' ') + (blocks.length > 8 ? ` … (${blocks.length} blocks)` : '');
}
