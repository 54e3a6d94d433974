import { describe, expect, it } from 'vitest';
import { appClient } from '../http/helpers.js';

const { get } = appClient();

/** The text of every figure caption on a page, tags removed. */
async function captions(path: string): Promise<string[]> {
  const page = await (await get(path)).text();
  return [...page.matchAll(/<figcaption>(.*?)<\/figcaption>/gs)].map((m) => m[1].replace(/<[^>]+>/g, ' ').replace(/\s+/g, ' ').trim());
}

describe('the page: list mode and ranks of samples', () => {
  it('lists a page of members in order, each with its rank, as the API lists them', async () => {
    const shown = await captions('/?family=partitions&n=12&maxLength=4&mode=list&count=10&start=20');
    const api = await (await get('/v1/partitions/list?n=12&maxLength=4&start=20&count=10')).json();
    expect(shown).toEqual(api.members.map((m: { rank: string; parts: number[] }) => `rank ${m.rank} ${m.parts.join(' + ')}`));
    const page = await (await get('/?family=partitions&n=12&maxLength=4&mode=list&count=10&start=20')).text();
    expect(page).toContain('rel="prev"');
    expect(page).toContain('rel="next"');
    expect(page).toMatch(/href="\/\?family=partitions&amp;mode=list&amp;n=12&amp;maxLength=4&amp;count=10&amp;start=30" rel="next"/);
    expect((page.match(/<svg/g) ?? []).length).toBeGreaterThanOrEqual(10);
  });

  it('lists compositions to the end of the family, with no next page', async () => {
    const shown = await captions('/?family=compositions&n=5&mode=list&start=12&count=48');
    // Compositions of 5 in lexicographic order: ranks 0-11 start with 1 or 2, then 3+1+1, 3+2, 4+1, 5.
    expect(shown).toEqual(['rank 12 3 + 1 + 1', 'rank 13 3 + 2', 'rank 14 4 + 1', 'rank 15 5']);
    expect(await (await get('/?family=compositions&n=5&mode=list&start=12&count=48')).text()).not.toContain('rel="next"');
  });

  it('shows the rank of each random sample beside it, as the rank endpoint gives it', async () => {
    const shown = await captions('/?family=partitions&n=24&count=4&seed=page-ranks&distinct=true');
    const samples = (await (await get('/v1/partitions?n=24&count=4&seed=page-ranks&distinct=true')).json()).samples as number[][];
    for (const [i, parts] of samples.entries()) {
      const { rank } = await (await get(`/v1/partitions/rank?parts=${parts.join(',')}&distinct=true`)).json();
      expect(shown[i]).toBe(`#${i} ${parts.join(' + ')} rank ${rank}`);
    }
  });

  it('lists set partitions in the order of their restricted growth strings, drawn as blocks, as the API lists them', async () => {
    const shown = await captions('/?family=set-partitions&n=5&blocks=2&mode=list&count=48');
    const api = await (await get('/v1/set-partitions/list?n=5&blocks=2&count=48')).json();
    // S(5, 2) = 15 (OEIS A008277), the first {1, 2, 3, 4} {5}.
    expect(api.members).toHaveLength(15);
    expect(shown).toEqual(api.members.map((m: { rank: string; blocks: number[][] }) => `rank ${m.rank} ${m.blocks.map((b) => `{${b.join(', ')}}`).join(' ')}`));
    expect(shown[0]).toBe('rank 0 {1, 2, 3, 4} {5}');
    const page = await (await get('/?family=set-partitions&n=5&blocks=2&mode=list&count=48')).text();
    expect(page).toContain('restricted growth strings');
    expect(page).toContain('partsmith list set-partitions --n 5 --blocks 2');
  });

  it('shows the rank of each random set partition beside it, and none past the page limit', async () => {
    const shown = await captions('/?family=set-partitions&n=12&count=4&seed=page-ranks&maxBlockSize=4');
    const samples = (await (await get('/v1/set-partitions?n=12&count=4&seed=page-ranks&maxBlockSize=4&as=rgs')).json()).samples as number[][];
    for (const [i, rgs] of samples.entries()) {
      const { rank } = await (await get(`/v1/set-partitions/rank?rgs=${rgs.join(',')}&maxBlockSize=4`)).json();
      expect(shown[i]).toMatch(new RegExp(`^#${i} .* rank ${rank}$`));
    }
    expect((await captions('/?family=set-partitions&n=30&count=1&seed=big'))[0]).not.toMatch(/rank/);
    expect(await (await get('/?family=set-partitions&n=30&mode=list')).text()).toMatch(/ranks set partitions of up to 24 items/);
  });

  it('says when a family is too large to rank on the page, and draws its samples without ranks', async () => {
    const page = await (await get('/?family=partitions&n=3000&mode=list')).text();
    expect(page).toMatch(/too large to rank on this page/);
    expect((await captions('/?family=partitions&n=3000&count=1&seed=big'))[0]).not.toMatch(/rank/);
  });

  it('reports a bad first rank next to its field', async () => {
    const page = await (await get('/?family=partitions&n=12&mode=list&start=-3')).text();
    expect(page).toMatch(/<p class="error" id="start-error">First rank listed must be a whole number/);
  });
});
