/**
 * Geometry for drawing the local footprint north-up on screen. Pure, no DOM.
 *
 * The core gives rings in its local frame (metres, x downwind, y left of
 * downwind) and the plume heading (degrees true). A local point (x, y) lies at
 * bearing `heading − atan2(y, x)` (degrees) and distance `hypot(x, y)` from the
 * source, so east = r·sin(bearing), north = r·cos(bearing). Screen y grows
 * downward, hence the minus sign in `project`.
 */
import type { LocalFootprint, LocalRing } from "../core/types.ts";
import { M_PER_FT, M_PER_MILE, type UnitSystem } from "./units.ts";

export interface EN {
  e: number;
  n: number;
}

const RAD = Math.PI / 180;

/** Local (x downwind, y left) in m → east/north in m, for a plume travelling toward `headingDeg`. */
export function toNorthUp(x: number, y: number, headingDeg: number): EN {
  const r = Math.hypot(x, y);
  const bearing = headingDeg * RAD - Math.atan2(y, x);
  return { e: r * Math.sin(bearing), n: r * Math.cos(bearing) };
}

export function ringToNorthUp(ring: LocalRing, headingDeg: number): EN[] {
  return ring.map(([x, y]) => toNorthUp(x, y, headingDeg));
}

export interface Box {
  minE: number;
  maxE: number;
  minN: number;
  maxN: number;
}

/** Bounding box of every swept band and the near-zone circle (source included), in east/north m. */
export function footprintBox(fp: LocalFootprint): Box {
  const r0 = Math.max(fp.near_zone_m, 1);
  const box: Box = { minE: -r0, maxE: r0, minN: -r0, maxN: r0 };
  for (const band of fp.bands) {
    for (const p of ringToNorthUp(band.swept.length ? band.swept : band.outline, fp.heading_deg)) {
      if (p.e < box.minE) box.minE = p.e;
      if (p.e > box.maxE) box.maxE = p.e;
      if (p.n < box.minN) box.minN = p.n;
      if (p.n > box.maxN) box.maxN = p.n;
    }
  }
  return box;
}

/** What part of the ground the drawing shows: centre (east/north m) and metres per pixel. */
export interface View {
  ce: number;
  cn: number;
  mPerPx: number;
  width: number;
  height: number;
}

/**
 * The view that fits `box` into `width`×`height` px with `marginPx` on every side,
 * zoomed by `zoom` (1 = fit) about a centre that moves toward the source as the
 * zoom grows, so zooming in always looks at the near field.
 */
export function fitView(box: Box, width: number, height: number, marginPx: number, zoom = 1): View {
  const spanE = Math.max(box.maxE - box.minE, 1);
  const spanN = Math.max(box.maxN - box.minN, 1);
  const fitMPerPx = Math.max(spanE / (width - 2 * marginPx), spanN / (height - 2 * marginPx));
  const z = zoom > 0 && Number.isFinite(zoom) ? zoom : 1;
  const ce0 = (box.minE + box.maxE) / 2;
  const cn0 = (box.minN + box.maxN) / 2;
  return { ce: ce0 / z, cn: cn0 / z, mPerPx: fitMPerPx / z, width, height };
}

/** East/north (m) → screen px. */
export function project(v: View, p: EN): [number, number] {
  return [v.width / 2 + (p.e - v.ce) / v.mPerPx, v.height / 2 - (p.n - v.cn) / v.mPerPx];
}

/** SVG path data for a closed ring (empty string for an empty ring). */
export function ringPath(v: View, ring: EN[]): string {
  if (ring.length === 0) return "";
  return `${ring
    .map((p, i) => {
      const [sx, sy] = project(v, p);
      return `${i === 0 ? "M" : "L"}${sx.toFixed(1)} ${sy.toFixed(1)}`;
    })
    .join("")}Z`;
}

/** Largest 1, 2 or 5 × 10^k not above `value` (value > 0). */
export function niceFloor(value: number): number {
  if (!(value > 0) || !Number.isFinite(value)) return 1;
  const p = 10 ** Math.floor(Math.log10(value));
  const f = value / p;
  const m = f >= 5 ? 5 : f >= 2 ? 2 : 1;
  return m * p;
}

