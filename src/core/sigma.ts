/**
 * Dispersion coefficients σy, σz (m) at downwind distance x (m), about 10-minute averages.
 *
 * - Briggs (1973) open-country and urban formulas, as given in Hanna, Briggs & Hosker (1982),
 *   *Handbook on Atmospheric Diffusion*, and Griffiths (1994), *Atmospheric Environment* 28.
 *   Valid about 100 m – 10 km (outside it the caller warns).
 * - Pasquill–Gifford curves (Turner 1970, Figs. 3-2, 3-3) in the fitted form of Boubel, Fox,
 *   Turner & Stern (1994), *Fundamentals of Air Pollution*, 3rd ed., Tables 19-4 and 19-5,
 *   pp. 303–304 (the same numbers as the ISC3 user's guide, EPA-454/B-95-003b, Vol. II, Tables 1-1, 1-2).
 *
 * x ≤ 0 gives 0 (nothing upwind is modelled).
 */
import type { SigmaScheme, StabilityClass, Terrain } from "./types.ts";

export interface Sigmas {
  /** Crosswind spread σy (m), 10-minute. */
  y: number;
  /** Vertical spread σz (m). */
  z: number;
}

type Pair = readonly [number, number];

/** Briggs open country: σy = ay·x·(1+0.0001x)^-½ ; σz by class. */
const BRIGGS_OPEN_Y: Record<StabilityClass, number> = {
  A: 0.22,
  B: 0.16,
  C: 0.11,
  D: 0.08,
  E: 0.06,
  F: 0.04,
};

function briggsOpenZ(c: StabilityClass, x: number): number {
  switch (c) {
    case "A":
      return 0.2 * x;
    case "B":
      return 0.12 * x;
    case "C":
      return 0.08 * x * (1 + 0.0002 * x) ** -0.5;
    case "D":
      return 0.06 * x * (1 + 0.0015 * x) ** -0.5;
    case "E":
      return (0.03 * x) / (1 + 0.0003 * x);
    case "F":
      return (0.016 * x) / (1 + 0.0003 * x);
  }
}

function briggsUrbanY(c: StabilityClass, x: number): number {
  const a = c === "A" || c === "B" ? 0.32 : c === "C" ? 0.22 : c === "D" ? 0.16 : 0.11;
  return a * x * (1 + 0.0004 * x) ** -0.5;
}

function briggsUrbanZ(c: StabilityClass, x: number): number {
  switch (c) {
    case "A":
    case "B":
      return 0.24 * x * (1 + 0.001 * x) ** 0.5;
    case "C":
      return 0.2 * x;
    case "D":
      return 0.14 * x * (1 + 0.0003 * x) ** -0.5;
    case "E":
    case "F":
      return 0.08 * x * (1 + 0.0015 * x) ** -0.5;
  }
}

/** Pasquill–Gifford σy fit constants (c, d); Boubel et al. (1994) Table 19-4. */
const PG_Y: Record<StabilityClass, Pair> = {
  A: [24.167, 2.5334],
  B: [18.333, 1.8096],
  C: [12.5, 1.0857],
  D: [8.333, 0.72382],
  E: [6.25, 0.54287],
  F: [4.1667, 0.36191],
};

/**
 * Pasquill–Gifford σz = a·x^b by distance range; Boubel et al. (1994) Table 19-5.
 * Each row: [upper bound of the range in km (exclusive), a, b]. The last row runs to infinity.
 * Class A beyond 3.11 km is 5000 m (a = 5000, b = 0).
 */
