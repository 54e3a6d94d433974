import { z } from 'zod';
import { SEED_PATTERN } from '../core/seeding.js';

/**
 * Builders for query parameters. Query values arrive as strings; each builder checks the raw
 * string strictly (digits only, no sign, exponent, blank or fraction: `z.coerce` would turn
 * `n=` into 0) and only then converts it, so the typed schema stays the single source of truth
 * for validation, TypeScript types and the OpenAPI document.
 */

const DIGITS = /^[0-9]{1,16}$/;

function digitsToNumber(raw: unknown): unknown {
  return typeof raw === 'string' && DIGITS.test(raw) ? Number(raw) : raw;
}

/** A whole number in [min, max], written as plain decimal digits. */
export function integerParam(min: number, max: number, description: string) {
  return z.preprocess(digitsToNumber, integerIn(min, max)).describe(description);
}

/**
 * The checked number of integerParam(min, max, ...), built once per range and shared by every
 * parameter with that range (zod schemas are immutable; each parameter keeps its own
 * description on its own wrapper, and the OpenAPI document writes shared schemas inline, so it
 * is unchanged). Building a zod schema is a few object copies per method call, and 30 of these
 * were built at every import of the schemas: the library's import time (bench: library).
 */
function integerIn(min: number, max: number) {
  const key = `${min},${max}`;
  let schema = INTEGERS.get(key);
  if (schema === undefined) {
    const message = `must be a whole number from ${min} to ${max}, written with digits only`;
    schema = z.number({ error: message }).int({ error: message }).min(min, { error: message }).max(max, { error: message });
    INTEGERS.set(key, schema);
  }
  return schema;
}

const INTEGERS = new Map<string, z.ZodNumber>();

/** `true` or `false`. */
export function booleanParam(description: string) {
  return z
    .preprocess((raw) => (raw === 'true' ? true : raw === 'false' ? false : raw), z.boolean({ error: 'must be true or false' }))
    .describe(description);
}

/** A comma-separated list of distinct-or-repeated whole numbers, returned sorted and de-duplicated. */
export function sizeListParam(min: number, max: number, maxItems: number, description: string) {
  const message = `must be a comma-separated list of whole numbers from ${min} to ${max} (at most ${maxItems} distinct values)`;
  return z
    .preprocess(
      (raw) => {
        if (typeof raw !== 'string' || !/^[0-9]{1,16}(,[0-9]{1,16})*$/.test(raw)) return raw;
        return [...new Set(raw.split(',').map(Number))].sort((a, b) => a - b);
      },
      z.array(z.number().int().min(min, { error: message }).max(max, { error: message }), { error: message }).min(1, { error: message }).max(maxItems, { error: message }),
    )
    .describe(description);
}

/**
 * A seed: 1 to 64 URL-safe characters (SEED_PATTERN), optional. Every endpoint that draws samples
 * takes it under the name `seed` (QueryReader parses it on its own; see query.ts).
 */
export function seedParam(description: string) {
  return z.string().regex(SEED_PATTERN, { error: 'must be 1 to 64 characters from A-Z a-z 0-9 . _ ~ : -' }).optional().describe(description);
}

/**
 * A whole number with thousands separators, as toLocaleString('en-US') writes it (10,000) but
 * without Intl: the first toLocaleString of a process loads locale data, ~10 ms of every
 * process that builds the schemas (measured with a CPU profile of the library's import).
 */
export function withThousands(value: number): string {
  return String(value).replace(/\B(?=(\d{3})+(?!\d))/g, ',');
}

/** One of a fixed set of words. */
export function choiceParam<const T extends readonly [string, ...string[]]>(values: T, description: string) {
  return z.enum(values, { error: `must be one of: ${values.join(', ')}` }).describe(description);
}

/**
 * A rank: a whole number of any size, written with decimal digits only (ranks outgrow 2^53, so
 * they travel as decimal strings, like counts). The parsed value is the canonical decimal string
 * (leading zeros dropped), for the endpoint to read with BigInt. The query-string limit bounds
 * its length.
 */
export function rankParam(description: string) {
  const message = 'must be a whole number (0, 1, 2, ...), written with digits only';
  return z
    .string({ error: message })
    .regex(/^[0-9]+$/, { error: message })
    .transform((digits) => digits.replace(/^0+(?=[0-9])/, ''))
    .describe(description);
}

/**
 * A member given as its parts: a comma-separated list of whole numbers from `min` to `max` in the
 * order given (repeats kept, nothing sorted: whether the order is the family's is for the endpoint
 * to say). An empty value is the empty list (the one member of size 0).
 */
export function partsParam(min: number, max: number, maxItems: number, description: string) {
  const message = `must be a comma-separated list of whole numbers from ${min} to ${max} (at most ${maxItems} of them; empty for the empty member)`;
  return z
    .preprocess(
      (raw) => (raw === '' ? [] : typeof raw === 'string' && /^[0-9]{1,16}(,[0-9]{1,16})*$/.test(raw) ? raw.split(',').map(Number) : raw),
      z.array(z.number().int().min(min, { error: message }).max(max, { error: message }), { error: message }).max(maxItems, { error: message }),
    )
    .describe(description);
}
