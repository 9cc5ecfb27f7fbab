import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { defineConfig } from "vitest/config";
import base from "./vitest.config.ts";

// `npm run fuzz`: the unit suite's property tests (every test file that calls fc.assert), each
// property with a fresh random seed and FC_SCALE (default 10) times its runs; see
// tests/support/fast-check.ts. Not part of `npm test`; takes minutes.
function propertyFiles(dir: string): string[] {
  const out: string[] = [];
  for (const e of readdirSync(dir, { withFileTypes: true })) {
    const p = join(dir, e.name);
    if (e.isDirectory()) {
      if (e.name !== "browser") out.push(...propertyFiles(p));
    } else if (/\.test\.tsx?$/.test(e.name) && readFileSync(p, "utf8").includes("fc.assert(")) {
      out.push(p);
    }
  }
  return out.sort();
}

export default defineConfig({
  ...base,
  test: {
    ...base.test,
    include: propertyFiles("tests"),
    env: { FC_FUZZ: "1" },
    testTimeout: 3_600_000,
    hookTimeout: 3_600_000,
  },
});
