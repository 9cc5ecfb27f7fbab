/**
 * Averaging-time and release-duration corrections (src/core/averaging.ts), model.md
 * "Averaging time and release duration": the 0.2-power meander law (Turner 1970, Workbook of
 * Atmospheric Dispersion Estimates, ch. 3) with model.md's clamps, and the Palazzi, De Faveri,
 * Fumarola & Ferraiolo (1982, Atmospheric Environment 16) window average.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  durationFactor,
  instantaneousFactor,
  meanderFactor,
  phi,
  samplingTime,
} from "../../src/core/averaging.ts";
import { erf } from "../../src/core/numeric.ts";
import { runs } from "../support/fast-check.ts";

describe("meander correction σy,eff = σy·(t_s/600)^0.2 (Turner 1970 ch. 3, p = 0.2)", () => {
  it("is 1 at the 10-minute reference and (t_s/600)^0.2 elsewhere", () => {
    expect(meanderFactor(600)).toBe(1);
    expect(meanderFactor(3600)).toBeCloseTo(6 ** 0.2, 14); // 1.431
    expect(meanderFactor(180)).toBeCloseTo(0.3 ** 0.2, 14); // 0.786
    expect(meanderFactor(1800)).toBeCloseTo(3 ** 0.2, 14);
  });

  // model.md: t_s = clamp(min(t_a, T), 180 s, 3600 s), T = ∞ ongoing, 0 all at once.
  const CASES: [number, number | null, number, boolean][] = [
    [600, null, 600, false],
    [3600, null, 3600, false],
    [7200, null, 3600, true], // above the 1-hour clamp
    [60, null, 180, true], // below the 3-minute clamp
    [180, null, 180, false],
    [3600, 900, 900, false], // a 15-minute release averaged over an hour
    [3600, 60, 180, true], // a 1-minute release: clamp
    [600, 0, 180, true], // all at once (T = 0)
  ];
  for (const [ta, T, ts, clamped] of CASES) {
    it(`t_a ${ta} s, T ${T ?? "∞"} → t_s ${ts} s${clamped ? " (clamped)" : ""} (model.md)`, () => {
      expect(samplingTime(ta, T)).toEqual({ ts, clamped });
    });
  }
});

describe("Palazzi et al. (1982) window-average factor F", () => {
  /** G(τ) of model.md, τ from the passage midpoint. */
  const G = (tau: number, T: number, u: number, sx: number) =>
    0.5 *
    (erf(((u * T) / 2 - u * tau) / (Math.SQRT2 * sx)) +
      erf(((u * T) / 2 + u * tau) / (Math.SQRT2 * sx)));
  /**
   * Highest t_a-average by direct quadrature of G over the centred window: composite Simpson on
   * pieces split where G has its fronts (τ = ±T/2 ± 10σx/u), 2000 intervals a piece.
   */
  const windowAverage = (T: number, ta: number, u: number, sx: number) => {
    const lo = -ta / 2;
    const hi = ta / 2;
    const edges = [lo, hi];
    for (const c of [-T / 2, T / 2])
      for (const d of [-10, 0, 10]) {
        const e = c + (d * sx) / u;
        if (e > lo && e < hi) edges.push(e);
      }
    edges.sort((p, q) => p - q);
    const n = 2000;
    let total = 0;
    for (let k = 1; k < edges.length; k++) {
      const a = edges[k - 1] as number;
      const h = ((edges[k] as number) - a) / n;
      let s = 0;
      for (let i = 0; i <= n; i++)
        s += (i === 0 || i === n ? 1 : i % 2 ? 4 : 2) * G(a + i * h, T, u, sx);
      total += (s * h) / 3;
    }
    return total / ta;
  };

  it("equals the direct average of G(τ) over the window centred on the midpoint", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 10, max: 20_000, noNaN: true }), // T (s)
        fc.double({ min: 60, max: 7200, noNaN: true }), // t_a (s)
        fc.double({ min: 1, max: 15, noNaN: true }), // u (m/s)
        fc.double({ min: 1, max: 3000, noNaN: true }), // σx (m)
        (T, ta, u, sx) => {
          expect(Math.abs(durationFactor(T, ta, u, sx) - windowAverage(T, ta, u, sx))).toBeLessThan(
            1e-7,
          );
        },
      ),
      runs(100),
    );
  });

  it("is 1 for an ongoing release and tends to 1 for a long one (steady plume)", () => {
    expect(durationFactor(null, 3600, 3, 200)).toBe(1);
    // Φ((a+h)/b) − Φ((a−h)/b) cancels: F carries a rounding error of about ε·T/t_a (here ~1e-12).
    expect(durationFactor(1e8, 3600, 3, 200)).toBeCloseTo(1, 9);
  });

  it("tends to (T/t_a)·erf(h/b) as T → 0, h = u·t_a/2, b = √2·σx (model.md)", () => {
    for (const [ta, u, sx] of [
      [600, 3, 100],
      [3600, 2, 800],
      [60, 8, 30],
    ] as const) {
      const T = 1e-4;
      const limit = (T / ta) * erf((u * ta) / 2 / (Math.SQRT2 * sx));
      expect(durationFactor(T, ta, u, sx) / limit).toBeCloseTo(1, 5);
    }
  });

  it("tends to min(1, T/t_a) without along-wind spread (σx → 0)", () => {
    expect(durationFactor(300, 600, 3, 1e-6)).toBeCloseTo(0.5, 8);
    expect(durationFactor(900, 600, 3, 1e-6)).toBeCloseTo(1, 8);
    expect(durationFactor(300, 600, 3, 0)).toBe(0.5);
  });

  it("lies in (0, 1] and grows with the duration", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 1e5, noNaN: true }),
        fc.double({ min: 1, max: 86_400, noNaN: true }),
        fc.double({ min: 1, max: 20, noNaN: true }),
        fc.double({ min: 0.1, max: 5000, noNaN: true }),
        (T, ta, u, sx) => {
          const f = durationFactor(T, ta, u, sx);
          expect(f).toBeGreaterThan(0);
          expect(f).toBeLessThanOrEqual(1);
          // up to the ε·T/t_a rounding of the difference of Φ's (see above)
          expect(durationFactor(T * 1.5, ta, u, sx)).toBeGreaterThanOrEqual(f - 1e-9);
        },
      ),
      runs(200),
    );
  });

  it("Φ(s) = s·erf(s) + e^{−s²}/√π is even and its derivative is erf (antiderivative)", () => {
    for (const s of [0, 0.2, 1, 2.7, 4]) {
      expect(phi(-s)).toBe(phi(s));
      if (s > 0) {
        const h = 1e-5;
        expect((phi(s + h) - phi(s - h)) / (2 * h)).toBeCloseTo(erf(s), 8);
      }
    }
    expect(phi(0)).toBeCloseTo(1 / Math.sqrt(Math.PI), 15);
  });
});

describe("all-at-once factor erf(u·t_a/(2√2σx))/t_a", () => {
  it("is the T → 0 limit of F/T (Q·T = M, model.md)", () => {
    for (const [ta, u, sx] of [
      [600, 3, 100],
      [3600, 1, 2000],
      [10, 5, 40],
    ] as const) {
      const T = 1e-4;
      expect(durationFactor(T, ta, u, sx) / T / instantaneousFactor(ta, u, sx)).toBeCloseTo(1, 5);
    }
  });

  it("tends to u/(√(2π)·σx) as t_a → 0 (the puff's peak in time)", () => {
    const u = 4;
    const sx = 75;
    expect(instantaneousFactor(1e-6, u, sx) / (u / (Math.sqrt(2 * Math.PI) * sx))).toBeCloseTo(
      1,
      8,
    );
  });

  it("tends to 1/t_a when the puff passes well inside the window", () => {
    expect(instantaneousFactor(3600, 5, 10) * 3600).toBeCloseTo(1, 12);
  });
});
