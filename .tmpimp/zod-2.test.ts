import { it } from 'vitest';
it('imports', async () => { const t0 = performance.now(); await import('zod'); console.log('IMPORT zod', (performance.now() - t0).toFixed(1)); });
