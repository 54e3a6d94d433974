import { partsOf, type Partition } from '../core/partition.js';
import { listBytes, listText, pairsBytes, pairsText } from './int-text.js';

/**
 * Lists at least this long are written byte by byte (int-text.ts); shorter ones by string
 * concatenation, which has no buffer to allocate and decode.
 */
const BYTE_TEXT_NUMBERS = 64;

/**
 * How one sample is written in each response format. A sample is encoded once per format into
 * JSON text (for json and ndjson) or a line of text, so the three formats always agree.
 */
export interface SampleEncoder<S> {
  /** Key of the sample in an NDJSON line, e.g. "parts" or "multiplicities". */
  readonly field: string;
  /** The sample as JSON text: what JSON.stringify gives for its JSON form. */
  json(sample: S): string;
  text(sample: S): string;
  /**
   * `open` + json(sample) + `close` as ASCII bytes (`open` and `close` are ASCII: a body's
   * head and tail), for samples large enough that bytes pay (a body sent as written, not
   * decoded into a string and encoded again); undefined for the others, which go as text.
   */
  jsonBytes?(sample: S, open: string, close: string): Uint8Array<ArrayBuffer> | undefined;
}

export const partitionAsParts: SampleEncoder<Partition> = {
  field: 'parts',
  // JSON.stringify(partsOf(p)), written from the (size, multiplicity) pairs without building the
  // list of parts: each distinct size's text is repeated, instead of written once per part.
  json: (p) => {
    const last = p.sizes.length - 1;
    if (last < 0) return '[]';
    let text = '[';
    for (let i = 0; i < last; i++) text += repeated(partWithComma(p.sizes[i]), p.multiplicities[i]);
    return `${text}${repeated(partWithComma(p.sizes[last]), p.multiplicities[last] - 1)}${p.sizes[last]}]`;
  },
  text: (p) => partsOf(p).join(' '),
};

/** `${size},` for sizes below 4096, made once each: a number's decimal text never changes. */
const PART_WITH_COMMA: (string | undefined)[] = new Array<string | undefined>(4096).fill(undefined);

function partWithComma(size: number): string {
  return size < 4096 ? (PART_WITH_COMMA[size] ??= `${size},`) : `${size},`;
}

function repeated(text: string, times: number): string {
  return times === 1 ? text : text.repeat(times);
}

export const partitionAsMultiplicities: SampleEncoder<Partition> = {
  field: 'multiplicities',
  // [[part, multiplicity], ...], largest part first; long lists written as bytes (int-text.ts).
  json: (p) => {
    if (p.sizes.length >= BYTE_TEXT_NUMBERS) {
      const text = pairsText(p.sizes, p.multiplicities);
      if (text !== undefined) return text;
    }
    let items = '';
    for (let i = 0; i < p.sizes.length; i++) items += `${i > 0 ? ',' : ''}[${p.sizes[i]},${p.multiplicities[i]}]`;
    return `[${items}]`;
  },
  jsonBytes: (p, open, close) => (p.sizes.length >= BYTE_TEXT_NUMBERS ? pairsBytes(p.sizes, p.multiplicities, open, close) : undefined),
  // "5 4 1^3": a part followed by ^multiplicity when it occurs more than once.
  text: (p) => p.sizes.map((size, i) => (p.multiplicities[i] > 1 ? `${size}^${p.multiplicities[i]}` : `${size}`)).join(' '),
};

/**
 * A composition's parts, as a list or as the typed array of a sampler's `sampleParts` (large
 * compositions, written without building a list; see int-text.ts).
 */
export const compositionAsParts: SampleEncoder<readonly number[] | Int32Array> = {
  field: 'parts',
  json: (c) => (c instanceof Int32Array ? (listText(c, '[', ',', ']') ?? JSON.stringify(Array.from(c))) : JSON.stringify(c)),
  text: (c) => (c instanceof Int32Array ? (listText(c, '', ' ', '') ?? Array.from(c).join(' ')) : c.join(' ')),
  jsonBytes: (c, open, close) => (c instanceof Int32Array && c.length >= BYTE_TEXT_NUMBERS ? listBytes(c, `${open}[`, ',', `]${close}`) : undefined),
};
