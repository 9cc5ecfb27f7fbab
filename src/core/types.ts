/**
 * Public data shapes of the estimating core.
 *
 * Two layers:
 * - `Scenario` / `EstimateOutput`: the JSON contract shared by the command-line
 *   estimator, the app and any other caller (snake_case, units in the names).
 * - `ModelInput` and friends: the validated, SI-only form the physics works on.
 *
 * All internal quantities are SI: g, s, m, m/s, g/m³, K.
 */

export type StabilityClass = "A" | "B" | "C" | "D" | "E" | "F";
export const STABILITY_CLASSES: readonly StabilityClass[] = ["A", "B", "C", "D", "E", "F"];

/** `open` country or `urban` (built-up): selects the dispersion curves and wind exponents. */
export type Terrain = "open" | "urban";

export type SigmaScheme = "briggs" | "pasquill-gifford";

/** What the user sees of the sky (glossary: Sky). `sun` = clear day sky, strength from solar elevation. */
export type Sky =
  | "strong-sun"
  | "moderate-sun"
  | "slight-sun"
  | "overcast"
  | "night-cloudy"
  | "night-clear"
  | "sun";

export type LimitUnit = "ppm" | "mg/m3";

// ---------------------------------------------------------------------------
// JSON contract (scenario file in, estimate object out)
// ---------------------------------------------------------------------------

export interface ScenarioContinuousRelease {
  kind: "continuous";
  rate_g_s: number;
  /** Absent = ongoing (steady plume). */
  duration_s?: number;
  height_m?: number;
  /** Marks a heavier-than-air, cold or pressurised release (raises the dense-gas caution). */
  heavy_or_cold?: boolean;
  /** Optional hot release: lifts the plume (Briggs final rise). */
  hot?: ScenarioHotRelease;
}

export interface ScenarioInstantaneousRelease {
  kind: "instantaneous";
  mass_g: number;
  height_m?: number;
  heavy_or_cold?: boolean;
  hot?: ScenarioHotRelease;
}

export interface ScenarioHotRelease {
  exit_speed_m_s: number;
  diameter_m: number;
  gas_temperature_k: number;
}

export interface ScenarioWeather {
  wind_speed_m_s: number;
  wind_height_m?: number;
  wind_from_deg: number;
  /** A class letter, or "auto" to suggest one from wind and `sky`. */
  stability: StabilityClass | "auto";
  sky?: Sky;
  /** ISO 8601; used with sky "sun" (and `source`) to get the sun's elevation. */
  time?: string;
  terrain?: Terrain;
  mixing_height_m?: number;
  air_temperature_k?: number;
}

export interface ScenarioLimit {
  label: string;
  value: number;
  unit: LimitUnit;
  averaging_s: number;
}

export interface ScenarioPoint {
  x_m: number;
  y_m: number;
  z_m?: number;
  averaging_s?: number;
}

/** How far the weather is varied for the spread (glossary: Spread). */
export interface ScenarioSpread {
  /** Stability classes stepped each way: 0 (this class only) or 1 (one less and one more stable). */
  classes?: number;
  /** The measured wind is divided and multiplied by this (1 = not varied). */
  wind_factor?: number;
}

export interface Scenario {
  release: ScenarioContinuousRelease | ScenarioInstantaneousRelease;
  weather: ScenarioWeather;
  sigma_scheme?: SigmaScheme;
  receptor_height_m?: number;
  molecular_weight_g_mol?: number;
  limits: ScenarioLimit[];
  wind_swing_deg?: number;
  near_zone_m?: number;
  source?: { lat: number; lon: number };
  points?: ScenarioPoint[];
  /** The limit set (glossary) the limits were filled from, recorded with the estimate. */
  limit_set?: ScenarioLimitSet;
  /** Default `{ classes: 1, wind_factor: 1.3 }`; `{ classes: 0, wind_factor: 1 }` turns it off. */
  spread?: ScenarioSpread;
}

