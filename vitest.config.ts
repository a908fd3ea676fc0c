import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

const here = (p: string) => fileURLToPath(new URL(p, import.meta.url));

// Test files share one PostgreSQL, one Redis and one sign-in fake started by scripts/test.ts,
// and the app under test listens on a fixed loopback port the fake knows, so files run one at a time.
export default defineConfig({
  resolve: { alias: { '@': here('./src'), '@shared': here('./shared'), '@server': here('./server') } },
  test: {
    include: ['shared/**/*.test.ts', 'src/**/*.test.{ts,tsx}', 'server/**/*.test.ts', 'tests/**/*.test.ts'],
    fileParallelism: false,
    testTimeout: 30_000,
    hookTimeout: 60_000,
  },
});
