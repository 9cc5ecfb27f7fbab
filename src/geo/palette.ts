/**
 * The one colour ramp for bands: viridis (van der Walt & Smith, matplotlib, 2015), a perceptually
 * uniform sequential map that stays ordered for the common colour-vision deficiencies and in
 * greyscale (its lightness rises monotonically). Darkest = most severe. Never a traffic-light triad.
 *
 * Pure data and arithmetic: no DOM, usable from geo, export and ui alike.
 */

/** Viridis at t = 0, 0.1, …, 1 (dark purple → yellow). Hex values as published with matplotlib. */
export const VIRIDIS: readonly string[] = [
  "#440154",
  "#482475",
  "#414487",
  "#355f8d",
  "#2a788e",
  "#21918c",
  "#22a884",
  "#44bf70",
  "#7ad151",
  "#bddf26",
  "#fde725",
];

/** Neutral styling for the near zone (not part of the ramp: it is not a limit band). */
export const NEAR_ZONE_STYLE = {
  stroke: "#000000",
  "stroke-width": 3,
  fill: "#000000",
  "fill-opacity": 0.12,
} as const;

/** Styling of the source point and the centreline. */
export const SOURCE_COLOUR = "#000000";
export const CENTRELINE_STYLE = { stroke: "#000000", "stroke-width": 1.5 } as const;

/** Fill opacity of band polygons: low enough that overlapping bands stay readable. */
export const BAND_FILL_OPACITY = 0.35;
/** The spread's envelope: the band's colour, unfilled, thinner and dashed (simplestyle has no dash). */
export const SPREAD_STYLE = {
  "stroke-width": 1,
  "stroke-opacity": 0.6,
  "fill-opacity": 0,
} as const;
/** Dash pattern of the spread's envelope on screen (SVG stroke-dasharray, px). */
export const SPREAD_DASH = "2 4";

/** The ramp is used only up to this point so that the lightest band still shows on a pale map. */
const RAMP_END = 0.85;

function hexToRgb(hex: string): [number, number, number] {
  const n = Number.parseInt(hex.slice(1), 16);
  return [(n >> 16) & 255, (n >> 8) & 255, n & 255];
}

function rgbToHex(rgb: [number, number, number]): string {
  return `#${rgb.map((c) => Math.round(c).toString(16).padStart(2, "0")).join("")}`;
}

/**
 * Colour at position t of the ramp (0 = darkest, 1 = lightest), linear between the stops.
 * t outside [0, 1] is clamped; NaN is treated as 0 (darkest, the cautious choice).
 */
export function rampColour(t: number): string {
  const tt = Number.isNaN(t) ? 0 : Math.min(1, Math.max(0, t));
  const pos = tt * (VIRIDIS.length - 1);
  const i = Math.min(VIRIDIS.length - 2, Math.floor(pos));
  const f = pos - i;
  const a = hexToRgb(VIRIDIS[i] as string);
  const b = hexToRgb(VIRIDIS[i + 1] as string);
  return rgbToHex([a[0] + (b[0] - a[0]) * f, a[1] + (b[1] - a[1]) * f, a[2] + (b[2] - a[2]) * f]);
}

/**
 * One colour per band, in the order given. The band with the highest limit (mg/m³), the most
 * severe, gets the darkest colour; the lowest gets the lightest used. Equal limits share a colour.
 *
 * @param limitsMgM3 each band's limit in mg/m³
 * @returns hex colours, same length and order as the input
 * @example bandColours([1, 10, 100]) // → [light, middle, "#440154"]
 */
export function bandColours(limitsMgM3: readonly number[]): string[] {
  const distinct = [...new Set(limitsMgM3.filter((v) => Number.isFinite(v)))].sort((a, b) => b - a);
  const n = distinct.length;
  return limitsMgM3.map((v) => {
    const rank = distinct.indexOf(v);
    if (rank < 0 || n <= 1) return rampColour(0);
    return rampColour((rank / (n - 1)) * RAMP_END);
  });
}
