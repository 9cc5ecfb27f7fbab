/**
 * The scenario's fields: allowed ranges, defaults, list sizes and the keys allowed in each
 * object. Adding a field: its range or choices here, its key in {@link KEYS}, its reading in
 * the section's file (release.ts, weather.ts, lists.ts, options.ts) and a row below.
 *
 * Allowed values (all SI; `(a, b]` = greater than a and at most b):
 *
 * | field | allowed | default (model.md) |
 * |---|---|---|
 * | release.kind | "continuous" \| "instantaneous" | "continuous" |
 * | release.rate_g_s (continuous) | (0, 1e10] g/s | required |
 * | release.duration_s (continuous) | (0, 3.2e7] s (1 s to over a year) | absent = ongoing |
 * | release.mass_g (instantaneous) | (0, 1e11] g | required |
 * | release.height_m | [0, 1000] m | 0 |
 * | release.heavy_or_cold | boolean | false |
 * | release.hot.exit_speed_m_s | (0, 300] m/s | whole `hot` absent = no plume rise |
 * | release.hot.diameter_m | (0, 50] m | |
 * | release.hot.gas_temperature_k | (0, 3000] K, and above the air temperature | |
 * | weather.wind_speed_m_s | [0, 75] m/s (below 1 m/s the model clamps calms) | required |
 * | weather.wind_height_m | (0, 500] m | 10 |
 * | weather.wind_from_deg | [0, 360] degrees true | required |
 * | weather.stability | "A"…"F" \| "auto" | required |
 * | weather.sky | one of {@link SKY_VALUES}; required when stability is "auto" | none |
 * | weather.time | ISO 8601 date-time with a zone (Z or ±hh:mm); required with sky "sun" | none |
 * | weather.terrain | "open" \| "urban" | "open" |
 * | weather.mixing_height_m | [10, 10000] m | absent = no lid |
 * | weather.air_temperature_k | [200, 350] K | 298.15 |
 * | sigma_scheme | "briggs" \| "pasquill-gifford" | "briggs" |
 * | receptor_height_m | [0, 100] m | 1.5 |
 * | molecular_weight_g_mol | (0, 1000] g/mol; required when any limit is in ppm | none |
 * | limits | array of 0–100 limits | required |
 * | limits[i].label | non-empty text, at most 80 characters | required |
 * | limits[i].value | (0, 1e9] in its unit | required |
 * | limits[i].unit | "ppm" \| "mg/m3" | required |
 * | limits[i].averaging_s | [1, 86400] s | required |
 * | wind_swing_deg | [0, 90] degrees | 0 |
 * | near_zone_m | [0, 10000] m | 100 |
 * | source.lat / source.lon | [-90, 90] / [-180, 180] degrees; required with sky "sun" | none |
 * | points | array of 0–1000 points | none |
 * | points[i].x_m, points[i].y_m | [-1e6, 1e6] m | required |
 * | points[i].z_m | [0, 1000] m | receptor height |
 * | points[i].averaging_s | [1, 86400] s | 600 |
 * | limit_set.name | text of 1 to 120 characters (not blank) | whole `limit_set` absent = none |
 * | limit_set.source_note | text of 0 to 1000 characters | required with `limit_set` |
 * | spread.classes | 0 or 1 (classes stepped each way) | 1 |
 * | spread.wind_factor | [1, 3] (wind ÷ and × it; 1 = off) | 1.3 |
 */

import { TABLE_SKIES } from "../stability.ts";
import type { LimitUnit, SigmaScheme, Sky, Terrain } from "../types.ts";
import type { NumberRange } from "./read.ts";

const r = (min: number, max: number, unit: string, minOpen = false): NumberRange => ({
  min,
  max,
  minOpen,
  unit,
});

/** Allowed numeric ranges, keyed by the scenario field name (see the table above). */
export const RANGES = {
  rate_g_s: r(0, 1e10, "g/s", true),
  duration_s: r(0, 3.2e7, "s", true),
  mass_g: r(0, 1e11, "g", true),
  height_m: r(0, 1000, "m"),
  exit_speed_m_s: r(0, 300, "m/s", true),
  diameter_m: r(0, 50, "m", true),
  gas_temperature_k: r(0, 3000, "K", true),
  wind_speed_m_s: r(0, 75, "m/s"),
  wind_height_m: r(0, 500, "m", true),
  wind_from_deg: r(0, 360, "degrees"),
  mixing_height_m: r(10, 10000, "m"),
  air_temperature_k: r(200, 350, "K"),
  receptor_height_m: r(0, 100, "m"),
  molecular_weight_g_mol: r(0, 1000, "g/mol", true),
  limit_value: r(0, 1e9, "(in the limit's unit)", true),
  averaging_s: r(1, 86400, "s"),
  wind_swing_deg: r(0, 90, "degrees"),
  near_zone_m: r(0, 10000, "m"),
  lat: r(-90, 90, "degrees"),
  lon: r(-180, 180, "degrees"),
  x_m: r(-1e6, 1e6, "m"),
  y_m: r(-1e6, 1e6, "m"),
  z_m: r(0, 1000, "m"),
  spread_wind_factor: r(1, 3, ""),
} as const satisfies Record<string, NumberRange>;

/** Defaults from model.md ("Inputs") and issue 2. */
export const DEFAULTS = {
  height_m: 0,
  wind_height_m: 10,
  terrain: "open" as Terrain,
  air_temperature_k: 298.15,
  sigma_scheme: "briggs" as SigmaScheme,
  receptor_height_m: 1.5,
  wind_swing_deg: 0,
  near_zone_m: 100,
  point_averaging_s: 600,
  spread_classes: 1,
  spread_wind_factor: 1.3,
} as const;

export const MAX_LIMITS = 100;
export const MAX_POINTS = 1000;
export const MAX_LABEL_LENGTH = 80;
/** Longest limit set name and source note (limit_set). */
export const MAX_SET_NAME_LENGTH = 120;
export const MAX_SOURCE_NOTE_LENGTH = 1000;

/** The skies a scenario may give: the table's, or "sun" (strength from the sun's elevation). */
export const SKY_VALUES: readonly Sky[] = [...TABLE_SKIES, "sun"];
export const TERRAINS: readonly Terrain[] = ["open", "urban"];
export const SCHEMES: readonly SigmaScheme[] = ["briggs", "pasquill-gifford"];
export const UNITS: readonly LimitUnit[] = ["ppm", "mg/m3"];
export const KINDS = ["continuous", "instantaneous"] as const;

export const KEYS = {
  top: [
    "release",
    "weather",
    "sigma_scheme",
    "receptor_height_m",
    "molecular_weight_g_mol",
    "limits",
    "wind_swing_deg",
    "near_zone_m",
    "source",
    "points",
    "limit_set",
    "spread",
  ],
  continuous: ["kind", "rate_g_s", "duration_s", "height_m", "heavy_or_cold", "hot"],
  instantaneous: ["kind", "mass_g", "height_m", "heavy_or_cold", "hot"],
  hot: ["exit_speed_m_s", "diameter_m", "gas_temperature_k"],
  weather: [
    "wind_speed_m_s",
    "wind_height_m",
    "wind_from_deg",
    "stability",
    "sky",
    "time",
    "terrain",
    "mixing_height_m",
    "air_temperature_k",
  ],
  limit: ["label", "value", "unit", "averaging_s"],
  point: ["x_m", "y_m", "z_m", "averaging_s"],
  source: ["lat", "lon"],
  limitSet: ["name", "source_note"],
  spread: ["classes", "wind_factor"],
} as const;
