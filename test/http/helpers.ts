import { createApp, type AppOptions } from '../../src/http/app.js';

/** Calls the app in-process, exactly as a runtime would. */
export function appClient(options: AppOptions = {}) {
  const app = createApp({ drawSeed: () => 'drawn-seed', ...options });
  return {
    app,
    get: (pathAndQuery: string, init: RequestInit = {}) => app.fetch(new Request(`http://partsmith.test${pathAndQuery}`, init)),
  };
}
