/**
 * The footprint of one limit (model.md, "Footprint of a limit"): reach, start, half-width
 * profile, widest point, area, outline, and the outline swept through the wind swing ±α.
 *
 * Local frame: x downwind (m), y crosswind to the left looking downwind (m), source at the origin.
 * Rings are counter-clockwise in that frame and not closed (first point not repeated).
 */
import { brent, goldenMax, ringArea } from "./numeric.ts";
import type { Plume } from "./plume.ts";
import type { LocalRing } from "./types.ts";

/** Scan range for the centreline (m) and grid density (points per decade). */
export const SCAN_MIN_M = 1;
export const SCAN_MAX_M = 100_000;
const PER_DECADE = 40;
/** θ-nodes for the half-width profile (even; Simpson's rule). */
const PROFILE_INTERVALS = 128;

export interface BandSolution {
  /** Limit C* (g/m³). */
  limit: number;
  /** Largest x (m) with C̄(x, 0, z_r) ≥ C*; null when nowhere; SCAN_MAX_M when over 100 km. */
  reach: number | null;
  /** Smallest such x (m); SCAN_MIN_M when the band reaches the scan origin. */
  start: number | null;
  overMaxRange: boolean;
  /** Exceedance intervals along the centreline [from, to] (m). */
  intervals: [number, number][];
  /** Widest crosswind extent 2·max w (m) and where (m), of the unswept band. */
  maxWidth: number | null;
  maxWidthAt: number | null;
  /** Downwind distance (m) of the swept band's widest point (= maxWidthAt for a zero swing). */
  sweptMaxWidthAt: number | null;
  /** ∫ 2w dx (m²) of the unswept band. */
  area: number | null;
  /** Unswept outline. */
  outline: LocalRing;
  /** Outline swept through ±swing; equals `outline` for a zero swing. */
  swept: LocalRing;
  sweptArea: number | null;
  sweptMaxWidth: number | null;
  /** Half-width w(x) (m) at x (m); 0 where the limit is not exceeded. */
  halfWidth(x: number): number;
}

/** Half-width w(x) = σy,eff(x)·√(2·ln(C̄(x,0,z_r)/C*)), 0 where C̄ < C*. */
export function halfWidthAt(plume: Plume, limit: number, zr: number, x: number): number {
  const c = plume.centreline(x, zr);
  if (!(c > limit)) return 0;
  return plume.sigmaY(x) * Math.sqrt(2 * Math.log(c / limit));
}

/** Exceedance intervals of C̄(x, 0, z_r) ≥ C* on [1 m, 100 km], roots refined to ~1e-10 in ln x. */
export function exceedanceIntervals(plume: Plume, limit: number, zr: number): [number, number][] {
  const lnMin = Math.log(SCAN_MIN_M);
  const lnMax = Math.log(SCAN_MAX_M);
  const n = Math.round(((lnMax - lnMin) / Math.LN10) * PER_DECADE);
  const f = (s: number) => plume.centreline(Math.exp(s), zr) / limit - 1;
  const ss: number[] = [];
  const fs: number[] = [];
  for (let i = 0; i <= n; i++) {
    const s = lnMin + ((lnMax - lnMin) * i) / n;
    ss.push(s);
    fs.push(f(s));
  }
  const refine = (a: number, b: number) => Math.exp(brent(f, a, b, 1e-11));
  const intervals: [number, number][] = [];
  let open: number | null = (fs[0] as number) >= 0 ? SCAN_MIN_M : null;
  for (let i = 1; i <= n; i++) {
    const f0 = fs[i - 1] as number;
    const f1 = fs[i] as number;
    if (f0 < 0 && f1 >= 0) open = refine(ss[i - 1] as number, ss[i] as number);
    else if (f0 >= 0 && f1 < 0 && open !== null) {
      intervals.push([open, refine(ss[i - 1] as number, ss[i] as number)]);
      open = null;
    }
  }
  if (open !== null) intervals.push([open, SCAN_MAX_M]);
  if (intervals.length > 0) return intervals;

  // No grid point exceeds: a narrow peak between grid points may still do so.
  let iMax = 0;
  for (let i = 1; i <= n; i++) if ((fs[i] as number) > (fs[iMax] as number)) iMax = i;
  if (iMax === 0 || iMax === n || !((fs[iMax] as number) > -1)) return [];
  const [sPeak, fPeak] = goldenMax(f, ss[iMax - 1] as number, ss[iMax + 1] as number, 1e-9);
  if (fPeak < 0) return [];
  return [[refine(ss[iMax - 1] as number, sPeak), refine(sPeak, ss[iMax + 1] as number)]];
}

