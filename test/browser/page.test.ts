import { existsSync, mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { serve, type ServerType } from '@hono/node-server';
import { chromium, type Browser, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../src/http/app.js';
import { PAGE_CSP } from '../../src/http/routes/page.js';

/**
 * The page in a real browser: headless Debian chromium driven by playwright-core, against the
 * app on an ephemeral loopback port, served under the strict CSP the page promises to work with
 * (any inline script or style would show up as a console error and fail the test).
 */
const CHROMIUM = '/usr/bin/chromium';
const available = existsSync(CHROMIUM);
if (!available) console.log(`browser test skipped: ${CHROMIUM} is absent (apt-get install chromium)`);

const ARTIFACTS = join(import.meta.dirname, '..', 'artifacts');

describe.skipIf(!available)('the page in headless chromium', () => {
  let server: ServerType;
  let base = '';
  let browser: Browser;

  beforeAll(async () => {
    const app = createApp();
    const fetchWithCsp = async (request: Request): Promise<Response> => {
      const response = await app.fetch(request);
      const headers = new Headers(response.headers);
      headers.set('content-security-policy', PAGE_CSP);
      return new Response(response.body, { status: response.status, headers });
    };
    await new Promise<void>((resolve) => {
      server = serve({ fetch: fetchWithCsp, port: 0, hostname: '127.0.0.1' }, (info) => {
        base = `http://127.0.0.1:${info.port}`;
        resolve();
      });
    });
    browser = await chromium.launch({
      executablePath: CHROMIUM,
      headless: true,
      // Flags for this machine's closed network and root user (see the node machine notes).
      // launch() itself gives chromium a new empty --user-data-dir (and refuses one passed here).
      args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
    });
    mkdirSync(ARTIFACTS, { recursive: true });
  });

  afterAll(async () => {
    await browser?.close();
    await new Promise<void>((resolve) => (server ? server.close(() => resolve()) : resolve()));
  });

  function watchConsole(page: Page): string[] {
    const problems: string[] = [];
    page.on('console', (message) => {
      if (message.type() === 'error' || message.type() === 'warning') problems.push(`${message.type()}: ${message.text()}`);
    });
    page.on('pageerror', (error) => problems.push(`page error: ${error.message}`));
    page.on('requestfailed', (request) => problems.push(`request failed: ${request.url()}`));
    page.on('response', (response) => {
      if (response.status() >= 400) problems.push(`HTTP ${response.status()}: ${response.url()}`);
    });
    return problems;
  }

  it('fills the form, submits, shows diagrams, JSON, snippets and the check, with no console errors', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    await context.grantPermissions(['clipboard-read', 'clipboard-write'], { origin: base });
    const page = await context.newPage();
    const problems = watchConsole(page);
    await page.goto(`${base}/`);
    await expect(page.locator('.diagrams figure').count()).resolves.toBe(6);

    await page.getByLabel('Size n').fill('15');
    await page.getByLabel('Samples', { exact: true }).fill('4');
    await page.getByLabel('Seed').fill('browser');
    await page.getByLabel('Samples to check').fill('600');
    // Submit from the keyboard, as a person without a mouse would.
    await page.getByLabel('Seed').press('Enter');
    await page.waitForURL(/n=15/);

    const figures = page.locator('.diagrams figure');
    await expect(figures.count()).resolves.toBe(4);
    for (let i = 0; i < 4; i++) {
      // One cell per unit: every diagram of a partition of 15 has 15 cells.
      await expect(figures.nth(i).locator('svg rect').count()).resolves.toBe(15);
    }
    const json = JSON.parse((await page.locator('#json-body').textContent()) ?? '');
    expect(json.seed).toBe('browser');
    expect(json.samples).toHaveLength(4);
    await expect(page.locator('#snippet-curl').textContent()).resolves.toBe(`curl '${base}/v1/partitions?n=15&count=4&seed=browser'`);
    await expect(page.locator('.plots svg').count()).resolves.toBe(2);
    await expect(page.locator('.verdict').textContent()).resolves.toContain('Consistent with uniform');

    await page.locator('button[data-copy="snippet-curl"]').focus();
    await page.keyboard.press('Enter');
    // The clipboard write resolves asynchronously; wait for the status line to say so.
    await page.locator('#copy-status', { hasText: 'copied to the clipboard' }).waitFor({ timeout: 10_000 });

    await page.screenshot({ path: join(ARTIFACTS, 'page.png'), fullPage: true });
    expect(problems).toEqual([]);
    await context.close();
  });

  it('draws compositions: chosen in the form, one bargraph column per part, the binomial check and the real CLI and client snippets', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    const problems = watchConsole(page);
    await page.goto(`${base}/`);
    await page.getByLabel('Family').selectOption('compositions');
    await page.getByLabel('Size n').fill('12');
    await page.getByLabel('Samples', { exact: true }).fill('5');
    await page.getByLabel('Seed').fill('browser-comp');
    await page.getByLabel('Samples to check').fill('800');
    await page.getByRole('button', { name: 'Draw' }).click();
    await page.waitForURL(/family=compositions/);

    const json = JSON.parse((await page.locator('#json-body').textContent()) ?? '');
    expect(json.family).toEqual({ kind: 'composition', n: 12 });
    // The page shows exactly the API's samples for the seed.
    const api = await (await fetch(`${base}/v1/compositions?n=12&count=5&seed=browser-comp`)).json();
    expect(json.samples).toEqual(api.samples);
    const figures = page.locator('.diagrams figure');
    await expect(figures.count()).resolves.toBe(5);
    for (let i = 0; i < 5; i++) {
      // One cell per unit, one size label per part, the parts in order in the caption.
      await expect(figures.nth(i).locator('svg rect').count()).resolves.toBe(12);
      await expect(figures.nth(i).locator('svg text.part-size').count()).resolves.toBe(api.samples[i].length);
      // The rank of each sample is shown beside it (the family is small enough to rank).
      const { rank } = await (await fetch(`${base}/v1/compositions/rank?parts=${api.samples[i].join(',')}`)).json();
      await expect(figures.nth(i).locator('figcaption').textContent()).resolves.toBe(`#${i} ${api.samples[i].join(' + ')} rank ${rank}`);
      await expect(figures.nth(i).locator('svg').getAttribute('aria-label')).resolves.toContain(`Composition ${api.samples[i].join(' + ')}`);
    }
    await expect(page.locator('#samples-title').textContent()).resolves.toBe('5 compositions of 12');
    await expect(page.locator('#snippet-curl').textContent()).resolves.toBe(`curl '${base}/v1/compositions?n=12&count=5&seed=browser-comp'`);
    await expect(page.locator('#snippet-cli').textContent()).resolves.toBe('partsmith compositions --n 12 --count 5 --seed browser-comp');
    const client = (await page.locator('#snippet-client').textContent()) ?? '';
    expect(client).toContain(`import { createClient } from 'partsmith/client';`);
    expect(client).toContain(`await client.compositions({ n: 12, count: 5, seed: 'browser-comp' })`);
    await expect(page.locator('.plots svg').count()).resolves.toBe(1);
    await expect(page.locator('.verdict').textContent()).resolves.toContain('Consistent with uniform');
    await page.screenshot({ path: join(ARTIFACTS, 'page-compositions.png'), fullPage: true });

    // Weak compositions with kebab-case CLI flags; a partitions-only constraint is reported, not ignored.
    await page.goto(`${base}/?family=compositions&n=7&count=3&seed=weak&length=4&minPart=0&maxPart=3`);
    await expect(page.locator('#snippet-cli').textContent()).resolves.toBe('partsmith compositions --n 7 --count 3 --min-part 0 --max-part 3 --length 4 --seed weak');
    await expect(page.locator('.diagrams figure svg rect').count()).resolves.toBe(21);
    await page.goto(`${base}/?family=compositions&n=7&count=3&maxLength=2`);
    await expect(page.locator('#maxLength-error').textContent()).resolves.toContain('applies to partitions only');
    expect(problems).toEqual([]);
    await context.close();
  });

  it('draws set partitions: one tray per block, one disc per item, the API\'s samples and the real CLI and client snippets', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    const problems = watchConsole(page);
    await page.goto(`${base}/`);
    await page.getByLabel('Family').selectOption('set-partitions');
    await page.getByLabel('Size n').fill('10');
    await page.getByLabel('Samples', { exact: true }).fill('4');
    await page.getByLabel('Seed').fill('browser-sp');
    await page.locator('details.constraints summary').click();
    await page.getByLabel('Smallest block ≥').fill('2');
    await page.getByRole('button', { name: 'Draw' }).click();
    await page.waitForURL(/family=set-partitions/);
    const json = JSON.parse((await page.locator('#json-body').textContent()) ?? '');
    expect(json.family).toEqual({ kind: 'set-partition', n: 10, minBlockSize: 2 });
    const api = await (await fetch(`${base}/v1/set-partitions?n=10&count=4&seed=browser-sp&minBlockSize=2`)).json();
    expect(json.samples).toEqual(api.samples);
    const figures = page.locator('.diagrams figure');
    await expect(figures.count()).resolves.toBe(4);
    for (let i = 0; i < 4; i++) {
      await expect(figures.nth(i).locator('svg circle').count()).resolves.toBe(10);
      await expect(figures.nth(i).locator('svg rect.block').count()).resolves.toBe(api.samples[i].length);
    }
    await expect(page.locator('#samples-title').textContent()).resolves.toBe('4 set partitions of 10 items');
    await expect(page.locator('#snippet-cli').textContent()).resolves.toBe('partsmith set-partitions --n 10 --count 4 --min-block-size 2 --seed browser-sp');
    await expect(page.locator('#snippet-client').textContent()).resolves.toContain(`await client.setPartitions({ n: 10, count: 4, minBlockSize: 2, seed: 'browser-sp' })`);
    await page.screenshot({ path: join(ARTIFACTS, 'page-set-partitions.png'), fullPage: true });
    // A set-partition constraint on partitions is reported, not ignored.
    await page.goto(`${base}/?family=partitions&n=7&count=3&blocks=2`);
    await expect(page.locator('#blocks-error').textContent()).resolves.toContain('applies to set-partitions only');
    expect(problems).toEqual([]);
    await context.close();
  });

  it('lists a family in order in list mode, a page at a time', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    const problems = watchConsole(page);
    await page.goto(`${base}/`);
    await page.getByLabel('Size n').fill('12');
    await page.getByLabel('Samples', { exact: true }).fill('10');
    await page.getByLabel('List every member in order, with its rank').check();
    await page.getByLabel('First rank listed').fill('20');
    await page.getByRole('button', { name: 'Draw' }).click();
    await page.waitForURL(/mode=list/);
    const api = await (await fetch(`${base}/v1/partitions/list?n=12&start=20&count=10`)).json();
    const captions = await page.locator('.members figcaption').allTextContents();
    expect(captions).toEqual(api.members.map((m: { rank: string; parts: number[] }) => `rank ${m.rank} ${m.parts.join(' + ')}`));
    await page.getByRole('link', { name: 'Next 10 →' }).click();
    await page.waitForURL(/start=30/);
    await expect(page.locator('.members figcaption').first().textContent()).resolves.toMatch(/^rank 30 /);
    expect(problems).toEqual([]);
    await context.close();
  });

  it('is readable on a phone and reports form errors next to their fields', async () => {
    const context = await browser.newContext({ viewport: { width: 390, height: 844 }, deviceScaleFactor: 2, isMobile: true, hasTouch: true });
    const page = await context.newPage();
    const problems = watchConsole(page);
    await page.goto(`${base}/?family=partitions&n=30&count=4&seed=phone&check=true&samples=800`);
    await expect(page.locator('.diagrams figure').count()).resolves.toBe(4);
    // Nothing wider than the screen: no sideways scrolling of the page.
    // (A mobile browser widens its layout viewport to the content, so compare with the device width.)
    await expect(page.evaluate(() => document.documentElement.scrollWidth)).resolves.toBeLessThanOrEqual(390);
    await page.screenshot({ path: join(ARTIFACTS, 'page-phone.png'), fullPage: true });

    await page.goto(`${base}/?n=abc&count=4`);
    await expect(page.locator('#n').getAttribute('aria-invalid')).resolves.toBe('true');
    await expect(page.locator('#n-error').textContent()).resolves.toContain('whole number');
    expect(problems).toEqual([]);
    await context.close();
  });
});
