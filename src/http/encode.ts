import { partsOf, type Partition } from '../core/partition.js';

/**
 * How one sample is written in each response format. A sample is encoded once per format into
 * a JSON value (for json and ndjson) or a line of text, so the three formats always agree.
 */
export interface SampleEncoder<S> {
  /** Key of the sample in an NDJSON line, e.g. "parts" or "multiplicities". */
  readonly field: string;
  json(sample: S): unknown;
  text(sample: S): string;
}

export const partitionAsParts: SampleEncoder<Partition> = {
  field: 'parts',
  json: (p) => partsOf(p),
  text: (p) => partsOf(p).join(' '),
};

export const partitionAsMultiplicities: SampleEncoder<Partition> = {
  field: 'multiplicities',
  // As integers (`| 0`, exact below 2^31), for the same reason as in partsOf.
  json: (p) => p.sizes.map((size, i) => [size | 0, p.multiplicities[i] | 0]),
  // "5 4 1^3": a part followed by ^multiplicity when it occurs more than once.
  text: (p) => p.sizes.map((size, i) => (p.multiplicities[i] > 1 ? `${size}^${p.multiplicities[i]}` : `${size}`)).join(' '),
};

export const compositionAsParts: SampleEncoder<number[]> = {
  field: 'parts',
  json: (c) => c,
  text: (c) => c.join(' '),
};
