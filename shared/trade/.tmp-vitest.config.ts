import { defineConfig } from 'vitest/config';
export default defineConfig({ test: { root: '/work/main', include: ['shared/trade/**/*.test.ts'] } });
