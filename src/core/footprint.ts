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
  let swept = outline;
  if (alpha > 0) {
    // The gaps' edges are zeros of w: profile nodes there, so the profile's bound sees each edge.
    const nodes: [number, number][] = Array.from(xs, (x, i) => [x, ws[i] as number]);
    for (let k = 0; k < intervals.length; k++) {
      const [a, b] = intervals[k] as [number, number];
      if (k > 0) nodes.push([a, 0]);
      if (k < intervals.length - 1) nodes.push([b, 0]);
    }
    nodes.sort((p, q) => p[0] - q[0]);
    swept = sweptRing(
      nodes.map((p) => p[0]),
      nodes.map((p) => p[1]),
      alpha,
    );
  }
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
  const ox: number[] = [];
  const ow: number[] = [];
  const at = (i: number): [number, number] => [xs[i] as number, ws[i] as number];
  for (let i = 0; i < n; i++) {
    const [x0, w0] = at(i);
    ox.push(x0);
    ow.push(w0);
    if (i === n - 1) break;
    const [x1, w1] = at(i + 1);
    if (!(x1 > x0) || (w0 === 0 && w1 === 0)) continue;
    const sc = (w1 - w0) / (x1 - x0);
    // Neighbouring secants, unless the segment starts or ends a stretch of zero width.
    let sp: number | null = null;
    let sn: number | null = null;
    if (i >= 1 && w0 > 0) {
      const [xp, wp] = at(i - 1);
      if (x0 > xp) sp = (w0 - wp) / (x0 - xp);
    }
    if (i + 2 <= n - 1 && w1 > 0) {
      const [xn, wn] = at(i + 2);
      if (xn > x1) sn = (wn - w1) / (xn - x1);
    }
    if (sp !== null && sn !== null) {
      if (sp > sc && sc > sn) {
        const xc = (w1 - w0 + sp * x0 - sn * x1) / (sp - sn);
        if (xc > x0 && xc < x1) {
          ox.push(xc);
          ow.push(w0 + sp * (xc - x0));
        }
      }
    } else if (sn !== null) {
      if (sc > sn) {
        ox.push(x0);
        ow.push(w1 - sn * (x1 - x0));
      }
    } else if (sp !== null) {
      if (sp > sc) {
        ox.push(x1);
        ow.push(w0 + sp * (x1 - x0));
      }
    }
  }
  return { xs: ox, ws: ow };
}

/**
 * The band swept through every rotation in [−α, α] (α in radians), built exactly in polar form:
 * at radius r the band spans angles θ₁(r) ≤ |θ| ≤ θ₂(r) (θ₁ = 0 while the axis point (r, 0) is
 * in the band); the swept band spans max(θ₁ − α, 0) ≤ |θ| ≤ θ₂ + α. Where the band at one radius
 * splits into several arcs, the envelope [θ₁, θ₂] is used (conservative: covers every arc).
 * Input: the upper half-width profile, x ascending from start to reach, w ≥ 0.
 *
 * The ring contains the swept band (errs outward): the profile is first made an upper bound
 * (`outwardProfile`); every vertex radius is a sample radius, so between two samples the outer
 * edge is one profile edge turned by α and the ring's chord is that edge itself; where the
 * running maximum of the radius has a dip (θ₂ jumps) the arc at that radius is drawn; arcs on the
 * outside are drawn circumscribed (every chord tangent to the circle); the notch beyond the reach
 * closes where the turned edge crosses the axis.
 */
