import { describe, expect, it } from 'vitest';
import { compositionSvg } from '../../src/core/pictures/composition-svg.js';
import { elementsNamed, parseXml } from './support/xml.js';

/** The page's picture of a composition: a bargraph, one column per part in order, one cell per unit. */
describe('compositionSvg', () => {
  it('is well-formed SVG with exactly n cells, one column per part, in order', () => {
    const parts = [3, 1, 4, 1, 5];
    const svg = compositionSvg(parts);
    const root = parseXml(svg);
    const cells = elementsNamed(root, 'rect');
    expect(cells).toHaveLength(14);
    // Columns left to right in the composition's order: cells grouped by x, counted.
    const columns = new Map<string, number>();
    for (const cell of cells) columns.set(cell.attributes.x, (columns.get(cell.attributes.x) ?? 0) + 1);
    const xs = [...columns.keys()].map(Number).sort((a, b) => a - b);
    expect(xs.map((x) => columns.get(String(x)))).toEqual(parts);
    expect(root.attributes.role).toBe('img');
    expect(root.attributes['aria-label']).toBe('Composition 3 + 1 + 4 + 1 + 5 (n = 14), one column per part in order');
    expect(svg).not.toMatch(/style/);
  });

  it('marks a part 0 on the baseline and draws the empty composition', () => {
    const weak = parseXml(compositionSvg([2, 0, 1]));
    expect(elementsNamed(weak, 'rect')).toHaveLength(3);
    expect(elementsNamed(weak, 'line')).toHaveLength(1);
    const empty = parseXml(compositionSvg([]));
    expect(elementsNamed(empty, 'rect')).toHaveLength(0);
    expect(empty.attributes['aria-label']).toBe('The empty composition (n = 0)');
  });
});
