import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    name: 'server',
    environment: 'node',
    include: ['src/**/*.spec.ts'],
    // API specs boot Nest on an in-memory PGlite; give them room on a 2-core machine.
    testTimeout: 30_000,
    hookTimeout: 60_000,
  },
});
