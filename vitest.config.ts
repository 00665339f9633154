import { defineConfig } from 'vitest/config'

// Three layers, one command (`npm test`):
// - unit:    the domain core in shared/, plain Node, no server;
// - server:  the built app over HTTP (and later sockets), each file on its own database file;
// - browser: real Chromium through playwright-core against the built app.
// The server and browser layers share one build, made by tests/support/build.ts.
const builtApp = {
  globalSetup: ['tests/support/build.ts'],
  testTimeout: 60_000,
  hookTimeout: 300_000,
  environment: 'node' as const,
}

export default defineConfig({
  test: {
    projects: [
      { test: { name: 'unit', include: ['tests/unit/**/*.test.ts'], environment: 'node' } },
      { test: { name: 'server', include: ['tests/server/**/*.test.ts'], ...builtApp } },
      // One browser at a time: two cores are shared with the servers under test.
      // A browser test walks a whole flow in real Chromium: minutes, not seconds, on a busy 2-core machine.
      { test: { name: 'browser', include: ['tests/browser/**/*.test.ts'], ...builtApp, testTimeout: 180_000, fileParallelism: false } },
    ],
  },
})
