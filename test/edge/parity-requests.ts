/**
 * The requests every runtime must answer identically (test/edge/parity.test.ts): the app
 * in-process, the Node server over HTTP and the bundled worker in workerd.
 *
 * ONE list on purpose: extend it here when an endpoint, a family or a format is added. Every
 * request that returns samples is seeded, so the answer is a pure function of the request.
 * Requests for families that are not served yet (constrained partitions, compositions) are
 * included too: today they are 422/404 everywhere, after the samplers land they are 200
 * everywhere, and parity is checked either way.
 */
export interface ParityRequest {
  /** Path and query, e.g. "/v1/partitions?n=10&seed=a". */
  readonly path: string;
  /** Defaults to GET. */
  readonly method?: string;
  readonly headers?: Readonly<Record<string, string>>;
}

const get = (path: string): ParityRequest => ({ path });

/** Unrestricted partitions of small and medium n, every format and representation. */
const partitionSamples: ParityRequest[] = [];
for (const n of [0, 1, 2, 7, 20, 100, 1000]) {
  for (const format of ['json', 'ndjson', 'text'] as const) {
    partitionSamples.push(get(`/v1/partitions?n=${n}&count=5&seed=parity-${n}&format=${format}`));
  }
}
for (const format of ['json', 'ndjson', 'text'] as const) {
  partitionSamples.push(get(`/v1/partitions?n=60&count=4&seed=mult&as=multiplicities&format=${format}`));
  partitionSamples.push(get(`/v1/partitions?n=60&count=4&seed=mult&as=parts&start=1000000&format=${format}`));
}

export const PARITY_REQUESTS: readonly ParityRequest[] = [
  ...partitionSamples,
  // Defaults (count=1, start=0, format=json), a long seed with every allowed character, parameter order.
  get('/v1/partitions?n=30&seed=default'),
  get('/v1/partitions?seed=A-z.0_9~:x&n=30&count=2'),
  get('/v1/partitions?format=text&count=2&n=30&seed=order'),
  get(`/v1/partitions?n=12&count=3&seed=${'s'.repeat(64)}`),
  // Large n and a body over the 64 KiB streaming chunk (several chunks).
  get('/v1/partitions?n=5000&count=2&seed=big&format=ndjson'),
  get('/v1/partitions?n=40&count=4000&seed=chunks&format=text'),
  get('/v1/partitions?n=40&count=3000&seed=chunks&format=json&start=17'),
  // HEAD: headers only.
  { path: '/v1/partitions?n=25&count=3&seed=head', method: 'HEAD' },
  // Constrained families (422 "not available yet" until the constrained samplers are merged).
  get('/v1/partitions?n=30&count=3&seed=c&distinct=true'),
  get('/v1/partitions?n=30&count=3&seed=c&maxPart=4&format=ndjson'),
  get('/v1/partitions?n=30&count=3&seed=c&minPart=2&maxLength=6&format=text'),
  get('/v1/partitions?n=30&count=3&seed=c&length=5&as=multiplicities'),
  get('/v1/partitions?n=30&count=3&seed=c&allowed=1,2,5,10'),
  get('/v1/partitions?n=7&count=3&seed=c&allowed=2,4'),
  // Counts.
  get('/v1/partitions/count?n=0'),
  get('/v1/partitions/count?n=100'),
  get('/v1/partitions/count?n=5000'),
  get('/v1/partitions/count?n=50001'),
  get('/v1/partitions/count?n=30&distinct=true'),
  get('/v1/partitions/count?n=30&maxPart=5&length=4'),
  // Compositions (404 until the compositions endpoints are merged, then samples).
  get('/v1/compositions?n=10&count=4&seed=comp'),
  get('/v1/compositions?n=10&count=4&seed=comp&format=ndjson'),
  get('/v1/compositions?n=10&count=4&seed=comp&format=text&length=3'),
  get('/v1/compositions/count?n=10'),
  // Meta.
  get('/healthz'),
  get('/openapi.json'),
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
  get('/healthz?verbose=1'),
  // 404.
  get('/'),
  get('/v1/partition?n=10'),
  get('/v2/partitions?n=10'),
  // 405 (with Allow).
  { path: '/v1/partitions?n=10&seed=x', method: 'POST' },
  { path: '/v1/partitions/count?n=10', method: 'DELETE' },
  { path: '/healthz', method: 'PUT' },
  // 422: over the interim sampler's n, over the index limit.
  get('/v1/partitions?n=100000&seed=x'),
  get('/v1/partitions?n=10&seed=x&start=1000000000000000&count=2'),
];
