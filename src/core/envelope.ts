/**
 * The outer envelope of several bands (the spread's outline): one ring that contains every
 * band given, built in polar form around the source like the wind swing (model.md).
 *
 * Each band is symmetric about the downwind axis, so at radius r it lies within |θ| ≤ θ(r).
 * The radii are cut into intervals [r_k, r_k+1]; M_k is the largest |θ| of any band's boundary
 * with its radius in that interval (exact: along a straight edge the polar angle is monotone, so
 * the largest angle of the part of an edge inside an interval is at that part's ends). The
 * envelope's half-angle at r_k is max(M_k−1, M_k), so both ends of every edge of the envelope lie
 * at an angle at least that of every band point between them, and an edge between two points at
 * angles ≥ M stays at angles ≥ M. The envelope thus contains every band (conservative); it fills
 * the axis between the source and the far end even where a band leaves a gap there.
 *
 * Local frame: x downwind, y left (m); rings counter-clockwise, not closed (types.ts LocalRing).
 */
import type { LocalRing } from "./types.ts";

/** Most radii kept (the union of the bands' vertex radii, thinned). */
const MAX_RADII = 300;
/** Angular step of the arcs at both ends (radians). */
const ARC_STEP = Math.PI / 180;

/**
 * The outer envelope of `rings` (each a band's ring, symmetric about the x axis; empty rings are
 * skipped). One non-empty ring is returned as it is (the union of one band is that band).
 *
 * @param rings - counter-clockwise rings in metres
 * @returns a counter-clockwise ring in metres containing every ring; empty when all are empty
 */
export function envelopeRing(rings: readonly LocalRing[]): LocalRing {
  const bands = rings.filter((r) => r.length >= 3);
  if (bands.length === 0) return [];
  if (bands.length === 1) return (bands[0] as LocalRing).map((p) => [p[0], p[1]]);

  const radii = keptRadii(bands);
  const k = radii.length - 1; // intervals
  const m = new Float64Array(k).fill(Number.NEGATIVE_INFINITY);
  const note = (i: number, x: number, y: number) => {
    const th = Math.atan2(Math.abs(y), x);
    if (th > (m[i] as number)) m[i] = th;
  };
  for (const ring of bands) {
    const n = ring.length;
    for (let e = 0; e < n; e++) {
      const a = ring[e] as [number, number];
      const b = ring[(e + 1) % n] as [number, number];
      edgeIntoIntervals(a, b, radii, note);
    }
  }
  const theta = new Float64Array(k + 1);
  for (let i = 0; i <= k; i++) {
    const t = Math.max(i > 0 ? (m[i - 1] as number) : -1, i < k ? (m[i] as number) : -1);
    theta[i] = Math.max(0, Math.min(Math.PI, t));
  }

  const ring: LocalRing = [];
  const pt = (r: number, th: number): [number, number] => [r * Math.cos(th), r * Math.sin(th)];
  for (let i = 0; i < k; i++) ring.push(pt(radii[i] as number, -(theta[i] as number)));
  // Far arc through the axis; vertices pushed out by 1/cos(step/2) so its chords stay outside r.
  arc(ring, radii[k] as number, -(theta[k] as number), theta[k] as number, true);
  for (let i = k - 1; i >= 1; i--) ring.push(pt(radii[i] as number, theta[i] as number));
  // Near arc back through the axis (its chords cut inside r_0: conservative there too).
  arc(ring, radii[0] as number, theta[0] as number, -(theta[0] as number), false);
  ring.pop(); // equals the first vertex
  return dedupe(ring);
}

