/**
 * Text of the figures shown for each band, and which warnings go where.
 * Rounding is chosen so a shown figure never makes the hazard look smaller:
 * reach, width and area round up; start and arrival round down; clearing rounds up.
 */
import type { BandOutput, ScenarioLimit, Warning } from "../core/types.ts";
import {
  formatArea,
  formatConcentration,
  formatDistance,
  formatDuration,
  formatReach,
  type UnitSystem,
} from "./units.ts";

/**
 * A start nearer the source than this (m) is not shown: the band in effect
 * begins at the source, well inside the near zone.
 */
export const START_SHOWN_FROM_M = 10;

export interface Figure {
  key: "reach" | "width" | "start" | "area" | "arrives" | "clears" | "limit";
  label: string;
  value: string;
}

/**
 * The figures of one band. `limit` is the limit as entered (to show a ppm value
 * beside its mg/m³ equivalent); without it only mg/m³ is shown.
 */
export function bandFigures(
  b: BandOutput,
  system: UnitSystem,
  ongoing: boolean,
  limit?: ScenarioLimit,
): Figure[] {
  const rows: Figure[] = [{ key: "reach", label: "Reach", value: formatReach(b.reach_m, system) }];
  if (b.reach_m !== null) {
    if (b.max_width_m !== null) {
      rows.push({
        key: "width",
        label: "Width",
        value: formatDistance(b.max_width_m, system, "up"),
      });
    }
    if (b.start_m !== null && b.start_m >= START_SHOWN_FROM_M) {
      rows.push({
        key: "start",
        label: "Starts at",
        value: formatDistance(b.start_m, system, "down"),
      });
    }
    if (b.area_m2 !== null) {
      rows.push({ key: "area", label: "Area", value: formatArea(b.area_m2, system, "up") });
    }
    if (b.arrives_s !== null) {
      rows.push({
        key: "arrives",
        label: "Arrives at far end",
        value: `${formatDuration(b.arrives_s, "down")} after release start (cloud front)`,
      });
      rows.push({
        key: "clears",
        label: "Clears far end",
        value:
          b.clears_s !== null
            ? `${formatDuration(b.clears_s, "up")} after release start (cloud back)`
            : ongoing
              ? "Not while the release goes on"
              : "Not computed",
      });
    }
  }
  rows.push({
    key: "limit",
    label: "Limit",
    value: `${
      limit?.unit === "ppm"
        ? `${limit.value} ppm (${formatConcentration(b.limit_mg_m3)})`
        : formatConcentration(b.limit_mg_m3)
    } averaged over ${formatDuration(b.averaging_s)}`,
  });
  return rows;
}

/** Warnings that name a band go with it; the rest apply to the whole estimate. */
export function splitWarnings(
  warnings: readonly Warning[],
  bandLabels: readonly string[],
): { general: Warning[]; byBand: Warning[][] } {
  const byBand = bandLabels.map(() => [] as Warning[]);
  const general: Warning[] = [];
  for (const w of warnings) {
    const i = w.limit === undefined ? -1 : bandLabels.indexOf(w.limit);
    if (i >= 0) byBand[i]?.push(w);
    else general.push(w);
  }
  return { general, byBand };
}

/** "Stability class D, as entered." or "Stability class D, suggested: <reason>". */
export function stabilityWords(cls: string, reason: string): string {
  if (/^given/i.test(reason)) return `Stability class ${cls}, as entered.`;
  return `Stability class ${cls}, suggested: ${reason}`;
}

/** The near-zone line shown with every result. */
export function nearZoneWords(radiusM: number, system: UnitSystem): string {
  return `Near zone: within ${formatDistance(radiusM, system, "up")} of the source the model does not hold and the hazard is highest. Treat it as dangerous whatever the bands show.`;
}
