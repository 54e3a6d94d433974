import { it } from 'vitest';
it('imports', async () => { const t0 = performance.now(); await import('../src/index.ts'); console.log('IMPORT lib', (performance.now() - t0).toFixed(1)); });
