/**
 * Bad-scenario cases shared by tests/core/scenario.test.ts (every case, through parseScenario)
 * and tests/cli/estimate.test.ts (the cases marked `cli`, through the command).
 *
 * Source of every rule: issue 2 ("The command-line estimator": fields, units, what is
 * optional) and model.md ("Inputs": defaults), with the ranges written in the JSDoc table of
 * src/core/scenario/fields.ts. Each case breaks exactly one rule of an otherwise valid scenario, so it
 * must produce exactly one problem: its field, the value found, and a message saying what is
 * allowed.
 */

// biome-ignore lint/suspicious/noExplicitAny: a draft is free-form JSON that each case breaks on purpose
export type Draft = any;

/** A valid, invented scenario (not a real incident or chemical). */
export function baseScenario(): Draft {
  return {
    release: { kind: "continuous", rate_g_s: 500, duration_s: 900, height_m: 2 },
    weather: { wind_speed_m_s: 3, wind_height_m: 10, wind_from_deg: 250, stability: "D" },
    molecular_weight_g_mol: 34.1,
    limits: [
      { label: "Limit A (invented)", value: 3, unit: "ppm", averaging_s: 3600 },
      { label: "Limit B (invented)", value: 40, unit: "mg/m3", averaging_s: 600 },
    ],
    source: { lat: 47.0, lon: 8.0 },
    points: [{ x_m: 1000, y_m: 0 }],
  };
}

export interface BadCase {
  /** The rule, as a sentence fragment. */
  rule: string;
  /** Breaks the draft in place, or returns a replacement for the whole scenario. */
  edit: (s: Draft) => unknown;
  /** Dotted path the problem must name. */
  field: string;
  /** The value the problem must report (undefined = missing). */
  value: unknown;
  /** Text the message must contain (what is allowed). */
  allowed: string;
  /** Also run through the command-line estimator. */
  cli?: boolean;
  /** Replaces the value in JSON (for values JSON cannot hold literally, e.g. 1e999). */
  json?: string;
}

const ISO = "ISO 8601 date-time with a zone";

