// Vitest for the server, the project's shared/ code and the API tests. The Angular client's specs run
// through `ng test` (the @angular/build unit-test builder), not here.
import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['shared/**/*.spec.ts', 'server/**/*.spec.ts', 'tests/api/**/*.test.ts'],
    environment: 'node',
    pool: 'forks',
    testTimeout: 20_000,
    hookTimeout: 30_000,
    env: { NODE_ENV: 'test' },
  },
});
