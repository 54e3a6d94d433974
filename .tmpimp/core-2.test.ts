import { it } from 'vitest';
it('imports', async () => { const t0 = performance.now(); await import('./core.ts'); console.log('IMPORT core', (performance.now() - t0).toFixed(1)); });
