/**
 * Arrival and clear times at a point (src/core/timing.ts), model.md "Arrival and departure at a
 * point": C(τ) = C_plume·G(τ), σx = σy,eff (common practice), times from the release start.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { erf } from "../../src/core/numeric.ts";
import { makePlume } from "../../src/core/plume.ts";
import { briggsSigmaY, briggsSigmaZ } from "../../src/core/sigma.ts";
import { cloudPassage, passageAt } from "../../src/core/timing.ts";
import type { PlumeSetup, Release } from "../../src/core/types.ts";
import { verticalTerm } from "../../src/core/vertical.ts";
import { runs } from "../support/fast-check.ts";

const U = 2.5;
function plumeOf(release: Release, ta: number) {
  const s: PlumeSetup = {
    release,
    height: 2,
    windSpeed: U,
    stability: "E",
    terrain: "open",
    scheme: "briggs",
    mixingHeight: null,
    effectiveHeight: 2,
  };
  return makePlume(s, ta);
}

describe("all-at-once release: x/u ∓ (σx/u)·√(2 ln(C_peak/C*))", () => {
  const M = 20_000;
  const p = plumeOf({ kind: "instantaneous", mass: M }, 600);
  const meander = (180 / 600) ** 0.2; // t_s clamped at 180 s for T = 0 (model.md)
  /** Puff peak at (x, y, 1.5): M/((2π)^{3/2}·σx·σy·σz)·exp(−y²/2σy²)·V, σx = σy,eff. */
  const peak = (x: number, y: number) => {
    const sy = briggsSigmaY("E", "open", x) * meander;
    const sz = briggsSigmaZ("E", "open", x);
    return (
      (M / ((2 * Math.PI) ** 1.5 * sy * sy * sz)) *
      Math.exp(-(y * y) / (2 * sy * sy)) *
      verticalTerm(1.5, 2, sz, null)
    );
  };

  it("matches the closed form at several points and limits", () => {
    for (const [x, y, frac] of [
      [500, 0, 0.5],
      [2000, 20, 0.1],
      [5000, -50, 0.9],
      [800, 0, 1e-3],
    ] as const) {
      const cPeak = peak(x, y);
      const limit = frac * cPeak;
      const sx = briggsSigmaY("E", "open", x) * meander;
      const half = (sx / U) * Math.sqrt(2 * Math.log(cPeak / limit));
      const t = passageAt(p, limit, x, y, 1.5);
      expect(t.arrives as number).toBeCloseTo(Math.max(0, x / U - half), 6);
      expect(t.clears as number).toBeCloseTo(x / U + half, 6);
    }
  });

  it("is null where the puff's peak stays below the limit", () => {
    expect(passageAt(p, 1.01 * peak(1000, 0), 1000, 0, 1.5)).toEqual({
      arrives: null,
      clears: null,
    });
    expect(passageAt(p, 1e-3, 1000, 5000, 1.5)).toEqual({ arrives: null, clears: null });
    expect(passageAt(p, 1e-9, -100, 0, 1.5)).toEqual({ arrives: null, clears: null });
  });
});

describe("ongoing release: arrives, never clears", () => {
  const p = plumeOf({ kind: "continuous", rate: 100, duration: null }, 600);
  it("clears is null; at the arrival ½[1 + erf((u·t − x)/(√2σx))]·C_plume = C*", () => {
    for (const [x, frac] of [
      [300, 0.5],
      [1500, 0.2],
      [4000, 0.9],
    ] as const) {
      const amp = p.amplitude(x, 0, 1.5);
      const limit = frac * amp;
      const t = passageAt(p, limit, x, 0, 1.5);
      expect(t.clears).toBeNull();
      const a = t.arrives as number;
      const sx = p.sigmaY(x);
      const c = 0.5 * (1 + erf((U * a - x) / (Math.SQRT2 * sx))) * amp;
      expect(c / limit).toBeCloseTo(1, 6);
      // half the plateau arrives with the mean wind, x/u (frac = 0.5)
      if (frac === 0.5) expect(a).toBeCloseTo(x / U, 4);
    }
  });

  it("is null where the steady concentration never reaches the limit", () => {
    const amp = p.amplitude(1000, 0, 1.5);
    expect(passageAt(p, amp * 1.001, 1000, 0, 1.5)).toEqual({ arrives: null, clears: null });
  });
});

describe("finite release of duration T: symmetric about x/u + T/2", () => {
  const T = 900;
  const p = plumeOf({ kind: "continuous", rate: 100, duration: T }, 3600);
  it("arrival and clear straddle the midpoint and cross C* there (fast-check)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 100, max: 8000, noNaN: true }),
        fc.double({ min: -1, max: 1, noNaN: true }),
        fc.double({ min: 0.01, max: 0.95, noNaN: true }),
        (x, fy, frac) => {
          const sx = p.sigmaY(x);
          const y = fy * sx;
          const amp = p.amplitude(x, y, 1.5);
          const k = Math.SQRT2 * sx;
          const a = (U * T) / 2;
          const G0 = 0.5 * (erf(a / k) + erf(a / k)); // peak of G at τ = 0
          const limit = frac * G0 * amp;
          const t = passageAt(p, limit, x, y, 1.5);
          const mid = x / U + T / 2;
          const arr = t.arrives as number;
          const clr = t.clears as number;
          expect(clr).toBeGreaterThan(arr);
          if (arr > 0) {
            expect((arr + clr) / 2).toBeCloseTo(mid, 4);
            const tau = mid - arr;
            const G = 0.5 * (erf((a - U * tau) / k) + erf((a + U * tau) / k));
            expect((G * amp) / limit).toBeCloseTo(1, 5);
          } else {
            expect(clr - mid).toBeGreaterThan(mid); // clipped at the release start
          }
        },
      ),
      runs(200),
    );
  });

  it("is null where the peak of the passage stays below the limit", () => {
    const x = 2000;
    const amp = p.amplitude(x, 0, 1.5);
    const k = Math.SQRT2 * p.sigmaY(x);
    const G0 = erf((U * T) / 2 / k);
    expect(passageAt(p, 1.001 * G0 * amp, x, 0, 1.5)).toEqual({ arrives: null, clears: null });
    expect(passageAt(p, 0.999 * G0 * amp, x, 0, 1.5).arrives).not.toBeNull();
  });
});

describe("cloudPassage (the cloud's half-peak front and back)", () => {
  it("ongoing: the front at x/u, never clears", () => {
    const p = plumeOf({ kind: "continuous", rate: 1, duration: null }, 600);
    expect(cloudPassage(p, 1200)).toEqual({ arrives: 1200 / U, clears: null });
  });

  it("all at once: x/u ∓ (σx/u)·√(2 ln 2)", () => {
    const p = plumeOf({ kind: "instantaneous", mass: 1 }, 600);
    const sx = p.sigmaY(3000);
    const c = cloudPassage(p, 3000);
    expect(c.arrives as number).toBeCloseTo(3000 / U - (sx / U) * Math.sqrt(2 * Math.LN2), 9);
    expect(c.clears as number).toBeCloseTo(3000 / U + (sx / U) * Math.sqrt(2 * Math.LN2), 9);
  });

  it("duration T: symmetric about x/u + T/2, about T apart for a long release", () => {
    const p = plumeOf({ kind: "continuous", rate: 1, duration: 3600 }, 600);
    const c = cloudPassage(p, 1000);
    expect(((c.arrives as number) + (c.clears as number)) / 2).toBeCloseTo(1000 / U + 1800, 4);
    expect(((c.clears as number) - (c.arrives as number)) / 3600).toBeCloseTo(1, 2);
  });
});
