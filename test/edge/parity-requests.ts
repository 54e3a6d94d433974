/**
 * The requests every runtime must answer identically (test/edge/parity.test.ts): the app
 * in-process, the Node server over HTTP and the bundled worker in workerd.
 *
 * ONE list on purpose: extend it here when an endpoint, a family or a format is added. Every
 * request that returns samples is seeded, so the answer is a pure function of the request.
 * `SERVED` lists the requests that must answer 200 (every family and picture the service
 * offers); the rest are the error cases (400, 404, 405, 422).
 */
export interface ParityRequest {
  /** Path and query, e.g. "/v1/partitions?n=10&seed=a". */
  readonly path: string;
  /** Defaults to GET. */
  readonly method?: string;
  readonly headers?: Readonly<Record<string, string>>;
}

const get = (path: string): ParityRequest => ({ path });
const FORMATS = ['json', 'ndjson', 'text'] as const;

/** Unrestricted partitions of small and medium n, every format and representation. */
const partitionSamples: ParityRequest[] = [];
for (const n of [0, 1, 2, 7, 20, 100, 1000]) {
  for (const format of FORMATS) partitionSamples.push(get(`/v1/partitions?n=${n}&count=5&seed=parity-${n}&format=${format}`));
}
for (const format of FORMATS) {
  partitionSamples.push(get(`/v1/partitions?n=60&count=4&seed=mult&as=multiplicities&format=${format}`));
  partitionSamples.push(get(`/v1/partitions?n=60&count=4&seed=mult&as=parts&start=1000000&format=${format}`));
}

/** Every partition constraint on its own and combined, each with its count. */
const PARTITION_CONSTRAINTS = ['distinct=true', 'minPart=3', 'maxPart=4', 'length=5', 'maxLength=6', 'allowed=1,2,5,10', 'minPart=2&maxPart=9&maxLength=6', 'distinct=true&allowed=1,2,3,5,8,13'];
const constrainedPartitions: ParityRequest[] = [];
PARTITION_CONSTRAINTS.forEach((constraint, k) => {
  const format = FORMATS[k % FORMATS.length];
  constrainedPartitions.push(get(`/v1/partitions?n=30&count=3&seed=c&${constraint}&format=${format}`));
  constrainedPartitions.push(get(`/v1/partitions/count?n=30&${constraint}`));
});
constrainedPartitions.push(get('/v1/partitions?n=30&count=3&seed=c&length=5&as=multiplicities'));
constrainedPartitions.push(get('/v1/partitions?n=2000&count=2&seed=c&distinct=true&format=ndjson'));
constrainedPartitions.push(get('/v1/partitions?n=400&count=2&seed=c&maxPart=10&minPart=2&format=text'));

/** Compositions: unrestricted, exact length, weak (minPart=0), bounded, allowed sizes; every format; counts. */
const COMPOSITION_CONSTRAINTS = ['', 'length=4', 'length=5&minPart=0', 'maxPart=3', 'allowed=1,3,4', 'minPart=2&maxPart=5', 'length=4&allowed=2,5,7'];
const compositions: ParityRequest[] = [];
COMPOSITION_CONSTRAINTS.forEach((constraint, k) => {
  const extra = constraint ? `&${constraint}` : '';
  compositions.push(get(`/v1/compositions/count?n=20${extra}`));
  if (k < 2) {
    for (const format of FORMATS) compositions.push(get(`/v1/compositions?n=20&count=4&seed=comp${extra}&format=${format}`));
  } else {
    compositions.push(get(`/v1/compositions?n=20&count=4&seed=comp${extra}&format=${FORMATS[k % FORMATS.length]}`));
  }
});
compositions.push(
  get('/v1/compositions?n=0&count=2&seed=comp'),
  get('/v1/compositions?n=20&count=4&seed=comp&length=4&format=text&start=999'),
  get('/v1/compositions?n=100000&count=1&seed=big&format=ndjson'),
  get('/v1/compositions?n=3000&count=2&seed=big&maxPart=4&format=text'),
  get('/v1/compositions/count?n=10'),
  get('/v1/compositions/count?n=1000&allowed=1,2'),
  { path: '/v1/compositions?n=9&count=2&seed=head', method: 'HEAD' },
);

