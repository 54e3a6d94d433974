import seedrandom from 'seedrandom';

/**
 * Seeded generator of random and adversarial query strings for the fuzz tests. Everything is
 * drawn from one seedrandom stream (never Math.random), so a failing case is replayed by its
 * seed and index. The endpoint list comes from the app's own OpenAPI document, so endpoints
 * added later are fuzzed without changes here.
 */

export interface EndpointSpec {
  readonly path: string;
  readonly params: readonly string[];
}

export interface FuzzCase {
  readonly index: number;
  readonly path: string;
  /** The raw query string, without "?": may be malformed on purpose. */
  readonly query: string;
}

type Rng = () => number;

const pick = <T>(rng: Rng, items: readonly T[]): T => items[Math.floor(rng() * items.length)];
const below = (rng: Rng, bound: number): number => Math.floor(rng() * bound);

/** Numbers people and broken scripts actually send, and boundaries of the stated limits. */
const NUMBER_LIKE = [
  '0', '1', '2', '3', '7', '10', '20', '42', '100', '1000', '4999', '5000', '5001', '9999', '10000', '10001',
  '50000', '50001', '999999999', '1000000000', '1000000001', '9007199254740991', '9007199254740993',
  '99999999999999999999999', '-1', '-0', '+5', '1.0', '3.5', '.5', '5.', '1e3', '1E2', '1e-3', '0x10', '0b11',
  '0o7', '007', ' 5', '5 ', '5\t', 'NaN', 'Infinity', '-Infinity', 'null', 'undefined', 'true', '[]', '{}',
  '١٢', '１２', '²', '٣', '⅔', '1_000', '1,000', '10%', '', '  ',
];

const WORDS = [
  'json', 'ndjson', 'text', 'JSON', 'xml', 'parts', 'multiplicities', 'blocks', 'rgs', 'true', 'false', 'TRUE', 'yes', 'no', '1', '0',
  'demo', 'a', 'seed-with.ok_chars~:', 'x'.repeat(64), 'y'.repeat(65), 'white space', 'é', '😀', '\u0000', '\u202e',
  '<script>alert(1)</script>', '"quoted"', "'; DROP TABLE", '../../etc/passwd', '%', '%%', '%zz', '%E0%A4%A', '%00',
  '%FF', '%ED%A0%80', '%C0%AF', '%2e%2e%2f', '%u0041', '&', '=', '==', '+', '#frag',
];

const LISTS = ['1,2,5', '1', '2,4', '5,1,1,2', '1,,2', ',', '1,', ',1', '1,2,a', '0,1', '-1,2', '1.5,2', '1;2', '1 2', '1000000001,2'];

const ODD_KEYS = [
  '__proto__', 'constructor', 'toString', 'hasOwnProperty', 'valueOf', 'prototype', '__defineGetter__', '',
  'n[]', 'N', 'Count', 'n ', ' n', 'n.x', 'n%00', '%6E', 'c%6Fnt', 'seed[0]', 'cout', 'sed', 'lenght', 'max_part',
  '😀', 'é', '\u0000', 'a'.repeat(65), 'k'.repeat(300),
];

function randomText(rng: Rng, length: number): string {
  let out = '';
  for (let i = 0; i < length; i++) {
    const r = rng();
    if (r < 0.6) out += String.fromCharCode(0x21 + below(rng, 0x5e)); // printable ASCII
    else if (r < 0.8) out += String.fromCharCode(below(rng, 0x20)); // control characters
    else if (r < 0.95) out += String.fromCharCode(0xa0 + below(rng, 0xd700)); // BMP, below the surrogates
    else out += String.fromCharCode(0xd800 + below(rng, 0x800)); // lone surrogates
  }
  return out;
}

/** A random value for `key`, drawn from the value kinds above; sometimes huge. */
function randomValue(rng: Rng, key: string): string {
  const r = rng();
  if (r < 0.005) return 'x'.repeat(10_000); // 10 kB value
  // Switches and choices get one of their words often enough for a good share of requests to get through.
  if ((key === 'distinct' || key === 'conjugate') && r < 0.5) return pick(rng, ['true', 'false']);
  if ((key === 'format' || key === 'as' || key === 'style') && r < 0.5) return pick(rng, ['json', 'ndjson', 'text', 'parts', 'multiplicities', 'blocks', 'rgs', 'svg']);
  if (r < 0.01) return pick(rng, NUMBER_LIKE).repeat(1 + below(rng, 3000));
  if (r < 0.05) return randomText(rng, 1 + below(rng, 40));
  if (r < 0.1) return Array.from({ length: 1 + below(rng, 1200) }, () => String(1 + below(rng, 50))).join(',');
  if (r < 0.3) return pick(rng, WORDS);
  if (r < 0.35) return pick(rng, LISTS);
  if (key === 'parts' && r < 0.8) {
    // A plausible member: a few small parts, largest first (a partition) or shuffled (a composition, or out of order).
    const parts = Array.from({ length: below(rng, 6) }, () => 1 + below(rng, 9));
    return (r < 0.6 ? parts.sort((a, b) => b - a) : parts).join(',');
  }
  if (key === 'rgs' && r < 0.8) {
    // A plausible set partition: a restricted growth string of up to 7 items (or, a third of the time, any small numbers).
    const rgs: number[] = [];
    let max = -1;
    for (let i = below(rng, 8); i > 0; i--) {
      const v = r < 0.6 ? below(rng, max + 2) : below(rng, 4);
      rgs.push(v);
      max = Math.max(max, v);
    }
    return rgs.join(',');
  }
  if (key === 'n' || key === 'count' || key === 'start' || key === 'rank' || key.endsWith('Part') || key.endsWith('ength') || key.endsWith('locks') || key.endsWith('BlockSize')) {
    // Mostly small, plausible values so that a good share of requests succeed and get checked.
    if (r < 0.8) return String(below(rng, r < 0.7 ? 30 : 400));
  }
  return pick(rng, NUMBER_LIKE);
}

