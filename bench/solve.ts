/**
 * Footprint solve timings, and the analytic footprint against brute force (issue 5, bench).
 *
 * Analytic: the core's `solveBand` (log-grid scan + Brent roots for the reach, w(x) from the
 * Gaussian, Simpson's rule on cosine-spaced nodes for the area; model.md "Footprint of a limit").
 * Brute force: C̄(x, y, z_r) on a 400×400 grid covering the band, contoured at C* by marching
 * squares (d3-contour, linear interpolation), reach = largest x on the contour, area = the
 * contour polygons' area.
 * Reference ("exact"): the reach refined by bisection on C̄(x, 0, z_r) − C* to machine precision
 * from the solver's own bracket, and the area ∫2w dx by Simpson's rule on 200,000 cosine-spaced
 * intervals (w(x) is exact, model.md, so only the quadrature errs).
 * Times are wall-clock (performance.now) on this machine; they are printed, never asserted.
 */
import { contours } from "d3-contour";
import { halfWidthAt, solveBand } from "../src/core/footprint.ts";
import { estimate, prepare } from "../src/core/index.ts";
import type { Scenario } from "../src/core/types.ts";

export interface Stats {
  runs: number;
  median_ms: number;
  p95_ms: number;
  min_ms: number;
}

export function stats(samples: number[]): Stats {
  const s = [...samples].sort((a, b) => a - b);
  const q = (p: number) => s[Math.min(s.length - 1, Math.ceil(p * s.length) - 1)] as number;
  return { runs: s.length, median_ms: q(0.5), p95_ms: q(0.95), min_ms: s[0] as number };
}

/** Times `fn` `runs` times after `warmup` untimed calls. */
export function time(fn: () => void, runs: number, warmup = 5): number[] {
  for (let i = 0; i < warmup; i++) fn();
  const out: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    fn();
    out.push(performance.now() - t0);
  }
  return out;
}

export type ReleaseCase = "ongoing" | "finite" | "all-at-once";

export interface Case {
  limits: 1 | 3 | 5;
  release: ReleaseCase;
  lid: boolean;
  swing: 0 | 20;
  terrain: "open" | "urban";
}

/** Invented limits (mg/m³, averaging s): three averaging times, values a decade apart. */
const LIMITS = [
  { value: 40, averaging_s: 3600 },
  { value: 4, averaging_s: 600 },
  { value: 0.4, averaging_s: 60 },
  { value: 150, averaging_s: 3600 },
  { value: 15, averaging_s: 600 },
];

/** The invented bench scenario for one case: 500 g/s (or 450 kg at once), class D, 3 m/s. */
export function caseScenario(c: Case): Scenario {
  const release: Scenario["release"] =
    c.release === "all-at-once"
      ? { kind: "instantaneous", mass_g: 450_000, height_m: 2 }
      : c.release === "finite"
        ? { kind: "continuous", rate_g_s: 500, duration_s: 900, height_m: 2 }
        : { kind: "continuous", rate_g_s: 500, height_m: 2 };
  const s: Scenario = {
    release,
    weather: { wind_speed_m_s: 3, wind_from_deg: 250, stability: "D", terrain: c.terrain },
    limits: LIMITS.slice(0, c.limits).map((l, i) => ({
      label: `Limit ${i + 1} (invented)`,
      value: l.value,
      unit: "mg/m3" as const,
      averaging_s: l.averaging_s,
    })),
    source: { lat: 47, lon: 8 },
  };
  if (c.lid) s.weather.mixing_height_m = 300;
  if (c.swing) s.wind_swing_deg = c.swing;
  return s;
}

export function allCases(): Case[] {
  const out: Case[] = [];
  for (const limits of [1, 3, 5] as const)
    for (const release of ["ongoing", "finite", "all-at-once"] as const)
      for (const lid of [false, true])
        for (const swing of [0, 20] as const)
          for (const terrain of ["open", "urban"] as const)
            out.push({ limits, release, lid, swing, terrain });
  return out;
}

