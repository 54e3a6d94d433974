import { DEFAULT_MAX_COUNT, MAX_COUNT, MAX_INDEX, MAX_N } from '../schemas/bounds.js';

export { MAX_COUNT, MAX_N };

/**
 * The service's stated limits (documented in the README). Work is limited in time: each
 * sampler's estimate (basic steps, see SamplerEstimate) is turned into nanoseconds with the
 * measured cost table of its method (src/core/work-costs.ts), so one budget covers every method.
 */
export interface Limits {
  /** Samples in one response. */
  readonly maxCount: number;
  /** Numbers in one response (parts, or two per [part, multiplicity] pair), by expected size. */
  readonly maxNumbers: number;
  /**
   * Estimated time of one request's sampling, in milliseconds of one core of a 2-core machine
   * (see work-costs.ts): requests estimated over it are refused before any work is done. The
   * estimate is not exact (`npm run bench -- costs` prints how far off it is per method); the
   * deadline is the hard stop for what it misses.
   */
  readonly workBudgetMs: number;
  /** Largest index of a sample (start + count - 1). */
  readonly maxIndex: number;
  /**
   * Wall-clock budget of one request in milliseconds, checked between samples. The work
   * budget refuses most oversized requests up front; the deadline bounds the rest.
   */
  readonly deadlineMs: number;
}

export const DEFAULT_LIMITS: Limits = {
  maxCount: DEFAULT_MAX_COUNT,
  maxNumbers: 10_000_000,
  workBudgetMs: 2_000,
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
  PARTSMITH_WORK_BUDGET_MS: { key: 'workBudgetMs', min: 1, max: 3_600_000, example: '2000' },
  PARTSMITH_DEADLINE_MS: { key: 'deadlineMs', min: 1, max: 3_600_000, example: '5000' },
};

/** Settings that were removed, with what replaces them: set, they stop the server instead of being ignored. */
export const RETIRED_SETTINGS: Readonly<Record<string, string>> = {
  PARTSMITH_MAX_WORK:
    'the work limit is now a time, set with PARTSMITH_WORK_BUDGET_MS (milliseconds per request, default 2000); remove PARTSMITH_MAX_WORK',
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
  for (const [name, replacement] of Object.entries(RETIRED_SETTINGS)) {
    if (env[name] !== undefined && env[name] !== '') problems.push(`${name} is no longer a setting: ${replacement}`);
  }
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
  return Object.keys(env).filter((name) => name.startsWith('PARTSMITH_') && !(name in LIMIT_SETTINGS) && !(name in RETIRED_SETTINGS) && !known.includes(name));
}
