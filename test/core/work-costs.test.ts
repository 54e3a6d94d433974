import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import {
  NS_PER_NUMBER,
  NS_PER_SETUP_UNIT,
  NS_PER_STEP,
  SEEDING_NS,
  UNKNOWN_NS_PER_STEP,
  baseMethod,
  nsPerSetupUnit,
  nsPerStep,
  sampleTimeNs,
} from '../../src/core/work-costs.js';
import { partitionFamily } from '../../src/library/partitions.js';
import { compositionFamily } from '../../src/library/compositions.js';
import { setPartitionFamily } from '../../src/library/set-partitions.js';

const CORE = join(import.meta.dirname, '../../src/core');

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? sourceFiles(path) : path.endsWith('.ts') ? [path] : [];
  });
}

/**
 * Every sampler method id written in the core: quoted "name/version" strings (method ids are the
 * only strings of that shape there). A new sampler brings a new id, which must get a row.
 */
function methodIdsInCore(): Set<string> {
  const ids = new Set<string>();
  for (const file of sourceFiles(CORE)) {
    for (const match of readFileSync(file, 'utf8').matchAll(/['"`]([a-z][a-z0-9]*(?:-[a-z0-9]+)*\/\d+)['"`]/g)) ids.add(match[1]);
  }
  return ids;
}

describe('the work-cost table', () => {
  it('has a row for every sampler method of the core, and none for methods that do not exist', () => {
    const ids = methodIdsInCore();
    expect(ids.size).toBeGreaterThanOrEqual(29); // the scan finds the methods at all
    const missing = [...ids].filter((id) => NS_PER_STEP[id] === undefined);
    expect(missing, 'add a row to NS_PER_STEP in src/core/work-costs.ts (measure it with npm run bench -- costs)').toEqual([]);
    expect(Object.keys(NS_PER_STEP).filter((id) => !ids.has(id))).toEqual([]);
  });

  it('prices the methods the planners actually choose (wrapped ids included) from their own rows', () => {
    const samplers = [
      partitionFamily({ n: 1_000_000 }).sampler,
      partitionFamily({ n: 500 }).sampler,
      partitionFamily({ n: 100_000, length: 50 }).sampler,
      partitionFamily({ n: 100_000, maxPart: 100 }).sampler,
      compositionFamily({ n: 1_000_000 }).sampler,
      compositionFamily({ n: 1_000_000, allowed: [3, 7, 11], length: 100_000 }).sampler,
      setPartitionFamily({ n: 1000 }).sampler,
    ];
    for (const sampler of samplers) {
      expect(NS_PER_STEP[baseMethod(sampler.method)], sampler.method).toBeDefined();
      expect(nsPerStep(sampler.method)).toBe(NS_PER_STEP[baseMethod(sampler.method)]);
    }
    expect(baseMethod('bounded-boltzmann/1+conjugate')).toBe('bounded-boltzmann/1');
    expect(baseMethod('box-subset/1+conjugate+length-filter')).toBe('box-subset/1');
  });

  it('prices setup units per method: rows only for existing methods, wrapped ids by their base, else the step', () => {
    for (const id of Object.keys(NS_PER_SETUP_UNIT)) expect(NS_PER_STEP[id], id).toBeDefined();
    expect(nsPerSetupUnit('bounded-self-similar/1+conjugate')).toBe(NS_PER_SETUP_UNIT['bounded-self-similar/1']);
    expect(nsPerSetupUnit('table-sizes/1+length-filter')).toBe(NS_PER_SETUP_UNIT['table-sizes/1']);
    expect(nsPerSetupUnit('box-subset/1')).toBe(NS_PER_STEP['box-subset/1']);
  });

  it('estimates a sample as seeding + steps × ns/step + numbers × ns/number', () => {
    const sampler = { method: 'self-similar/1', expectedWork: 1000 };
    expect(sampleTimeNs(sampler, 0)).toBe(SEEDING_NS + 1000 * NS_PER_STEP['self-similar/1']);
    expect(sampleTimeNs(sampler, 10)).toBe(SEEDING_NS + 1000 * NS_PER_STEP['self-similar/1'] + 10 * NS_PER_NUMBER);
    // An unknown method is priced at the dearest known step, never for free.
    expect(nsPerStep('made-up/1')).toBe(UNKNOWN_NS_PER_STEP);
    expect(UNKNOWN_NS_PER_STEP).toBe(Math.max(...Object.values(NS_PER_STEP)));
    for (const [id, ns] of Object.entries(NS_PER_STEP)) expect(ns, id).toBeGreaterThan(0);
  });
});
