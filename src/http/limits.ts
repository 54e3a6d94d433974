import { DEFAULT_MAX_COUNT, MAX_COUNT, MAX_INDEX, MAX_N } from '../schemas/bounds.js';

export { MAX_COUNT, MAX_N };

/**
 * The service's stated limits (documented in the README). Work is counted in the samplers'
 * own units (basic steps; see SamplerEstimate) so one budget covers every method.
 */
export interface Limits {
  /** Samples in one response. */
  readonly maxCount: number;
  /** Numbers in one response (parts, or two per [part, multiplicity] pair), by expected size. */
  readonly maxNumbers: number;
  /**
   * Expected work of one request, in the samplers' basic steps. Measured on a 2-core machine a
   * step costs 40-70 ns in the unrestricted sampler and up to ~500 ns in the heavier constrained
   * and composition methods, so the default (2e7) is about 1-10 s of one core; the deadline
   * bounds what the estimate misses.
   */
  readonly maxWork: number;
  /** Largest index of a sample (start + count - 1). */
  readonly maxIndex: number;
  /**
   * Wall-clock budget of one request in milliseconds, checked between samples. The work
   * estimate refuses most oversized requests up front; the deadline bounds the rest.
   */
  readonly deadlineMs: number;
}

export const DEFAULT_LIMITS: Limits = {
  maxCount: DEFAULT_MAX_COUNT,
  maxNumbers: 10_000_000,
  maxWork: 2e7,
  maxIndex: MAX_INDEX,
  deadlineMs: 5_000,
};

// ---------------------------------------------------------------------------------------------
// Configuration from the environment. The entry points (src/node.ts, src/worker.ts) hand their
// environment to this function; the app itself never reads the environment.

/** A setting that is present but not acceptable; the message names the variable and the rule. */
export class ConfigurationError extends Error {
  override readonly name = 'ConfigurationError';
}

interface Setting {
  readonly key: keyof Limits;
  readonly min: number;
  readonly max: number;
  readonly example: string;
}

/** Environment variable -> limit, with the accepted range of each. */
export const LIMIT_SETTINGS: Readonly<Record<string, Setting>> = {
  PARTSMITH_MAX_COUNT: { key: 'maxCount', min: 1, max: MAX_COUNT, example: '10000' },
  PARTSMITH_MAX_NUMBERS: { key: 'maxNumbers', min: 1, max: 1e12, example: '1e7' },
  PARTSMITH_MAX_WORK: { key: 'maxWork', min: 1, max: 1e15, example: '2e7' },
  PARTSMITH_DEADLINE_MS: { key: 'deadlineMs', min: 1, max: 3_600_000, example: '5000' },
};

/**
 * The limits set in an environment (`process.env`, or a Worker's `env` bindings). Absent or
 * empty variables keep their defaults. Values are whole numbers, written with digits and
 * optionally an exponent (`2e9`) or `_` separators (`10_000`); anything else is refused with a
 * ConfigurationError naming every bad variable, so a typo stops the server at startup instead
 * of silently running with a default.
 */
export function limitsFromEnvironment(env: Readonly<Record<string, unknown>>): Partial<Limits> {
  const limits: Record<string, number> = {};
  const problems: string[] = [];
  for (const [name, setting] of Object.entries(LIMIT_SETTINGS)) {
    const raw = env[name];
    if (raw === undefined || raw === '') continue;
    const text = typeof raw === 'string' ? raw.trim().replace(/_/g, '') : '';
    const value = /^[0-9]+(\.[0-9]+)?([eE][0-9]+)?$/.test(text) ? Number(text) : NaN;
    if (!Number.isSafeInteger(value) || value < setting.min || value > setting.max) {
      problems.push(`${name} must be a whole number from ${setting.min} to ${setting.max} (e.g. ${setting.example}), got ${JSON.stringify(raw)}`);
      continue;
    }
    limits[setting.key] = value;
  }
  if (problems.length > 0) throw new ConfigurationError(problems.join('; '));
  return limits as Partial<Limits>;
}

/** PARTSMITH_* variables that are not settings: probably typos, worth a warning at startup. */
export function unknownSettings(env: Readonly<Record<string, unknown>>, known: readonly string[] = []): string[] {
  return Object.keys(env).filter((name) => name.startsWith('PARTSMITH_') && !(name in LIMIT_SETTINGS) && !known.includes(name));
}
