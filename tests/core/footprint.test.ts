/**
 * The footprint of a limit (src/core/footprint.ts), model.md "Footprint of a limit": reach and start
 * as roots of C̄(x, 0, z_r) = C*, the exact half-width, the widest point, the outline's area against
 * ∫2w dx computed here by an independent quadrature, and counter-clockwise rings.
 */
import { describe, expect, it } from "vitest";
import { halfWidthAt, SCAN_MAX_M, SCAN_MIN_M, solveBand } from "../../src/core/footprint.ts";
import { ringArea } from "../../src/core/numeric.ts";
import { makePlume, type Plume } from "../../src/core/plume.ts";
import type { PlumeSetup, Release, StabilityClass } from "../../src/core/types.ts";

const ZR = 1.5;

function plumeOf(o: {
  release: Release;
  H?: number;
  c?: StabilityClass;
  u?: number;
  lid?: number | null;
  ta?: number;
}): Plume {
  const s: PlumeSetup = {
    release: o.release,
    height: o.H ?? 0,
    windSpeed: o.u ?? 3,
    stability: o.c ?? "D",
    terrain: "open",
    scheme: "briggs",
    mixingHeight: o.lid ?? null,
    effectiveHeight: o.H ?? 0,
  };
  return makePlume(s, o.ta ?? 3600);
}

/** Largest centreline value on a fine log grid 1 m – 100 km (g/m³). */
function peakCentreline(p: Plume): number {
  let m = 0;
  for (let i = 0; i <= 20_000; i++) m = Math.max(m, p.centreline(10 ** ((5 * i) / 20_000), ZR));
  return m;
}

const ground = plumeOf({ release: { kind: "continuous", rate: 500, duration: null } });
const elevated = plumeOf({ release: { kind: "continuous", rate: 500, duration: null }, H: 40 });
const finite = plumeOf({
  release: { kind: "continuous", rate: 500, duration: 900 },
  lid: 300,
  c: "E",
  u: 2,
});
const puff = plumeOf({
  release: { kind: "instantaneous", mass: 50_000 },
  H: 2,
  c: "F",
  u: 1.5,
  ta: 600,
});
const elevatedLimit = 0.3 * peakCentreline(elevated);

const CASES: [string, Plume, number][] = [
  ["ground source, ongoing, D", ground, 0.004],
  ["elevated 40 m, ongoing, D (gap near the source)", elevated, elevatedLimit],
  ["15-minute release under a 300 m lid, E", finite, 0.01],
  ["all-at-once 50 kg, F", puff, 0.02],
];

describe("reach and start", () => {
  for (const [name, p, limit] of CASES) {
    it(`${name}: C̄(reach, 0, z_r) = C* to 1e-6, and below C* just beyond`, () => {
      const b = solveBand(p, limit, ZR, 0);
      expect(b.reach).not.toBeNull();
      const reach = b.reach as number;
      expect(reach).toBeLessThan(SCAN_MAX_M);
      expect(Math.abs(p.centreline(reach, ZR) / limit - 1)).toBeLessThan(1e-6);
      expect(p.centreline(reach * 1.001, ZR)).toBeLessThan(limit);
      expect(p.centreline(reach * 0.999, ZR)).toBeGreaterThan(limit);
      // the largest such x: nothing beyond exceeds (fine log grid from reach to 100 km)
      for (let i = 1; i <= 2000; i++) {
        const x = reach * (SCAN_MAX_M / reach) ** (i / 2000);
        expect(p.centreline(x, ZR)).toBeLessThan(limit);
      }
    });
  }

  it("elevated release: start is the smallest exceeding x, a root to 1e-6, with a gap before it", () => {
    const b = solveBand(elevated, elevatedLimit, ZR, 0);
    const start = b.start as number;
    expect(start).toBeGreaterThan(10 * SCAN_MIN_M);
    expect(Math.abs(elevated.centreline(start, ZR) / elevatedLimit - 1)).toBeLessThan(1e-6);
    for (let i = 0; i < 2000; i++) {
      const x = SCAN_MIN_M * (start / SCAN_MIN_M) ** (i / 2000);
      expect(elevated.centreline(x, ZR)).toBeLessThan(elevatedLimit);
    }
    expect(elevated.centreline(start * 1.001, ZR)).toBeGreaterThan(elevatedLimit);
  });

  it("a limit above the highest ground concentration has no band", () => {
    const b = solveBand(elevated, 1.01 * peakCentreline(elevated), ZR, 0);
    expect(b.reach).toBeNull();
    expect(b.start).toBeNull();
    expect(b.outline).toEqual([]);
    expect(b.area).toBeNull();
  });

  it("a limit just below the peak of an elevated plume still finds its narrow band", () => {
    const peak = peakCentreline(elevated);
    const b = solveBand(elevated, 0.999 * peak, ZR, 0);
    expect(b.reach).not.toBeNull();
    expect((b.reach as number) > (b.start as number)).toBe(true);
    expect(Math.abs(elevated.centreline(b.reach as number, ZR) / (0.999 * peak) - 1)).toBeLessThan(
      1e-6,
    );
  });
});

