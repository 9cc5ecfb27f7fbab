/**
 * Suggesting a Pasquill stability class from the surface wind and the sky.
 *
 * Table: Pasquill (1961), *Meteorological Magazine* 90, as tabulated in Boubel, Fox,
 * Turner & Stern (1994), *Fundamentals of Air Pollution*, 3rd ed., Table 19-3, p. 302.
 * Calm nights (Pasquill leaves them blank) are filled E (cloudy) / F (clear) after NOAA's
 * READY stability page. Split classes (A–B, B–C, C–D) resolve to the MORE STABLE letter,
 * the conservative choice for the reach of near-ground releases (model.md).
 *
 * Pure: the instant and the place are passed in.
 */

import { ScenarioError } from "./errors.ts";
import { isNightByClock, solarElevationDeg } from "./solar.ts";
import type { Sky, StabilityClass, Terrain, Warning } from "./types.ts";

/** Sky as the table knows it: `Sky` without "sun" (which is resolved to one of these). */
export type TableSky = Exclude<Sky, "sun">;

/** Insolation (incoming solar radiation) class by day. */
export type Insolation = "strong" | "moderate" | "slight";

/**
 * Insolation class from the sun's elevation (degrees): above 60° strong, 35°–60°
 * moderate, below 35° slight (15°–35° slight, and below 15° treated as slight).
 * Edges: exactly 60° is moderate, exactly 35° is moderate.
 * Source: insolation by solar altitude after Turner (1964), as in US EPA-454/R-99-005,
 * Table 6-5 (model.md; from memory).
 *
 * @param elevDeg solar elevation, degrees
 * @returns the insolation class
 * @throws RangeError when the elevation is not a finite number
 */
export function insolationFromElevation(elevDeg: number): Insolation {
  if (!Number.isFinite(elevDeg)) {
    throw new RangeError(`solar elevation: must be a finite number of degrees (got ${elevDeg})`);
  }
  if (elevDeg > 60) return "strong";
  if (elevDeg >= 35) return "moderate";
  return "slight";
}

/** One row of the table: [strong, moderate, slight, night-cloudy, night-clear]; "AB" = A–B. */
type Row = readonly [string, string, string, string, string];

/**
 * Pasquill (1961), Boubel et al. (1994) Table 19-3, p. 302; calm-night cells (u < 2)
 * E / F after NOAA READY. Columns: strong sun, moderate, slight, night thin overcast or
 * ≥ 4/8 low cloud, night ≤ 3/8 cloud.
 */
const TABLE: readonly Row[] = [
  ["A", "AB", "B", "E", "F"], // u < 2
  ["AB", "B", "C", "E", "F"], // 2 ≤ u < 3
  ["B", "BC", "C", "D", "E"], // 3 ≤ u < 5
  ["C", "CD", "D", "D", "D"], // 5 ≤ u ≤ 6
  ["C", "D", "D", "D", "D"], // u > 6
];

const COLUMN: Record<Exclude<TableSky, "overcast">, number> = {
  "strong-sun": 0,
  "moderate-sun": 1,
  "slight-sun": 2,
  "night-cloudy": 3,
  "night-clear": 4,
};

/**
 * Wind-speed bin of the table. Edges (m/s): u < 2; 2 ≤ u < 3; 3 ≤ u < 5; 5 ≤ u ≤ 6;
 * u > 6. So exactly 2, 3 and 5 fall in the higher bin, exactly 6 in the 5–6 bin
 * (the table's "> 6" row starts above 6).
 */
function windRow(u: number): number {
  if (u < 2) return 0;
  if (u < 3) return 1;
  if (u < 5) return 2;
  if (u <= 6) return 3;
  return 4;
}

/** The skies the table knows, in its column order (overcast: both day and night). */
export const TABLE_SKIES: readonly TableSky[] = [
  "strong-sun",
  "moderate-sun",
  "slight-sun",
  "overcast",
  "night-cloudy",
  "night-clear",
];

/**
 * The Pasquill class for a 10 m wind speed and a sky, exactly per model.md's table.
 *
 * - Heavy overcast ("overcast") is D, day or night.
 * - A split cell (A–B, B–C, C–D) resolves to the more stable (later) letter; `split`
 *   then holds the cell as printed, e.g. "A–B" (en dash), else null.
 * - Calm nights (u < 2 m/s, night sky) are E (cloudy) / F (clear) after NOAA READY,
 *   with `calmNight` true (Pasquill leaves these cells blank).
 *
 * @param wind10 wind speed at 10 m, m/s (≥ 0)
 * @param sky the sky, "sun" already resolved to a strength or a night
 * @throws RangeError when the wind is negative or not finite, or the sky is unknown
 */