const PG_Z: Record<StabilityClass, readonly (readonly [number, number, number])[]> = {
  A: [
    [0.1, 122.8, 0.9447],
    [0.15, 158.08, 1.0542],
    [0.2, 170.22, 1.0932],
    [0.25, 179.52, 1.1262],
    [0.3, 217.41, 1.2644],
    [0.4, 258.89, 1.4094],
    [0.5, 346.75, 1.7283],
    [3.11, 453.85, 2.1166],
    [Number.POSITIVE_INFINITY, 5000, 0],
  ],
  B: [
    [0.2, 90.673, 0.93198],
    [0.4, 98.483, 0.98332],
    [Number.POSITIVE_INFINITY, 109.3, 1.0971],
  ],
  C: [[Number.POSITIVE_INFINITY, 61.141, 0.91465]],
  D: [
    [0.3, 34.459, 0.86974],
    [1, 32.093, 0.81066],
    [3, 32.093, 0.64403],
    [10, 33.504, 0.60486],
    [30, 36.65, 0.56589],
    [Number.POSITIVE_INFINITY, 44.053, 0.51179],
  ],
  E: [
    [0.1, 24.26, 0.8366],
    [0.3, 23.331, 0.81956],
    [1, 21.628, 0.7566],
    [2, 21.628, 0.63077],
    [4, 22.534, 0.57154],
    [10, 24.703, 0.50527],
    [20, 26.97, 0.46713],
    [40, 35.42, 0.37615],
    [Number.POSITIVE_INFINITY, 47.618, 0.29592],
  ],
  F: [
    [0.2, 15.209, 0.81558],
    [0.7, 14.457, 0.78407],
    [1, 13.953, 0.68465],
    [2, 13.953, 0.63227],
    [3, 14.823, 0.54503],
    [7, 16.187, 0.4649],
    [15, 17.836, 0.41507],
    [30, 22.651, 0.32681],
    [60, 27.074, 0.27436],
    [Number.POSITIVE_INFINITY, 34.219, 0.21716],
  ],
};

/** Pasquill–Gifford σy (m) at x (m): 465.11628·x_km·tan(0.017453293·(c − d·ln x_km)). */
export function pgSigmaY(c: StabilityClass, xM: number): number {
  if (!(xM > 0)) return 0;
  const xk = xM / 1000;
  const [cc, d] = PG_Y[c];
  return 465.11628 * xk * Math.tan(0.017453293 * (cc - d * Math.log(xk)));
}

/** Pasquill–Gifford σz (m) at x (m), capped at 5000 m. */
export function pgSigmaZ(c: StabilityClass, xM: number): number {
  if (!(xM > 0)) return 0;
  const xk = xM / 1000;
  const rows = PG_Z[c];
  for (const [upper, a, b] of rows) {
    if (xk < upper) return Math.min(5000, a * xk ** b);
  }
  return 5000;
}

/** Briggs σy (m) at x (m) for the class and ground. */
export function briggsSigmaY(c: StabilityClass, terrain: Terrain, xM: number): number {
  if (!(xM > 0)) return 0;
  return terrain === "open"
    ? BRIGGS_OPEN_Y[c] * xM * (1 + 0.0001 * xM) ** -0.5
    : briggsUrbanY(c, xM);
}

/** Briggs σz (m) at x (m) for the class and ground. */
export function briggsSigmaZ(c: StabilityClass, terrain: Terrain, xM: number): number {
  if (!(xM > 0)) return 0;
  return terrain === "open" ? briggsOpenZ(c, xM) : briggsUrbanZ(c, xM);
}

/**
 * σy and σz (m) at downwind distance x (m). The Pasquill–Gifford curves are open-country curves:
 * with that scheme the ground type is not used (the caller says so).
 */
export function sigmas(
  scheme: SigmaScheme,
  c: StabilityClass,
  terrain: Terrain,
  xM: number,
): Sigmas {
  if (scheme === "pasquill-gifford") return { y: pgSigmaY(c, xM), z: pgSigmaZ(c, xM) };
  return { y: briggsSigmaY(c, terrain, xM), z: briggsSigmaZ(c, terrain, xM) };
}

/** Distances (m) between which the dispersion curves were fitted; outside, compute but warn. */
export const CURVE_RANGE_M = { min: 100, max: 10_000 } as const;
