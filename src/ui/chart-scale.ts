/**
 * Log–log scales for the centreline chart. Pure, no DOM.
 */

/** `count` distances spaced evenly in log from `minM` to `maxM` (both > 0, min < max). */
export function logGrid(minM: number, maxM: number, count: number): number[] {
  const a = Math.log10(minM);
  const b = Math.log10(maxM);
  const n = Math.max(2, Math.floor(count));
  return Array.from({ length: n }, (_, i) => 10 ** (a + ((b - a) * i) / (n - 1)));
}

/** Powers of ten within [min, max] (inclusive, with a small tolerance). */
export function decadeTicks(min: number, max: number): number[] {
  if (!(min > 0) || !(max > min)) return [];
  const out: number[] = [];
  for (let k = Math.ceil(Math.log10(min) - 1e-9); k <= Math.floor(Math.log10(max) + 1e-9); k++) {
    out.push(10 ** k);
  }
  return out;
}

export interface LogScale {
  min: number;
  max: number;
  /** Pixel position of `min` and of `max`. */
  from: number;
  to: number;
}

/** Value → pixel on a log scale; values ≤ 0 map to `null`. */
export function logPos(s: LogScale, v: number): number | null {
  if (!(v > 0) || !Number.isFinite(v)) return null;
  const f = (Math.log10(v) - Math.log10(s.min)) / (Math.log10(s.max) - Math.log10(s.min));
  return s.from + f * (s.to - s.from);
}

/**
 * Polyline pieces of a curve on log–log scales: points with a non-positive or
 * non-finite value break the line; values are clamped to the y range so the
 * line never leaves the plot.
 */
export function curvePieces(
  xs: readonly number[],
  ys: readonly number[],
  sx: LogScale,
  sy: LogScale,
): string[] {
  const pieces: string[] = [];
  let cur: string[] = [];
  xs.forEach((x, i) => {
    const y = ys[i] ?? 0;
    const px = logPos(sx, x);
    const py = y > 0 ? logPos(sy, Math.min(sy.max, Math.max(sy.min, y))) : null;
    if (px === null || py === null || y < sy.min) {
      if (cur.length > 1) pieces.push(cur.join(" "));
      cur = [];
      return;
    }
    cur.push(`${px.toFixed(1)},${py.toFixed(1)}`);
  });
  if (cur.length > 1) pieces.push(cur.join(" "));
  return pieces;
}

/**
 * Concentration range to show: from a tenth of the lowest limit to the larger
 * of three times the highest limit and the highest computed value (capped at
 * 10⁴× the highest limit so a near-source spike does not flatten the chart).
 */
export function concentrationRange(
  limits: readonly number[],
  values: readonly number[],
): { min: number; max: number } {
  const pos = limits.filter((v) => v > 0 && Number.isFinite(v));
  if (pos.length === 0) return { min: 1e-3, max: 1e3 };
  const lo = Math.min(...pos);
  const hi = Math.max(...pos);
  const top = Math.max(...values.filter((v) => Number.isFinite(v)), 0);
  const max = Math.min(Math.max(hi * 3, top * 1.5), hi * 1e4);
  return { min: lo / 10, max };
}

const SUPERSCRIPT: Record<string, string> = {
  "-": "⁻",
  "0": "⁰",
  "1": "¹",
  "2": "²",
  "3": "³",
  "4": "⁴",
  "5": "⁵",
  "6": "⁶",
  "7": "⁷",
  "8": "⁸",
  "9": "⁹",
};

/** Short tick label for a power of ten: 0.01 … 1000 in plain digits, otherwise 10 with a superscript power. */
export function tickLabel(v: number): string {
  const k = Math.round(Math.log10(v));
  if (k >= -2 && k <= 3) return v.toLocaleString("en-US", { maximumFractionDigits: 2 });
  return `10${[...String(k)].map((c) => SUPERSCRIPT[c] ?? c).join("")}`;
}
