/**
 * Pure drawing helpers of the estimate screen: north-up placement of the local footprint
 * (src/ui/footprint-view.ts), band styles (src/ui/palette.ts), log–log chart scales
 * (src/ui/chart-scale.ts) and band figures (src/ui/figures.ts).
 *
 * Geometry: the local frame of docs/model.md ("Coordinates": x downwind, y left of downwind) and
 * bearings clockwise from true north (east = r·sin β, north = r·cos β; common practice).
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import type { BandOutput, LocalFootprint } from "../../src/core/types.ts";
import {
  concentrationRange,
  curvePieces,
  decadeTicks,
  logGrid,
  logPos,
  tickLabel,
} from "../../src/ui/chart-scale.ts";
import { bandFigures, splitWarnings, stabilityWords } from "../../src/ui/figures.ts";
import {
  bandLabelSpots,
  fitView,
  footprintBox,
  niceFloor,
  niceLength,
  project,
  rangeRings,
  ringLabelAt,
  ringLabelFits,
  toNorthUp,
  wrapLabel,
} from "../../src/ui/footprint-view.ts";
import { bandStyles } from "../../src/ui/palette.ts";

describe("toNorthUp", () => {
  it("puts downwind along the heading and 'left' 90° anticlockwise of it", () => {
    // Plume toward the east (wind from the west): left of downwind is north.
    const a = toNorthUp(100, 0, 90);
    expect(a.e).toBeCloseTo(100, 9);
    expect(a.n).toBeCloseTo(0, 9);
    const b = toNorthUp(0, 50, 90);
    expect(b.e).toBeCloseTo(0, 9);
    expect(b.n).toBeCloseTo(50, 9);
    // Plume toward the north: left is west.
    const c = toNorthUp(0, 50, 0);
    expect(c.e).toBeCloseTo(-50, 9);
    // Toward the south-west (225°): 100 m downwind is 70.7 m south and 70.7 m west.
    const d = toNorthUp(100, 0, 225);
    expect(d.e).toBeCloseTo(-100 * Math.SQRT1_2, 9);
    expect(d.n).toBeCloseTo(-100 * Math.SQRT1_2, 9);
  });

  it("keeps distances from the source (rotation invariant)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: -1e5, max: 1e5, noNaN: true }),
        fc.double({ min: -1e5, max: 1e5, noNaN: true }),
        fc.double({ min: 0, max: 360, noNaN: true }),
        (x, y, h) => {
          const p = toNorthUp(x, y, h);
          expect(Math.hypot(p.e, p.n)).toBeCloseTo(Math.hypot(x, y), 6);
        },
      ),
    );
  });
});

const FP: LocalFootprint = {
  heading_deg: 90,
  wind_swing_deg: 10,
  near_zone_m: 100,
  centreline_m: 1000,
  bands: [
    {
      label: "Wide low limit",
      outline: [
        [0, 0],
        [500, 100],
        [1000, 0],
        [500, -100],
      ],
      swept: [
        [0, 0],
        [500, 180],
        [1000, 0],
        [500, -180],
      ],
    },
    {
      label: "High limit",
      outline: [
        [0, 0],
        [200, 30],
        [300, 0],
        [200, -30],
      ],
      swept: [
        [0, 0],
        [200, 60],
        [300, 0],
        [200, -60],
      ],
    },
  ],
};

describe("fitting the footprint on screen", () => {
  it("boxes the swept bands and the near zone", () => {
    const box = footprintBox(FP);
    expect(box.maxE).toBeCloseTo(1000, 9);
    expect(box.minE).toBeCloseTo(-100, 9); // near zone reaches upwind
    expect(box.maxN).toBeCloseTo(180, 9);
    expect(box.minN).toBeCloseTo(-180, 9);
  });

  it("fits the box inside the drawing with its margin, north up", () => {
    const v = fitView(footprintBox(FP), 360, 360, 30);
    const [x0] = project(v, { e: -100, n: 0 });
    const [x1] = project(v, { e: 1000, n: 0 });
    expect(x0).toBeCloseTo(30, 6);
    expect(x1).toBeCloseTo(330, 6);
    const [, yN] = project(v, { e: 0, n: 100 });
    const [, yS] = project(v, { e: 0, n: -100 });
    expect(yN).toBeLessThan(yS); // north is up
  });

  it("zooms toward the source", () => {
    const v1 = fitView(footprintBox(FP), 360, 360, 30, 1);
    const v4 = fitView(footprintBox(FP), 360, 360, 30, 4);
    expect(v4.mPerPx).toBeCloseTo(v1.mPerPx / 4, 12);
    expect(Math.hypot(v4.ce, v4.cn)).toBeLessThan(Math.hypot(v1.ce, v1.cn));
  });

  it("picks round lengths (1, 2, 5 × 10^k) for scale bar and rings", () => {
    expect(niceFloor(7.3)).toBe(5);
    expect(niceFloor(199)).toBe(100);
    expect(niceFloor(0.031)).toBeCloseTo(0.02, 12);
    expect(niceLength(1500, "metric")).toEqual({ m: 1000, label: "1 km" });
    expect(niceLength(300, "metric")).toEqual({ m: 200, label: "200 m" });
    // 1000 m = 0.62 mi → 0.5 mi = 804.672 m (mile = 1609.344 m, NIST SP 811 App. B).
    expect(niceLength(1000, "us").label).toBe("0.5 mi");
    expect(niceLength(1000, "us").m).toBeCloseTo(804.672, 9);
    expect(niceLength(100, "us")).toMatchObject({ label: "200 ft" });
  });

  it("draws range rings at equal round steps within the view", () => {
    const v = fitView(footprintBox(FP), 360, 360, 30);
    const rings = rangeRings(v, "metric");
    expect(rings.length).toBeGreaterThan(1);
    const step = rings[0]?.m ?? 0;
    for (const [i, r] of rings.entries()) expect(r.m).toBeCloseTo(step * (i + 1), 9);
  });

  it("labels every band, inside the drawing, without overlapping labels", () => {
    const v = fitView(footprintBox(FP), 360, 360, 30);
    const spots = bandLabelSpots(v, FP, 12);
    expect(spots.map((s) => s.index).sort()).toEqual([0, 1]);
    for (const s of spots) {
      expect(s.y).toBeGreaterThan(0);
      expect(s.y).toBeLessThan(360);
    }
    const [a, b] = spots;
    if (a && b) expect(Math.abs(a.y - b.y) >= 14 || Math.abs(a.x - b.x) > 80).toBe(true);
  });

  it("wraps long labels at spaces", () => {
    expect(wrapLabel("Limit A (invented) 60 min", 20)).toEqual(["Limit A (invented)", "60 min"]);
    expect(wrapLabel("Short", 20)).toEqual(["Short"]);
    expect(wrapLabel("x".repeat(25), 10)).toEqual(["x".repeat(10), "x".repeat(10), "x".repeat(5)]);
  });
});

/** WCAG 2.x relative luminance of #rrggbb. */
function luminance(hex: string): number {
  const c = [1, 3, 5].map((i) => Number.parseInt(hex.slice(i, i + 2), 16) / 255);
  const lin = c.map((v) => (v <= 0.03928 ? v / 12.92 : ((v + 0.055) / 1.055) ** 2.4));
  return 0.2126 * (lin[0] ?? 0) + 0.7152 * (lin[1] ?? 0) + 0.0722 * (lin[2] ?? 0);
}

