import { describe, expect, it } from 'vitest';
import { createApp } from '../../src/http/app.js';
import { PAGE_ASSETS, PAGE_CSP } from '../../src/http/routes/page.js';
import { elementsNamed, parseXml } from './support/xml.js';

const app = createApp({ drawSeed: () => 'drawn' });

describe('GET /v1/partitions/check', () => {
  it('reports the largest-part test with statistic, pValue and test, and the boundary', async () => {
    const response = await app.request('/v1/partitions/check?n=30&samples=3000&seed=endpoint');
    expect(response.status).toBe(200);
    expect(response.headers.get('cache-control')).toContain('immutable');
    const body = await response.json();
    expect(body).toMatchObject({ family: { kind: 'partition', n: 30 }, seed: 'endpoint', samples: 3000, law: 'exact', test: 'chi-square', alpha: 1e-4 });
    expect(typeof body.statistic).toBe('number');
    // alpha = 1e-4 for this fixed seed (the service's own sampler).
    expect(body.pValue).toBeGreaterThan(1e-4);
    expect(body.passed).toBe(true);
    expect(body.largestPart.observed.reduce((a: number, b: number) => a + b, 0)).toBe(3000);
    expect(body.boundary.curve).toBe('partitions');
    expect(body.boundary.points.length).toBeGreaterThan(10);
  });

  it('draws the plots as well-formed SVG', async () => {
    const response = await app.request('/v1/partitions/check?n=30&samples=500&seed=endpoint&format=svg');
    expect(response.status).toBe(200);
    expect(response.headers.get('content-type')).toBe('image/svg+xml; charset=utf-8');
    const svg = await response.text();
    const root = parseXml(svg);
    expect(elementsNamed(root, 'svg')).toHaveLength(3);
    expect(elementsNamed(root, 'path').length).toBeGreaterThanOrEqual(2);
    expect(svg).not.toMatch(/style/);
  });

  it('above the largest-part table, plots the verdict\'s exact law first and marks the Gumbel plot as asymptotic', async () => {
    // n = 20,000 > 13,600: the verdict is the exact law of the number of 1s (JSON `quantity`).
    for (const [query, quantity] of [
      ['n=20000', 'number of 1s'],
      ['n=20000&distinct=true', 'sum of power-of-2 parts'],
    ]) {
      const json = await (await app.request(`/v1/partitions/check?${query}&samples=300&seed=endpoint`)).json();
      expect(json.largestPart.asymptotic).toBe(true);
      expect(json.quantity).toBe(json.ones.quantity);
      const svg = await (await app.request(`/v1/partitions/check?${query}&samples=300&seed=endpoint&format=svg`)).text();
      parseXml(svg);
      const titles = [...svg.matchAll(/aria-label="Histogram of the ([^"]*?) of 300 samples against the ([^;"]*);([^"]*)"/g)];
      expect(titles.map((t) => [t[1], t[2]])).toEqual([
        [quantity, 'exact law'],
        ['largest part', 'Gumbel limit'],
      ]);
      // The first plot's verdict is the JSON's headline test; the Gumbel one says it is not.
      expect(titles[0][3]).toContain(`χ² = ${json.statistic.toFixed(2)} on ${json.degreesOfFreedom ?? json.ones.degreesOfFreedom} df`);
      expect(titles[1][3]).toMatch(/asymptotic, not the verdict/);
    }
  });

  it('bounds samples and work', async () => {
    expect((await app.request('/v1/partitions/check?n=30&samples=20001')).status).toBe(400);
    const small = createApp({ limits: { workBudgetMs: 10 } });
    const refused = await small.request('/v1/partitions/check?n=300&samples=20000&seed=a');
    expect(refused.status).toBe(422);
    expect((await refused.json()).detail).toMatch(/ask for at most \d+ samples/);
  });

  it('draws a seed when none is given and does not let it be cached', async () => {
    const response = await app.request('/v1/partitions/check?n=10&samples=100');
    expect(response.headers.get('cache-control')).toBe('no-store');
    expect((await response.json()).seed).toBe('drawn');
  });
});

describe('GET / (the page)', () => {
  it('is one HTML page whose style and script are same-origin files', async () => {
    const response = await app.request('/');
    expect(response.status).toBe(200);
    expect(response.headers.get('content-type')).toBe('text/html; charset=utf-8');
    const page = await response.text();
    expect(page).toContain('<link rel="stylesheet" href="/assets/page.css">');
    expect(page).toContain('<script src="/assets/page.js" defer></script>');
    // Nothing inline for a strict CSP to block: no <style>, no style="", no inline script or handlers.
    expect(page).not.toMatch(/<style|style=|<script>|\son[a-z]+=/i);
    // Nothing from elsewhere: it works offline.
    expect(page).not.toMatch(/(src|href)="(https?:)?\/\//);
    // The first visit shows a worked example: six diagrams of partitions of 24.
    expect(page.match(/class="ferrers"/g)).toHaveLength(6);
    for (const [path, asset] of Object.entries(PAGE_ASSETS)) {
      const served = await app.request(path);
      expect(served.status).toBe(200);
      expect(served.headers.get('content-type')).toBe(asset.contentType);
    }
    expect(PAGE_CSP).toContain("script-src 'self'");
  });

  it('renders the request in the query, with snippets for the exact request', async () => {
    const page = await (await app.request('http://partsmith.test/?family=partitions&n=12&count=3&seed=s1')).text();
    expect(page.match(/class="ferrers"/g)).toHaveLength(3);
    expect(page).toContain('curl &#39;http://partsmith.test/v1/partitions?n=12&amp;count=3&amp;seed=s1&#39;');
    expect(page).toContain('partsmith partitions --n 12 --count 3 --seed s1');
    expect(page).toContain('client.partitions({ n: 12, count: 3, seed: &#39;s1&#39; })');
  });

  it('shows form errors next to their fields and unservable requests as problems', async () => {
    const invalid = await (await app.request('/?n=-3&count=2')).text();
    expect(invalid).toMatch(/id="n-error"[^>]*>Size n must be a whole number/);
    expect(invalid).toContain('aria-invalid="true"');
    const refused = await app.request('/?n=7&allowed=2,4&count=1');
    expect(refused.status).toBe(200);
    expect(await refused.text()).toContain('This request cannot be served');
  });

  it('answers other methods with 405', async () => {
    expect((await app.request('/', { method: 'POST' })).status).toBe(405);
  });
});
