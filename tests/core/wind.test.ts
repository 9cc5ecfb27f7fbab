/**
 * Wind at release height (src/core/wind.ts): power law with the regulatory default exponents
 * (Irwin 1979, Atmospheric Environment 13; EPA-454/R-99-005 §6.2.5; ISC3 user's guide
 * EPA-454/B-95-003b) and model.md's calm clamp at 1 m/s.
 */
import { describe, expect, it } from "vitest";
import { STABILITY_CLASSES } from "../../src/core/types.ts";
import { CALM_WIND_M_S, WIND_EXPONENTS, windAtHeight } from "../../src/core/wind.ts";

describe("windAtHeight", () => {
  // Irwin (1979) exponents as tabulated in the ISC3 user's guide (EPA-454/B-95-003b), Vol. II.
  const IRWIN = {
    open: [0.07, 0.07, 0.1, 0.15, 0.35, 0.55],
    urban: [0.15, 0.15, 0.2, 0.25, 0.3, 0.3],
  };

  it("uses the Irwin (1979) exponents for every class and ground", () => {
    STABILITY_CLASSES.forEach((c, i) => {
      expect(WIND_EXPONENTS.open[c]).toBe(IRWIN.open[i]);
      expect(WIND_EXPONENTS.urban[c]).toBe(IRWIN.urban[i]);
    });
  });

  it("scales u_ref by (h/z_ref)^p above the measuring height: D open, 3 m/s at 10 m → 3·5^0.15 at 50 m", () => {
    const w = windAtHeight(3, 10, 50, "D", "open");
    expect(w.powerLaw).toBeCloseTo(3 * 5 ** 0.15, 12);
    expect(w.used).toBe(w.powerLaw);
    expect(w.calm).toBe(false);
  });

  it("F urban at 100 m from 2 m/s at 10 m: 2·10^0.3 = 3.99 m/s", () => {
    expect(windAtHeight(2, 10, 100, "F", "urban").used).toBeCloseTo(2 * 10 ** 0.3, 12);
  });

  it("keeps the measured speed below the measuring height (max(h, z_ref), model.md)", () => {
    for (const h of [0, 2, 10]) expect(windAtHeight(4, 10, h, "E", "open").used).toBe(4);
  });

  it("clamps calms to 1 m/s and flags them (model.md, Wind speed at release height)", () => {
    const w = windAtHeight(0.4, 10, 2, "F", "open");
    expect(CALM_WIND_M_S).toBe(1);
    expect(w.calm).toBe(true);
    expect(w.powerLaw).toBeCloseTo(0.4, 12);
    expect(w.used).toBe(1);
    expect(windAtHeight(0, 10, 0, "D", "open").used).toBe(1);
  });

  it("judges the calm after the power law: 0.9 m/s at 10 m is 1.03 m/s at 20 m in class F", () => {
    const w = windAtHeight(0.9, 10, 20, "F", "open");
    expect(w.powerLaw).toBeCloseTo(0.9 * 2 ** 0.55, 12);
    expect(w.calm).toBe(false);
    expect(w.used).toBe(w.powerLaw);
  });
});
