import { defineConfig } from 'vitest/config';
import vue from '@vitejs/plugin-vue';

export default defineConfig({
  plugins: [vue()],
  test: {
    include: ['test/**/*.test.ts'],
    environment: 'node',
    testTimeout: 60_000,
    hookTimeout: 120_000,
    pool: 'forks',
    // The child-process CLI tests run the bundle; build it from the current sources first.
    globalSetup: ['test/support/buildCli.setup.ts'],
  },
});