/** estimate() as the app's first answer calls it (no GeoJSON, no spread), per case. */
export function solveTimings(runs: number) {
  return allCases().map((c) => {
    const s = caseScenario(c);
    const st = stats(time(() => estimate(s, { geojson: false, spread: false }), runs));
    const withGeo = stats(
      time(() => estimate(s, { spread: false }), Math.max(5, Math.round(runs / 4))),
    );
    return { case: c, estimate: st, estimate_with_geojson: withGeo };
  });
}

// --- analytic against brute force -------------------------------------------------------------

/** One band's setting for the comparison (no wind swing: the exact area is ∫2w dx). */
export interface CompareCase {
  name: string;
  scenario: Scenario;
}

export function compareCases(): CompareCase[] {
  const one = (c: Case) => caseScenario(c);
  const elevated = one({ limits: 1, release: "ongoing", lid: false, swing: 0, terrain: "open" });
  elevated.release.height_m = 30;
  elevated.limits = [{ label: "Limit 2 (invented)", value: 4, unit: "mg/m3", averaging_s: 600 }];
  const stable = one({ limits: 1, release: "ongoing", lid: false, swing: 0, terrain: "open" });
  stable.weather.stability = "F";
  stable.weather.wind_speed_m_s = 2;
  return [
    {
      name: "ongoing, open, 40 mg/m³ 60 min",
      scenario: one({ limits: 1, release: "ongoing", lid: false, swing: 0, terrain: "open" }),
    },
    {
      name: "finite 15 min, open",
      scenario: one({ limits: 1, release: "finite", lid: false, swing: 0, terrain: "open" }),
    },
    {
      name: "all at once, open",
      scenario: one({ limits: 1, release: "all-at-once", lid: false, swing: 0, terrain: "open" }),
    },
    {
      name: "ongoing, lid 300 m",
      scenario: one({ limits: 1, release: "ongoing", lid: true, swing: 0, terrain: "open" }),
    },
    {
      name: "ongoing, built-up",
      scenario: one({ limits: 1, release: "ongoing", lid: false, swing: 0, terrain: "urban" }),
    },
    { name: "ongoing, class F 2 m/s", scenario: stable },
    { name: "elevated 30 m, 4 mg/m³ 10 min", scenario: elevated },
  ];
}

/** Area of d3-contour MultiPolygon coordinates mapped to metres (exterior minus holes). */
function multiPolygonArea(
  coords: number[][][][],
  toX: (g: number) => number,
  toY: (g: number) => number,
): number {
  let a = 0;
  for (const poly of coords) {
    poly.forEach((ring, k) => {
      let s = 0;
      for (let i = 0, n = ring.length; i < n; i++) {
        const p = ring[i] as number[];
        const q = ring[(i + 1) % n] as number[];
        s += toX(p[0] as number) * toY(q[1] as number) - toX(q[0] as number) * toY(p[1] as number);
      }
      a += (k === 0 ? 1 : -1) * Math.abs(s / 2);
    });
  }
  return a;
}

