/**
 * The scenario boundary: turn an untrusted Scenario JSON value into a validated
 * {@link ParsedScenario} (SI, defaults filled), or throw a {@link ScenarioError}
 * listing every problem found.
 *
 * Pure: no DOM, no storage, no clock, no randomness. Nothing is coerced — a
 * string where a number is expected is a problem, never converted.
 * Keys beginning with `_` (at any level) are comments and are ignored; any
 * other key that is not part of the contract is reported, so a misspelt field
 * is never silently dropped.
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
 */

import { ScenarioError } from "./errors.ts";
import { TABLE_SKIES } from "./stability.ts";
import type {
  HotRelease,
  LimitUnit,
  ParsedScenario,
  Release,
  ScenarioProblem,
  SigmaScheme,
  Sky,
  StabilityClass,
  Terrain,
} from "./types.ts";
import { STABILITY_CLASSES } from "./types.ts";

/** A numeric range: `[min, max]`, or `(min, max]` when `minOpen`. */
export interface NumberRange {
  min: number;
  max: number;
  minOpen: boolean;
  unit: string;
}

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
} as const;

export const MAX_LIMITS = 100;
export const MAX_POINTS = 1000;
export const MAX_LABEL_LENGTH = 80;

/** The skies a scenario may give: the table's, or "sun" (strength from the sun's elevation). */
export const SKY_VALUES: readonly Sky[] = [...TABLE_SKIES, "sun"];
const TERRAINS: readonly Terrain[] = ["open", "urban"];
const SCHEMES: readonly SigmaScheme[] = ["briggs", "pasquill-gifford"];
const UNITS: readonly LimitUnit[] = ["ppm", "mg/m3"];
const KINDS = ["continuous", "instantaneous"] as const;

const KEYS = {
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
} as const;

type Obj = Record<string, unknown>;

/** Shows a range bound: plain below a million, otherwise `1e10` / `3.2e7` style. */
function showBound(n: number): string {
  if (Math.abs(n) < 1e6) return String(n);
  return n.toExponential().replace("e+", "e");
}

/** The "what is allowed" text of a range, e.g. "must be a number greater than 0 and at most 1e10 g/s". */
export function rangeText(range: NumberRange): string {
  const unit = range.unit ? ` ${range.unit}` : "";
  if (range.minOpen) {
    return `must be a number greater than ${showBound(range.min)} and at most ${showBound(range.max)}${unit}`;
  }
  return `must be a number from ${showBound(range.min)} to ${showBound(range.max)}${unit}`;
}

function isObject(v: unknown): v is Obj {
  return typeof v === "object" && v !== null && !Array.isArray(v);
}

function oneOfText(values: readonly string[]): string {
  return values.map((v) => JSON.stringify(v)).join(", ");
}

const toInt = (s: string | undefined): number => Number(s ?? "0");

const ISO_TIME =
  /^(\d{4})-(\d{2})-(\d{2})[Tt](\d{2}):(\d{2})(?::(\d{2})(\.\d{1,9})?)?(?:([Zz])|([+-])(\d{2})(?::?(\d{2}))?)$/;

/**
 * Parses an ISO 8601 date-time that carries a zone (`Z`, `±hh`, `±hhmm` or `±hh:mm`),
 * e.g. `2026-06-21T12:00:00+02:00`. Returns ms since 1970-01-01T00:00Z, or null when the
 * text is not such a date-time or names an impossible date (Feb 30, hour 24, …). Pure.
 */
