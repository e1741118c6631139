import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    name: 'sample-data',
    environment: 'node',
    include: ['src/**/*.test.ts'],
  },
});
