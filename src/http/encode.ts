import { partsOf, type Partition } from '../core/partition.js';

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
}

export const partitionAsParts: SampleEncoder<Partition> = {
  field: 'parts',
  // JSON.stringify(partsOf(p)), written from the (size, multiplicity) pairs without building the
  // list of parts: each distinct size is written once and repeated, instead of once per part.
  json: (p) => {
    let items = '';
    for (let i = 0; i < p.sizes.length; i++) items += `${p.sizes[i]},`.repeat(p.multiplicities[i]);
    return `[${items.slice(0, -1)}]`;
  },
  text: (p) => partsOf(p).join(' '),
};

export const partitionAsMultiplicities: SampleEncoder<Partition> = {
  field: 'multiplicities',
  // [[part, multiplicity], ...], largest part first.
  json: (p) => {
    let items = '';
    for (let i = 0; i < p.sizes.length; i++) items += `${i > 0 ? ',' : ''}[${p.sizes[i]},${p.multiplicities[i]}]`;
    return `[${items}]`;
  },
  // "5 4 1^3": a part followed by ^multiplicity when it occurs more than once.
  text: (p) => p.sizes.map((size, i) => (p.multiplicities[i] > 1 ? `${size}^${p.multiplicities[i]}` : `${size}`)).join(' '),
};

export const compositionAsParts: SampleEncoder<number[]> = {
  field: 'parts',
  json: (c) => JSON.stringify(c),
  text: (c) => c.join(' '),
};
