import { defineConfig } from 'vitest/config';

// One vitest run for the whole tree; each workspace is a project with its own environment.
export default defineConfig({
  test: {
    projects: [
      'shared/vitest.config.ts',
      'server/vitest.config.ts',
      'client/vitest.config.ts',
      'sample-data/vitest.config.ts',
      'tests/vitest.config.ts',
    ],
  },
});
