/**
 * Size budget (issue 5, "Budgets"): the app JS of every chunk the first screen loads is at most
 * 35 kB gzip (35 × 1000 bytes). Runs on the built app (`npm run build` first), by size, never by
 * time. "First screen" = what dist/index.html names plus their static imports (bench/bundle.ts).
 * The numbers are printed on every run, and the failure message lists them.
 */
import { existsSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, test } from "vitest";
import {
  bundleReport,
  DIST,
  FIRST_SCREEN_JS_GZIP_BUDGET,
  firstScreenFiles,
  staticImports,
} from "../../bench/bundle.ts";

const kB = (n: number) => `${(n / 1000).toFixed(1)} kB`;

describe("size budget", () => {
  test("static imports are read from minified modules, dynamic import() is not", () => {
    const code =
      'import{a as b}from"./a-1.js";import"./b-2.js";export{c}from"./c-3.js";const d=()=>import("./lazy-4.js");';
    expect(staticImports(code)).toEqual(["./a-1.js", "./b-2.js", "./c-3.js"]);
  });

  test(`first-screen app JS ≤ ${kB(FIRST_SCREEN_JS_GZIP_BUDGET)} gzip`, () => {
    if (!existsSync(join(DIST, "index.html"))) {
      throw new Error(`dist/ is missing (${DIST}): run npm run build first`);
    }
    const r = bundleReport(DIST);
    expect(
      firstScreenFiles(DIST).js.length,
      "index.html loads at least one script",
    ).toBeGreaterThan(0);
    const lines = [
      ...r.firstScreen.js.map((f) => `  ${f.file}: ${kB(f.raw)} raw, ${kB(f.gzip)} gzip`),
      `  total first-screen JS: ${kB(r.firstScreen.jsGzip)} gzip (budget ${kB(FIRST_SCREEN_JS_GZIP_BUDGET)})`,
      ...r.workers.map((f) => `  (worker, loaded later: ${f.file} ${kB(f.gzip)} gzip)`),
    ].join("\n");
    console.log(`first screen:\n${lines}`);
    expect(
      r.firstScreen.jsGzip,
      `first-screen JS is over budget by ${kB(r.firstScreen.jsGzip - FIRST_SCREEN_JS_GZIP_BUDGET)}:\n${lines}`,
    ).toBeLessThanOrEqual(FIRST_SCREEN_JS_GZIP_BUDGET);
  });
});
