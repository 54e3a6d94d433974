import { createApp } from './src/http/app.ts';
const app = createApp();
for (const q of ['/v1/set-partitions?n=6&count=3&seed=demo','/v1/set-partitions?n=6&count=3&seed=demo&as=rgs&format=text','/v1/set-partitions?n=6&count=2&seed=demo&format=ndjson&blocks=2','/v1/set-partitions?n=9&count=2&seed=demo&format=text&minBlockSize=2&maxBlockSize=3','/v1/set-partitions/count?n=50','/v1/set-partitions/count?n=10&blocks=12','/v1/set-partitions?n=10&minBlockSize=5&maxBlockSize=3&seed=x','/v1/set-partitions?n=10&blocks=3&minBlockSize=4&seed=x','/v1/set-partitions?n=10&blocks=3&maxBlocks=4','/v1/set-partitions?n=20000000','/v1/set-partitions?n=0&seed=a','/v1/set-partitions/count?n=3000','/v1/set-partitions?n=1000000&seed=a&as=rgs&format=text']) {
  const r = await app.fetch(new Request('http://x'+q)); const t = await r.text();
  console.log(r.status, q, r.headers.get('partsmith-method'), t.slice(0, 300));
}