/** Set partitions: every constraint shape, both forms, every format, counts; large n; errors are below. */
const SET_PARTITION_CONSTRAINTS = ['', 'blocks=3', 'maxBlocks=2', 'minBlockSize=2', 'maxBlockSize=3', 'minBlockSize=2&maxBlockSize=4', 'blocks=4&minBlockSize=2', 'maxBlocks=5&maxBlockSize=3'];
const setPartitions: ParityRequest[] = [];
SET_PARTITION_CONSTRAINTS.forEach((constraint, k) => {
  const extra = constraint ? `&${constraint}` : '';
  setPartitions.push(get(`/v1/set-partitions?n=12&count=3&seed=sp${extra}&format=${FORMATS[k % FORMATS.length]}${k % 2 === 1 ? '&as=rgs' : ''}`));
  setPartitions.push(get(`/v1/set-partitions/count?n=20${extra}`));
});
for (const format of FORMATS) {
  setPartitions.push(get(`/v1/set-partitions?n=9&count=4&seed=sp-forms&as=blocks&format=${format}`));
  setPartitions.push(get(`/v1/set-partitions?n=9&count=4&seed=sp-forms&as=rgs&format=${format}&start=1000000`));
}
setPartitions.push(
  get('/v1/set-partitions?n=0&count=2&seed=sp'),
  get('/v1/set-partitions?n=20000&count=1&seed=big&as=rgs'),
  get('/v1/set-partitions?n=5000&count=2&seed=big&blocks=10&format=ndjson'),
  get('/v1/set-partitions?n=3000&count=1&seed=big&minBlockSize=2&format=text'),
  get('/v1/set-partitions?n=2000&count=1&seed=big&maxBlockSize=8&as=rgs&format=text'),
  get('/v1/set-partitions/count?n=50'),
  get('/v1/set-partitions/count?n=30&blocks=15'),
  { path: '/v1/set-partitions?n=9&count=2&seed=head', method: 'HEAD' },
);
/** Ranks: listings in every format and representation (one over several stream chunks), rank and unrank (ranks past 2^53 too). */
const ranks: ParityRequest[] = [
  ...FORMATS.map((format) => get(`/v1/partitions/list?n=12&maxLength=4&format=${format}`)),
  ...FORMATS.map((format) => get(`/v1/compositions/list?n=10&allowed=1,2,3&start=100&count=50&format=${format}`)),
  get('/v1/partitions/list?n=20&distinct=true&as=multiplicities&format=text'),
  get('/v1/partitions/list?n=40&minPart=2&maxPart=9&count=3000&format=ndjson'),
  get('/v1/compositions/list?n=90&start=1000000000000000000000&count=5'),
  get('/v1/partitions/rank?parts=5,4,2,1'),
  get('/v1/partitions/rank?parts=9,7,7,1&n=24&allowed=1,7,9'),
  get('/v1/compositions/rank?parts=0,3,0&length=3&minPart=0'),
  get('/v1/partitions/unrank?n=400&rank=1234567890123456789'), // p(400) = 6727090051741041926 (OEIS A000041, from memory): a rank past 2^53
  get('/v1/partitions/unrank?n=30&length=5&rank=17&as=multiplicities'),
  get('/v1/compositions/unrank?n=200&rank=98765432109876543210987654321'),
  get('/v1/compositions/unrank?n=30&length=4&maxPart=12&rank=500'),
  // Set partitions in the order of their restricted growth strings: both forms, every format.
  ...FORMATS.map((format) => get(`/v1/set-partitions/list?n=6&maxBlocks=3&format=${format}`)),
  ...FORMATS.map((format) => get(`/v1/set-partitions/list?n=9&minBlockSize=2&as=rgs&start=100&count=40&format=${format}`)),
  get('/v1/set-partitions/rank?rgs=0,1,0,2,1'),
  get('/v1/set-partitions/rank?rgs=0,0,1,1,2,2&minBlockSize=2&maxBlockSize=3'),
  get('/v1/set-partitions/unrank?n=40&rank=123456789012345678901234567890'), // B_40 ~ 1.6e35 (OEIS A000110): a rank past 2^53
  get('/v1/set-partitions/unrank?n=12&blocks=3&rank=500&as=rgs'),
  get('/v1/set-partitions/unrank?n=5000&blocks=3&rank=12345678901234567890&as=rgs'), // 5000 items: counted without recursion (a worker's stack)
];

