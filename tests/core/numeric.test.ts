/**
 * Numerical helpers (src/core/numeric.ts): erf against tabulated values, its symmetry and edge
 * cases; Brent's root finder and the golden-section maximiser on functions with closed-form
 * answers; the shoelace area and its orientation sign.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { brent, clamp, erf, goldenMax, ringArea } from "../../src/core/numeric.ts";
import { runs } from "../support/fast-check.ts";

describe("erf", () => {
  // Abramowitz & Stegun (1964), Handbook of Mathematical Functions, Table 7.1 (10 decimals).
  const TABLE: [number, number][] = [
    [0.5, 0.5204998778],
    [1, 0.8427007929],
    [2, 0.995322265],
    [3, 0.9999779095],
  ];
  for (const [x, v] of TABLE) {
    it(`erf(${x}) = ${v} to the 10 printed decimals (A&S 1964 Table 7.1)`, () => {
      expect(Math.abs(erf(x) - v)).toBeLessThan(5e-11);
    });
  }

  // A&S 1964 Table 7.1, further rows used to check the switch to the continued fraction (x ≥ 3).
  it("is continuous across the series / continued-fraction switch at x = 3", () => {
    const below = erf(3 - 1e-12);
    const above = erf(3);
    expect(Math.abs(above - below)).toBeLessThan(1e-13);
  });

  it("erfc(4) = 1.5417257900e-8 via 1 − erf (from memory)", () => {
    expect(Math.abs(1 - erf(4) - 1.54172579e-8)).toBeLessThan(1e-15);
  });

  it("is odd: erf(−x) = −erf(x) (A&S 1964 eq. 7.1.9)", () => {
    fc.assert(
      fc.property(fc.double({ min: -10, max: 10, noNaN: true }), (x) => {
        // === rather than Object.is: erf(−0) may be +0.
        expect(erf(-x) === -erf(x)).toBe(true);
      }),
      runs(300),
    );
  });

  it("is increasing and bounded by ±1 (its derivative 2/√π·e^{−x²} is positive)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: -5.5, max: 5.5, noNaN: true }),
        fc.double({ min: 1e-3, max: 1, noNaN: true }),
        (x, dx) => {
          expect(erf(x + dx)).toBeGreaterThanOrEqual(erf(x));
          expect(Math.abs(erf(x))).toBeLessThanOrEqual(1);
        },
      ),
      runs(300),
    );
  });

  it("matches its derivative 2/√π·e^{−x²} by central differences (A&S 1964 eq. 7.1.19)", () => {
    for (const x of [0, 0.3, 1.2, 2.5, 2.999, 3.2, 4]) {
      const h = 1e-5;
      const d = (erf(x + h) - erf(x - h)) / (2 * h);
      expect(d).toBeCloseTo((2 / Math.sqrt(Math.PI)) * Math.exp(-x * x), 8);
    }
  });

  it("treats 0, ±Infinity and NaN as documented", () => {
    expect(erf(0)).toBe(0);
    expect(erf(Number.POSITIVE_INFINITY)).toBe(1);
    expect(erf(Number.NEGATIVE_INFINITY)).toBe(-1);
    expect(Number.isNaN(erf(Number.NaN))).toBe(true);
  });
});

describe("brent", () => {
  it("finds √2 as the root of x² − 2 on [0, 2] to the asked tolerance", () => {
    const r = brent((x) => x * x - 2, 0, 2, 1e-12);
    expect(Math.abs(r - Math.SQRT2)).toBeLessThan(1e-11);
  });

  it("finds the fixed point of cos, 0.7390851332151607 (the Dottie number, from memory)", () => {
    const r = brent((x) => Math.cos(x) - x, 0, 1, 1e-14);
    expect(Math.abs(r - 0.7390851332151607)).toBeLessThan(1e-12);
  });

  it("finds ln 10 as the root of eˣ − 10 with the bracket given backwards", () => {
    const r = brent((x) => Math.exp(x) - 10, 5, 0, 1e-12);
    expect(Math.abs(r - Math.LN10)).toBeLessThan(1e-11);
  });

  it("returns an end point that is itself a root", () => {
    expect(brent((x) => x - 1, 1, 3, 1e-9)).toBe(1);
    expect(brent((x) => x - 3, 1, 3, 1e-9)).toBe(3);
  });

  it("throws on a bracket without a sign change", () => {
    expect(() => brent((x) => x * x + 1, -1, 1, 1e-9)).toThrow(/not bracketed/);
  });

  it("finds the root of any bracketed cubic (x − r)(x² + 1)", () => {
    fc.assert(
      fc.property(fc.double({ min: -100, max: 100, noNaN: true }), (root) => {
        const f = (x: number) => (x - root) * (x * x + 1);
        const x = brent(f, root - 7.3, root + 11.1, 1e-10);
        expect(Math.abs(x - root)).toBeLessThan(1e-8);
      }),
      runs(200),
    );
  });
});

describe("goldenMax", () => {
  // Near a smooth maximum f changes by O(δ²), so x can only be located to about √ε·|x| ≈ 1.5e-8·|x|
  // (Press et al. 1992, Numerical Recipes, 2nd ed., §10.1): the x tolerances below are 1e-7.
  it("finds the vertex of 3 − (x − 2)² on [−5, 7]", () => {
    const [x, v] = goldenMax((t) => 3 - (t - 2) ** 2, -5, 7, 1e-9);
    expect(Math.abs(x - 2)).toBeLessThan(1e-7);
    expect(v).toBeCloseTo(3, 12);
  });

  it("finds sin's maximum at π/2 on [0, π]", () => {
    const [x, v] = goldenMax(Math.sin, 0, Math.PI, 1e-10);
    expect(Math.abs(x - Math.PI / 2)).toBeLessThan(1e-7);
    expect(v).toBeCloseTo(1, 14);
  });

  it("finds x·e^{−x}'s maximum at x = 1 (value 1/e)", () => {
    const [x, v] = goldenMax((t) => t * Math.exp(-t), 0, 10, 1e-10);
    expect(Math.abs(x - 1)).toBeLessThan(1e-7);
    expect(v).toBeCloseTo(1 / Math.E, 14);
  });
});

describe("ringArea (shoelace)", () => {
  it("is +1 for the counter-clockwise unit square and −1 clockwise", () => {
    const ccw: [number, number][] = [
      [0, 0],
      [1, 0],
      [1, 1],
      [0, 1],
    ];
    expect(ringArea(ccw)).toBe(1);
    expect(ringArea([...ccw].reverse())).toBe(-1);
  });

  it("approaches πr² for a fine regular polygon (area n/2·r²·sin(2π/n))", () => {
    const n = 3600;
    const r = 250;
    const ring: [number, number][] = [];
    for (let i = 0; i < n; i++) {
      const t = (2 * Math.PI * i) / n;
      ring.push([r * Math.cos(t), r * Math.sin(t)]);
    }
    expect(ringArea(ring)).toBeCloseTo((n / 2) * r * r * Math.sin((2 * Math.PI) / n), 6);
  });

  it("is 0 for an empty ring", () => {
    expect(ringArea([])).toBe(0);
  });
});

describe("clamp", () => {
  it("clamps to the range and keeps NaN as NaN", () => {
    expect(clamp(5, 0, 3)).toBe(3);
    expect(clamp(-5, 0, 3)).toBe(0);
    expect(clamp(2, 0, 3)).toBe(2);
    expect(Number.isNaN(clamp(Number.NaN, 0, 3))).toBe(true);
  });
});