export function pasquillClass(
  wind10: number,
  sky: TableSky,
): { stability: StabilityClass; split: string | null; calmNight: boolean } {
  if (!Number.isFinite(wind10) || wind10 < 0) {
    throw new RangeError(`wind speed at 10 m: must be a finite number ≥ 0 m/s (got ${wind10})`);
  }
  if (!TABLE_SKIES.includes(sky)) {
    throw new RangeError(`sky: must be one of ${TABLE_SKIES.join(", ")} (got ${String(sky)})`);
  }
  if (sky === "overcast") return { stability: "D", split: null, calmNight: false };
  const row = windRow(wind10);
  const cell = (TABLE[row] as Row)[COLUMN[sky]] as string;
  const calmNight = row === 0 && (sky === "night-cloudy" || sky === "night-clear");
  if (cell.length === 2) {
    return {
      stability: cell[1] as StabilityClass,
      split: `${cell[0]}–${cell[1]}`,
      calmNight,
    };
  }
  return { stability: cell as StabilityClass, split: null, calmNight };
}

/**
 * Neutral (class D) power-law exponents used to bring a measured wind to 10 m for the
 * table (Irwin 1979, as in EPA-454/R-99-005 §6.2.5; model.md): open 0.15, urban 0.25.
 */
const NEUTRAL_EXPONENT: Record<Terrain, number> = { open: 0.15, urban: 0.25 };

/**
 * The measured wind brought to 10 m for the table: u₁₀ = u · (10 / z)^p with the
 * neutral (class D) exponent p of the terrain (open 0.15, urban 0.25). The class is not
 * yet known, so the neutral exponent is the only choice that does not presuppose it.
 * Applied both up (z < 10) and down (z > 10); unchanged at z = 10.
 *
 * @param windSpeed measured wind, m/s
 * @param windHeight height of the measurement, m (> 0)
 * @param terrain open country or urban
 * @returns wind at 10 m, m/s
 */
export function windAt10m(windSpeed: number, windHeight: number, terrain: Terrain): number {
  if (windHeight === 10) return windSpeed;
  return windSpeed * (10 / windHeight) ** NEUTRAL_EXPONENT[terrain];
}

const SKY_WORDS: Record<TableSky, string> = {
  "strong-sun": "strong sun",
  "moderate-sun": "moderate sun",
  "slight-sun": "slight sun",
  overcast: "heavy overcast",
  "night-cloudy": "a cloudy night",
  "night-clear": "a clear night",
};

const SKIES: readonly Sky[] = [...TABLE_SKIES, "sun"];

function fmt(x: number, digits: number): string {
  const s = x.toFixed(digits);
  return s === `-${(0).toFixed(digits)}` ? (0).toFixed(digits) : s;
}

/**
 * Suggest a Pasquill stability class from the wind and the sky (model.md, "Stability
 * class").
 *
 * - The table needs the 10 m wind: a wind measured at another height is brought to 10 m
 *   with the neutral power law ({@link windAt10m}).
 * - Sky "sun" needs `timeMs`, `lat` and `lon`: the sun's elevation gives the strength
 *   ({@link insolationFromElevation}); at night by the clock ({@link isNightByClock})
 *   the sky is taken as a clear night and a "night-by-clock" warning is added.
 * - Warnings: "split-class" when the table gives two letters, "stable-low-wind" on a
 *   calm night (E/F filled after NOAA READY).
 *
 * @param args.windSpeed measured wind speed, m/s (≥ 0)
 * @param args.windHeight height of the wind measurement, m (> 0)
 * @param args.terrain open country or urban
 * @param args.sky the sky the user sees, or "sun" to derive its strength
 * @param args.timeMs instant, ms since 1970-01-01T00:00Z (needed for sky "sun")
 * @param args.lat latitude, degrees north (needed for sky "sun")
 * @param args.lon longitude, degrees east (needed for sky "sun")
 * @returns the class, one plain sentence saying why, and warnings
 * @throws ScenarioError naming the scenario field, the value and what is allowed
 * @example suggestStability({ windSpeed: 2.5, windHeight: 10, terrain: "open",
 *   sky: "strong-sun", timeMs: null, lat: null, lon: null }).stability // "B"
 */
