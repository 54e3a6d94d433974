/**
 * `npm run bench`: speed tables, every ratio measured side by side in one run. Each section
 * lives in scripts/bench/. `npm run bench -- unrestricted` (or constrained, shapes, compositions, set-partitions, http, library, ranks, serving, costs, plan-fit, setup) runs one.
 */
import { benchCompositions } from './bench/compositions.js';
import { benchConstrained } from './bench/constrained.js';
import { benchCosts } from './bench/costs.js';
import { benchHttp } from './bench/http.js';
import { benchSetPartitions } from './bench/set-partitions.js';
import { benchLibrary } from './bench/library.js';
import { benchPlanFit } from './bench/plan-fit.js';
import { benchRanks } from './bench/ranks.js';
import { benchServing } from './bench/serving.js';
import { benchSetup } from './bench/setup.js';
import { benchShapes } from './bench/shapes.js';
import { benchUnrestricted } from './bench/unrestricted.js';

const sections: Record<string, () => Promise<void>> = {
  unrestricted: benchUnrestricted,
  constrained: benchConstrained,
  shapes: benchShapes,
  compositions: benchCompositions,
  'set-partitions': benchSetPartitions,
  http: benchHttp,
  library: benchLibrary,
  ranks: benchRanks,
  serving: benchServing,
  costs: benchCosts,
  'plan-fit': () => benchPlanFit(),
  setup: benchSetup,
};

const chosen = process.argv.slice(2);
for (const name of chosen) {
  if (!(name in sections)) {
    console.error(`unknown bench section ${JSON.stringify(name)}; choose from ${Object.keys(sections).join(', ')}`);
    process.exit(2);
  }
}
for (const name of chosen.length > 0 ? chosen : Object.keys(sections)) {
  console.log(`\n## ${name}\n`);
  await sections[name]();
}
