import { defineConfig } from 'vitest/config';
export default defineConfig({ test: { include: ['.tmpimp/smoke.test.ts'] } });