export function sweptRing(
  xsIn: readonly number[],
  wsIn: readonly number[],
  alpha: number,
): LocalRing {
  const { xs, ws } = outwardProfile(xsIn, wsIn);
  const n = xs.length;
  const rho = xs.map((x, i) => Math.hypot(x, ws[i] as number));
  const start = xs[0] as number;
  const reach = xs[n - 1] as number;
  let rMax = 0;
  for (const r of rho) if (r > rMax) rMax = r;
  const rMin = start;

  // Radii: every vertex's ρ, and the start and the reach.
  const radii = new Set<number>(rho);
  radii.add(start);
  radii.add(reach);
  const rs = [...radii].filter((r) => r >= rMin && r <= rMax).sort((a, b) => a - b);

  // θ₂(r): from the smallest x' with ρ(x') ≥ r (or > r: the far side of a dip); θ₁(r): from the
  // largest x' ≤ min(r, reach) with ρ(x') ≥ r. Prefix / suffix maxima of ρ make both a binary
  // search. Interpolating x linearly in ρ along an edge errs outward: ρ is convex along a line.
  const pre = new Float64Array(n);
  const suf = new Float64Array(n);
  for (let i = 0; i < n; i++)
    pre[i] = Math.max(i > 0 ? (pre[i - 1] as number) : 0, rho[i] as number);
  for (let i = n - 1; i >= 0; i--)
    suf[i] = Math.max(i < n - 1 ? (suf[i + 1] as number) : 0, rho[i] as number);
  const xLow = (r: number, strict: boolean): number | null => {
    const reached = (v: number) => (strict ? v > r : v >= r);
    if (reached(rho[0] as number)) return start;
    if (!reached(pre[n - 1] as number)) return null;
    let lo = 0; // pre[lo] has not reached r
    let hi = n - 1; // pre[hi] has
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (reached(pre[mid] as number)) hi = mid;
      else lo = mid;
    }
    const r0 = rho[hi - 1] as number;
    const r1 = rho[hi] as number;
    return lerp(xs[hi - 1] as number, xs[hi] as number, Math.max(0, (r - r0) / (r1 - r0)));
  };
  const xHigh = (r: number): number | null => {
    if (r <= reach) return r;
    if ((suf[0] as number) < r) return null;
    let lo = 0; // suf[lo] >= r
    let hi = n - 1; // suf[hi] < r (rho at the tip is the reach, below r)
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if ((suf[mid] as number) >= r) lo = mid;
      else hi = mid;
    }
    const r0 = rho[lo] as number;
    const r1 = rho[hi] as number;
    return lerp(xs[lo] as number, xs[hi] as number, (r0 - r) / (r0 - r1));
  };
  const acosSafe = (v: number) => Math.acos(Math.max(-1, Math.min(1, v)));
  const pt = (r: number, th: number): [number, number] => [r * Math.cos(th), r * Math.sin(th)];
  /** Arc of radius r from angle `from` to `to` (excluding both ends), outside the circle. */
  const arcOutside = (r: number, from: number, to: number): [number, number][] => {
    const steps = Math.max(1, Math.ceil(Math.abs(to - from) / (Math.PI / 180)));
    const d = (to - from) / steps;
    const rc = r / Math.cos(d / 2);
    const out: [number, number][] = [];
    for (let k = 0; k < steps; k++) out.push(pt(rc, from + d * (k + 0.5)));
    return out;
  };

  // Upper half of the outer edge, from the start outward: points [x, y] (the lower half mirrors).
  const outer: [number, number][] = [];
  // Inner edge beyond the reach: [r, θ₁ − α] (signed: negative where the axis is covered).
  const inner: [number, number][] = [];
  for (const r of rs) {
    const lo = xLow(r, false);
    const hi = xHigh(r);
    if (lo === null || hi === null) continue;
    const th2 = acosSafe(lo / r);
    outer.push(pt(r, Math.min(Math.PI, th2 + alpha)));
    const loFar = r < rMax ? xLow(r, true) : null;
    if (loFar !== null) {
      const th2Far = acosSafe(loFar / r);
      if (th2Far < th2 - 1e-12) {
        // A dip in ρ: θ₂ drops at this radius; the swept edge follows the arc down to it.
        outer.push(
          ...arcOutside(r, Math.min(Math.PI, th2 + alpha), Math.min(Math.PI, th2Far + alpha)),
        );
        outer.push(pt(r, Math.min(Math.PI, th2Far + alpha)));
      }
    }
    inner.push([r, Math.min(acosSafe(hi / r), th2) - alpha]);
  }
  if (outer.length === 0) return [];
  const thOut = (q: [number, number]) => Math.atan2(q[1], q[0]);

  const ring: LocalRing = [];
  const mirror = (q: [number, number]): [number, number] => [q[0], -q[1]];
  // Lower outer edge outward (without its last point, the far arc's start).
  for (let k = 0; k < outer.length - 1; k++) ring.push(mirror(outer[k] as [number, number]));
  const last = outer[outer.length - 1] as [number, number];
  const thOutLast = thOut(last);
  const rOut = rMax;
  // The notch beyond the reach: the contiguous run of radii from the outside in with θ₁ − α > 0.
  let kNotch = inner.length;
  while (kNotch > 0 && (inner[kNotch - 1] as [number, number])[1] > 0) kNotch--;
  ring.push(mirror(last));
  if (kNotch < inner.length) {
    const thInLast = (inner[inner.length - 1] as [number, number])[1];
    ring.push(...arcOutside(rOut, -thOutLast, -thInLast));
    for (let k = inner.length - 1; k >= kNotch; k--) {
      const [r, th] = inner[k] as [number, number];
      ring.push(pt(r, -th));
    }
    // The turned edge between the last two samples crosses the axis: the notch's inner corner.
    const [ra, ta] = (inner[kNotch - 1] ?? inner[kNotch]) as [number, number];
    const [rb, tb] = inner[kNotch] as [number, number];
    const [ax, ay] = pt(ra, ta);
    const [bx, by] = pt(rb, tb);
    const xAxis = by - ay !== 0 && ta < 0 ? ax + ((bx - ax) * (0 - ay)) / (by - ay) : rb;
    ring.push([Math.min(xAxis, rb), 0]);
    for (let k = kNotch; k < inner.length; k++) {
      const [r, th] = inner[k] as [number, number];
      ring.push(pt(r, th));
    }
    ring.push(...arcOutside(rOut, thInLast, thOutLast));
  } else {
    ring.push(...arcOutside(rOut, -thOutLast, thOutLast));
  }
  // Upper outer edge inward, then the arc at the near end back to the start (its chords lie
  // inside the circle r = start, i.e. outside the band: erring outward).
  for (let k = outer.length - 1; k >= 1; k--) ring.push(outer[k] as [number, number]);
  const first = outer[0] as [number, number];
  const r0 = Math.hypot(first[0], first[1]);
  const th0 = thOut(first);
  const steps = Math.max(1, Math.ceil((2 * th0) / (Math.PI / 180)));
  for (let k = 0; k < steps; k++) ring.push(pt(r0, th0 - (2 * th0 * k) / steps));
  return dedupe(ring);
}

function lerp(a: number, b: number, t: number): number {
  return a + (b - a) * t;
}

function dedupe(ring: LocalRing): LocalRing {
  const out: LocalRing = [];
  for (const p of ring) {
    const q = out[out.length - 1];
    if (q === undefined || Math.abs(q[0] - p[0]) > 1e-9 || Math.abs(q[1] - p[1]) > 1e-9)
      out.push(p);
  }
  const a = out[0];
  const b = out[out.length - 1];
  if (a && b && out.length > 1 && Math.abs(a[0] - b[0]) <= 1e-9 && Math.abs(a[1] - b[1]) <= 1e-9)
    out.pop();
  return out;
}