export function parseIsoTime(text: string): number | null {
  const m = ISO_TIME.exec(text);
  if (!m) return null;
  const year = toInt(m[1]);
  const month = toInt(m[2]);
  const day = toInt(m[3]);
  const hour = toInt(m[4]);
  const minute = toInt(m[5]);
  const second = toInt(m[6]);
  const fraction = m[7] ? Number(m[7]) : 0;
  if (month < 1 || month > 12) return null;
  const leap = (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
  const daysInMonth = [31, leap ? 29 : 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31][month - 1] ?? 0;
  if (day < 1 || day > daysInMonth) return null;
  if (hour > 23 || minute > 59 || second > 59) return null;
  let offsetMin = 0;
  if (!m[8]) {
    const oh = toInt(m[10]);
    const om = toInt(m[11]);
    if (oh > 14 || om > 59) return null;
    offsetMin = (m[9] === "-" ? -1 : 1) * (oh * 60 + om);
  }
  const utc = new Date(0);
  utc.setUTCFullYear(year, month - 1, day);
  utc.setUTCHours(hour, minute, second, 0);
  return utc.getTime() + Math.round(fraction * 1000) - offsetMin * 60_000;
}

/** Collects problems while reading one scenario. */
class Reader {
  readonly problems: ScenarioProblem[] = [];

  add(field: string, value: unknown, message: string): void {
    this.problems.push({ field, value, message });
  }

  /** Reports keys that are not in `allowed` (keys starting with `_` are comments). */
  unknownKeys(obj: Obj, path: string, allowed: readonly string[]): void {
    for (const key of Object.keys(obj)) {
      if (key.startsWith("_") || allowed.includes(key)) continue;
      this.add(
        join(path, key),
        obj[key],
        `is not a known field here (allowed: ${allowed.join(", ")}; prefix a key with "_" for a comment)`,
      );
    }
  }

  /** A number in `range`; undefined when absent (and `required` is false) or invalid. */
  number(
    obj: Obj,
    key: string,
    path: string,
    range: NumberRange,
    required: boolean,
    requiredWhy = "",
  ): number | undefined {
    const field = join(path, key);
    const v = obj[key];
    const text = rangeText(range);
    if (v === undefined) {
      if (required) this.add(field, v, `is required${requiredWhy}; ${text}`);
      return undefined;
    }
    if (typeof v !== "number") {
      const hint =
        typeof v === "string"
          ? " (write it as a JSON number, without quotes)"
          : v === null && !required
            ? " (leave the field out to use the default)"
            : "";
      this.add(field, v, `${text}${hint}`);
      return undefined;
    }
    if (!Number.isFinite(v)) {
      // Shown as text: JSON has no NaN/Infinity and would print them as null.
      this.add(field, String(v), `${text} (a finite number)`);
      return undefined;
    }
    const low = range.minOpen ? v <= range.min : v < range.min;
    if (low || v > range.max) {
      this.add(field, v, text);
      return undefined;
    }
    return v;
  }

  /** One of `values`; undefined when absent (and not required) or invalid. */
  choice<T extends string>(
    obj: Obj,
    key: string,
    path: string,
    values: readonly T[],
    required: boolean,
    requiredWhy = "",
  ): T | undefined {
    const field = join(path, key);
    const v = obj[key];
    const text = `must be one of ${oneOfText(values)}`;
    if (v === undefined) {
      if (required) this.add(field, v, `is required${requiredWhy}; ${text}`);
      return undefined;
    }
    if (typeof v !== "string" || !(values as readonly string[]).includes(v)) {
      this.add(field, v, `${text} (exactly as written)`);
      return undefined;
    }
    return v as T;
  }

  /** An object; undefined when absent (and not required) or not an object. */
  object(obj: Obj, key: string, path: string, required: boolean, what: string): Obj | undefined {
    const field = join(path, key);
    const v = obj[key];
    if (v === undefined) {
      if (required) this.add(field, v, `is required; must be an object (${what})`);
      return undefined;
    }
    if (!isObject(v)) {
      this.add(field, v, `must be an object (${what})`);
      return undefined;
    }
    return v;
  }

  /** An array of at most `max` items; undefined when absent (and not required) or invalid. */
  array(obj: Obj, key: string, path: string, required: boolean, max: number, what: string) {
    const field = join(path, key);
    const v = obj[key];
    const text = `must be a list of 0 to ${max} ${what}`;
    if (v === undefined) {
      if (required) this.add(field, v, `is required; ${text} (may be empty: [])`);
      return undefined;
    }
    if (!Array.isArray(v)) {
      this.add(field, v, text);
      return undefined;
    }
    if (v.length > max) {
      this.add(field, `${v.length} items`, text);
      return undefined;
    }
    return v as unknown[];
  }
}

function join(path: string, key: string): string {
  return path ? `${path}.${key}` : key;
}

function readHot(rd: Reader, release: Obj): HotRelease | null | undefined {
  const hot = rd.object(
    release,
    "hot",
    "release",
    false,
    "exit_speed_m_s, diameter_m, gas_temperature_k",
  );
  if (!hot) return release.hot === undefined ? null : undefined;
  rd.unknownKeys(hot, "release.hot", KEYS.hot);
  const exitSpeed = rd.number(hot, "exit_speed_m_s", "release.hot", RANGES.exit_speed_m_s, true);
  const diameter = rd.number(hot, "diameter_m", "release.hot", RANGES.diameter_m, true);
  const gasTemperature = rd.number(
    hot,
    "gas_temperature_k",
    "release.hot",
    RANGES.gas_temperature_k,
    true,
  );
  if (exitSpeed === undefined || diameter === undefined || gasTemperature === undefined) {
    return undefined;
  }
  return { exitSpeed, diameter, gasTemperature };
}

/**
 * Validates a Scenario JSON value (issue 2's contract, `Scenario` in types.ts) and returns it
 * in the model's SI form with model.md's defaults filled. Pure: the input is not modified.
 *
 * @param raw - anything (typically the result of `JSON.parse`)
 * @returns the validated scenario: rates g/s, masses g, lengths m, times s, angles degrees,
 *   temperatures K, `timeMs` in ms since 1970-01-01T00:00Z
 * @throws {ScenarioError} listing every problem found (field as a dotted path, the value
 *   found, and what is allowed)
 *
 * @example
 * parseScenario({
 *   release: { kind: "continuous", rate_g_s: 500 },
 *   weather: { wind_speed_m_s: 3, wind_from_deg: 250, stability: "D" },
 *   limits: [{ label: "Limit A (invented)", value: 40, unit: "mg/m3", averaging_s: 3600 }],
 * }).receptorHeight; // 1.5
 */
export function parseScenario(raw: unknown): ParsedScenario {
  const rd = new Reader();
  if (!isObject(raw)) {
    rd.add("(scenario)", raw, "must be a JSON object with at least release, weather and limits");
    throw new ScenarioError(rd.problems);
  }
  rd.unknownKeys(raw, "", KEYS.top);

  // --- release -------------------------------------------------------------
  let release: Release | undefined;
  let height: number | undefined = DEFAULTS.height_m;
  let heavyOrCold = false;
  let hot: HotRelease | null | undefined = null;
  const rel = rd.object(raw, "release", "", true, 'e.g. {"kind": "continuous", "rate_g_s": 500}');
  if (rel) {
    let kind: (typeof KINDS)[number] | undefined = "continuous";
    if (rel.kind !== undefined) kind = rd.choice(rel, "kind", "release", KINDS, false);
    if (kind === "continuous") {
      rd.unknownKeys(rel, "release", KEYS.continuous);
      const rate = rd.number(rel, "rate_g_s", "release", RANGES.rate_g_s, true);
      const duration = rd.number(rel, "duration_s", "release", RANGES.duration_s, false);
      const durationOk = rel.duration_s === undefined || duration !== undefined;
      if (rate !== undefined && durationOk) {
        release = { kind: "continuous", rate, duration: duration ?? null };
      }
    } else if (kind === "instantaneous") {
      rd.unknownKeys(rel, "release", KEYS.instantaneous);
      const mass = rd.number(rel, "mass_g", "release", RANGES.mass_g, true);
      if (mass !== undefined) release = { kind: "instantaneous", mass };
    }
    height = rd.number(rel, "height_m", "release", RANGES.height_m, false);
    if (rel.height_m === undefined) height = DEFAULTS.height_m;
    if (rel.heavy_or_cold !== undefined) {
      if (typeof rel.heavy_or_cold === "boolean") heavyOrCold = rel.heavy_or_cold;
      else rd.add("release.heavy_or_cold", rel.heavy_or_cold, "must be true or false");
    }
    hot = readHot(rd, rel);
  }

  // --- weather -------------------------------------------------------------
  const wx = rd.object(
    raw,
    "weather",
    "",
    true,
    'e.g. {"wind_speed_m_s": 3, "wind_from_deg": 250, "stability": "D"}',
  );
  let windSpeedRef: number | undefined;
  let windRefHeight: number | undefined = DEFAULTS.wind_height_m;
  let windFromDeg: number | undefined;
  let stability: StabilityClass | "auto" | undefined;
  let sky: Sky | null | undefined = null;
  let timeMs: number | null | undefined = null;
  let terrain: Terrain | undefined = DEFAULTS.terrain;
  let mixingHeight: number | null | undefined = null;
  let airTemperature: number | undefined = DEFAULTS.air_temperature_k;
  if (wx) {
    rd.unknownKeys(wx, "weather", KEYS.weather);
    windSpeedRef = rd.number(wx, "wind_speed_m_s", "weather", RANGES.wind_speed_m_s, true);
    if (wx.wind_height_m !== undefined) {
      windRefHeight = rd.number(wx, "wind_height_m", "weather", RANGES.wind_height_m, false);
    }
    windFromDeg = rd.number(wx, "wind_from_deg", "weather", RANGES.wind_from_deg, true);
    stability = rd.choice(wx, "stability", "weather", [...STABILITY_CLASSES, "auto"], true);
    const auto = stability === "auto";
    if (wx.sky !== undefined || auto) {
      sky = rd.choice(wx, "sky", "weather", SKY_VALUES, auto, ' when weather.stability is "auto"');
    }
    const needTime = auto && sky === "sun";
    if (wx.time !== undefined || needTime) {
      timeMs = undefined;
      const t = wx.time;
      const text =
        "must be an ISO 8601 date-time with a zone, e.g. 2026-06-21T14:30:00+02:00 or 2026-06-21T12:30:00Z";
      if (t === undefined) {
        rd.add("weather.time", t, `is required when weather.sky is "sun"; ${text}`);
      } else if (typeof t !== "string") {
        rd.add("weather.time", t, text);
      } else {
        const ms = parseIsoTime(t);
        if (ms === null) rd.add("weather.time", t, `${text} (a real date and time)`);
        else timeMs = ms;
      }
    }
    if (needTime && raw.source === undefined) {
      rd.add(
        "source",
        undefined,
        'is required when weather.sky is "sun" (the sun\'s elevation depends on the place); must be an object {"lat": …, "lon": …}',
      );
    }
    if (wx.terrain !== undefined) {
      terrain = rd.choice(wx, "terrain", "weather", TERRAINS, false);
    }
    if (wx.mixing_height_m !== undefined) {
      mixingHeight = rd.number(wx, "mixing_height_m", "weather", RANGES.mixing_height_m, false);
    }
    if (wx.air_temperature_k !== undefined) {
      airTemperature = rd.number(
        wx,
        "air_temperature_k",
        "weather",
        RANGES.air_temperature_k,
        false,
      );
    }
  }
  if (hot && airTemperature !== undefined && hot.gasTemperature <= airTemperature) {
    rd.add(
      "release.hot.gas_temperature_k",
      hot.gasTemperature,
      `must be above the air temperature (${airTemperature} K) for a hot release; leave "hot" out for a cold release`,
    );
  }

  // --- top-level options ---------------------------------------------------
  let scheme: SigmaScheme | undefined = DEFAULTS.sigma_scheme;
  if (raw.sigma_scheme !== undefined) scheme = rd.choice(raw, "sigma_scheme", "", SCHEMES, false);
  let receptorHeight: number | undefined = DEFAULTS.receptor_height_m;
  if (raw.receptor_height_m !== undefined) {
    receptorHeight = rd.number(raw, "receptor_height_m", "", RANGES.receptor_height_m, false);
  }
  let windSwingDeg: number | undefined = DEFAULTS.wind_swing_deg;
  if (raw.wind_swing_deg !== undefined) {
    windSwingDeg = rd.number(raw, "wind_swing_deg", "", RANGES.wind_swing_deg, false);
  }
  let nearZone: number | undefined = DEFAULTS.near_zone_m;
  if (raw.near_zone_m !== undefined) {
    nearZone = rd.number(raw, "near_zone_m", "", RANGES.near_zone_m, false);
  }

  // --- limits --------------------------------------------------------------
  const limits: ParsedScenario["limits"] = [];
  let firstPpm = -1;
  const rawLimits = rd.array(raw, "limits", "", true, MAX_LIMITS, "limits");
  rawLimits?.forEach((item, i) => {
    const path = `limits[${i}]`;
    if (!isObject(item)) {
      rd.add(path, item, "must be an object with label, value, unit and averaging_s");
      return;
    }
    rd.unknownKeys(item, path, KEYS.limit);
    let label: string | undefined;
    const labelText = `must be a non-empty text of at most ${MAX_LABEL_LENGTH} characters`;
    if (item.label === undefined) rd.add(`${path}.label`, undefined, `is required; ${labelText}`);
    else if (
      typeof item.label !== "string" ||
      item.label.trim() === "" ||
      item.label.length > MAX_LABEL_LENGTH
    ) {
      rd.add(`${path}.label`, item.label, labelText);
    } else label = item.label;
    const value = rd.number(item, "value", path, RANGES.limit_value, true);
    const unit = rd.choice(item, "unit", path, UNITS, true);
    if (unit === "ppm" && firstPpm < 0) firstPpm = i;
    const averaging = rd.number(item, "averaging_s", path, RANGES.averaging_s, true);
    if (
      label !== undefined &&
      value !== undefined &&
      unit !== undefined &&
      averaging !== undefined
    ) {
      limits.push({ label, value, unit, averaging });
    }
  });

  // --- molecular weight ----------------------------------------------------
  const needMw = firstPpm >= 0;
  const molecularWeight = rd.number(
    raw,
    "molecular_weight_g_mol",
    "",
    RANGES.molecular_weight_g_mol,
    needMw,
    needMw ? ` when a limit is in ppm (limits[${firstPpm}] is)` : "",
  );

  // --- source ----------------------------------------------------------------
  let source: ParsedScenario["source"] | undefined = null;
  const src = rd.object(raw, "source", "", false, 'e.g. {"lat": 47.0, "lon": 8.0}');
  if (src) {
    rd.unknownKeys(src, "source", KEYS.source);
    const lat = rd.number(src, "lat", "source", RANGES.lat, true);
    const lon = rd.number(src, "lon", "source", RANGES.lon, true);
    source = lat !== undefined && lon !== undefined ? { lat, lon } : undefined;
  } else if (raw.source !== undefined) source = undefined;

  // --- points ----------------------------------------------------------------
  const points: ParsedScenario["points"] = [];
  const rawPoints = rd.array(raw, "points", "", false, MAX_POINTS, "points");
  rawPoints?.forEach((item, i) => {
    const path = `points[${i}]`;
    if (!isObject(item)) {
      rd.add(path, item, "must be an object with x_m, y_m and optionally z_m, averaging_s");
      return;
    }
    rd.unknownKeys(item, path, KEYS.point);
    const x = rd.number(item, "x_m", path, RANGES.x_m, true);
    const y = rd.number(item, "y_m", path, RANGES.y_m, true);
    const z =
      item.z_m === undefined ? receptorHeight : rd.number(item, "z_m", path, RANGES.z_m, false);
    const averaging =
      item.averaging_s === undefined
        ? DEFAULTS.point_averaging_s
        : rd.number(item, "averaging_s", path, RANGES.averaging_s, false);
    if (x !== undefined && y !== undefined && z !== undefined && averaging !== undefined) {
      points.push({ x, y, z, averaging });
    }
  });

  // --- checks across fields ----------------------------------------------------
  // Bands, warnings and point results are matched to their limit by label.
  const seen = new Map<string, number>();
  for (const [i, l] of limits.entries()) {
    const prev = seen.get(l.label);
    if (prev !== undefined) {
      rd.add(
        `limits[${i}].label`,
        l.label,
        `must differ from every other limit's label (limits[${prev}] has it too)`,
      );
    } else seen.set(l.label, i);
  }
  // The reflection between ground and lid describes the layer below the lid only.
  if (typeof mixingHeight === "number") {
    if (typeof receptorHeight === "number" && receptorHeight >= mixingHeight) {
      rd.add(
        "receptor_height_m",
        receptorHeight,
        `must be below the mixing height (${mixingHeight} m)`,
      );
    }
    rawPoints?.forEach((item, i) => {
      if (isObject(item) && typeof item.z_m === "number" && item.z_m >= mixingHeight) {
        rd.add(`points[${i}].z_m`, item.z_m, `must be below the mixing height (${mixingHeight} m)`);
      }
    });
  }

  if (rd.problems.length > 0) throw new ScenarioError(rd.problems);

  // With no problems every value below is defined; the checks narrow the types.
  if (
    release === undefined ||
    height === undefined ||
    hot === undefined ||
    windSpeedRef === undefined ||
    windRefHeight === undefined ||
    windFromDeg === undefined ||
    stability === undefined ||
    sky === undefined ||
    timeMs === undefined ||
    terrain === undefined ||
    mixingHeight === undefined ||
    airTemperature === undefined ||
    scheme === undefined ||
    receptorHeight === undefined ||
    windSwingDeg === undefined ||
    nearZone === undefined ||
    source === undefined
  ) {
    throw new ScenarioError([
      { field: "(scenario)", value: undefined, message: "could not be read (internal check)" },
    ]);
  }

  return {
    release,
    height,
    heavyOrCold,
    hot,
    windSpeedRef,
    windRefHeight,
    windFromDeg,
    stability,
    sky,
    timeMs,
    terrain,
    mixingHeight,
    airTemperature,
    scheme,
    receptorHeight,
    molecularWeight: molecularWeight ?? null,
    limits,
    windSwingDeg,
    nearZone,
    source,
    points,
  };
}
