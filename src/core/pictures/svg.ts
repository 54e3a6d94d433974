/**
 * Small helpers for writing SVG as text. Drawings use presentation attributes only (fill,
 * stroke, font-size...), never `style` attributes or <style> elements, so they render unchanged
 * under a Content-Security-Policy without 'unsafe-inline', inline in a page or on their own.
 */

/** The palette shared by every drawing (the page's stylesheet may override it through classes). */
export const PALETTE = {
  ink: '#1f1d2b',
  muted: '#5b5868',
  grid: '#d9d3c7',
  cell: '#17676c',
  durfee: '#b5461b',
  expected: '#b5461b',
  observed: '#17676c',
  paper: '#fbf8f2',
} as const;

export const FONT = 'system-ui, -apple-system, Segoe UI, Roboto, sans-serif';

/**
 * The grid of unit cells shared by the partition and composition drawings: the cell size that
 * fits `longest` cells in `fit` pixels (4 to 26), the gap between cells, their corner radius,
 * the label font size, the padding, and whether cells are large enough to label.
 */
export function cellGrid(longest: number, fit: number, hasCells: boolean) {
  const unit = Math.max(4, Math.min(26, Math.floor(fit / Math.max(longest, 1))));
  return {
    unit,
    gap: Math.max(1, Math.round(unit * 0.14)),
    radius: Math.max(0, Math.round(unit * 0.2 * 10) / 10),
    labels: unit >= 14 && hasCells,
    fontSize: Math.round(unit * 0.55),
    pad: Math.max(2, Math.round(unit * 0.25)),
  };
}

/** Escapes text for XML character data and attribute values. */
export function escapeXml(text: string): string {
  return text.replace(/[&<>"']/g, (ch) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&apos;' })[ch]!);
}

/** A coordinate with at most two decimals (keeps files small and deterministic). */
export function num(x: number): string {
  return String(Math.round(x * 100) / 100);
}

/** An element with attributes (undefined ones dropped) and optional children. */
export function el(name: string, attrs: Record<string, string | number | undefined>, children?: string): string {
  const attributes = Object.entries(attrs)
    .filter(([, v]) => v !== undefined)
    .map(([k, v]) => ` ${k}="${typeof v === 'number' ? num(v) : escapeXml(v as string)}"`)
    .join('');
  return children === undefined ? `<${name}${attributes}/>` : `<${name}${attributes}>${children}</${name}>`;
}

/** The root element; `label` is the accessible name (aria-label and <title>). */
export function svgRoot(width: number, height: number, label: string, body: string, className?: string): string {
  return el(
    'svg',
    { xmlns: 'http://www.w3.org/2000/svg', viewBox: `0 0 ${num(width)} ${num(height)}`, width, height, role: 'img', 'aria-label': label, class: className },
    `${el('title', {}, escapeXml(label))}${body}`,
  );
}
