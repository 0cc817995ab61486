// Extra settings for the Angular component tests (`ng test`, angular.json's runnerConfig). The builder supplies
// everything else. A component test waits at most 20 s: on the 2-core CI machine, with MariaDB and the build
// sharing the cores, a dialog test has been seen to need more than vitest's default 5 s.
import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    testTimeout: 20_000,
  },
});