describe("band styles", () => {
  it("give the highest limit (most severe) the darkest colour, and get lighter as limits fall", () => {
    const s = bandStyles([1, 100, 10]);
    expect(s.map((x) => x.rank)).toEqual([2, 0, 1]);
    const l = s.map((x) => luminance(x.fill));
    expect(l[1]).toBeLessThan(l[2] as number);
    expect(l[2]).toBeLessThan(l[0] as number);
  });

  it("give every band its own outline pattern, so they differ in greyscale", () => {
    const s = bandStyles([6, 5, 4, 3, 2, 1]);
    expect(new Set(s.map((x) => `${x.dash}|${x.strokeWidth}`)).size).toBe(6);
  });
});

describe("log–log chart scales", () => {
  it("spaces distances evenly in log", () => {
    const g = logGrid(10, 1e4, 4);
    expect(g[0]).toBeCloseTo(10, 9);
    expect(g[1]).toBeCloseTo(100, 9);
    expect(g[3]).toBeCloseTo(1e4, 6);
  });

  it("ticks at powers of ten and maps them linearly in log", () => {
    expect(decadeTicks(3, 2000)).toEqual([10, 100, 1000]);
    const s = { min: 10, max: 1000, from: 0, to: 200 };
    expect(logPos(s, 100)).toBeCloseTo(100, 9);
    expect(logPos(s, 0)).toBeNull();
    expect(tickLabel(1000)).toBe("1,000");
    expect(tickLabel(1e4)).toBe("10⁴");
    expect(tickLabel(1e-3)).toBe("10⁻³");
  });

  it("breaks a curve where it is zero (elevated source near the stack)", () => {
    const sx = { min: 1, max: 1000, from: 0, to: 300 };
    const sy = { min: 0.1, max: 100, from: 200, to: 0 };
    const pieces = curvePieces([1, 10, 100, 200, 1000], [5, 0, 3, 2, 1], sx, sy);
    expect(pieces).toHaveLength(1);
    expect(pieces[0]?.split(" ")).toHaveLength(3);
  });

  it("shows from a tenth of the lowest limit up past the highest", () => {
    const r = concentrationRange([2, 50], [1e9, 10]);
    expect(r.min).toBeCloseTo(0.2, 12);
    expect(r.max).toBe(50 * 1e4);
  });
});