/** Which limit set was used: its name and where its values come from (free text). */
export interface ScenarioLimitSet {
  name: string;
  source_note: string;
}

export interface Warning {
  /** Stable machine code, e.g. "calm-wind". */
  code: WarningCode;
  /** Plain-language message for a responder. */
  message: string;
  /** Label of the limit the warning is about, when it concerns one band only. */
  limit?: string;
  /** Index in the scenario's `points` of the point the warning is about, when it concerns one. */
  point?: number;
}

export type WarningCode =
  | "calm-wind"
  | "outside-curve-range"
  | "dense-gas"
  | "above-lid"
  | "receptor-above-lid"
  | "reach-over-100km"
  | "no-exceedance"
  | "averaging-clamped"
  | "stable-low-wind"
  | "split-class"
  | "night-by-clock"
  | "near-zone-only"
  | "upwind-point"
  | "spread-calm-wind";

export interface BandOutput {
  label: string;
  limit_mg_m3: number;
  averaging_s: number;
  /** Downwind reach (m); null when no ground point exceeds the limit; 100000 when over 100 km. */
  reach_m: number | null;
  start_m: number | null;
  /** Widest crosswind extent (m); of the swept band when a wind swing is given. */
  max_width_m: number | null;
  /** Downwind distance of the widest point (m); of the swept band when a wind swing is given. */
  max_width_at_m: number | null;
  /** Ground area (m²); of the swept band when a wind swing is given. */
  area_m2: number | null;
  /** When the hazard arrives at / clears the band's far end (reach, 0), s from release start. */
  arrives_s: number | null;
  clears_s: number | null;
  /** The same band under the weather's spread; absent only when the spread was not computed. */
  spread?: BandSpread;
}

/** One weather of the spread: a stability class and a measured wind speed. */
export interface SpreadVariant {
  stability: StabilityClass;
  /** Measured wind speed (m/s) at the scenario's wind height (before the calm clamp). */
  wind_speed_m_s: number;
}

/**
 * A band under the weather's spread: every variant (neighbouring classes × wind ÷ and × the
 * factor, the estimate itself included). Reaches are null where a variant gives no band.
 */
export interface BandSpread {
  /** Shortest reach of any variant (m); null when some variant gives no band at all. */
  reach_min_m: number | null;
  /** Longest reach of any variant (m); null when no variant gives a band. */
  reach_max_m: number | null;
  /** Widest crosswind extent of any variant (m), swing included; null when no band. */
  width_max_m: number | null;
  /** Largest ground area of any variant (m²), swing included; null when no band. */
  area_max_m2: number | null;
  /** The variants giving the shortest and the longest reach, and the widest band. */
  reach_min_variant: SpreadVariant;
  reach_max_variant: SpreadVariant;
  widest_variant: SpreadVariant;
}

/** Which weathers the spread took (output summary). */
export interface SpreadSummary {
  /** The classes crossed, least stable first. */
  classes: StabilityClass[];
  /** The measured wind speeds crossed (m/s), slowest first. */
  wind_speeds_m_s: number[];
  /** Number of distinct variants solved, the estimate itself included. */
  variants: number;
}

export interface PointLimitOutput {
  label: string;
  arrives_s: number | null;
  clears_s: number | null;
}

export interface PointOutput {
  x_m: number;
  y_m: number;
  z_m: number;
  averaging_s: number;
  concentration_mg_m3: number;
  concentration_ppm: number | null;
  limits: PointLimitOutput[];
}

export interface EstimateOutput {
  model_version: string;
  caution: string;
  wind_speed_used_m_s: number;
  release_height_used_m: number;
  /** Release height plus plume rise (m). */
  effective_height_m: number;
  stability_used: StabilityClass;
  /** Why this class: "given", or the suggestion's reason. */
  stability_reason: string;
  bands: BandOutput[];
  points: PointOutput[];
  warnings: Warning[];
  /** The scenario's `limit_set`, when given: which set the limits came from. */
  limit_set?: ScenarioLimitSet;
  /** Local footprint geometry (x downwind, y left, metres) for drawing without a place. */
  footprint: LocalFootprint;
  /** The weathers of the spread; absent only when the spread was not computed. */
  spread?: SpreadSummary;
  /** Present when `source` is given: RFC 7946 FeatureCollection. */
  geojson?: import("geojson").FeatureCollection;
}

