import { defineConfig } from "vitest/config";

export default defineConfig({
  test: {
    include: ["tests/**/*.test.ts", "tests/**/*.test.tsx"],
    exclude: ["tests/browser/**", "node_modules/**"],
    environment: "node",
    // A timeout only catches a hang; it must never fail a slow run on a busy machine (speed is
    // measured by `npm run bench`, not asserted). Tests that need longer state it themselves.
    testTimeout: 120_000,
    hookTimeout: 120_000,
    // fast-check's seed and run counts for every property (tests/support/fast-check.ts).
    setupFiles: ["tests/support/fast-check.ts"],
  },
});