const BAND: BandOutput = {
  label: "Tier",
  limit_mg_m3: 28,
  averaging_s: 1800,
  reach_m: 495.6,
  start_m: 1.8,
  max_width_m: 200.4,
  max_width_at_m: 300,
  area_m2: 67_732,
  arrives_s: 165.2,
  clears_s: 1065.2,
};

describe("band figures", () => {
  it("lists reach, width, area, arrival and clearing, rounded toward caution", () => {
    const f = Object.fromEntries(bandFigures(BAND, "metric", false).map((x) => [x.key, x.value]));
    expect(f.reach).toBe("500 m");
    expect(f.width).toBe("210 m");
    expect(f.area).toBe("68,000 m²");
    expect(f.start).toBeUndefined(); // 1.8 m: the band starts at the source
    expect(f.arrives).toBe("2 min after release start (cloud front)");
    expect(f.clears).toBe("18 min after release start (cloud back)");
    expect(f.limit).toBe("28 mg/m³ averaged over 30 min");
    const ppm = bandFigures(BAND, "metric", false, {
      label: "Tier",
      value: 20,
      unit: "ppm",
      averaging_s: 1800,
    });
    expect(ppm.find((x) => x.key === "limit")?.value).toBe(
      "20 ppm (28 mg/m³) averaged over 30 min",
    );
  });

  it("shows a start for an elevated release's gap, and an ongoing release that never clears", () => {
    const f = Object.fromEntries(
      bandFigures({ ...BAND, start_m: 240, clears_s: null }, "us", true).map((x) => [
        x.key,
        x.value,
      ]),
    );
    expect(f.start).toBe("780 ft"); // 787.4 ft, rounded down
    expect(f.clears).toBe("Not while the release goes on");
  });

  it("says 'Not exceeded' and nothing else when no ground point exceeds the limit", () => {
    const keys = bandFigures({ ...BAND, reach_m: null }, "metric", true).map((x) => x.key);
    expect(keys).toEqual(["reach", "limit"]);
  });

  it("puts warnings about one limit with that band, the rest with the whole estimate", () => {
    const w = splitWarnings(
      [
        { code: "calm-wind", message: "calm" },
        { code: "no-exceedance", message: "none", limit: "B" },
        { code: "averaging-clamped", message: "clamp", limit: "Z" },
      ],
      ["A", "B"],
    );
    expect(w.byBand[1]?.map((x) => x.message)).toEqual(["none"]);
    expect(w.byBand[0]).toEqual([]);
    expect(w.general.map((x) => x.message)).toEqual(["calm", "clamp"]);
  });

  it("words the stability line", () => {
    expect(stabilityWords("D", "Given: class D")).toBe("Stability class D, as entered.");
    expect(stabilityWords("F", "clear night, light wind")).toMatch(/suggested: clear night/);
  });
});

describe("range-ring labels", () => {
  it("sit on the ring, square to the plume, on the northern side", () => {
    // Plume toward the east: the northern side is straight up from the source.
    const [x, y] = ringLabelAt(100, 100, 50, 90);
    expect(x).toBeCloseTo(103, 9);
    expect(y).toBeCloseTo(47, 9);
    // Plume toward the west: still the northern side.
    const [, y2] = ringLabelAt(100, 100, 50, 270);
    expect(y2).toBeCloseTo(47, 9);
  });
});

describe("ring labels stay readable", () => {
  it("are left out under the corner marks and at the edges", () => {
    expect(ringLabelFits(180, 180, 360, 360)).toBe(true);
    expect(ringLabelFits(20, 20, 360, 360)).toBe(false); // wind dial
    expect(ringLabelFits(340, 30, 360, 360)).toBe(false); // north arrow
    expect(ringLabelFits(180, 355, 360, 360)).toBe(false); // bottom edge
  });
});
