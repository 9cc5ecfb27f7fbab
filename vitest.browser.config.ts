import { defineConfig } from "vitest/config";

// Browser tests drive Debian's /usr/bin/chromium through playwright-core against the built app
// (`npm run build` first). One file at a time: each starts its own server and browser.
export default defineConfig({
  test: {
    include: ["tests/browser/**/*.test.ts"],
    environment: "node",
    fileParallelism: false,
    testTimeout: 60_000,
    hookTimeout: 60_000,
  },
});
