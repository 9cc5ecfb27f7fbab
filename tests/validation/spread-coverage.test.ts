/**
 * The spread against Prairie Grass (Barad 1958; data README in ../shared/data/prairie_grass):
 * coverage per arc distance and per class is a share (finite, in [0, 1]) and the spread's width
 * is finite and at least 1 (max ≥ min). Nothing is tuned; the figures are printed by
 * `npm run validate` and written in README.md.
 */
import path from "node:path";
import { describe, expect, it } from "vitest";
import { runCheck } from "../../scripts/validation/check.ts";
import { readPrairieGrass } from "../../scripts/validation/prairie-grass.ts";
import { coverage, formatCoverage } from "../../scripts/validation/spread-coverage.ts";
import { estimate } from "../../src/core/index.ts";

const DATA = path.resolve(__dirname, "../../../shared/data/prairie_grass");

describe("spread coverage on Prairie Grass", () => {
  const result = runCheck(readPrairieGrass(DATA), (s) => estimate(s, { geojson: false }));
  for (const scheme of ["briggs", "pasquill-gifford"] as const) {
    it(`${scheme}: every group's coverage is finite and in [0, 1], its width finite and ≥ 1`, () => {
      const groups = coverage(result, scheme);
      expect(groups.map((g) => g.group)).toEqual(
        expect.arrayContaining(["all arcs", "50 m", "800 m", "class D"]),
      );
      for (const g of groups) {
        expect(g.count).toBeGreaterThan(0);
        expect(Number.isFinite(g.coverage)).toBe(true);
        expect(g.coverage).toBeGreaterThanOrEqual(0);
        expect(g.coverage).toBeLessThanOrEqual(1);
        expect(Number.isFinite(g.width_ratio)).toBe(true);
        expect(g.width_ratio).toBeGreaterThanOrEqual(1);
      }
    });
  }
  it("every arc's spread holds the estimate's own prediction", () => {
    for (const r of result.compared) {
      for (const scheme of ["briggs", "pasquill-gifford"] as const) {
        const [lo, hi] = r.spread_mg_m3[scheme];
        expect(lo).toBeLessThanOrEqual(r.predicted_mg_m3[scheme] * (1 + 1e-12));
        expect(hi).toBeGreaterThanOrEqual(r.predicted_mg_m3[scheme] * (1 - 1e-12));
      }
    }
  });
  it("prints a table for both schemes", () => {
    const text = formatCoverage(result);
    expect(text).toMatch(/Spread coverage, briggs/);
    expect(text).toMatch(/Spread coverage, pasquill-gifford/);
  });
});
