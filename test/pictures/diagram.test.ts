import { describe, expect, it } from 'vitest';
import { conjugateParts, durfeeSide, ferrersText } from '../../src/core/pictures/ferrers.js';
import { ferrersSvg } from '../../src/core/pictures/ferrers-svg.js';
import { createApp } from '../../src/http/app.js';
import { elementsNamed, parseXml } from './support/xml.js';

const app = createApp({ drawSeed: () => 'drawn' });

function cells(svg: string): number {
  return elementsNamed(parseXml(svg), 'rect').length;
}

describe('Ferrers diagrams in the core', () => {
  it('conjugates by columns', () => {
    // By hand from the definition λ'_j = #{i : λ_i >= j}.
    expect(conjugateParts([5, 4, 1, 1])).toEqual([4, 2, 2, 2, 1]);
    expect(conjugateParts([])).toEqual([]);
    expect(conjugateParts(conjugateParts([7, 7, 3, 2, 2, 1]))).toEqual([7, 7, 3, 2, 2, 1]);
  });

  it('finds the Durfee square', () => {
    // By hand: 5,4,1,1 has λ_2 = 4 >= 2 and λ_3 = 1 < 3.
    expect(durfeeSide([5, 4, 1, 1])).toBe(2);
    expect(durfeeSide([3, 3, 3])).toBe(3);
    expect(durfeeSide([])).toBe(0);
  });

  it('draws one well-formed SVG cell per unit, the Durfee square highlighted', () => {
    for (const parts of [[1], [5, 4, 1, 1], [10, 10, 9, 3, 3, 1], Array.from({ length: 200 }, () => 200)]) {
      const n = parts.reduce((a, b) => a + b, 0);
      const svg = ferrersSvg(parts);
      const root = parseXml(svg);
      expect(root.name).toBe('svg');
      expect(root.attributes.xmlns).toBe('http://www.w3.org/2000/svg');
      expect(elementsNamed(root, 'rect')).toHaveLength(n);
      const d = durfeeSide(parts);
      expect(elementsNamed(root, 'rect').filter((r) => r.attributes.class === 'cell durfee')).toHaveLength(d * d);
      // No style attributes or elements: the drawing must render under a strict CSP.
      expect(svg).not.toMatch(/style/);
    }
    expect(cells(ferrersSvg([]))).toBe(0);
  });

  it('escapes its accessible name', () => {
    const root = parseXml(ferrersSvg([2, 1], { label: 'a < b & "c"' }));
    expect(root.attributes['aria-label']).toBe('a &lt; b &amp; &quot;c&quot;');
  });

  it('writes text rows', () => {
    expect(ferrersText([5, 4, 1, 1])).toBe('#####\n####\n#\n#\n');
    expect(ferrersText([])).toBe('');
  });
});

describe('GET /v1/partitions/diagram', () => {
  it('draws given parts as SVG, in any order, and their conjugate', async () => {
    const response = await app.request('/v1/partitions/diagram?parts=1,5,1,4');
    expect(response.status).toBe(200);
    expect(response.headers.get('content-type')).toBe('image/svg+xml; charset=utf-8');
    expect(response.headers.get('etag')).toMatch(/^"[0-9a-f]{32}"$/);
    const svg = await response.text();
    expect(cells(svg)).toBe(11);
    const rows = new Set(elementsNamed(parseXml(svg), 'rect').map((r) => r.attributes.y));
    expect(rows.size).toBe(4);
    const conjugate = await (await app.request('/v1/partitions/diagram?parts=5,4,1,1&conjugate=true')).text();
    expect(cells(conjugate)).toBe(11);
    expect(new Set(elementsNamed(parseXml(conjugate), 'rect').map((r) => r.attributes.y)).size).toBe(5);
  });

  it('writes text with style=text', async () => {
    const response = await app.request('/v1/partitions/diagram?parts=5,4,1,1&style=text');
    expect(response.headers.get('content-type')).toBe('text/plain; charset=utf-8');
    expect(await response.text()).toBe('#####\n####\n#\n#\n');
    const conjugate = await app.request('/v1/partitions/diagram?parts=5,4,1,1&style=text&conjugate=true');
    expect(await conjugate.text()).toBe('####\n##\n##\n##\n#\n');
  });

  it('draws sample index of a seed: the very partition GET /v1/partitions returns', async () => {
    const listed = await (await app.request('/v1/partitions?n=30&seed=pic&start=3&count=1')).json();
    const parts: number[] = listed.samples[0];
    const text = await (await app.request('/v1/partitions/diagram?n=30&seed=pic&index=3&style=text')).text();
    expect(text).toBe(parts.map((p) => `${'#'.repeat(p)}\n`).join(''));
    const svg = await app.request('/v1/partitions/diagram?n=30&seed=pic&index=3');
    expect(svg.headers.get('partsmith-seed')).toBe('pic');
    expect(cells(await svg.text())).toBe(30);
    const conjugate = await (await app.request('/v1/partitions/diagram?n=30&seed=pic&index=3&conjugate=true')).text();
    expect(cells(conjugate)).toBe(30);
  });

  it('draws a seed when none is given, and says which (not cacheable)', async () => {
    const response = await app.request('/v1/partitions/diagram?n=12');
    expect(response.status).toBe(200);
    expect(response.headers.get('partsmith-seed')).toBe('drawn');
    expect(response.headers.get('cache-control')).toBe('no-store');
  });

  it('refuses diagrams over the stated limits with 422 naming the limit', async () => {
    const cases: [string, RegExp][] = [
      ['parts=201', /201 columns.*at most 200 rows and 200 columns/],
      [`parts=${Array.from({ length: 201 }, () => 1).join(',')}`, /201 rows.*at most 200 rows/],
      ['n=40001&seed=a', /40001 cells; diagrams are drawn with at most 40000 cells/],
    ];
    for (const [query, message] of cases) {
      const response = await app.request(`/v1/partitions/diagram?${query}`);
      expect(response.status, query).toBe(422);
      expect((await response.json()).detail).toMatch(message);
    }
    // The largest drawable diagram: 200 x 200.
    const square = await app.request(`/v1/partitions/diagram?parts=${Array.from({ length: 200 }, () => 200).join(',')}&style=text`);
    expect(square.status).toBe(200);
  });

  it('rejects contradictory or malformed queries with 400', async () => {
    for (const query of ['', 'parts=5,4&n=9', 'parts=5,0', 'parts=5,,4', 'parts=5,4&seed=a', 'parts=5&distinct=true', 'n=5&style=png', 'parts=3&conjugate=yes']) {
      const response = await app.request(`/v1/partitions/diagram?${query}`);
      expect(response.status, query).toBe(400);
    }
  });

  it('is described in the OpenAPI document', async () => {
    const doc = await (await app.request('/openapi.json')).json();
    expect(Object.keys(doc.paths)).toEqual(expect.arrayContaining(['/v1/partitions/diagram', '/v1/partitions/check']));
    expect(Object.keys(doc.paths)).not.toContain('/');
  });
});
