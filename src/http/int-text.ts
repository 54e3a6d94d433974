/**
 * Decimal text of large samples, written byte by byte into one buffer (doubled when full), with
 * no intermediate strings or arrays: for 10^4–10^6 numbers this is several times faster than
 * building a number[] (or a list of pairs) and stringifying it, or joining a typed array (see
 * the serving section of `npm run bench`). The text is exactly what JSON.stringify (or join)
 * gives; test/http/encode.test.ts checks it.
 *
 * The `...Bytes` writers return the ASCII bytes themselves, framed by an ASCII `open` and
 * `close` (a response body's head and tail), so that a large single-sample body goes to the
 * network as it was written, without being decoded into a string and encoded again (bench:
 * http, "n = 1e9 as=multiplicities" rows). The `...Text` writers return a string.
 *
 * The numbers are integers in [0, 2^31): every part and multiplicity of a sample, since n <=
 * MAX_N < 2^31. A value outside that range makes the writers return undefined, and the caller
 * falls back to JSON.stringify.
 */

/**
 * `open` v0 `separator` v1 ... `close`: listText(v, '[', ',', ']') is JSON.stringify of the
 * list, listText(v, '', ' ', '') its join(' '). `open` and `close` are ASCII, `separator` one
 * ASCII character.
 */
export function listText(values: ArrayLike<number>, open: string, separator: string, close: string): string | undefined {
  const bytes = listBytes(values, open, separator, close);
  return bytes === undefined ? undefined : DECODER.decode(bytes);
}

/** The ASCII bytes of listText(values, open, separator, close). */
export function listBytes(values: ArrayLike<number>, open: string, separator: string, close: string): Uint8Array<ArrayBuffer> | undefined {
  const count = values.length;
  // Room for two digits and a separator per value; grown when a longer run needs more.
  let bytes = new Uint8Array(open.length + close.length + 3 * count + MAX_ITEM);
  let at = writeAscii(bytes, 0, open);
  const sep = separator.charCodeAt(0);
  for (let i = 0; i < count; i++) {
    const value = values[i];
    if (!fits(value)) return undefined;
    if (at + MAX_ITEM > bytes.length) bytes = grown(bytes, 0);
    if (i > 0) bytes[at++] = sep;
    at = writeDigits(bytes, at, value | 0);
  }
  if (at + close.length > bytes.length) bytes = grown(bytes, close.length);
  at = writeAscii(bytes, at, close);
  return bytes.subarray(0, at);
}

/** `[[a0,b0],[a1,b1],...]`: JSON.stringify of the pairs (a[i], b[i]). */
export function pairsText(a: ArrayLike<number>, b: ArrayLike<number>): string | undefined {
  const bytes = pairsBytes(a, b, '', '');
  return bytes === undefined ? undefined : DECODER.decode(bytes);
}

/**
 * The ASCII bytes of `open` + pairsText(a, b) + `close`. `a` is a partition's sizes, largest
 * first, so the buffer starts with room for every pair at the first size's digit count and a
 * one-digit multiplicity: about the final length at large n (less than 1% is grown).
 */
export function pairsBytes(a: ArrayLike<number>, b: ArrayLike<number>, open: string, close: string): Uint8Array<ArrayBuffer> | undefined {
  const count = a.length;
  const widest = count > 0 && fits(a[0]) ? digitCount(a[0] | 0) : 1;
  let bytes = new Uint8Array(open.length + close.length + 2 + count * (widest + 5) + 2 * MAX_ITEM);
  let at = writeAscii(bytes, 0, open);
  bytes[at++] = OPEN;
  for (let i = 0; i < count; i++) {
    const x = a[i];
    const y = b[i];
    if (!fits(x) || !fits(y)) return undefined;
    if (at + 2 * MAX_ITEM > bytes.length) bytes = grown(bytes, 0);
    if (i > 0) bytes[at++] = COMMA;
    bytes[at++] = OPEN;
    at = writeDigits(bytes, at, x | 0);
    bytes[at++] = COMMA;
    at = writeDigits(bytes, at, y | 0);
    bytes[at++] = CLOSE;
  }
  if (at + 1 + close.length > bytes.length) bytes = grown(bytes, close.length);
  bytes[at++] = CLOSE;
  at = writeAscii(bytes, at, close);
  return bytes.subarray(0, at);
}

/** The most bytes one value with its separators takes: 10 digits (2^31 - 1) and 3 more. */
const MAX_ITEM = 13;

/** A buffer twice as large holding the bytes so far (room for at least 4 more items of any length, and `extra` bytes). */
function grown(bytes: Uint8Array<ArrayBuffer>, extra: number): Uint8Array<ArrayBuffer> {
  const larger = new Uint8Array(2 * bytes.length + 4 * MAX_ITEM + extra);
  larger.set(bytes);
  return larger;
}

const OPEN = 91; // [
const CLOSE = 93; // ]
const COMMA = 44;

/** ASCII bytes are the same in UTF-8, which every runtime's TextDecoder reads (and fast). */
const DECODER = new TextDecoder();

function fits(value: number): boolean {
  return value >= 0 && value <= 0x7fffffff && value === (value | 0);
}

function writeAscii(bytes: Uint8Array, at: number, text: string): number {
  for (let i = 0; i < text.length; i++) bytes[at++] = text.charCodeAt(i);
  return at;
}

/** The two ASCII digits of 0 ... 99, at 2k and 2k + 1. */
const DIGIT_PAIRS = new Uint8Array(200);
for (let k = 0; k < 100; k++) {
  DIGIT_PAIRS[2 * k] = 48 + ((k / 10) | 0);
  DIGIT_PAIRS[2 * k + 1] = 48 + (k % 10);
}

/**
 * Writes the decimal digits of value (a 32-bit integer in [0, 2^31), as `x | 0` makes it, so that
 * the divisions below are integer divisions) at `at`; returns the position after them. Two
 * digits at a time, from the last ones backwards.
 */
function writeDigits(bytes: Uint8Array, at: number, value: number): number {
  // Most numbers of a large sample are small: one and two digits are written directly.
  if (value < 10) {
    bytes[at] = 48 + value;
    return at + 1;
  }
  if (value < 100) {
    bytes[at] = DIGIT_PAIRS[2 * value];
    bytes[at + 1] = DIGIT_PAIRS[2 * value + 1];
    return at + 2;
  }
  const end = at + digitCount(value);
  let p = end;
  while (value >= 100) {
    const next = (value / 100) | 0;
    const pair = 2 * (value - 100 * next);
    bytes[--p] = DIGIT_PAIRS[pair + 1];
    bytes[--p] = DIGIT_PAIRS[pair];
    value = next;
  }
  if (value >= 10) {
    bytes[--p] = DIGIT_PAIRS[2 * value + 1];
    bytes[--p] = DIGIT_PAIRS[2 * value];
  } else {
    bytes[--p] = 48 + value;
  }
  return end;
}

/** Decimal digits of a value in [0, 2^31). */
function digitCount(value: number): number {
  if (value < 10) return 1;
  if (value < 100) return 2;
  if (value < 1000) return 3;
  if (value < 10000) return 4;
  if (value < 100000) return 5;
  if (value < 1000000) return 6;
  if (value < 10000000) return 7;
  if (value < 100000000) return 8;
  return value < 1000000000 ? 9 : 10;
}