/** How a key or value is written into the query: as is (possibly breaking it), or percent-encoded. */
function encode(rng: Rng, text: string): string {
  const r = rng();
  if (r < 0.6) return encodeURIComponentLoose(text);
  if (r < 0.9) return text; // raw: '&', '=', '%' and '#' in here make the query malformed on purpose
  return [...text].map((ch) => (rng() < 0.5 ? encodeURIComponentLoose(ch) : ch)).join('');
}

/** encodeURIComponent that does not throw on lone surrogates (it percent-encodes U+FFFD instead). */
function encodeURIComponentLoose(text: string): string {
  return encodeURIComponent(text.replace(/[\ud800-\udfff]/g, '\ufffd'));
}

/** One query string for an endpoint: a mix of its own parameters, unknown keys, repeats and garbage. */
function randomQuery(rng: Rng, endpoint: EndpointSpec): string {
  const pairs: string[] = [];
  const usual = endpoint.params;
  // One query in eight is plausible: the endpoint's own parameters with plausible values, written
  // plainly, so that the accepted side of the contract is checked on every endpoint whatever the
  // number of endpoints (the rest below are mostly refused).
  if (rng() < 0.125) return plausibleQuery(rng, usual);
  // Most queries give the required n; others are free-form.
  // (Less often where a member can be given instead: n then defaults to its sum, or must be absent.)
  if (usual.includes('n') && rng() < (usual.includes('parts') || usual.includes('rgs') ? 0.3 : 0.85)) pairs.push(`n=${encode(rng, randomValue(rng, 'n'))}`);
  // The rank endpoints' member or rank, likewise (drawn only for endpoints that have them).
  for (const key of ['parts', 'rgs', 'rank']) if (usual.includes(key) && rng() < 0.9) pairs.push(`${key}=${encode(rng, randomValue(rng, key))}`);
  const extra = below(rng, 5);
  for (let i = 0; i < extra; i++) {
    const r = rng();
    const key = r < 0.75 && usual.length > 0 ? pick(rng, usual) : r < 0.9 ? pick(rng, ODD_KEYS) : randomText(rng, 1 + below(rng, 8));
    const form = rng();
    if (form < 0.05) pairs.push(encode(rng, key)); // key without "="
    else if (form < 0.1) pairs.push(`${encode(rng, key)}=`); // empty value
    else pairs.push(`${encode(rng, key)}=${encode(rng, randomValue(rng, key))}`);
    if (rng() < 0.05) pairs.push(pairs[pairs.length - 1]); // repeat
  }
  const r = rng();
  if (r < 0.03) pairs.push(pick(rng, ['', '&', '&&', '=', '%', '%%41', '%zz=1', '%E0%A4%A=2', ';', '?', '#x']));
  if (r > 0.97) pairs.push(`pad=${'9'.repeat(5000 + below(rng, 6000))}`);
  let query = pairs.join('&');
  if (rng() < 0.03) query = query.replace(/&/g, pick(rng, ['&amp;', ';', '&&']));
  return query;
}

/** n and up to two other parameters of the endpoint, each with a value from randomValue's plausible branches. */
function plausibleQuery(rng: Rng, usual: readonly string[]): string {
  const keys = new Set<string>(usual.filter((key) => key === 'n' || key === 'parts' || key === 'rgs' || key === 'rank'));
  for (let i = below(rng, 3); i > 0 && usual.length > 0; i--) keys.add(pick(rng, usual));
  const pairs: string[] = [];
  for (const key of keys) {
    let value = randomValue(rng, key);
    for (let tries = 0; tries < 5 && !/^[0-9A-Za-z,]{1,30}$/.test(value); tries++) value = randomValue(rng, key);
    pairs.push(`${key}=${encodeURIComponentLoose(value)}`);
  }
  return pairs.join('&');
}

/** `total` fuzz cases, cycling over the endpoints so every path gets its share. */
export function* fuzzCases(seed: string, total: number, endpoints: readonly EndpointSpec[]): Generator<FuzzCase> {
  const rng = seedrandom(seed);
  for (let index = 0; index < total; index++) {
    const endpoint = endpoints[index % endpoints.length];
    yield { index, path: endpoint.path, query: randomQuery(rng, endpoint) };
  }
}
