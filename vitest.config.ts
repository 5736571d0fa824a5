import { fileURLToPath } from 'node:url'
import { defineConfig } from 'vitest/config'

const root = fileURLToPath(new URL('.', import.meta.url))

/**
 * Three projects, run in this order by scripts/run-tests.ts:
 * unit (beside the code), integration (real PostgreSQL), e2e (headless Chromium against the built app).
 */
export default defineConfig({
  resolve: {
    alias: {
      '@/': root,
      // `server-only` throws outside a React Server Components bundle; tests run services directly.
      'server-only': `${root}tests/support/empty-module.ts`,
    },
  },
  test: {
    projects: [
      {
        extends: true,
        test: {
          name: 'unit',
          include: ['geometry/**/*.test.ts', 'lib/**/*.test.ts', 'components/**/*.test.ts', 'scripts/**/*.test.ts', 'tests/booklet/**/*.test.ts'],
          environment: 'node',
          // Property tests run a hundred plans or more; on a busy 2-core machine the default 5 s
          // was seen to run out while the same test takes under a second alone.
          testTimeout: 20_000,
        },
      },
      {
        extends: true,
        test: {
          name: 'integration',
          include: ['tests/integration/**/*.test.ts'],
          environment: 'node',
          // One database for the whole project: files take turns so each can start from empty tables.
          fileParallelism: false,
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      {
        extends: true,
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          environment: 'node',
          fileParallelism: false,
          testTimeout: 60_000,
          hookTimeout: 60_000,
        },
      },
    ],
  },
})
