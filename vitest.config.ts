import { defineConfig } from "vitest/config";

export default defineConfig({
  test: {
    include: ["tests/**/*.test.ts", "tests/**/*.test.tsx"],
    exclude: ["tests/browser/**", "node_modules/**"],
    environment: "node",
    // fast-check's seed and run counts for every property (tests/support/fast-check.ts).
    setupFiles: ["tests/support/fast-check.ts"],
  },
});
