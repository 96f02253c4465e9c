import { defineConfig } from 'vitest/config';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';

// One config for the client build and for Vitest.
// Test projects: "unit" needs nothing but Node; "integration" gets a throw-away
// PostgreSQL database from tests/setup/global-setup.ts.
// Every project but "stress" unless a --project option names others (`npm run test:stress`). This is the CLI's
// --project filter given a default here; Vitest reads it from the config but its config type does not list it.
const everyProjectButStress = { project: ['!stress'] } as Record<string, unknown>;

export default defineConfig({
  plugins: [react(), tailwindcss()],
  build: {
    outDir: 'dist/client',
    emptyOutDir: true,
    chunkSizeWarningLimit: 1200,
  },
  test: {
    ...everyProjectButStress,
    projects: [
      {
        test: {
          name: 'unit',
          include: ['tests/analysis/**/*.test.ts', 'tests/shared/**/*.test.ts', 'tests/scripts/**/*.test.ts'],
          environment: 'node',
        },
      },
      {
        test: {
          name: 'client',
          include: ['tests/src/**/*.test.tsx'],
          environment: 'jsdom',
          // jsdom screens are slow on a loaded 2-core machine; a generous limit avoids false failures.
          testTimeout: 20_000,
        },
      },
      {
        test: {
          name: 'integration',
          include: ['tests/server/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/setup/global-setup.ts'],
          fileParallelism: false,
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      {
        // Browser tests: the built client and the real app in Debian's Chromium (tests/e2e/harness.ts).
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/setup/global-setup.ts', 'tests/e2e/global-build.ts'],
          fileParallelism: false,
          testTimeout: 120_000,
          hookTimeout: 240_000,
        },
      },
      {
        // Load and fault tests of `npm test` (a server in a child process, a private PostgreSQL cluster): they
        // run after every other project (groupOrder), so their CPU use cannot slow the others' tests down.
        test: {
          name: 'faults',
          include: ['tests/stress/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/setup/global-setup.ts'],
          fileParallelism: false,
          sequence: { groupOrder: 1 },
          testTimeout: 120_000,
          hookTimeout: 120_000,
        },
      },
      {
        // The longer runs, only with `npm run test:stress` (left out of a plain `vitest run` by `project` above).
        test: {
          name: 'stress',
          include: ['tests/stress/**/*.stress.ts'],
          environment: 'node',
          globalSetup: ['tests/setup/global-setup.ts'],
          fileParallelism: false,
          testTimeout: 600_000,
          hookTimeout: 120_000,
        },
      },
    ],
  },
});