/**
 * Solve the band of limit C* (g/m³) at receptor height z_r (m), swept through ±swingDeg (degrees).
 */
export function solveBand(plume: Plume, limit: number, zr: number, swingDeg: number): BandSolution {
  const intervals = exceedanceIntervals(plume, limit, zr);
  const w = (x: number) => halfWidthAt(plume, limit, zr, x);
  const first = intervals[0];
  const last = intervals[intervals.length - 1];
  if (first === undefined || last === undefined) {
    return {
      limit,
      reach: null,
      start: null,
      overMaxRange: false,
      intervals,
      maxWidth: null,
      maxWidthAt: null,
      sweptMaxWidthAt: null,
      area: null,
      outline: [],
      swept: [],
      sweptArea: null,
      sweptMaxWidth: null,
      halfWidth: w,
    };
  }
  const start = first[0];
  const reach = last[1];
  const len = reach - start;

  // Half-width profile on cosine-spaced nodes x = start + L(1 − cos θ)/2 (dense near both ends).
  const m = PROFILE_INTERVALS;
  const xs = new Float64Array(m + 1);
  const ws = new Float64Array(m + 1);
  let area = 0;
  for (let i = 0; i <= m; i++) {
    const th = (Math.PI * i) / m;
    const x = i === m ? reach : start + (len * (1 - Math.cos(th))) / 2;
    const wi = i === m ? 0 : w(x);
    xs[i] = x;
    ws[i] = wi;
    // Simpson's rule in θ on ∫ 2w(x(θ))·(L/2)·sin θ dθ.
    const weight = i === 0 || i === m ? 1 : i % 2 === 1 ? 4 : 2;
    area += weight * 2 * wi * (len / 2) * Math.sin(th);
  }
  area *= Math.PI / m / 3;

  // Widest point: best node, then golden-section between its neighbours.
  let iMax = 0;
  for (let i = 1; i <= m; i++) if ((ws[i] as number) > (ws[iMax] as number)) iMax = i;
  let maxW = ws[iMax] as number;
  let maxAt = xs[iMax] as number;
  if (iMax > 0 && iMax < m) {
    const [xb, wb] = goldenMax(
      w,
      xs[iMax - 1] as number,
      xs[iMax + 1] as number,
      1e-6 * len + 1e-9,
    );
    if (wb > maxW) {
      maxW = wb;
      maxAt = xb;
    }
  }

  // Outline from every second node (the polygon's area is checked against ∫2w dx in the tests).
  const ox: number[] = [];
  const ow: number[] = [];
  for (let i = 0; i <= m; i += 2) {
    ox.push(xs[i] as number);
    ow.push(ws[i] as number);
  }
  const outline = outlineRing(ox, ow);
  const alpha = (Math.abs(swingDeg) * Math.PI) / 180;
  // Nodes inside a gap have w = 0, so the profile's bound closes each gap's edge conservatively.
  const swept = alpha > 0 ? sweptRing(Array.from(xs), Array.from(ws), alpha) : outline;
  let maxY = 0;
  let maxYAt = maxAt;
  for (const p of swept) {
    if (p[1] > maxY) {
      maxY = p[1];
      maxYAt = p[0];
    }
  }
  return {
    limit,
    reach,
    start,
    overMaxRange: reach >= SCAN_MAX_M,
    intervals,
    maxWidth: 2 * maxW,
    maxWidthAt: maxAt,
    sweptMaxWidthAt: alpha > 0 ? maxYAt : maxAt,
    area,
    outline,
    swept,
    sweptArea: alpha > 0 ? ringArea(swept) : area,
    sweptMaxWidth: alpha > 0 ? 2 * maxY : 2 * maxW,
    halfWidth: w,
  };
}

