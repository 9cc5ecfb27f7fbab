/** Ring helpers for the geometry tests (local frame, metres). */
import type { LocalRing } from "../../src/core/types.ts";

/** Even-odd ray casting (Shimrat 1962, Algorithm 112, Comm. ACM 5). */
export function inside(ring: LocalRing, x: number, y: number): boolean {
  let c = false;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const [xi, yi] = ring[i] as [number, number];
    const [xj, yj] = ring[j] as [number, number];
    if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) c = !c;
  }
  return c;
}

/** Shortest distance (m) from (x, y) to the ring's edges. */
export function distanceToRing(ring: LocalRing, x: number, y: number): number {
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

/**
 * Points of `inner` (its vertices and the midpoints of its edges) that lie neither inside `outer`
 * nor within `tol` (m) of its boundary.
 */
export function pointsOutside(inner: LocalRing, outer: LocalRing, tol: number): [number, number][] {
  const out: [number, number][] = [];
  for (let i = 0; i < inner.length; i++) {
    const a = inner[i] as [number, number];
    const b = inner[(i + 1) % inner.length] as [number, number];
    for (const [x, y] of [a, [(a[0] + b[0]) / 2, (a[1] + b[1]) / 2] as [number, number]]) {
      if (!inside(outer, x, y) && distanceToRing(outer, x, y) > tol) out.push([x, y]);
    }
  }
  return out;
}
