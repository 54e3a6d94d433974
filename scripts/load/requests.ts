/**
 * The requests of each load phase. Seeds differ per request, so nothing can be served from a
 * cache; the bad requests are the mistakes real clients make (typos, repeats, malformed and
 * out-of-range values), each of which must get a 4xx.
 */
export const BAD_QUERIES = [
  'n=abc',
  'n=5&n=6',
  'cout=5&n=5',
  'n=1e3',
  'n=-4',
  'n=10&format=xml',
  'n=10&seed=not%20a%20seed',
  'n=10000000000',
  'n=10&count=0',
  '__proto__=1&n=5',
];

export const isOk = (status: number): boolean => status === 200;
export const isClientError = (status: number): boolean => status >= 400 && status < 500;

export function sampleRequest(n: number, count: number, tag: string) {
  return (i: number) => ({ path: `/v1/partitions?n=${n}&count=${count}&seed=${tag}-${i}`, ok: isOk });
}

/** 10% bad requests (every tenth), the rest like `good`. */
export function mixedRequest(n: number, tag: string) {
  const good = sampleRequest(n, 1, tag);
  return (i: number) => (i % 10 === 9 ? { path: `/v1/partitions?${BAD_QUERIES[(i / 10) % BAD_QUERIES.length | 0]}`, ok: isClientError } : good(i));
}

export const bareRequest = () => ({ path: '/', ok: isOk });