export function compare(c: CompareCase, grid = 400, runs = 20) {
  const prep = prepare(c.scenario);
  const limit = prep.limits[0] as { value: number; averaging: number };
  const plume = prep.plume(limit.averaging);
  const zr = prep.parsed.receptorHeight;
  const sol = solveBand(plume, limit.value, zr, 0);
  if (sol.reach === null || sol.start === null || sol.maxWidth === null || sol.area === null) {
    throw new Error(`${c.name}: no band`);
  }
  const reach = sol.reach;
  const start = sol.start;

  // Reference reach: bisection from a bracket around the solver's root, to adjacent doubles.
  const f = (x: number) => plume.centreline(x, zr) - limit.value;
  let lo = reach * (1 - 1e-3);
  let hi = reach * (1 + 1e-3);
  if (!(f(lo) >= 0 && f(hi) < 0)) throw new Error(`${c.name}: reference bracket lost`);
  for (let i = 0; i < 200 && hi - lo > 0; i++) {
    const mid = (lo + hi) / 2;
    if (mid === lo || mid === hi) break;
    if (f(mid) >= 0) lo = mid;
    else hi = mid;
  }
  const reachRef = lo;
  // Reference area: Simpson on x = start + L(1 − cos θ)/2, 200,000 intervals.
  const m = 200_000;
  const len = reachRef - start;
  let areaRef = 0;
  for (let i = 0; i <= m; i++) {
    const th = (Math.PI * i) / m;
    const x = start + (len * (1 - Math.cos(th))) / 2;
    const wgt = i === 0 || i === m ? 1 : i % 2 === 1 ? 4 : 2;
    areaRef += wgt * 2 * halfWidthAt(plume, limit.value, zr, x) * (len / 2) * Math.sin(th);
  }
  areaRef *= Math.PI / m / 3;

  // Brute force: a grid over [0, 1.05·reach] × [−0.55·W, 0.55·W]; sample (i, j) at x0 + i·dx.
  const W = sol.maxWidth;
  const x0 = 0;
  const x1 = 1.05 * reach;
  const y0 = -0.55 * W;
  const y1 = 0.55 * W;
  const dx = (x1 - x0) / (grid - 1);
  const dy = (y1 - y0) / (grid - 1);
  const values = new Float64Array(grid * grid);
  let bruteReach = 0;
  let bruteArea = 0;
  const brute = () => {
    for (let j = 0; j < grid; j++) {
      const y = y0 + j * dy;
      for (let i = 0; i < grid; i++) values[j * grid + i] = plume.concentration(x0 + i * dx, y, zr);
    }
    const [shape] = contours().size([grid, grid]).smooth(true).thresholds([limit.value])(
      values as unknown as number[],
    );
    // d3-contour puts sample i at coordinate i + 0.5.
    const toX = (g: number) => x0 + (g - 0.5) * dx;
    const toY = (g: number) => y0 + (g - 0.5) * dy;
    let rx = 0;
    for (const poly of shape?.coordinates ?? [])
      for (const ring of poly) for (const p of ring) rx = Math.max(rx, toX(p[0] as number));
    bruteReach = rx;
    bruteArea = multiPolygonArea((shape?.coordinates ?? []) as number[][][][], toX, toY);
  };
  const analytic = () => {
    solveBand(plume, limit.value, zr, 0);
  };
  const tA = stats(time(analytic, runs * 5));
  const tB = stats(time(brute, runs, 2));
  const rel = (v: number, ref: number) => (v - ref) / ref;
  return {
    name: c.name,
    grid: `${grid}×${grid}`,
    reference: { reach_m: reachRef, area_m2: areaRef },
    analytic: {
      time: tA,
      reach_m: reach,
      area_m2: sol.area,
      reach_rel_error: rel(reach, reachRef),
      area_rel_error: rel(sol.area, areaRef),
      outline_polygon_area_rel_error: rel(ringAreaOf(sol.outline), areaRef),
    },
    brute_force: {
      time: tB,
      reach_m: bruteReach,
      area_m2: bruteArea,
      reach_rel_error: rel(bruteReach, reachRef),
      area_rel_error: rel(bruteArea, areaRef),
      cell_m: { dx, dy },
    },
    speed_ratio: tB.median_ms / tA.median_ms,
  };
}

function ringAreaOf(ring: readonly [number, number][]): number {
  let s = 0;
  for (let i = 0, n = ring.length; i < n; i++) {
    const p = ring[i] as [number, number];
    const q = ring[(i + 1) % n] as [number, number];
    s += p[0] * q[1] - q[0] * p[1];
  }
  return Math.abs(s / 2);
}
