/**
 * Band styles on screen: colour from the project's one ramp (viridis, in
 * src/geo/palette.ts, so the screen and the shared GeoJSON agree), plus a dash
 * pattern and stroke width per severity rank so outlines stay distinguishable in
 * greyscale. Severity: the band of the highest limit in mg/m³ is the most severe
 * (it marks where concentrations are highest) and gets the darkest colour, the
 * solid and widest outline; lower limits reach further and get lighter colours.
 * Every band also carries a text label. No red/amber/green.
 */
import { bandColours } from "../geo/palette.ts";

export interface BandStyle {
  /** Severity rank: 0 = most severe (highest limit in mg/m³); ties keep input order. */
  rank: number;
  fill: string;
  /** SVG stroke-dasharray ("" = solid). */
  dash: string;
  strokeWidth: number;
}

export const DASHES = ["", "9 4", "3 3", "12 3 3 3", "6 6", "1 4"];

/** Style of each band, in the order given; `limitsMgM3[i]` is band i's limit. */
export function bandStyles(limitsMgM3: readonly number[]): BandStyle[] {
  const order = limitsMgM3
    .map((v, i) => ({ v, i }))
    .sort((a, b) => b.v - a.v || a.i - b.i)
    .map((o) => o.i);
  const colours = bandColours(limitsMgM3);
  return limitsMgM3.map((_, i) => {
    const rank = order.indexOf(i);
    return {
      rank,
      fill: colours[i] ?? "#440154",
      dash: DASHES[rank % DASHES.length] ?? "",
      strokeWidth: Math.max(1.5, 3.5 - 0.5 * rank),
    };
  });
}