/** Pictures: Ferrers diagrams (svg, text, conjugate; parts= and n/seed/index), distribution checks (json, svg). */
const pictures: ParityRequest[] = [
  get('/v1/partitions/diagram?parts=5,4,1,1'),
  get('/v1/partitions/diagram?parts=5,4,1,1&style=text'),
  get('/v1/partitions/diagram?parts=1,4,1,5&conjugate=true'),
  get('/v1/partitions/diagram?parts=6,3,3,2&conjugate=true&style=text'),
  get('/v1/partitions/diagram?n=20&seed=d&index=3'),
  get('/v1/partitions/diagram?n=20&seed=d&index=3&style=text'),
  get('/v1/partitions/diagram?n=40&seed=d&index=7&distinct=true&conjugate=true'),
  get('/v1/partitions/diagram?n=30&seed=d&maxPart=5&length=8&style=text'),
  get('/v1/partitions/check?n=20&samples=300&seed=chk'),
  get('/v1/partitions/check?n=20&samples=300&seed=chk&format=svg'),
  get('/v1/partitions/check?n=30&samples=200&seed=chk&distinct=true'),
  get('/v1/partitions/check?n=30&samples=200&seed=chk&maxPart=6&format=svg'),
  get('/v1/compositions/check?n=30&samples=300&seed=chk'),
  get('/v1/compositions/check?n=30&samples=300&seed=chk&format=svg'),
];

/** The page (seeded, so server-rendered identically) and its assets. */
const page: ParityRequest[] = [
  get('/'),
  get('/?family=partitions&n=12&count=3&seed=page&check=true&samples=300'),
  get('/?family=partitions&n=30&count=2&seed=page&maxPart=5'),
  get('/?family=compositions&n=12&count=3&seed=page&check=true&samples=300'),
  get('/?family=compositions&n=9&count=2&seed=page&length=4&minPart=0'),
  get('/?family=set-partitions&n=10&count=3&seed=page&minBlockSize=2'),
  get('/?family=partitions&n=12&maxLength=4&mode=list&count=10&start=20'),
  get('/?family=compositions&n=10&allowed=1,2&mode=list&count=48'),
  get('/?n=abc&count=4'),
  get('/assets/page.css'),
  get('/assets/page.js'),
  get('/favicon.ico'),
];

/** Requests that must answer 200 on every runtime. */
export const SERVED: readonly ParityRequest[] = [
  ...partitionSamples,
  ...constrainedPartitions,
  ...compositions,
  ...setPartitions,
  ...ranks,
  ...pictures,
  ...page,
  // Defaults (count=1, start=0, format=json), a long seed with every allowed character, parameter order.
  get('/v1/partitions?n=30&seed=default'),
  get('/v1/partitions?seed=A-z.0_9~:x&n=30&count=2'),
  get('/v1/partitions?format=text&count=2&n=30&seed=order'),
  get(`/v1/partitions?n=12&count=3&seed=${'s'.repeat(64)}`),
  // Large n and a body over the 64 KiB streaming chunk (several chunks).
  get('/v1/partitions?n=5000&count=2&seed=big&format=ndjson'),
  get('/v1/partitions?n=100000&count=1&seed=big'),
  get('/v1/partitions?n=40&count=4000&seed=chunks&format=text'),
  get('/v1/partitions?n=40&count=3000&seed=chunks&format=json&start=17'),
  // HEAD: headers only.
  { path: '/v1/partitions?n=25&count=3&seed=head', method: 'HEAD' },
  // Counts.
  get('/v1/partitions/count?n=0'),
  get('/v1/partitions/count?n=100'),
  get('/v1/partitions/count?n=5000'),
  get('/v1/partitions/count?n=50001'),
  // Meta.
  get('/healthz'),
  get('/openapi.json'),
];