export interface NiceLength {
  m: number;
  label: string;
}

/**
 * A round length not above `maxM`, in the display unit system: m/km (metric)
 * or ft/mi (US customary; ft below half a mile).
 */
export function niceLength(maxM: number, system: UnitSystem): NiceLength {
  if (system === "metric") {
    const m = niceFloor(maxM);
    return { m, label: m >= 1000 ? `${m / 1000} km` : `${m} m` };
  }
  const mi = maxM / M_PER_MILE;
  if (mi >= 0.5) {
    const v = niceFloor(mi);
    return { m: v * M_PER_MILE, label: `${v} mi` };
  }
  const ft = niceFloor(maxM / M_PER_FT);
  return { m: ft * M_PER_FT, label: `${ft} ft` };
}

/**
 * Range rings: round distances from the source, `step` apart, out to the
 * farthest visible corner of the view (at most `maxRings`).
 */
export function rangeRings(v: View, system: UnitSystem, maxRings = 4): NiceLength[] {
  const corners = [
    [-1, -1],
    [1, -1],
    [-1, 1],
    [1, 1],
  ].map(([a, b]) =>
    Math.hypot(
      v.ce + ((a ?? 0) * v.width * v.mPerPx) / 2,
      v.cn + ((b ?? 0) * v.height * v.mPerPx) / 2,
    ),
  );
  const far = Math.max(...corners);
  const step = niceLength(far / maxRings, system);
  const rings: NiceLength[] = [];
  for (let k = 1; k <= maxRings; k++) {
    const m = step.m * k;
    if (m > far) break;
    const num = Number.parseFloat(step.label) * k;
    const unit = step.label.replace(/^[\d.]+\s*/, "");
    rings.push({ m, label: `${Number(num.toPrecision(6))} ${unit}` });
  }
  return rings;
}

/** Split a label into lines of at most `maxChars` characters, at spaces where possible. */
export function wrapLabel(text: string, maxChars = 16): string[] {
  const lines: string[] = [];
  let cur = "";
  for (const word of text.trim().split(/\s+/)) {
    if (!cur) cur = word;
    else if (cur.length + 1 + word.length <= maxChars) cur = `${cur} ${word}`;
    else {
      lines.push(cur);
      cur = word;
    }
  }
  if (cur) lines.push(cur);
  return lines.flatMap((l) => {
    const parts: string[] = [];
    for (let i = 0; i < l.length; i += maxChars) parts.push(l.slice(i, i + maxChars));
    return parts;
  });
}

export interface LabelSpot {
  index: number;
  lines: string[];
  /** Text anchor point (px): x per `anchor`, y of the first line's baseline. */
  x: number;
  y: number;
  anchor: "start" | "end";
  /** The band tip the label names (px); a leader line is drawn when the label had to move. */
  tipX: number;
  tipY: number;
  moved: boolean;
}

/** Line height and character width (px) assumed for 12 px labels. */
export const LABEL_LINE_PX = 14;
export const LABEL_CHAR_PX = 6.8;

interface Rect {
  x0: number;
  x1: number;
  y0: number;
  y1: number;
}

function rectOf(s: LabelSpot): Rect {
  const w = Math.max(...s.lines.map((l) => l.length)) * LABEL_CHAR_PX;
  const x0 = s.anchor === "start" ? s.x : s.x - w;
  return { x0, x1: x0 + w, y0: s.y - 11, y1: s.y - 11 + s.lines.length * LABEL_LINE_PX };
}

function clampInto(s: LabelSpot, v: View): void {
  const r = rectOf(s);
  if (s.anchor === "start" && r.x1 > v.width - 4) {
    s.anchor = "end";
    s.x = Math.min(s.x, v.width - 4);
  }
  const r2 = rectOf(s);
  if (r2.x0 < 4) s.x += 4 - r2.x0;
  if (rectOf(s).x1 > v.width - 4) s.x -= rectOf(s).x1 - (v.width - 4);
  const h = r.y1 - r.y0;
  s.y = Math.min(v.height - 4 - h + 11, Math.max(15, s.y));
}

/**
 * Where each band's label goes: just beyond the band's downwind tip (its point
 * of largest x), wrapped into short lines, kept inside the drawing and pushed
 * apart so no two overlap. Labels that had to move get a leader line to their tip.
 */
