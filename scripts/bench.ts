/** `npm run bench`: speed tables. Each section lives in scripts/bench/. */
import { benchUnrestricted } from './bench/unrestricted.js';

await benchUnrestricted();
