/** Reads the scenario's `weather` object (wind, stability or sky, time, ground, lid, air). */

import type { ParsedScenario, Sky, StabilityClass, Terrain } from "../types.ts";
import { STABILITY_CLASSES } from "../types.ts";
import { DEFAULTS, KEYS, RANGES, SKY_VALUES, TERRAINS } from "./fields.ts";
import { type Maybe, type Obj, parseIsoTime, type Reader } from "./read.ts";

export type WeatherPart = Maybe<
  Pick<
    ParsedScenario,
    | "windSpeedRef"
    | "windRefHeight"
    | "windFromDeg"
    | "stability"
    | "sky"
    | "timeMs"
    | "terrain"
    | "mixingHeight"
    | "airTemperature"
  >
>;

const TIME_TEXT =
  "must be an ISO 8601 date-time with a zone, e.g. 2026-06-21T14:30:00+02:00 or 2026-06-21T12:30:00Z";

/** `weather.time` as ms since 1970-01-01T00:00Z; null when absent and not needed. */
function readTime(rd: Reader, wx: Obj, needTime: boolean): number | null | undefined {
  if (wx.time === undefined && !needTime) return null;
  const t = wx.time;
  if (t === undefined) {
    rd.add("weather.time", t, `is required when weather.sky is "sun"; ${TIME_TEXT}`);
  } else if (typeof t !== "string") {
    rd.add("weather.time", t, TIME_TEXT);
  } else {
    const ms = parseIsoTime(t);
    if (ms === null) rd.add("weather.time", t, `${TIME_TEXT} (a real date and time)`);
    else return ms;
  }
  return undefined;
}

/**
 * `weather`: wind speed (m/s) at its height (m), direction (degrees true), stability class or
 * "auto" with the sky, time, ground type, mixing height (m), air temperature (K).
 * Problems go to `rd`; a "sun" sky without `source` is reported here (it needs the place).
 */
export function readWeather(rd: Reader, raw: Obj): WeatherPart {
  const part: WeatherPart = {
    windSpeedRef: undefined,
    windRefHeight: DEFAULTS.wind_height_m,
    windFromDeg: undefined,
    stability: undefined,
    sky: null,
    timeMs: null,
    terrain: DEFAULTS.terrain,
    mixingHeight: null,
    airTemperature: DEFAULTS.air_temperature_k,
  };
  const wx = rd.object(
    raw,
    "weather",
    "",
    true,
    'e.g. {"wind_speed_m_s": 3, "wind_from_deg": 250, "stability": "D"}',
  );
  if (!wx) return part;
  rd.unknownKeys(wx, "weather", KEYS.weather);
  part.windSpeedRef = rd.number(wx, "wind_speed_m_s", "weather", RANGES.wind_speed_m_s, true);
  if (wx.wind_height_m !== undefined) {
    part.windRefHeight = rd.number(wx, "wind_height_m", "weather", RANGES.wind_height_m, false);
  }
  part.windFromDeg = rd.number(wx, "wind_from_deg", "weather", RANGES.wind_from_deg, true);
  const stability: StabilityClass | "auto" | undefined = rd.choice(
    wx,
    "stability",
    "weather",
    [...STABILITY_CLASSES, "auto"],
    true,
  );
  part.stability = stability;
  const auto = stability === "auto";
  let sky: Sky | null | undefined = null;
  if (wx.sky !== undefined || auto) {
    sky = rd.choice(wx, "sky", "weather", SKY_VALUES, auto, ' when weather.stability is "auto"');
  }
  part.sky = sky;
  const needTime = auto && sky === "sun";
  part.timeMs = readTime(rd, wx, needTime);
  if (needTime && raw.source === undefined) {
    rd.add(
      "source",
      undefined,
      'is required when weather.sky is "sun" (the sun\'s elevation depends on the place); must be an object {"lat": …, "lon": …}',
    );
  }
  if (wx.terrain !== undefined) {
    part.terrain = rd.choice<Terrain>(wx, "terrain", "weather", TERRAINS, false);
  }
  if (wx.mixing_height_m !== undefined) {
    part.mixingHeight = rd.number(wx, "mixing_height_m", "weather", RANGES.mixing_height_m, false);
  }
  if (wx.air_temperature_k !== undefined) {
    part.airTemperature = rd.number(
      wx,
      "air_temperature_k",
      "weather",
      RANGES.air_temperature_k,
      false,
    );
  }
  return part;
}