/** Counter-clockwise ring: lower edge (y = −w) outward, upper edge (y = +w) back. */
export function outlineRing(xs: readonly number[], ws: readonly number[]): LocalRing {
  const ring: LocalRing = [];
  const n = xs.length;
  for (let i = 0; i < n; i++) ring.push([xs[i] as number, -(ws[i] as number)]);
  for (let i = n - 1; i >= 0; i--) {
    const wi = ws[i] as number;
    if (wi === 0 && (i === n - 1 || i === 0)) continue; // tip points already on the axis
    ring.push([xs[i] as number, wi]);
  }
  return ring;
}

/**
 * A piecewise-linear profile that contains the band: the nodes (x, w) plus, on each segment where
 * w is concave, the corner where the secants of the neighbouring segments meet. For a concave w
 * the secant through (x₋₁, w₋₁), (x₀, w₀) extended beyond x₀ lies above w, and so does the secant
 * through (x₁, w₁), (x₂, w₂) extended before x₁ (common practice for concave functions), so on
 * [x₀, x₁] w ≤ min of the two lines, while the chord alone lies below w. At a band end (w = 0 on
 * one side: the first and last segments and the edges of gaps, where w behaves like
 * √|x − root|) only the inner secant is used, which gives a vertical edge at the end (height 2/3 of the next node's width for
 * an exact square root; its tangent bound is 1/2). Where w is convex the chord is above w and is
 * kept. x (m) ascending, w (m) ≥ 0.
 */
export function outwardProfile(
  xs: readonly number[],
  ws: readonly number[],
): { xs: number[]; ws: number[] } {
  const n = xs.length;
  const X = (i: number) => xs[i] as number;
  const W = (i: number) => ws[i] as number;
  const slope = (i: number) => (W(i + 1) - W(i)) / (X(i + 1) - X(i));
  const ox: number[] = [];
  const ow: number[] = [];
  for (let i = 0; i < n; i++) {
    const x0 = X(i);
    const w0 = W(i);
    ox.push(x0);
    ow.push(w0);
    const x1 = X(i + 1);
    if (!(x1 > x0)) continue;
    // The neighbouring secants (none at a band end or the edge of a gap) and their corner;
    // with one missing, a vertical edge at that end of the segment.
    const sp = i > 0 && w0 > 0 ? slope(i - 1) : undefined;
    const sn = i < n - 2 && W(i + 1) > 0 ? slope(i + 1) : undefined;
    let xc = x0;
    let wc = sn === undefined ? 0 : W(i + 1) - sn * (x1 - x0);
    if (sp !== undefined) {
      xc = sn === undefined ? x1 : (W(i + 1) - w0 + sp * x0 - sn * x1) / (sp - sn);
      wc = w0 + sp * (xc - x0);
    }
    if (xc >= x0 && xc <= x1 && wc > w0 + slope(i) * (xc - x0)) {
      ox.push(xc);
      ow.push(wc);
    }
  }
  return { xs: ox, ws: ow };
}

/**
 * The band swept through every rotation in [−α, α] (α in radians), built exactly in polar form
 * (model.md): at radius r the band spans angles θ₁(r) ≤ |θ| ≤ θ₂(r) (θ₁ = 0 while the axis point
 * (r, 0) is in the band); the swept band spans max(θ₁ − α, 0) ≤ |θ| ≤ θ₂ + α. Where the band at
 * one radius splits into several arcs, the envelope [θ₁, θ₂] is used (conservative).
 * Input: the upper half-width profile, x ascending from start to reach, w ≥ 0.
 *
 * On a piecewise-linear profile θ₂(r) + α is traced by the profile's edges turned by α, taken
 * where the radius ρ = √(x² + w²) reaches a new maximum going out from the start, with an arc
 * at that radius across each dip of ρ; θ₁(r) − α beyond the reach likewise by the edges turned
 * by −α where ρ reaches a new maximum coming back from the tip (the notch), until they cross the
 * axis. The ring contains the swept band (errs outward): the profile is first made an upper bound
 * (`outwardProfile`), arcs on the outside are drawn circumscribed (every chord tangent to the
 * circle), and where an edge is cut at a radius the cut is placed on the circle at the edge's
 * x interpolated in ρ (ρ is convex along a line, so that angle is not below the edge's).
 */