export function suggestStability(args: {
  windSpeed: number;
  windHeight: number;
  terrain: Terrain;
  sky: Sky;
  timeMs: number | null;
  lat: number | null;
  lon: number | null;
}): { stability: StabilityClass; reason: string; warnings: Warning[] } {
  const { windSpeed, windHeight, terrain, sky, timeMs, lat, lon } = args;
  const problems: { field: string; value: unknown; message: string }[] = [];
  if (!Number.isFinite(windSpeed) || windSpeed < 0) {
    problems.push({
      field: "weather.wind_speed_m_s",
      value: windSpeed,
      message: "must be a number ≥ 0 m/s",
    });
  }
  if (!Number.isFinite(windHeight) || windHeight <= 0) {
    problems.push({
      field: "weather.wind_height_m",
      value: windHeight,
      message: "must be a number > 0 m",
    });
  }
  if (terrain !== "open" && terrain !== "urban") {
    problems.push({
      field: "weather.terrain",
      value: terrain,
      message: 'must be "open" or "urban"',
    });
  }
  if (!SKIES.includes(sky)) {
    problems.push({
      field: "weather.sky",
      value: sky,
      message: `must be one of ${SKIES.map((s) => `"${s}"`).join(", ")} when stability is "auto"`,
    });
  }
  if (sky === "sun") {
    if (timeMs === null || !Number.isFinite(timeMs)) {
      problems.push({
        field: "weather.time",
        value: timeMs,
        message: 'is needed (ISO 8601) with sky "sun" to find the sun\'s elevation',
      });
    }
    if (lat === null || !Number.isFinite(lat) || lat < -90 || lat > 90) {
      problems.push({
        field: "source.lat",
        value: lat,
        message: 'is needed with sky "sun": a latitude between -90 and 90 degrees',
      });
    }
    if (lon === null || !Number.isFinite(lon) || lon < -180 || lon > 180) {
      problems.push({
        field: "source.lon",
        value: lon,
        message: 'is needed with sky "sun": a longitude between -180 and 180 degrees',
      });
    }
  }
  if (problems.length > 0) throw new ScenarioError(problems);

  const warnings: Warning[] = [];
  const u10 = windAt10m(windSpeed, windHeight, terrain);
  let tableSky: TableSky;
  let skyWords: string;
  if (sky === "sun") {
    const t = timeMs as number;
    const la = lat as number;
    const lo = lon as number;
    const elev = solarElevationDeg(t, la, lo);
    if (isNightByClock(t, la, lo)) {
      tableSky = "night-clear";
      const where = elev >= 0 ? `${fmt(elev, 0)}° up` : `${fmt(-elev, 0)}° below the horizon`;
      skyWords = `a clear night (night by the clock: sun ${where})`;
      warnings.push({
        code: "night-by-clock",
        message:
          `Sky was given as sun, but at this time and place it counts as night (from one hour before ` +
          `sunset to one hour after sunrise; sun ${where}). Using a clear night.`,
      });
    } else {
      const strength = insolationFromElevation(elev);
      tableSky = `${strength}-sun`;
      skyWords = `${strength} sun (sun ${fmt(elev, 0)}° up)`;
    }
  } else {
    tableSky = sky;
    skyWords = SKY_WORDS[sky];
  }

  const cell = pasquillClass(u10, tableSky);
  const windWords =
    windHeight === 10
      ? `${fmt(u10, 1)} m/s wind`
      : `${fmt(u10, 1)} m/s wind at 10 m (${fmt(windSpeed, 1)} m/s measured at ${fmt(windHeight, 1)} m)`;
  const result = cell.split ? `${cell.split}, using ${cell.stability}` : cell.stability;
  const reason = `Suggested from ${windWords} and ${skyWords}: ${result}`;

  if (cell.split) {
    warnings.push({
      code: "split-class",
      message:
        `Table gives ${cell.split}; using the more stable ${cell.stability}, ` +
        `conservative for reach.`,
    });
  }
  if (cell.calmNight) {
    warnings.push({
      code: "stable-low-wind",
      message:
        `Calm night (wind under 2 m/s at 10 m): Pasquill's table leaves this blank; ` +
        `${cell.stability} is filled in after NOAA READY. Bands are long and narrow and may ` +
        `meander with the wind.`,
    });
  }
  return { stability: cell.stability, reason, warnings };
}