export function bandLabelSpots(
  v: View,
  fp: LocalFootprint,
  maxChars = 16,
  offsetPx = 8,
): LabelSpot[] {
  const [hx, hy] = headingVector(fp.heading_deg);
  const spots: LabelSpot[] = [];
  fp.bands.forEach((band, index) => {
    if (band.outline.length === 0) return;
    let tip = band.outline[0] as [number, number];
    for (const p of band.outline) if (p[0] > tip[0]) tip = p;
    const [tx, ty] = project(v, toNorthUp(tip[0], 0, fp.heading_deg));
    const s: LabelSpot = {
      index,
      lines: wrapLabel(band.label, maxChars),
      x: tx + hx * offsetPx,
      y: ty + hy * offsetPx + (hy > 0 ? 12 : 0),
      anchor: hx >= 0 ? "start" : "end",
      tipX: tx,
      tipY: ty,
      moved: false,
    };
    clampInto(s, v);
    spots.push(s);
  });
  spots.sort((a, b) => a.y - b.y);
  for (let i = 1; i < spots.length; i++) {
    const cur = spots[i] as LabelSpot;
    for (let j = 0; j < i; j++) {
      const a = rectOf(spots[j] as LabelSpot);
      const b = rectOf(cur);
      const overlap = a.x0 < b.x1 && b.x0 < a.x1 && a.y0 < b.y1 && b.y0 < a.y1;
      if (overlap) cur.y += a.y1 - b.y0 + 2;
    }
    clampInto(cur, v);
  }
  for (const s of spots) {
    const r = rectOf(s);
    const nearX = Math.min(Math.max(s.tipX, r.x0), r.x1);
    const nearY = Math.min(Math.max(s.tipY, r.y0), r.y1);
    s.moved = Math.hypot(nearX - s.tipX, nearY - s.tipY) > offsetPx + 14;
  }
  return spots;
}

/** The point of a label's box nearest its tip, where a leader line starts (px). */
export function leaderStart(s: LabelSpot): [number, number] {
  const r = rectOf(s);
  return [Math.min(Math.max(s.tipX, r.x0), r.x1), Math.min(Math.max(s.tipY, r.y0), r.y1)];
}

/** Unit vector (screen px, y down) of the plume heading. */
export function headingVector(headingDeg: number): [number, number] {
  return [Math.sin(headingDeg * RAD), -Math.cos(headingDeg * RAD)];
}

/**
 * Where a range ring's distance label goes (px): on the ring, square to the
 * plume on whichever side is more northerly (up on screen), where bands are
 * narrow and rarely cover it.
 */
export function ringLabelAt(
  sx: number,
  sy: number,
  radiusPx: number,
  headingDeg: number,
): [number, number] {
  const left = (headingDeg - 90) * RAD;
  const right = (headingDeg + 90) * RAD;
  const b = Math.cos(left) >= Math.cos(right) ? left : right;
  return [sx + radiusPx * Math.sin(b) + 3, sy - radiusPx * Math.cos(b) - 3];
}

/**
 * Whether a ring label at (x, y) px is clear of the drawing's edges and of the
 * two corner marks (wind dial top left, north arrow top right, each `cornerPx` square).
 */
export function ringLabelFits(
  x: number,
  y: number,
  width: number,
  height: number,
  cornerPx = 80,
): boolean {
  if (x < 4 || x > width - 40 || y < 14 || y > height - 30) return false;
  if (y < cornerPx && (x < cornerPx || x > width - cornerPx / 2 - 20)) return false;
  return true;
}

export interface WindArrow {
  x1: number;
  y1: number;
  x2: number;
  y2: number;
}

/**
 * The wind arrow: drawn in a corner of the map around (cx, cy), `lengthPx` long,
 * pointing the way the plume travels (downwind).
 */
export function windArrow(cx: number, cy: number, headingDeg: number, lengthPx = 40): WindArrow {
  const [hx, hy] = headingVector(headingDeg);
  const h = lengthPx / 2;
  return { x1: cx - hx * h, y1: cy - hy * h, x2: cx + hx * h, y2: cy + hy * h };
}
