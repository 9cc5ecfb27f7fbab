/**
 * Dispersion coefficients (src/core/sigma.ts) against published values and the published formulas
 * written out here, independently of the code's tables.
 */
import { describe, expect, it } from "vitest";
import {
  briggsSigmaY,
  briggsSigmaZ,
  CURVE_RANGE_M,
  pgSigmaY,
  pgSigmaZ,
  sigmas,
} from "../../src/core/sigma.ts";
import { STABILITY_CLASSES, type StabilityClass } from "../../src/core/types.ts";

/** Round to `d` decimals, as a printed table does. */
const printed = (v: number, d: number) => Math.round(v * 10 ** d) / 10 ** d;

describe("Pasquill–Gifford σz (Boubel, Fox, Turner & Stern 1994, Table 19-5, p. 304)", () => {
  // σz printed at the range limits for class D: Boubel et al. (1994) Table 19-5.
  const D_PRINTED: [number, number][] = [
    [0.3, 12.1],
    [1, 32.1],
    [3, 65.1],
    [10, 134.9],
    [30, 251.2],
  ];
  for (const [km, m] of D_PRINTED) {
    it(`class D at ${km} km is ${m} m to the printed precision (both fitted pieces)`, () => {
      // At a range limit both the piece below and the piece above must print the same value.
      expect(printed(pgSigmaZ("D", km * 1000), 1)).toBe(m);
      expect(printed(pgSigmaZ("D", km * 1000 * (1 - 1e-9)), 1)).toBe(m);
    });
  }

  it("class E 10–20 km piece (26.970, 0.46713) gives 109.3 m at 20 km (model.md note on Table 19-5)", () => {
    expect(printed(pgSigmaZ("E", 20_000 * (1 - 1e-9)), 1)).toBe(109.3);
    expect(printed(pgSigmaZ("E", 20_000), 1)).toBe(109.3);
    // The transposed exponent 0.46173 in one circulating copy would give 107.5 m: not what we use.
    expect(printed(26.97 * 20 ** 0.46173, 1)).not.toBe(109.3);
  });

  // Boubel et al. (1994) Table 19-5: the pieces are fitted to join; at every range limit the two
  // neighbouring pieces agree. A mistyped a or b in a transcription breaks this.
  const LIMITS_KM: Record<StabilityClass, number[]> = {
    A: [0.1, 0.15, 0.2, 0.25, 0.3, 0.4, 0.5],
    B: [0.2, 0.4],
    C: [],
    D: [0.3, 1, 3, 10, 30],
    E: [0.1, 0.3, 1, 2, 4, 10, 20, 40],
    F: [0.2, 0.7, 1, 2, 3, 7, 15, 30, 60],
  };
  for (const c of STABILITY_CLASSES) {
    it(`class ${c}: neighbouring pieces join within 0.1% at every range limit`, () => {
      for (const km of LIMITS_KM[c]) {
        const below = pgSigmaZ(c, km * 1000 * (1 - 1e-12));
        const above = pgSigmaZ(c, km * 1000);
        expect(Math.abs(above / below - 1)).toBeLessThan(1e-3);
      }
    });
  }

  it("class A is 5000 m beyond 3.11 km and every class is capped at 5000 m (Table 19-5)", () => {
    expect(pgSigmaZ("A", 3200)).toBe(5000);
    expect(pgSigmaZ("A", 50_000)).toBe(5000);
    for (const c of STABILITY_CLASSES) expect(pgSigmaZ(c, 1e7)).toBeLessThanOrEqual(5000);
  });

  it("class C is the single power law 61.141·x^0.91465 (x in km) at any distance", () => {
    for (const km of [0.05, 0.5, 2, 20, 80]) {
      expect(pgSigmaZ("C", km * 1000)).toBeCloseTo(61.141 * km ** 0.91465, 9);
    }
  });
});

describe("Pasquill–Gifford σy (Boubel et al. 1994, Table 19-4, p. 303)", () => {
  // σy = 465.11628·x·tan(0.017453293·(c − d·ln x)), x in km; constants of Table 19-4.
  const CD: Record<StabilityClass, [number, number]> = {
    A: [24.167, 2.5334],
    B: [18.333, 1.8096],
    C: [12.5, 1.0857],
    D: [8.333, 0.72382],
    E: [6.25, 0.54287],
    F: [4.1667, 0.36191],
  };
  const formula = (c: StabilityClass, km: number) => {
    const [cc, d] = CD[c];
    return 465.11628 * km * Math.tan(0.017453293 * (cc - d * Math.log(km)));
  };
  for (const c of STABILITY_CLASSES) {
    it(`class ${c} follows the published formula at 0.1, 0.5, 1, 3, 10 km`, () => {
      for (const km of [0.1, 0.5, 1, 3, 10]) {
        expect(pgSigmaY(c, km * 1000) / formula(c, km)).toBeCloseTo(1, 12);
      }
    });
  }

  it("at 1 km the formula reduces to 465.11628·tan(c°): class D 68.1 m (Turner 1970 Fig. 3-2 reads about 68 m, from memory)", () => {
    const v = pgSigmaY("D", 1000);
    expect(printed(v, 1)).toBe(printed(465.11628 * Math.tan((8.333 * Math.PI) / 180), 1));
    expect(Math.abs(v - 68) / 68).toBeLessThan(0.05);
  });

  it("class D at 3 km is within 5% of the 190 m Turner (1970) reads off Fig. 3-2 for Problem 1 (from memory)", () => {
    expect(Math.abs(pgSigmaY("D", 3000) - 190) / 190).toBeLessThan(0.05);
  });

  it("widens from A to F at every distance (the curves of Turner 1970 Fig. 3-2 do not cross)", () => {
    for (const x of [100, 1000, 10_000]) {
      for (let i = 1; i < STABILITY_CLASSES.length; i++) {
        const more = STABILITY_CLASSES[i - 1] as StabilityClass;
        const less = STABILITY_CLASSES[i] as StabilityClass;
        expect(pgSigmaY(more, x)).toBeGreaterThan(pgSigmaY(less, x));
      }
    }
  });
});