export function sweptRing(
  xsIn: readonly number[],
  wsIn: readonly number[],
  alpha: number,
): LocalRing {
  const { xs, ws } = outwardProfile(xsIn, wsIn);
  const n = xs.length;
  const X = (i: number) => xs[i] as number;
  const W = (i: number) => ws[i] as number;
  const R = (i: number) => Math.hypot(X(i), W(i));
  const ang = (i: number) => Math.atan2(W(i), X(i));
  const pt = (r: number, th: number): [number, number] => [r * Math.cos(th), r * Math.sin(th)];
  /** Angle of the point at radius r on edge (i, j), x interpolated in ρ. */
  const cut = (i: number, j: number, r: number) =>
    Math.acos(Math.min(1, (X(i) + ((X(j) - X(i)) * (r - R(i))) / (R(j) - R(i))) / r));
  /**
   * Arc of radius r from angle a to b, both ends excluded, in steps d of at most 1°: circumscribed
   * (h = ½: vertices at r / cos(d/2), every chord tangent to the circle) or inscribed (h = 0).
   */
  const arc = (out: LocalRing, r: number, a: number, b: number, h = 0.5) => {
    const steps = Math.max(1, Math.ceil(Math.abs(b - a) / (Math.PI / 180)));
    const d = (b - a) / steps;
    for (let k = h ? 0 : 1; k < steps; k++) out.push(pt(r / Math.cos(d * h), a + d * (k + h)));
  };

  // Upper outer edge, from the start out to the farthest vertex `top`, turned by +α.
  const upper: LocalRing = [pt(R(0), ang(0) + alpha)];
  let top = 0;
  for (let i = 1; i < n; i++) {
    if (R(i) <= R(top)) continue;
    if (top !== i - 1) {
      const th = cut(i - 1, i, R(top)) + alpha;
      arc(upper, R(top), ang(top) + alpha, th);
      upper.push(pt(R(top), th));
    }
    upper.push(pt(R(i), ang(i) + alpha));
    top = i;
  }
  const rOut = R(top);
  const thOut = ang(top) + alpha;

  // The notch: from `top` toward the tip, the vertices where ρ is the largest of all beyond them,
  // turned by −α, while above the axis; then where that edge crosses the axis.
  const notch: LocalRing = [];
  let last = top;
  let thLast = ang(top) - alpha;
  if (thLast > 0) {
    const records = [n - 1]; // the tip, on the axis
    for (let i = n - 2; i > top; i--)
      if (R(i) > R(records[records.length - 1] as number)) records.push(i);
    notch.push(pt(rOut, thLast));
    for (let k = records.length - 1; k >= 0; k--) {
      const i = records[k] as number;
      const th = ang(i) - alpha;
      if (th <= 0) {
        const [ax, ay] = pt(R(last), thLast);
        const [bx, by] = pt(R(i), th);
        notch.push([ax + ((bx - ax) * ay) / (ay - by), 0]);
        break;
      }
      notch.push(pt(R(i), th));
      last = i;
      thLast = th;
    }
  }

  const ring: LocalRing = upper.map(([x, y]) => [x, -y]);
  if (notch.length > 0) {
    arc(ring, rOut, -thOut, -(ang(top) - alpha));
    for (const [x, y] of notch) ring.push([x, -y]);
    ring.pop(); // the axis point is shared by both halves
    for (let k = notch.length - 1; k >= 0; k--) ring.push(notch[k] as [number, number]);
    arc(ring, rOut, ang(top) - alpha, thOut);
  } else arc(ring, rOut, -thOut, thOut);
  for (let k = upper.length - 1; k >= 0; k--) ring.push(upper[k] as [number, number]);
  // The near end: the arc at the start, inscribed (its chords lie outside the band).
  arc(ring, R(0), ang(0) + alpha, -ang(0) - alpha, 0);
  return dedupe(ring);
}

/** The ring without repeated points (within 1 nm), nor a last point equal to the first. */
function dedupe(ring: LocalRing): LocalRing {
  const same = (p: [number, number], q: [number, number]) =>
    Math.abs(p[0] - q[0]) <= 1e-9 && Math.abs(p[1] - q[1]) <= 1e-9;
  const out = ring.filter((p, i) => i === 0 || !same(p, ring[i - 1] as [number, number]));
  if (out.length > 1 && same(out[0] as [number, number], out[out.length - 1] as [number, number]))
    out.pop();
  return out;
}
