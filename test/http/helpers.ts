import { createApp, type AppOptions } from '../../src/http/app.js';

/**
 * Calls the app in-process, exactly as a runtime would. Its clock stands still unless a test
 * gives one, so no answer depends on how fast the machine is (the deadline never passes; tests
 * of the deadline drive their own clock).
 */
export function appClient(options: AppOptions = {}) {
  const app = createApp({ drawSeed: () => 'drawn-seed', clock: () => 0, ...options });
  return {
    app,
    get: (pathAndQuery: string, init: RequestInit = {}) => app.fetch(new Request(`http://partsmith.test${pathAndQuery}`, init)),
  };
}