export const PARITY_REQUESTS: readonly ParityRequest[] = [
  ...SERVED,
  // 400: missing, malformed, unknown, repeated parameters, bad seed, bad enum, length with maxLength.
  get('/v1/partitions'),
  get('/v1/partitions?n=&seed=x'),
  get('/v1/partitions?n=1e3&seed=x'),
  get('/v1/partitions?n=-4&seed=x'),
  get('/v1/partitions?n=10&cout=5&seed=x'),
  get('/v1/partitions?n=10&n=11&seed=x'),
  get('/v1/partitions?n=10&seed=no%20spaces'),
  get('/v1/partitions?n=10&seed=x&format=xml'),
  get('/v1/partitions?n=10&seed=x&as=ferrers'),
  get('/v1/partitions?n=10&seed=x&count=10001'),
  get('/v1/partitions?n=10&seed=x&length=2&maxLength=3'),
  get('/v1/partitions/count?n=10&seed=x'),
  get('/v1/compositions?n=10&seed=x&minPart=0'),
  get('/v1/compositions?n=10&seed=x&as=multiplicities'),
  get('/v1/partitions/diagram?parts=3,1&n=4'),
  get('/v1/partitions/check?n=20&samples=0'),
  get('/v1/compositions/check?n=20&maxPart=3'),
  get('/v1/set-partitions?n=10000001&seed=x'),
  get('/v1/set-partitions?n=10&seed=x&blocks=3&maxBlocks=4'),
  get('/v1/set-partitions?n=10&seed=x&as=parts'),
  get('/healthz?verbose=1'),
  get('/v1/partitions/rank?parts=1,a'),
  get('/v1/partitions/unrank?n=5&rank=-2'),
  get('/v1/set-partitions/rank?rgs=0,x'),
  get('/v1/set-partitions/unrank?n=5&rank=1&as=parts'),
  // 404.
  get('/index.html'),
  get('/v1/partition?n=10'),
  get('/v2/partitions?n=10'),
  // 405 (with Allow).
  { path: '/v1/partitions?n=10&seed=x', method: 'POST' },
  { path: '/v1/partitions/count?n=10', method: 'DELETE' },
  { path: '/v1/compositions?n=10&seed=x', method: 'PUT' },
  { path: '/healthz', method: 'PUT' },
  { path: '/', method: 'POST' },
  // 422: empty families, contradictory bounds, over the index limit, over the count limit of a count.
  get('/v1/partitions?n=7&count=3&seed=c&allowed=2,4'),
  get('/v1/partitions?n=10&seed=x&minPart=6&maxPart=4'),
  get('/v1/compositions?n=7&seed=x&allowed=2,4&length=2'),
  get('/v1/partitions?n=10&seed=x&start=1000000000000000&count=2'),
  get('/v1/set-partitions?n=10&seed=x&blocks=11'),
  get('/v1/set-partitions?n=10&seed=x&minBlockSize=4&maxBlockSize=3'),
  get('/v1/set-partitions?n=10&seed=x&blocks=3&minBlockSize=4'),
  get('/v1/set-partitions/count?n=5000'),
  // 422 of the rank endpoints: not a member (out of order, wrong sum), a rank or start past the end, a table over its limit.
  get('/v1/partitions/rank?parts=1,2,3'),
  get('/v1/compositions/rank?parts=2,2&n=5'),
  get('/v1/partitions/unrank?n=12&rank=77'),
  get('/v1/compositions/list?n=5&start=17'),
  get('/v1/partitions/list?n=5000'),
  get('/v1/set-partitions/rank?rgs=0,2,1'),
  get('/v1/set-partitions/rank?rgs=0,1,2&blocks=2'),
  get('/v1/set-partitions/unrank?n=4&rank=15'),
  get('/v1/set-partitions/list?n=4&blocks=5'),
  get('/v1/set-partitions/list?n=6000'),
];
