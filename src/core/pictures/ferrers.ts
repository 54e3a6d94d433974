import { LimitExceededError } from '../errors.js';

/**
 * Ferrers diagrams: a partition drawn as left-aligned rows of cells, one row per part, largest
 * part on top (English convention; Andrews, The Theory of Partitions, 1976, §1.3). Its conjugate
 * is the diagram read by columns: λ'_j = #{i : λ_i >= j}. Its Durfee square is the largest d×d
 * square in the top-left corner, d = max{i : λ_i >= i} (also called the rank square; Andrews
 * §2.3), drawn highlighted.
 */

/** Sizes above which a diagram is not drawn cell by cell. */
export interface DiagramLimits {
  readonly maxRows: number;
  readonly maxColumns: number;
  readonly maxCells: number;
}

export const DIAGRAM_LIMITS: DiagramLimits = { maxRows: 200, maxColumns: 200, maxCells: 40_000 };

/**
 * Refuses (before any drawing) a diagram with more rows, columns or cells than the limits.
 * Rows and columns are symmetric under conjugation, so one check covers both drawings.
 */
export function checkDiagramLimits(rows: number, columns: number, cells: number, limits: DiagramLimits = DIAGRAM_LIMITS): void {
  if (rows > limits.maxRows) {
    throw new LimitExceededError(`this diagram has ${rows} rows (parts); diagrams are drawn with at most ${limits.maxRows} rows and ${limits.maxColumns} columns`, `rows <= ${limits.maxRows}`);
  }
  if (columns > limits.maxColumns) {
    throw new LimitExceededError(`this diagram has ${columns} columns (its largest part); diagrams are drawn with at most ${limits.maxRows} rows and ${limits.maxColumns} columns`, `columns <= ${limits.maxColumns}`);
  }
  if (cells > limits.maxCells) {
    throw new LimitExceededError(`this diagram has ${cells} cells; diagrams are drawn with at most ${limits.maxCells} cells`, `cells <= ${limits.maxCells}`);
  }
}

/** The conjugate partition of parts given largest first (λ'_j = #{i : λ_i >= j}). */
export function conjugateParts(parts: readonly number[]): number[] {
  const largest = parts.length > 0 ? parts[0] : 0;
  const out: number[] = new Array(largest).fill(0);
  for (const part of parts) for (let j = 0; j < part; j++) out[j]++;
  return out;
}

/** Side of the Durfee square: the largest d with λ_d >= d. */
export function durfeeSide(parts: readonly number[]): number {
  let d = 0;
  while (d < parts.length && parts[d] >= d + 1) d++;
  return d;
}

/** The parts sorted largest first (a diagram is defined for any order of the same parts). */
export function sortedParts(parts: readonly number[]): number[] {
  return [...parts].sort((a, b) => b - a);
}

/** The diagram as text: one line per part, `cell` repeated part times. Empty partition: no lines. */
export function ferrersText(parts: readonly number[], cell = '#'): string {
  return parts.map((part) => `${cell.repeat(part)}\n`).join('');
}
