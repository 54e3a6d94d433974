import { describe, expect, it } from 'vitest';
import { appClient } from './helpers.js';

const { get } = appClient();

describe('constraints on /v1/partitions and /v1/partitions/count', () => {
  it('echoes the family normalised (allowed sorted and de-duplicated, default minPart dropped)', async () => {
    const body = await (await get('/v1/partitions?n=40&allowed=10,5,2,1,5&minPart=1&count=3&seed=norm')).json();
    expect(body.family).toEqual({ kind: 'partition', n: 40, allowed: [1, 2, 5, 10] });
    for (const parts of body.samples as number[][]) {
      expect(parts.reduce((a, b) => a + b, 0)).toBe(40);
      for (const p of parts) expect([1, 2, 5, 10]).toContain(p);
    }
  });

  it('serves every constraint kind with samples that satisfy it', async () => {
    const cases: [string, (parts: number[]) => boolean][] = [
      ['distinct=true', (p) => new Set(p).size === p.length],
      ['minPart=3', (p) => p.every((x) => x >= 3)],
      ['maxPart=4', (p) => p.every((x) => x <= 4)],
      ['length=5', (p) => p.length === 5],
      ['maxLength=3', (p) => p.length <= 3],
      ['distinct=true&maxPart=12&minPart=2', (p) => new Set(p).size === p.length && p.every((x) => x >= 2 && x <= 12)],
    ];
    for (const [query, holds] of cases) {
      const body = await (await get(`/v1/partitions?n=30&count=20&seed=kinds&${query}`)).json();
      for (const parts of body.samples as number[][]) {
        expect(parts.reduce((a, b) => a + b, 0)).toBe(30);
        expect(holds(parts)).toBe(true);
      }
    }
  });

  it.each([
    // OEIS A000009: q(100) = 444793 partitions of 100 into distinct parts.
    ['n=100&distinct=true', '444793'],
    // OEIS A008284: T(10, 3) = 8 partitions of 10 into exactly 3 parts.
    ['n=10&length=3', '8'],
    // OEIS A000008 (change from coins 1, 2, 5, 10): a(15) = 22.
    ['n=15&allowed=1,2,5,10', '22'],
    // Empty family: no partition of 7 into parts from {2, 4}.
    ['n=7&allowed=2,4', '0'],
  ])('counts %s = %s', async (query, count) => {
    const body = await (await get(`/v1/partitions/count?${query}`)).json();
    expect(body.count).toBe(count);
  });

  it('answers an empty family with 422 saying why', async () => {
    const response = await get('/v1/partitions?n=7&allowed=2,4&seed=empty');
    expect(response.status).toBe(422);
    expect((await response.json()).detail).toMatch(/no partition of 7 has all parts in \{2, 4\}/);
  });

  it.each(['n=10&minPart=5&maxPart=3', 'n=3&length=5'])('answers contradictory bounds (%s) with 422', async (query) => {
    const response = await get(`/v1/partitions?${query}&seed=contra`);
    expect(response.status).toBe(422);
    const body = await response.json();
    expect(body.detail.length).toBeGreaterThan(10);
  });
});
