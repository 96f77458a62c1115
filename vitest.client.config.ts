// Vitest options for the Angular client's specs (`ng test`: angular.json "runnerConfig"); the builder
// sets the rest (jsdom, the spec files, the build). The server and shared specs use vitest.config.ts.
import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    // Vitest's default 5 s: a component spec took 3.3 s on the shared 2-core machine under load; CI runs
    // on a similar machine. A deadline for a loaded machine, not a measure (speed belongs to bench/).
    testTimeout: 20_000,
  },
});