describe("Briggs (1973) σ, as in Hanna, Briggs & Hosker (1982), Handbook on Atmospheric Diffusion", () => {
  // The formulas of Hanna, Briggs & Hosker (1982) (also Griffiths 1994, Atmos. Environ. 28), x in m.
  const OPEN: Record<StabilityClass, [(x: number) => number, (x: number) => number]> = {
    A: [(x) => 0.22 * x * (1 + 0.0001 * x) ** -0.5, (x) => 0.2 * x],
    B: [(x) => 0.16 * x * (1 + 0.0001 * x) ** -0.5, (x) => 0.12 * x],
    C: [(x) => 0.11 * x * (1 + 0.0001 * x) ** -0.5, (x) => 0.08 * x * (1 + 0.0002 * x) ** -0.5],
    D: [(x) => 0.08 * x * (1 + 0.0001 * x) ** -0.5, (x) => 0.06 * x * (1 + 0.0015 * x) ** -0.5],
    E: [(x) => 0.06 * x * (1 + 0.0001 * x) ** -0.5, (x) => 0.03 * x * (1 + 0.0003 * x) ** -1],
    F: [(x) => 0.04 * x * (1 + 0.0001 * x) ** -0.5, (x) => 0.016 * x * (1 + 0.0003 * x) ** -1],
  };
  const URBAN: Record<StabilityClass, [(x: number) => number, (x: number) => number]> = {
    A: [(x) => 0.32 * x * (1 + 0.0004 * x) ** -0.5, (x) => 0.24 * x * (1 + 0.001 * x) ** 0.5],
    B: [(x) => 0.32 * x * (1 + 0.0004 * x) ** -0.5, (x) => 0.24 * x * (1 + 0.001 * x) ** 0.5],
    C: [(x) => 0.22 * x * (1 + 0.0004 * x) ** -0.5, (x) => 0.2 * x],
    D: [(x) => 0.16 * x * (1 + 0.0004 * x) ** -0.5, (x) => 0.14 * x * (1 + 0.0003 * x) ** -0.5],
    E: [(x) => 0.11 * x * (1 + 0.0004 * x) ** -0.5, (x) => 0.08 * x * (1 + 0.0015 * x) ** -0.5],
    F: [(x) => 0.11 * x * (1 + 0.0004 * x) ** -0.5, (x) => 0.08 * x * (1 + 0.0015 * x) ** -0.5],
  };
  for (const c of STABILITY_CLASSES) {
    it(`class ${c}, open and urban, at 100 m, 1 km, 10 km`, () => {
      for (const x of [100, 1000, 10_000]) {
        expect(briggsSigmaY(c, "open", x) / OPEN[c][0](x)).toBeCloseTo(1, 12);
        expect(briggsSigmaZ(c, "open", x) / OPEN[c][1](x)).toBeCloseTo(1, 12);
        expect(briggsSigmaY(c, "urban", x) / URBAN[c][0](x)).toBeCloseTo(1, 12);
        expect(briggsSigmaZ(c, "urban", x) / URBAN[c][1](x)).toBeCloseTo(1, 12);
      }
    });
  }

  it("hand values: open D at 1 km σy = 80/√1.1 = 76.28 m, σz = 60/√2.5 = 37.95 m", () => {
    expect(printed(briggsSigmaY("D", "open", 1000), 2)).toBe(76.28);
    expect(printed(briggsSigmaZ("D", "open", 1000), 2)).toBe(37.95);
  });

  it("hand values: open F at 2 km σy = 80/√1.2 = 73.03 m, σz = 32/1.6 = 20 m", () => {
    expect(printed(briggsSigmaY("F", "open", 2000), 2)).toBe(73.03);
    expect(briggsSigmaZ("F", "open", 2000)).toBeCloseTo(20, 10);
  });

  it("hand values: urban D at 500 m σy = 80/√1.2 = 73.03 m, σz = 70/√1.15 = 65.28 m", () => {
    expect(printed(briggsSigmaY("D", "urban", 500), 2)).toBe(73.03);
    expect(printed(briggsSigmaZ("D", "urban", 500), 2)).toBe(65.28);
  });
});

describe("sigmas()", () => {
  it("picks the scheme; Pasquill–Gifford ignores the ground type (open-country curves)", () => {
    expect(sigmas("pasquill-gifford", "D", "urban", 2000)).toEqual({
      y: pgSigmaY("D", 2000),
      z: pgSigmaZ("D", 2000),
    });
    expect(sigmas("briggs", "D", "urban", 2000)).toEqual({
      y: briggsSigmaY("D", "urban", 2000),
      z: briggsSigmaZ("D", "urban", 2000),
    });
  });

  it("is 0 upwind and at the source (nothing upwind is modelled, model.md Coordinates)", () => {
    for (const x of [0, -10, Number.NaN]) {
      expect(pgSigmaY("D", x)).toBe(0);
      expect(pgSigmaZ("D", x)).toBe(0);
      expect(briggsSigmaY("D", "open", x)).toBe(0);
      expect(briggsSigmaZ("D", "urban", x)).toBe(0);
    }
  });

  it("states the 100 m – 10 km range of the curves (model.md, Dispersion coefficients)", () => {
    expect(CURVE_RANGE_M).toEqual({ min: 100, max: 10_000 });
  });
});