/** Sorted radii: the bands' smallest and largest distance and their vertices', thinned. */
function keptRadii(bands: readonly LocalRing[]): number[] {
  let rMin = Number.POSITIVE_INFINITY;
  let rMax = 0;
  const all: number[] = [];
  for (const ring of bands) {
    const n = ring.length;
    for (let e = 0; e < n; e++) {
      const a = ring[e] as [number, number];
      const b = ring[(e + 1) % n] as [number, number];
      const ra = Math.hypot(a[0], a[1]);
      all.push(ra);
      if (ra > rMax) rMax = ra;
      const d = segmentDistance(a, b);
      if (d < rMin) rMin = d;
    }
  }
  all.sort((p, q) => p - q);
  const gap = (rMax - rMin) / MAX_RADII;
  const out = [rMin];
  for (const r of all) {
    if (r - (out[out.length - 1] as number) >= gap && rMax - r >= gap) out.push(r);
  }
  out.push(rMax);
  return out;
}

/** Distance (m) from the origin to the segment a–b. */
function segmentDistance(a: [number, number], b: [number, number]): number {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const len2 = dx * dx + dy * dy;
  const t = len2 > 0 ? Math.max(0, Math.min(1, -(a[0] * dx + a[1] * dy) / len2)) : 0;
  return Math.hypot(a[0] + t * dx, a[1] + t * dy);
}

/**
 * Calls `note(i, x, y)` for every point of the edge a–b that bounds its part inside interval i
 * [radii[i], radii[i+1]]: the edge's ends, its closest point to the origin, and its crossings
 * of each radius.
 */
function edgeIntoIntervals(
  a: [number, number],
  b: [number, number],
  radii: readonly number[],
  note: (i: number, x: number, y: number) => void,
): void {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const len2 = dx * dx + dy * dy;
  // Points along the edge, t in [0, 1], where it enters or leaves an interval.
  const ts: number[] = [0, 1];
  if (len2 > 0) {
    const tc = -(a[0] * dx + a[1] * dy) / len2;
    if (tc > 0 && tc < 1) ts.push(tc);
    const ra = Math.hypot(a[0], a[1]);
    const rb = Math.hypot(b[0], b[1]);
    const lo = segmentDistance(a, b);
    const hi = Math.max(ra, rb);
    // |a + t·d|² = r²: t² len2 + 2t (a·d) + |a|² − r² = 0.
    const half = a[0] * dx + a[1] * dy;
    for (let j = firstAtLeast(radii, lo); j < radii.length && (radii[j] as number) <= hi; j++) {
      const r = radii[j] as number;
      const disc = half * half - len2 * (ra * ra - r * r);
      if (disc < 0) continue;
      const sq = Math.sqrt(disc);
      for (const t of [(-half - sq) / len2, (-half + sq) / len2]) if (t > 0 && t < 1) ts.push(t);
    }
  }
  ts.sort((p, q) => p - q);
  for (let j = 0; j < ts.length; j++) {
    const t = ts[j] as number;
    const x = a[0] + t * dx;
    const y = a[1] + t * dy;
    const r = Math.hypot(x, y);
    // The point bounds the sub-edges on both sides; note it in every interval its radius touches.
    const i = intervalOf(radii, r);
    note(i, x, y);
    if (i > 0 && r <= (radii[i] as number)) note(i - 1, x, y);
    if (i < radii.length - 2 && r >= (radii[i + 1] as number)) note(i + 1, x, y);
  }
}

/** Index of the first radius ≥ r (binary search). */
function firstAtLeast(radii: readonly number[], r: number): number {
  let lo = 0;
  let hi = radii.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if ((radii[mid] as number) < r) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** The interval i with radii[i] ≤ r ≤ radii[i+1] (clamped to the first and last). */
function intervalOf(radii: readonly number[], r: number): number {
  const j = firstAtLeast(radii, r);
  return Math.max(0, Math.min(radii.length - 2, j - 1));
}

function arc(ring: LocalRing, r: number, from: number, to: number, outside: boolean): void {
  const steps = Math.max(1, Math.ceil(Math.abs(to - from) / ARC_STEP));
  const rr = outside ? r / Math.cos(Math.abs(to - from) / steps / 2) : r;
  for (let s = 0; s <= steps; s++) {
    const th = from + ((to - from) * s) / steps;
    ring.push([rr * Math.cos(th), rr * Math.sin(th)]);
  }
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