// ---------------------------------------------------------------------------
// Local footprint geometry (metres, source at the origin, x downwind, y left)
// ---------------------------------------------------------------------------

/** A closed ring of [x, y] points in metres (first point not repeated). */
export type LocalRing = [number, number][];

export interface LocalBand {
  label: string;
  /** Band outline before the wind swing (counter-clockwise). Empty when no exceedance. */
  outline: LocalRing;
  /** Band outline swept through ±wind swing (equals `outline` when swing is 0). */
  swept: LocalRing;
  /**
   * Outer envelope of the band under the weather's spread (swing included; contains every
   * variant's swept band). Absent when the spread was not computed; empty when no band.
   */
  envelope?: LocalRing;
}

export interface LocalFootprint {
  /** Bearing (degrees true) the plume travels toward: wind_from + 180, mod 360. */
  heading_deg: number;
  wind_swing_deg: number;
  near_zone_m: number;
  bands: LocalBand[];
  /** Downwind centreline from 0 to the longest reach (m). */
  centreline_m: number;
}

// ---------------------------------------------------------------------------
// Validated SI model input
// ---------------------------------------------------------------------------

export interface HotRelease {
  /** Exit speed (m/s). */
  exitSpeed: number;
  /** Vent diameter (m). */
  diameter: number;
  /** Gas temperature at exit (K). */
  gasTemperature: number;
}

export type Release =
  | { kind: "continuous"; rate: number; duration: number | null }
  | { kind: "instantaneous"; mass: number };

/** Everything the plume needs, validated and in SI. */
export interface PlumeSetup {
  release: Release;
  /** Physical release height (m). */
  height: number;
  /** Wind speed used at release height after the calm clamp (m/s). */
  windSpeed: number;
  stability: StabilityClass;
  terrain: Terrain;
  scheme: SigmaScheme;
  /** Mixing lid (m) or null for none. */
  mixingHeight: number | null;
  /** Effective source height H = height + plume rise (m). */
  effectiveHeight: number;
}

export interface Limit {
  label: string;
  /** Concentration limit in g/m³. */
  value: number;
  /** Averaging time t_a (s). */
  averaging: number;
}

/** A scenario after validation: SI, defaults filled, nothing converted yet. */
export interface ParsedScenario {
  release: Release;
  /** Physical release height (m). */
  height: number;
  heavyOrCold: boolean;
  hot: HotRelease | null;
  /** Measured wind speed (m/s) and the height it was measured at (m). */
  windSpeedRef: number;
  windRefHeight: number;
  /** Direction the wind blows from, degrees true, 0–360. */
  windFromDeg: number;
  stability: StabilityClass | "auto";
  sky: Sky | null;
  /** Milliseconds since 1970-01-01T00:00Z, parsed from `weather.time`. */
  timeMs: number | null;
  terrain: Terrain;
  mixingHeight: number | null;
  /** Air temperature (K); plume rise only. */
  airTemperature: number;
  scheme: SigmaScheme;
  receptorHeight: number;
  molecularWeight: number | null;
  limits: { label: string; value: number; unit: LimitUnit; averaging: number }[];
  windSwingDeg: number;
  nearZone: number;
  source: { lat: number; lon: number } | null;
  points: { x: number; y: number; z: number; averaging: number }[];
  /** The limit set the limits came from; null when not given. */
  limitSet: ScenarioLimitSet | null;
  /** Spread: classes stepped each way (0 or 1) and the wind factor (≥ 1). */
  spread: { classes: number; windFactor: number };
}

/** One problem with a scenario: the field (dotted path), the value found, and what is allowed. */
export interface ScenarioProblem {
  field: string;
  value: unknown;
  message: string;
}
