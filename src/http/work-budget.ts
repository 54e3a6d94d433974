import { LimitExceededError } from '../core/errors.js';
import type { Family } from '../core/family.js';
import { sampleTimeNs, type CostedSampler } from '../core/work-costs.js';
import type { Limits } from './limits.js';
import { ProblemError } from './problem.js';

/**
 * The work budget of a request, in time: a job's estimated time (its samplers' steps priced by
 * the measured cost table, src/core/work-costs.ts) against `Limits.workBudgetMs`, and the 422s
 * that say which limit, by how much, and what would fit — fewer samples with `start` paging, or,
 * when not even one sample fits, what to change about the family.
 */

/** What the budget looks at: the sampler's estimate, the numbers a sample writes, how many samples, from where. */
export interface BudgetedJob {
  readonly sampler: CostedSampler & { readonly expectedDistinct?: number };
  readonly numbersPerSample: number;
  readonly start: number;
  readonly count: number;
  /** The family (for advice naming its parameters); absent in callers that have none to give. */
  readonly family?: Family;
  /** The sample form (its field: "parts", "multiplicities", …), to suggest as=multiplicities where it would help. */
  readonly encoder?: { readonly field: string };
}

/** Estimated milliseconds for one sample of the job. */
export function sampleMs(job: Pick<BudgetedJob, 'sampler' | 'numbersPerSample'>): number {
  return sampleTimeNs(job.sampler, job.numbersPerSample) / 1e6;
}

/** Estimated milliseconds of the whole job's sampling. */
export function jobMs(job: Pick<BudgetedJob, 'sampler' | 'numbersPerSample' | 'count'>): number {
  return job.count * sampleMs(job);
}

/** A duration for people: "2 s", "3.4 s", "450 ms", "0.23 ms". */
export function formatMs(ms: number): string {
  if (ms >= 1000) return `${trimmed((ms / 1000).toPrecision(ms >= 10_000 ? 3 : 2))} s`;
  if (ms >= 1) return `${Math.round(ms)} ms`;
  return `${trimmed(ms.toPrecision(2))} ms`;
}

function trimmed(text: string): string {
  return text.includes('.') && !text.includes('e') ? text.replace(/\.?0+$/, '') : text;
}

/** Refuses (422), before any work is done, a job whose estimated time is over the work budget. */
export function checkWorkBudget(job: BudgetedJob, limits: Pick<Limits, 'workBudgetMs'>): void {
  const budget = limits.workBudgetMs;
  const total = jobMs(job);
  if (total <= budget) return;
  const each = sampleMs(job);
  const fits = Math.floor(budget / each);
  const limit = `the limit is ${formatMs(budget)} of work per request`;
  if (fits >= 1) {
    const next = job.start + fits;
    throw new ProblemError(
      422,
      `This request needs about ${formatMs(total)} of work (${job.count.toLocaleString('en-US')} samples at about ${formatMs(each)} each); ${limit}. Ask for count=${fits}, then page with start=${next}, start=${next + fits}, … for the rest.`,
      [{ param: 'count', message: `at most ${samplesText(fits)} of this family fit in the work budget of ${formatMs(budget)} per request; page with start for more` }],
    );
  }
  const changes = familyChanges(job, budget);
  throw new ProblemError(
    422,
    `One sample of this family needs about ${formatMs(each)} of work; ${limit}, so not even one sample fits. ${capitalised(changes.join(', or '))}.`,
    [{ param: 'n', message: `one sample needs about ${formatMs(each)} of work, over the budget of ${formatMs(budget)} per request: ${changes.join(', or ')}` }],
  );
}

/** What to change about a family whose single sample is over the budget, most useful first. */
function familyChanges(job: BudgetedJob, budget: number): string[] {
  const changes: string[] = [];
  const family = job.family as (Family & { length?: number; maxLength?: number }) | undefined;
  const n = family ? ` (n=${family.n} is too large for one sample within the budget)` : '';
  changes.push(`ask for a smaller n${n}`);
  if (family && (family.length !== undefined || family.maxLength !== undefined)) changes.push('ask for fewer parts (a smaller length or maxLength)');
  const distinct = job.sampler.expectedDistinct;
  if (family?.kind === 'partition' && job.encoder?.field === 'parts' && distinct !== undefined && sampleMs({ sampler: job.sampler, numbersPerSample: 2 * distinct }) <= budget) {
    changes.push('ask for as=multiplicities, which writes each part size once with its multiplicity');
  }
  return changes;
}

/** "1 sample", "2530 samples": digits only, as the parameter is written. */
export function samplesText(count: number): string {
  return `${count} sample${count === 1 ? '' : 's'}`;
}

function capitalised(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

/**
 * The same budget for the check and diagram endpoints, which draw `samples` samples to examine
 * rather than to send: a LimitExceededError (422) saying how many samples fit, or, when not even
 * one does, that n must be smaller. `what` starts the message ("checking", "drawing").
 */
export function checkSamplesBudget(what: string, samples: number, sampler: CostedSampler, numbersPerSample: number, limits: Pick<Limits, 'workBudgetMs'>): void {
  const budget = limits.workBudgetMs;
  const each = sampleMs({ sampler, numbersPerSample });
  if (samples * each <= budget) return;
  const fits = Math.floor(budget / each);
  const needs = `${what} ${samples === 1 ? 'one sample' : `${samples} samples`} of this family needs about ${formatMs(samples * each)} of work; the limit is ${formatMs(budget)} per request`;
  throw new LimitExceededError(
    fits >= 1 ? `${needs}: ask for at most ${samplesText(fits)}` : `${needs}, so not even one sample fits: ask for a smaller n`,
    `work <= ${formatMs(budget)}`,
  );
}
