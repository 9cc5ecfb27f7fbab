/**
 * Wind swing ±α (src/core/footprint.ts `sweptRing`), model.md "Footprint of a limit": the swept band
 * is the union of the band turned through every angle in [−α, α]. Checked here by its definition:
 * every rotated copy of every band point lies inside the swept ring (property test, own even-odd
 * point-in-polygon), every point of the swept ring comes from some rotated band point (it is not
 * larger than the union), its area grows with α, and α = 0 leaves the outline unchanged.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { halfWidthAt, solveBand } from "../../src/core/footprint.ts";
import { ringArea } from "../../src/core/numeric.ts";
import { makePlume, type Plume } from "../../src/core/plume.ts";
import type { LocalRing, PlumeSetup, Release, StabilityClass } from "../../src/core/types.ts";

const ZR = 1.5;

function plumeOf(release: Release, H: number, c: StabilityClass, u: number): Plume {
  const s: PlumeSetup = {
    release,
    height: H,
    windSpeed: u,
    stability: c,
    terrain: "open",
    scheme: "briggs",
    mixingHeight: null,
    effectiveHeight: H,
  };
  return makePlume(s, 1800);
}

/** Even-odd ray casting (Shimrat 1962, Algorithm 112, Comm. ACM 5). */
function inside(ring: LocalRing, x: number, y: number): boolean {
  let c = false;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const [xi, yi] = ring[i] as [number, number];
    const [xj, yj] = ring[j] as [number, number];
    if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) c = !c;
  }
  return c;
}

/** Shortest distance (m) from (x, y) to the ring's edges. */
function distanceToRing(ring: LocalRing, x: number, y: number): number {
  let d = Number.POSITIVE_INFINITY;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const [ax, ay] = ring[j] as [number, number];
    const [bx, by] = ring[i] as [number, number];
    const vx = bx - ax;
    const vy = by - ay;
    const t = Math.max(0, Math.min(1, ((x - ax) * vx + (y - ay) * vy) / (vx * vx + vy * vy || 1)));
    d = Math.min(d, Math.hypot(ax + t * vx - x, ay + t * vy - y));
  }
  return d;
}

const ground = plumeOf({ kind: "continuous", rate: 500, duration: null }, 0, "D", 3);
const elevated = plumeOf({ kind: "continuous", rate: 500, duration: null }, 40, "D", 3);
let peak = 0;
for (let i = 0; i <= 5000; i++)
  peak = Math.max(peak, elevated.centreline(10 ** ((5 * i) / 5000), ZR));
const narrow = plumeOf({ kind: "continuous", rate: 50, duration: 600 }, 0, "F", 1.5);

const CASES: [string, Plume, number][] = [
  ["ground source, D", ground, 0.004],
  ["elevated 40 m, D (gap near the source)", elevated, 0.3 * peak],
  ["long narrow F band", narrow, 0.002],
];

