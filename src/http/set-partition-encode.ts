import type { SetPartition } from '../core/set-partitions/set-partition.js';
import type { SampleEncoder } from './encode.js';

/**
 * How a set partition is written: as its restricted growth string (rgs: `[0,1,0,2]`, text
 * `0 1 0 2`) or as its blocks (`[[1,3],[2],[4]]`, text `1 3 | 2 | 4`; items 1..n, each block
 * increasing, blocks by smallest item).
 *
 * A sample holds n numbers, and at n = 10^6 writing them is most of a response's cost, so
 * large samples are written as ASCII bytes into one buffer and decoded once (AsciiText):
 * measured at n = 10^6 it is as fast as JSON.stringify of a plain array of the same numbers
 * (the output floor), where string concatenation and TypedArray.join are 5–10 times slower
 * (bench: set partitions). Small samples are joined as strings.
 */

/** Below this many items a sample is written by plain string concatenation. */
const SMALL = 256;

/** Decimal digits of v >= 0. */
function digitsOf(v: number): number {
  let d = 1;
  for (let p = 10; p <= v; p *= 10) d++;
  return d;
}

/** ASCII text built as bytes: numbers written digit by digit, decoded to a string once. */
class AsciiText {
  private readonly bytes: Uint8Array;
  private at = 0;

  constructor(capacity: number) {
    this.bytes = new Uint8Array(capacity);
  }

  byte(code: number): void {
    this.bytes[this.at++] = code;
  }

  /** A whole number 0 <= v < 2^31. */
  number(v: number): void {
    const bytes = this.bytes;
    if (v < 10) {
      bytes[this.at++] = 48 + v;
      return;
    }
    const end = (this.at += digitsOf(v));
    for (let i = end - 1; v > 0; i--) {
      const q = (v / 10) | 0;
      bytes[i] = 48 + v - q * 10;
      v = q;
    }
  }

  toString(): string {
    return DECODER.decode(this.bytes.subarray(0, this.at));
  }
}

const DECODER = new TextDecoder();
const COMMA = 44;
const SPACE = 32;
const OPEN = 91;
const CLOSE = 93;
const BAR = 124;

function rgsText(p: SetPartition, separator: number, open: boolean): string {
  const { rgs } = p;
  const n = rgs.length;
  if (n < SMALL) {
    const sep = String.fromCharCode(separator);
    let text = open ? '[' : '';
    for (let i = 0; i < n; i++) text += i === 0 ? `${rgs[i]}` : `${sep}${rgs[i]}`;
    return open ? `${text}]` : text;
  }
  const out = new AsciiText(n * (digitsOf(p.blocks) + 1) + 2);
  if (open) out.byte(OPEN);
  for (let i = 0; i < n; i++) {
    if (i > 0) out.byte(separator);
    out.number(rgs[i]);
  }
  if (open) out.byte(CLOSE);
  return out.toString();
}

/** The items of each block, block after block (a counting sort by block): items and where each block starts. */
function itemsByBlock(p: SetPartition): { items: Int32Array; starts: Int32Array } {
  const { rgs, blocks } = p;
  const starts = new Int32Array(blocks + 1);
  for (let i = 0; i < rgs.length; i++) starts[rgs[i] + 1]++;
  for (let b = 0; b < blocks; b++) starts[b + 1] += starts[b];
  const fill = starts.slice(0, blocks);
  const items = new Int32Array(rgs.length);
  for (let i = 0; i < rgs.length; i++) items[fill[rgs[i]]++] = i + 1;
  return { items, starts };
}

function blocksJson(p: SetPartition): string {
  const { items, starts } = itemsByBlock(p);
  const n = items.length;
  if (n < SMALL) {
    let text = '[';
    for (let b = 0; b < p.blocks; b++) {
      text += b === 0 ? '[' : ',[';
      for (let i = starts[b]; i < starts[b + 1]; i++) text += i === starts[b] ? `${items[i]}` : `,${items[i]}`;
      text += ']';
    }
    return `${text}]`;
  }
  const out = new AsciiText(n * (digitsOf(n) + 1) + 3 * p.blocks + 2);
  out.byte(OPEN);
  for (let b = 0; b < p.blocks; b++) {
    if (b > 0) out.byte(COMMA);
    out.byte(OPEN);
    for (let i = starts[b]; i < starts[b + 1]; i++) {
      if (i > starts[b]) out.byte(COMMA);
      out.number(items[i]);
    }
    out.byte(CLOSE);
  }
  out.byte(CLOSE);
  return out.toString();
}

function blocksLine(p: SetPartition): string {
  const { items, starts } = itemsByBlock(p);
  const out = new AsciiText(items.length * (digitsOf(items.length) + 1) + 3 * p.blocks + 1);
  for (let b = 0; b < p.blocks; b++) {
    if (b > 0) {
      out.byte(SPACE);
      out.byte(BAR);
      out.byte(SPACE);
    }
    for (let i = starts[b]; i < starts[b + 1]; i++) {
      if (i > starts[b]) out.byte(SPACE);
      out.number(items[i]);
    }
  }
  return out.toString();
}

export const setPartitionAsBlocks: SampleEncoder<SetPartition> = {
  field: 'blocks',
  json: blocksJson,
  text: blocksLine,
};

export const setPartitionAsRgs: SampleEncoder<SetPartition> = {
  field: 'rgs',
  json: (p) => rgsText(p, COMMA, true),
  text: (p) => rgsText(p, SPACE, false),
};
