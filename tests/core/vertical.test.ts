/**
 * Vertical term V(z) (src/core/vertical.ts), model.md "Concentration": ground image, lid images,
 * the well-mixed switch at σz ≥ 1.6 L. Reference sums are written out here.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { verticalTerm, WELL_MIXED_RATIO } from "../../src/core/vertical.ts";
import { runs } from "../support/fast-check.ts";

/** Image sum of model.md, n from −N to N (Turner 1970 eq. 5.2 form, from memory). */
function imageSum(z: number, H: number, sz: number, L: number, N: number): number {
  let s = 0;
  for (let n = -N; n <= N; n++) {
    s += Math.exp(-((z - H + 2 * n * L) ** 2) / (2 * sz * sz));
    s += Math.exp(-((z + H + 2 * n * L) ** 2) / (2 * sz * sz));
  }
  return s;
}
/** Single (ground) reflection. */
const single = (z: number, H: number, sz: number) =>
  Math.exp(-((z - H) ** 2) / (2 * sz * sz)) + Math.exp(-((z + H) ** 2) / (2 * sz * sz));
/** Well-mixed form √(2π)·σz/L. */
const wellMixed = (sz: number, L: number) => (Math.sqrt(2 * Math.PI) * sz) / L;

describe("V(z)", () => {
  it("without a lid is the ground-reflected pair", () => {
    for (const [z, H, sz] of [
      [1.5, 0, 10],
      [0, 30, 12],
      [2, 50, 80],
    ] as const) {
      expect(verticalTerm(z, H, sz, null)).toBeCloseTo(single(z, H, sz), 14);
    }
  });

  it("lid → ∞ gives the single reflection", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 100, noNaN: true }),
        fc.double({ min: 0, max: 200, noNaN: true }),
        fc.double({ min: 1, max: 500, noNaN: true }),
        (z, H, sz) => {
          const a = verticalTerm(z, H, sz, 1e7);
          const b = verticalTerm(z, H, sz, null);
          expect(Math.abs(a - b)).toBeLessThanOrEqual(1e-12 * Math.max(b, 1e-300) + 1e-300);
        },
      ),
      runs(200),
    );
  });

  it("with a lid matches the image sum n = −50…50 below the well-mixed switch", () => {
    for (const [z, H, sz, L] of [
      [1.5, 2, 100, 200],
      [0, 50, 150, 100],
      [10, 80, 40, 100],
      [1.5, 0, 159, 100],
    ] as const) {
      expect(verticalTerm(z, H, sz, L) / imageSum(z, H, sz, L, 50)).toBeCloseTo(1, 12);
    }
  });

  it("the image series and the well-mixed form agree to 1e-5 at σz = 1.6 L (model.md)", () => {
    expect(WELL_MIXED_RATIO).toBe(1.6);
    for (const L of [50, 400, 2000]) {
      const sz = 1.6 * L;
      for (const zf of [0, 0.3, 0.9]) {
        for (const Hf of [0, 0.5, 1]) {
          const series = imageSum(zf * L, Hf * L, sz, L, 60);
          expect(Math.abs(series / wellMixed(sz, L) - 1)).toBeLessThan(1e-5);
        }
      }
    }
  });

  it("switches to the well-mixed form at σz ≥ 1.6 L without a visible jump", () => {
    const L = 300;
    const just = verticalTerm(1.5, 10, 1.6 * L * (1 - 1e-9), L);
    const at = verticalTerm(1.5, 10, 1.6 * L, L);
    expect(at).toBeCloseTo(wellMixed(1.6 * L, L), 14);
    expect(Math.abs(at / just - 1)).toBeLessThan(1e-5);
    expect(verticalTerm(1.5, 10, 5 * L, L)).toBeCloseTo(wellMixed(5 * L, L), 14);
  });

  it("conserves mass in z: ∫₀^L V dz = √(2π)·σz (lid) and ∫₀^∞ V dz = √(2π)·σz (none)", () => {
    const simpson = (f: (z: number) => number, a: number, b: number, n: number) => {
      const h = (b - a) / n;
      let s = 0;
      for (let i = 0; i <= n; i++) s += (i === 0 || i === n ? 1 : i % 2 ? 4 : 2) * f(a + i * h);
      return (s * h) / 3;
    };
    for (const [H, sz, L] of [
      [0, 60, 200],
      [50, 120, 100],
      [90, 30, 100],
      [20, 150, 100],
    ] as const) {
      const I = simpson((z) => verticalTerm(z, H, sz, L), 0, L, 2000);
      expect(I / (Math.sqrt(2 * Math.PI) * sz)).toBeCloseTo(1, 8);
    }
    const I0 = simpson((z) => verticalTerm(z, 40, 25, null), 0, 40 + 12 * 25, 4000);
    expect(I0 / (Math.sqrt(2 * Math.PI) * 25)).toBeCloseTo(1, 9);
  });

  it("no-reflection form is half the reflected one at ground level (z = 0)", () => {
    const noReflection = (z: number, H: number, sz: number) =>
      Math.exp(-((z - H) ** 2) / (2 * sz * sz));
    expect(verticalTerm(0, 0, 20, null)).toBe(2);
    expect(verticalTerm(0, 0, 20, null)).toBe(2 * noReflection(0, 0, 20));
    for (const H of [5, 30])
      expect(verticalTerm(0, H, 20, null) / noReflection(0, H, 20)).toBeCloseTo(2, 14);
  });

  it("is symmetric in z and H (reciprocity of the image pair)", () => {
    expect(verticalTerm(3, 40, 25, null)).toBeCloseTo(verticalTerm(40, 3, 25, null), 15);
    expect(verticalTerm(3, 40, 25, 150)).toBeCloseTo(verticalTerm(40, 3, 25, 150), 14);
  });

  it("is 0 for a release above the lid and for σz = 0", () => {
    expect(verticalTerm(1.5, 300, 100, 200)).toBe(0);
    expect(verticalTerm(1.5, 0, 0, null)).toBe(0);
  });
});