describe("wind swing", () => {
  for (const [name, p, limit] of CASES) {
    const base = solveBand(p, limit, ZR, 0);
    const s = base.start as number;
    const r = base.reach as number;

    it(`${name}: α = 0 leaves the outline unchanged`, () => {
      expect(base.swept).toEqual(base.outline);
      expect(base.sweptArea).toBe(base.area);
    });

    const swept = new Map<number, LocalRing>();
    for (const a of [2, 10, 30, 60]) swept.set(a, solveBand(p, limit, ZR, a).swept);
    /** A band point (x, y), |y| ≤ 0.98·w(x), x at fraction fx of [start, reach], turned by φ = fφ·α. */
    const turned = (alphaDeg: number, fx: number, fy: number, fphi: number): [number, number] => {
      const x = s + (r - s) * fx;
      const y = fy * halfWidthAt(p, limit, ZR, x);
      const phi = (fphi * alphaDeg * Math.PI) / 180;
      return [x * Math.cos(phi) - y * Math.sin(phi), x * Math.sin(phi) + y * Math.cos(phi)];
    };

    it(`${name}: every rotated copy of a band point is inside the swept ring (fast-check)`, () => {
      // x kept 0.1% of the band's length away from both ends: there w(x) → 0 like a square root and
      // the polygon's last chord cuts inside the curve (see the next check for the ends).
      fc.assert(
        fc.property(
          fc.constantFrom(2, 10, 30, 60),
          fc.double({ min: 0.001, max: 0.999, noNaN: true }),
          fc.double({ min: -0.98, max: 0.98, noNaN: true }),
          fc.double({ min: -1, max: 1, noNaN: true }),
          (alphaDeg, fx, fy, fphi) => {
            const [xr, yr] = turned(alphaDeg, fx, fy, fphi);
            expect(inside(swept.get(alphaDeg) as LocalRing, xr, yr)).toBe(true);
          },
        ),
        { numRuns: 300 },
      );
    });

    it(`${name}: near the ends, rotated band points are inside or within 1e-4·reach of the ring`, () => {
      fc.assert(
        fc.property(
          fc.constantFrom(2, 10, 30, 60),
          fc.oneof(
            fc.double({ min: 0, max: 0.001, noNaN: true }),
            fc.double({ min: 0.999, max: 1, noNaN: true }),
          ),
          fc.double({ min: -0.98, max: 0.98, noNaN: true }),
          fc.double({ min: -1, max: 1, noNaN: true }),
          (alphaDeg, fx, fy, fphi) => {
            const ring = swept.get(alphaDeg) as LocalRing;
            const [xr, yr] = turned(alphaDeg, fx, fy, fphi);
            if (!inside(ring, xr, yr)) expect(distanceToRing(ring, xr, yr)).toBeLessThan(1e-4 * r);
          },
        ),
        { numRuns: 300 },
      );
    });

    it(`${name}: every point of the swept ring comes from a rotated band point (no larger than the union)`, () => {
      const alphaDeg = 20;
      const alpha = (alphaDeg * Math.PI) / 180;
      const ring = solveBand(p, limit, ZR, alphaDeg).swept;
      // Sample points inside the ring on a polar grid; for each, search rotations in [−α, α] for
      // one that lands in the band, allowing the ring's sampling error (0.1% of the radius).
      let checked = 0;
      for (let i = 1; i < 40; i++) {
        const rr = s + ((r - s) * i) / 40;
        for (let j = -40; j <= 40; j++) {
          const th = ((Math.PI / 2) * j) / 40;
          const px = rr * Math.cos(th);
          const py = rr * Math.sin(th);
          if (!inside(ring, px, py)) continue;
          checked++;
          let best = Number.POSITIVE_INFINITY; // distance to the band in rotated frames
          for (let k = 0; k <= 400; k++) {
            const phi = -alpha + (2 * alpha * k) / 400;
            const bx = px * Math.cos(phi) + py * Math.sin(phi);
            const by = -px * Math.sin(phi) + py * Math.cos(phi);
            const w = halfWidthAt(p, limit, ZR, bx);
            const d =
              bx >= s && bx <= r
                ? Math.max(0, Math.abs(by) - w)
                : Math.hypot(bx - Math.min(r, Math.max(s, bx)), by);
            best = Math.min(best, d);
          }
          expect(best).toBeLessThanOrEqual(0.001 * rr + 1e-6);
        }
      }
      expect(checked).toBeGreaterThan(20);
    });

    it(`${name}: area and width grow with α; reach is unchanged; the ring is counter-clockwise`, () => {
      let prevArea = base.area as number;
      let prevWidth = base.maxWidth as number;
      for (const a of [1, 5, 10, 20, 45, 90]) {
        const b = solveBand(p, limit, ZR, a);
        expect(b.reach).toBe(base.reach);
        expect(b.start).toBe(base.start);
        expect(ringArea(b.swept)).toBeGreaterThan(0);
        expect(b.sweptArea as number).toBeGreaterThan(prevArea);
        expect(b.sweptMaxWidth as number).toBeGreaterThan(prevWidth);
        expect(b.sweptArea).toBeCloseTo(ringArea(b.swept), 6);
        prevArea = b.sweptArea as number;
        prevWidth = b.sweptMaxWidth as number;
      }
    });
  }

  it("a thin band swept by α covers about the sector α·(R² − r₀²) (ring area, band width ≪ R·α)", () => {
    // For a band of negligible width the swept set tends to the annular sector between start r₀ and
    // reach R over 2α: area α·(R² − r₀²) (elementary geometry). Narrow F band, α = 45°.
    const b0 = solveBand(narrow, 0.002, ZR, 0);
    const b = solveBand(narrow, 0.002, ZR, 45);
    const R = b0.reach as number;
    const r0 = b0.start as number;
    const sector = (Math.PI / 4) * (R * R - r0 * r0);
    expect(b.sweptArea as number).toBeGreaterThan(sector);
    expect(b.sweptArea as number).toBeLessThan(sector + 2 * (b0.area as number) + 0.01 * sector);
  });
});