describe("half-width w(x) = σy,eff·√(2 ln(C̄(x,0,z_r)/C*))", () => {
  for (const [name, p, limit] of CASES) {
    it(`${name}: C̄(x, ±w(x), z_r) = C* inside the band`, () => {
      const b = solveBand(p, limit, ZR, 0);
      const s = b.start as number;
      const r = b.reach as number;
      for (let k = 1; k < 20; k++) {
        const x = s + ((r - s) * k) / 20;
        const w = halfWidthAt(p, limit, ZR, x);
        expect(w).toBeGreaterThan(0);
        expect(w).toBe(b.halfWidth(x));
        expect(Math.abs(p.concentration(x, w, ZR) / limit - 1)).toBeLessThan(1e-9);
        expect(Math.abs(p.concentration(x, -w, ZR) / limit - 1)).toBeLessThan(1e-9);
      }
      expect(halfWidthAt(p, limit, ZR, r * 1.01)).toBe(0);
    });
  }
});

describe("max width, area and outline", () => {
  /** ∫ 2w dx over [a, b] by the midpoint rule on 200 000 cells (w has √-ends; error ~ h^1.5). */
  const integral = (w: (x: number) => number, a: number, b: number) => {
    const n = 200_000;
    const h = (b - a) / n;
    let s = 0;
    for (let i = 0; i < n; i++) s += 2 * w(a + (i + 0.5) * h);
    return s * h;
  };

  for (const [name, p, limit] of CASES) {
    it(`${name}: outline area (shoelace) and band area within 1% of ∫2w dx`, () => {
      const b = solveBand(p, limit, ZR, 0);
      const ref = integral(
        (x) => halfWidthAt(p, limit, ZR, x),
        b.start as number,
        b.reach as number,
      );
      expect(Math.abs(ringArea(b.outline) / ref - 1)).toBeLessThan(0.01);
      expect(Math.abs((b.area as number) / ref - 1)).toBeLessThan(0.01);
      expect(b.sweptArea).toBe(b.area);
    });

    it(`${name}: max width is the max of 2w over a fine grid, at max_width_at`, () => {
      const b = solveBand(p, limit, ZR, 0);
      const s = b.start as number;
      const r = b.reach as number;
      let gridMax = 0;
      for (let i = 0; i <= 20_000; i++)
        gridMax = Math.max(gridMax, 2 * b.halfWidth(s + ((r - s) * i) / 20_000));
      const mw = b.maxWidth as number;
      expect(mw).toBeGreaterThanOrEqual(gridMax * (1 - 1e-12));
      expect(mw).toBeLessThanOrEqual(gridMax * (1 + 1e-4)); // grid spacing (r − s)/20 000
      expect(2 * b.halfWidth(b.maxWidthAt as number)).toBeCloseTo(mw, 9);
      expect(b.sweptMaxWidth).toBe(mw);
    });

    it(`${name}: outline ring is counter-clockwise, mirror-symmetric in y, from start to reach`, () => {
      const b = solveBand(p, limit, ZR, 0);
      expect(ringArea(b.outline)).toBeGreaterThan(0);
      const key = (x: number, y: number) => `${x.toPrecision(12)},${Math.abs(y).toPrecision(8)}`;
      const count = new Map<string, number>();
      for (const [x, y] of b.outline) {
        if (y === 0) continue;
        const k = key(x, y);
        count.set(k, (count.get(k) ?? 0) + (y > 0 ? 1 : -1));
      }
      for (const v of count.values()) expect(v).toBe(0);
      const xs = b.outline.map((q) => q[0]);
      expect(Math.min(...xs)).toBeCloseTo(b.start as number, 9);
      expect(Math.max(...xs)).toBeCloseTo(b.reach as number, 9);
      for (const [x, y] of b.outline)
        expect(Math.abs(y)).toBeLessThanOrEqual(b.halfWidth(x) + 1e-9);
    });
  }
});
