import react from '@vitejs/plugin-react';
import { defineConfig } from 'vitest/config';

// Two projects: the kernel and CLI run in node; components in jsdom.
// `include` is explicit so the Playwright specs in tests/e2e are never picked up.
export default defineConfig({
  plugins: [react()],
  test: {
    globals: true,
    // Both cores: vitest's default leaves one core to its own process, which is mostly idle here
    // (a full run on two cores: 289 s with one worker, 207 s with two).
    maxWorkers: 2,
    projects: [
      {
        extends: true,
        test: {
          name: 'unit',
          environment: 'node',
          include: ['tests/unit/**/*.test.ts'],
          testTimeout: 30_000,
          benchmark: { include: ['tests/bench/**/*.bench.ts'] },
        },
      },
      {
        extends: true,
        test: {
          name: 'component',
          environment: 'jsdom',
          include: ['tests/component/**/*.test.tsx'],
          setupFiles: ['tests/component/setup.ts'],
          // jsdom renders whole views; on a busy 2-core machine one test can take 20 s and more. The
          // timeout guards against a hang, never against slowness (speed is measured in benchmarks),
          // so files do not set shorter ones.
          testTimeout: 60_000,
          benchmark: { include: [] },
        },
      },
    ],
  },
});