// biome-ignore format: one case per line reads as a table
export const BAD_CASES: BadCase[] = [
  // --- the top level ---------------------------------------------------------
  { rule: "top level is an array", edit: () => [1, 2], field: "(scenario)", value: [1, 2], allowed: "JSON object", cli: true },
  { rule: "top level is null", edit: () => null, field: "(scenario)", value: null, allowed: "JSON object" },
  { rule: "top level is a string", edit: () => "release", field: "(scenario)", value: "release", allowed: "JSON object" },
  { rule: "unknown top-level field (misspelt)", edit: (s) => { s.limit = []; }, field: "limit", value: [], allowed: "not a known field", cli: true },
  { rule: "unknown nested field", edit: (s) => { s.weather.wind_dir = 250; }, field: "weather.wind_dir", value: 250, allowed: "allowed: wind_speed_m_s" },

  // --- checks across fields -----------------------------------------------------
  { rule: "two limits with the same label", edit: (s) => { s.limits[1].label = s.limits[0].label; }, field: "limits[1].label", value: "Limit A (invented)", allowed: "must differ from every other limit's label", cli: true },
  { rule: "receptor at or above the mixing height", edit: (s) => { s.weather.mixing_height_m = 40; s.receptor_height_m = 50; }, field: "receptor_height_m", value: 50, allowed: "below the mixing height (40 m)", cli: true },
  { rule: "point at or above the mixing height", edit: (s) => { s.weather.mixing_height_m = 40; s.points[0].z_m = 40; }, field: "points[0].z_m", value: 40, allowed: "below the mixing height (40 m)" },

  // --- release -----------------------------------------------------------------
  { rule: "release missing", edit: (s) => { delete s.release; }, field: "release", value: undefined, allowed: "is required", cli: true },
  { rule: "release not an object", edit: (s) => { s.release = 500; }, field: "release", value: 500, allowed: "must be an object" },
  { rule: "unknown release kind", edit: (s) => { s.release.kind = "leak"; }, field: "release.kind", value: "leak", allowed: '"continuous", "instantaneous"', cli: true },
  { rule: "release kind of the wrong type", edit: (s) => { s.release.kind = 1; }, field: "release.kind", value: 1, allowed: '"continuous", "instantaneous"' },
  { rule: "rate missing", edit: (s) => { delete s.release.rate_g_s; }, field: "release.rate_g_s", value: undefined, allowed: "is required; must be a number greater than 0 and at most 1e10 g/s", cli: true },
  { rule: "rate zero", edit: (s) => { s.release.rate_g_s = 0; }, field: "release.rate_g_s", value: 0, allowed: "greater than 0 and at most 1e10 g/s" },
  { rule: "negative rate", edit: (s) => { s.release.rate_g_s = -5; }, field: "release.rate_g_s", value: -5, allowed: "greater than 0 and at most 1e10 g/s", cli: true },
  { rule: "rate above 1e10 g/s", edit: (s) => { s.release.rate_g_s = 2e10; }, field: "release.rate_g_s", value: 2e10, allowed: "at most 1e10 g/s", cli: true },
  { rule: "rate as a string (no coercion)", edit: (s) => { s.release.rate_g_s = "500"; }, field: "release.rate_g_s", value: "500", allowed: "without quotes", cli: true },
  { rule: "rate NaN (a JavaScript caller)", edit: (s) => { s.release.rate_g_s = Number.NaN; }, field: "release.rate_g_s", value: "NaN", allowed: "finite" },
  { rule: "rate infinite (1e999 in JSON)", edit: (s) => { s.release.rate_g_s = Number.POSITIVE_INFINITY; }, json: '"rate_g_s": 1e999', field: "release.rate_g_s", value: "Infinity", allowed: "finite", cli: true },
  { rule: "rate a boolean", edit: (s) => { s.release.rate_g_s = true; }, field: "release.rate_g_s", value: true, allowed: "must be a number" },
  { rule: "duration zero", edit: (s) => { s.release.duration_s = 0; }, field: "release.duration_s", value: 0, allowed: "greater than 0 and at most 3.2e7 s", cli: true },
  { rule: "duration above 3.2e7 s", edit: (s) => { s.release.duration_s = 3.3e7; }, field: "release.duration_s", value: 3.3e7, allowed: "at most 3.2e7 s" },
  { rule: "duration null", edit: (s) => { s.release.duration_s = null; }, field: "release.duration_s", value: null, allowed: "leave the field out" },
  { rule: "mass missing (all at once)", edit: (s) => { s.release = { kind: "instantaneous" }; }, field: "release.mass_g", value: undefined, allowed: "greater than 0 and at most 1e11 g", cli: true },
  { rule: "mass above 1e11 g", edit: (s) => { s.release = { kind: "instantaneous", mass_g: 2e11 }; }, field: "release.mass_g", value: 2e11, allowed: "at most 1e11 g" },
  { rule: "duration given for an all-at-once release", edit: (s) => { s.release = { kind: "instantaneous", mass_g: 5e4, duration_s: 10 }; }, field: "release.duration_s", value: 10, allowed: "allowed: kind, mass_g" },
  { rule: "negative height", edit: (s) => { s.release.height_m = -1; }, field: "release.height_m", value: -1, allowed: "from 0 to 1000 m", cli: true },
  { rule: "height above 1000 m", edit: (s) => { s.release.height_m = 1001; }, field: "release.height_m", value: 1001, allowed: "from 0 to 1000 m" },
  { rule: "heavy_or_cold not a boolean", edit: (s) => { s.release.heavy_or_cold = "yes"; }, field: "release.heavy_or_cold", value: "yes", allowed: "true or false", cli: true },
  { rule: "hot not an object", edit: (s) => { s.release.hot = true; }, field: "release.hot", value: true, allowed: "must be an object" },
  { rule: "hot without a diameter", edit: (s) => { s.release.hot = { exit_speed_m_s: 10, gas_temperature_k: 500 }; }, field: "release.hot.diameter_m", value: undefined, allowed: "greater than 0 and at most 50 m", cli: true },
  { rule: "hot exit speed zero", edit: (s) => { s.release.hot = { exit_speed_m_s: 0, diameter_m: 1, gas_temperature_k: 500 }; }, field: "release.hot.exit_speed_m_s", value: 0, allowed: "greater than 0 and at most 300 m/s" },
  { rule: "hot exit speed above 300 m/s", edit: (s) => { s.release.hot = { exit_speed_m_s: 301, diameter_m: 1, gas_temperature_k: 500 }; }, field: "release.hot.exit_speed_m_s", value: 301, allowed: "at most 300 m/s" },
  { rule: "hot diameter above 50 m", edit: (s) => { s.release.hot = { exit_speed_m_s: 10, diameter_m: 51, gas_temperature_k: 500 }; }, field: "release.hot.diameter_m", value: 51, allowed: "at most 50 m" },
  { rule: "hot gas temperature above 3000 K", edit: (s) => { s.release.hot = { exit_speed_m_s: 10, diameter_m: 1, gas_temperature_k: 3001 }; }, field: "release.hot.gas_temperature_k", value: 3001, allowed: "at most 3000 K" },
  { rule: "hot gas not warmer than the air", edit: (s) => { s.release.hot = { exit_speed_m_s: 10, diameter_m: 1, gas_temperature_k: 290 }; }, field: "release.hot.gas_temperature_k", value: 290, allowed: "above the air temperature (298.15 K)" },

  // --- weather -----------------------------------------------------------------
  { rule: "weather missing", edit: (s) => { delete s.weather; }, field: "weather", value: undefined, allowed: "is required", cli: true },
  { rule: "weather not an object", edit: (s) => { s.weather = "windy"; }, field: "weather", value: "windy", allowed: "must be an object" },
  { rule: "wind speed missing", edit: (s) => { delete s.weather.wind_speed_m_s; }, field: "weather.wind_speed_m_s", value: undefined, allowed: "is required; must be a number from 0 to 75 m/s" },
  { rule: "negative wind speed", edit: (s) => { s.weather.wind_speed_m_s = -0.1; }, field: "weather.wind_speed_m_s", value: -0.1, allowed: "from 0 to 75 m/s", cli: true },
  { rule: "wind speed above 75 m/s", edit: (s) => { s.weather.wind_speed_m_s = 76; }, field: "weather.wind_speed_m_s", value: 76, allowed: "from 0 to 75 m/s" },
  { rule: "wind speed as a string", edit: (s) => { s.weather.wind_speed_m_s = "3"; }, field: "weather.wind_speed_m_s", value: "3", allowed: "without quotes" },
  { rule: "wind height zero", edit: (s) => { s.weather.wind_height_m = 0; }, field: "weather.wind_height_m", value: 0, allowed: "greater than 0 and at most 500 m", cli: true },
  { rule: "wind height above 500 m", edit: (s) => { s.weather.wind_height_m = 501; }, field: "weather.wind_height_m", value: 501, allowed: "at most 500 m" },
  { rule: "wind direction missing", edit: (s) => { delete s.weather.wind_from_deg; }, field: "weather.wind_from_deg", value: undefined, allowed: "is required; must be a number from 0 to 360 degrees" },
  { rule: "wind direction above 360", edit: (s) => { s.weather.wind_from_deg = 361; }, field: "weather.wind_from_deg", value: 361, allowed: "from 0 to 360 degrees", cli: true },
  { rule: "negative wind direction", edit: (s) => { s.weather.wind_from_deg = -10; }, field: "weather.wind_from_deg", value: -10, allowed: "from 0 to 360 degrees", cli: true },
  { rule: "stability missing", edit: (s) => { delete s.weather.stability; }, field: "weather.stability", value: undefined, allowed: '"A", "B", "C", "D", "E", "F", "auto"' },
  { rule: "unknown stability class", edit: (s) => { s.weather.stability = "G"; }, field: "weather.stability", value: "G", allowed: '"A", "B", "C", "D", "E", "F", "auto"', cli: true },
  { rule: "lower-case stability class (no coercion)", edit: (s) => { s.weather.stability = "d"; }, field: "weather.stability", value: "d", allowed: '"D"' },
  { rule: "split stability class", edit: (s) => { s.weather.stability = "A-B"; }, field: "weather.stability", value: "A-B", allowed: '"A", "B"' },
  { rule: "stability auto without a sky", edit: (s) => { s.weather.stability = "auto"; }, field: "weather.sky", value: undefined, allowed: 'required when weather.stability is "auto"', cli: true },
  { rule: "unknown sky", edit: (s) => { s.weather.stability = "auto"; s.weather.sky = "cloudy"; }, field: "weather.sky", value: "cloudy", allowed: '"strong-sun"', cli: true },
  { rule: "sky sun without a time", edit: (s) => { s.weather.stability = "auto"; s.weather.sky = "sun"; }, field: "weather.time", value: undefined, allowed: `required when weather.sky is "sun"; must be an ${ISO}`, cli: true },
  { rule: "sky sun without a source", edit: (s) => { s.weather.stability = "auto"; s.weather.sky = "sun"; s.weather.time = "2026-06-21T12:00:00Z"; delete s.source; }, field: "source", value: undefined, allowed: 'required when weather.sky is "sun"', cli: true },
  { rule: "time without a zone", edit: (s) => { s.weather.stability = "auto"; s.weather.sky = "sun"; s.weather.time = "2026-06-21T12:00:00"; }, field: "weather.time", value: "2026-06-21T12:00:00", allowed: ISO, cli: true },
  { rule: "time not a date", edit: (s) => { s.weather.time = "yesterday noon"; }, field: "weather.time", value: "yesterday noon", allowed: ISO },
  { rule: "time an impossible date (30 February)", edit: (s) => { s.weather.time = "2026-02-30T12:00:00Z"; }, field: "weather.time", value: "2026-02-30T12:00:00Z", allowed: ISO },
  { rule: "time an impossible hour", edit: (s) => { s.weather.time = "2026-06-21T24:30:00+02:00"; }, field: "weather.time", value: "2026-06-21T24:30:00+02:00", allowed: ISO },
  { rule: "time a number", edit: (s) => { s.weather.time = 1782045000000; }, field: "weather.time", value: 1782045000000, allowed: ISO },
  { rule: "unknown terrain", edit: (s) => { s.weather.terrain = "rural"; }, field: "weather.terrain", value: "rural", allowed: '"open", "urban"', cli: true },
  { rule: "mixing height below 10 m", edit: (s) => { s.weather.mixing_height_m = 9; }, field: "weather.mixing_height_m", value: 9, allowed: "from 10 to 10000 m", cli: true },
  { rule: "mixing height above 10000 m", edit: (s) => { s.weather.mixing_height_m = 10001; }, field: "weather.mixing_height_m", value: 10001, allowed: "from 10 to 10000 m" },
  { rule: "air temperature below 200 K", edit: (s) => { s.weather.air_temperature_k = 199; }, field: "weather.air_temperature_k", value: 199, allowed: "from 200 to 350 K", cli: true },
  { rule: "air temperature above 350 K (°C given as K?)", edit: (s) => { s.weather.air_temperature_k = 351; }, field: "weather.air_temperature_k", value: 351, allowed: "from 200 to 350 K" },

  // --- options -----------------------------------------------------------------
  { rule: "unknown sigma scheme", edit: (s) => { s.sigma_scheme = "gaussian"; }, field: "sigma_scheme", value: "gaussian", allowed: '"briggs", "pasquill-gifford"', cli: true },
  { rule: "negative receptor height", edit: (s) => { s.receptor_height_m = -1; }, field: "receptor_height_m", value: -1, allowed: "from 0 to 100 m", cli: true },
  { rule: "receptor height above 100 m", edit: (s) => { s.receptor_height_m = 101; }, field: "receptor_height_m", value: 101, allowed: "from 0 to 100 m" },
  { rule: "molecular weight missing with a ppm limit", edit: (s) => { delete s.molecular_weight_g_mol; }, field: "molecular_weight_g_mol", value: undefined, allowed: "required when a limit is in ppm (limits[0] is)", cli: true },
  { rule: "molecular weight zero", edit: (s) => { s.molecular_weight_g_mol = 0; }, field: "molecular_weight_g_mol", value: 0, allowed: "greater than 0 and at most 1000 g/mol" },
  { rule: "molecular weight above 1000 g/mol", edit: (s) => { s.molecular_weight_g_mol = 1001; }, field: "molecular_weight_g_mol", value: 1001, allowed: "at most 1000 g/mol" },
  { rule: "negative wind swing", edit: (s) => { s.wind_swing_deg = -1; }, field: "wind_swing_deg", value: -1, allowed: "from 0 to 90 degrees" },
  { rule: "wind swing above 90 degrees", edit: (s) => { s.wind_swing_deg = 91; }, field: "wind_swing_deg", value: 91, allowed: "from 0 to 90 degrees", cli: true },
  { rule: "negative near zone", edit: (s) => { s.near_zone_m = -1; }, field: "near_zone_m", value: -1, allowed: "from 0 to 10000 m", cli: true },
  { rule: "near zone above 10000 m", edit: (s) => { s.near_zone_m = 10001; }, field: "near_zone_m", value: 10001, allowed: "from 0 to 10000 m" },

  // --- limits ------------------------------------------------------------------
  { rule: "limits missing", edit: (s) => { delete s.limits; delete s.molecular_weight_g_mol; }, field: "limits", value: undefined, allowed: "is required; must be a list of 0 to 100 limits", cli: true },
  { rule: "limits not a list", edit: (s) => { s.limits = { label: "A" }; }, field: "limits", value: { label: "A" }, allowed: "must be a list of 0 to 100 limits" },
  { rule: "more than 100 limits", edit: (s) => { s.limits = Array.from({ length: 101 }, (_, i) => ({ label: `L${i}`, value: 1, unit: "mg/m3", averaging_s: 600 })); }, field: "limits", value: "101 items", allowed: "0 to 100 limits", cli: true },
  { rule: "a limit not an object", edit: (s) => { s.limits[1] = 27; }, field: "limits[1]", value: 27, allowed: "must be an object" },
  { rule: "limit label missing", edit: (s) => { delete s.limits[1].label; }, field: "limits[1].label", value: undefined, allowed: "non-empty text of at most 80 characters" },
  { rule: "limit label empty", edit: (s) => { s.limits[1].label = ""; }, field: "limits[1].label", value: "", allowed: "non-empty text", cli: true },
  { rule: "limit label only spaces", edit: (s) => { s.limits[1].label = "   "; }, field: "limits[1].label", value: "   ", allowed: "non-empty text" },
  { rule: "limit label over 80 characters", edit: (s) => { s.limits[1].label = "x".repeat(81); }, field: "limits[1].label", value: "x".repeat(81), allowed: "at most 80 characters" },
  { rule: "limit label a number", edit: (s) => { s.limits[1].label = 2; }, field: "limits[1].label", value: 2, allowed: "non-empty text" },
  { rule: "limit value zero", edit: (s) => { s.limits[1].value = 0; }, field: "limits[1].value", value: 0, allowed: "greater than 0 and at most 1e9", cli: true },
  { rule: "limit value above 1e9", edit: (s) => { s.limits[1].value = 2e9; }, field: "limits[1].value", value: 2e9, allowed: "at most 1e9" },
  { rule: "limit value as a string", edit: (s) => { s.limits[1].value = "40"; }, field: "limits[1].value", value: "40", allowed: "without quotes" },
  { rule: "unknown limit unit", edit: (s) => { s.limits[1].unit = "ppb"; }, field: "limits[1].unit", value: "ppb", allowed: '"ppm", "mg/m3"', cli: true },
  { rule: "limit unit spelt mg/m³", edit: (s) => { s.limits[1].unit = "mg/m³"; }, field: "limits[1].unit", value: "mg/m³", allowed: '"mg/m3"' },
  { rule: "limit averaging missing", edit: (s) => { delete s.limits[1].averaging_s; }, field: "limits[1].averaging_s", value: undefined, allowed: "is required; must be a number from 1 to 86400 s" },
  { rule: "limit averaging below 1 s", edit: (s) => { s.limits[1].averaging_s = 0.5; }, field: "limits[1].averaging_s", value: 0.5, allowed: "from 1 to 86400 s", cli: true },
  { rule: "limit averaging above a day", edit: (s) => { s.limits[1].averaging_s = 86401; }, field: "limits[1].averaging_s", value: 86401, allowed: "from 1 to 86400 s" },

  // --- source ------------------------------------------------------------------
  { rule: "source not an object", edit: (s) => { s.source = [47, 8]; }, field: "source", value: [47, 8], allowed: "must be an object", cli: true },
  { rule: "latitude above 90", edit: (s) => { s.source.lat = 91; }, field: "source.lat", value: 91, allowed: "from -90 to 90 degrees", cli: true },
  { rule: "latitude below -90", edit: (s) => { s.source.lat = -91; }, field: "source.lat", value: -91, allowed: "from -90 to 90 degrees" },
  { rule: "longitude above 180", edit: (s) => { s.source.lon = 181; }, field: "source.lon", value: 181, allowed: "from -180 to 180 degrees", cli: true },
  { rule: "longitude missing", edit: (s) => { delete s.source.lon; }, field: "source.lon", value: undefined, allowed: "is required" },

  // --- points ------------------------------------------------------------------
  { rule: "points not a list", edit: (s) => { s.points = { x_m: 1 }; }, field: "points", value: { x_m: 1 }, allowed: "must be a list of 0 to 1000 points" },
  { rule: "more than 1000 points", edit: (s) => { s.points = Array.from({ length: 1001 }, (_, i) => ({ x_m: i + 1, y_m: 0 })); }, field: "points", value: "1001 items", allowed: "0 to 1000 points", cli: true },
  { rule: "a point not an object", edit: (s) => { s.points[0] = [1000, 0]; }, field: "points[0]", value: [1000, 0], allowed: "must be an object" },
  { rule: "point x missing", edit: (s) => { delete s.points[0].x_m; }, field: "points[0].x_m", value: undefined, allowed: "is required; must be a number from -1e6 to 1e6 m", cli: true },
  { rule: "point x beyond 1e6 m", edit: (s) => { s.points[0].x_m = 1e6 + 1; }, field: "points[0].x_m", value: 1e6 + 1, allowed: "from -1e6 to 1e6 m" },
  { rule: "point y beyond -1e6 m", edit: (s) => { s.points[0].y_m = -1e6 - 1; }, field: "points[0].y_m", value: -1e6 - 1, allowed: "from -1e6 to 1e6 m" },
  { rule: "negative point height", edit: (s) => { s.points[0].z_m = -1; }, field: "points[0].z_m", value: -1, allowed: "from 0 to 1000 m", cli: true },
  { rule: "point height above 1000 m", edit: (s) => { s.points[0].z_m = 1001; }, field: "points[0].z_m", value: 1001, allowed: "from 0 to 1000 m" },
  { rule: "point averaging below 1 s", edit: (s) => { s.points[0].averaging_s = 0; }, field: "points[0].averaging_s", value: 0, allowed: "from 1 to 86400 s" },
  { rule: "point averaging above a day", edit: (s) => { s.points[0].averaging_s = 86401; }, field: "points[0].averaging_s", value: 86401, allowed: "from 1 to 86400 s", cli: true },
  // --- the limit set used ----------------------------------------------------
  { rule: "limit set not an object", edit: (s) => { s.limit_set = "Gas (invented)"; }, field: "limit_set", value: "Gas (invented)", allowed: "must be an object (name and source_note)" },
  { rule: "limit set without a name", edit: (s) => { s.limit_set = { source_note: "" }; }, field: "limit_set.name", value: undefined, allowed: "is required; must be a text of 1 to 120 characters", cli: true },
  { rule: "limit set name blank", edit: (s) => { s.limit_set = { name: " ", source_note: "" }; }, field: "limit_set.name", value: " ", allowed: "must be a text of 1 to 120 characters" },
  { rule: "limit set source note not text", edit: (s) => { s.limit_set = { name: "G", source_note: 3 }; }, field: "limit_set.source_note", value: 3, allowed: "must be a text of 0 to 1000 characters" },
  { rule: "limit set with an unknown key", edit: (s) => { s.limit_set = { name: "G", source_note: "", mw: 3 }; }, field: "limit_set.mw", value: 3, allowed: "allowed: name, source_note" },
];

/** Applies a case to a fresh base scenario. */
export function breakScenario(c: BadCase): unknown {
  const s = baseScenario();
  const replaced = c.edit(s);
  return replaced === undefined ? s : replaced;
}

/** The scenario as JSON text (honouring `json` for values JSON cannot hold literally). */
export function badScenarioJson(c: BadCase): string {
  const text = JSON.stringify(breakScenario(c));
  if (c.json === undefined) return text;
  const key = c.json.slice(0, c.json.indexOf(":") + 1);
  return text.replace(new RegExp(`${escapeRegExp(key)}null`), c.json);
}

function escapeRegExp(s: string): string {
  return s.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");
}
