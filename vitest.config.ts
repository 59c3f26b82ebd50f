import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    projects: [
      {
        test: {
          name: 'node',
          environment: 'node',
          setupFiles: ['test/setup/tmpdir.ts'],
          include: ['test/core/**/*.test.ts', 'test/worker/**/*.test.ts', 'test/cli/**/*.test.ts', 'test/demo/**/*.test.ts', 'test/host/**/*.test.ts', 'test/lint/**/*.test.ts', 'test/app/**/*.test.ts', 'test/scripts/**/*.test.ts', 'test/fuzz/**/*.test.ts'],
          testTimeout: 60_000,
        },
      },
      {
        test: {
          name: 'e2e',
          environment: 'node',
          setupFiles: ['test/setup/tmpdir.ts'],
          include: ['test/e2e/**/*.test.ts'],
          testTimeout: 180_000,
          hookTimeout: 180_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
