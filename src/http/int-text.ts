/**
 * Decimal text of large samples, written byte by byte into one buffer (doubled when full) and
 * decoded once, with no intermediate strings or arrays: for 10^4–10^6 numbers this is several
 * times faster than building a number[] (or a list of pairs) and stringifying it, or joining a
 * typed array (see the serving section of `npm run bench`). The text is exactly what JSON.stringify (or join)
 * gives; test/http/encode.test.ts checks it.
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
  const count = values.length;
  // Room for two digits and a separator per value; grown when a longer run needs more.
  let bytes = new Uint8Array(open.length + close.length + 3 * count + MAX_ITEM);
  let at = writeAscii(bytes, 0, open);
  const sep = separator.charCodeAt(0);
  for (let i = 0; i < count; i++) {
    const value = values[i];
    if (!fits(value)) return undefined;
    if (at + MAX_ITEM > bytes.length) bytes = grown(bytes);
    if (i > 0) bytes[at++] = sep;
    at = writeDigits(bytes, at, value);
  }
  if (at + close.length > bytes.length) bytes = grown(bytes);
  at = writeAscii(bytes, at, close);
  return DECODER.decode(bytes.subarray(0, at));
}

/** `[[a0,b0],[a1,b1],...]`: JSON.stringify of the pairs (a[i], b[i]). */
export function pairsText(a: ArrayLike<number>, b: ArrayLike<number>): string | undefined {
  const count = a.length;
  let bytes = new Uint8Array(2 + 8 * count + 2 * MAX_ITEM);
  let at = 0;
  bytes[at++] = OPEN;
  for (let i = 0; i < count; i++) {
    const x = a[i];
    const y = b[i];
    if (!fits(x) || !fits(y)) return undefined;
    if (at + 2 * MAX_ITEM > bytes.length) bytes = grown(bytes);
    if (i > 0) bytes[at++] = COMMA;
    bytes[at++] = OPEN;
    at = writeDigits(bytes, at, x);
    bytes[at++] = COMMA;
    at = writeDigits(bytes, at, y);
    bytes[at++] = CLOSE;
  }
  bytes[at++] = CLOSE;
  return DECODER.decode(bytes.subarray(0, at));
}

/** The most bytes one value with its separators takes: 10 digits (2^31 - 1) and 3 more. */
const MAX_ITEM = 13;

/** A buffer twice as large holding the bytes so far (room for at least 4 more items of any length). */
function grown(bytes: Uint8Array<ArrayBuffer>): Uint8Array<ArrayBuffer> {
  const larger = new Uint8Array(2 * bytes.length + 4 * MAX_ITEM);
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

/** Writes the decimal digits of value (in [0, 2^31)) at `at`; returns the position after them. */
function writeDigits(bytes: Uint8Array, at: number, value: number): number {
  // Most numbers of a large sample are small: one and two digits are written directly.
  if (value < 10) {
    bytes[at] = 48 + value;
    return at + 1;
  }
  if (value < 100) {
    const tens = (value / 10) | 0;
    bytes[at] = 48 + tens;
    bytes[at + 1] = 48 + value - 10 * tens;
    return at + 2;
  }
  const end = at + digitCount(value);
  // Digits from the last one backwards.
  for (let p = end - 1; p >= at; p--) {
    const next = (value / 10) | 0;
    bytes[p] = 48 + value - 10 * next;
    value = next;
  }
  return end;
}

/** Decimal digits of a value in [0, 2^31). */
function digitCount(value: number): number {
  if (value < 10) return 1;
  if (value < 100) return 2;
  if (value < 1000) return 3;
  if (value < 10000) return 4;
  let digits = 5;
  for (let rest = (value / 100000) | 0; rest > 0; rest = (rest / 10) | 0) digits++;
  return digits;
}
