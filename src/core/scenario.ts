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
 * One reader per section, in `scenario/`: `release.ts`, `weather.ts`, `options.ts`,
 * `lists.ts` (limits, points, checks across fields); the allowed values and defaults are
 * in `scenario/fields.ts` (with the table of every field), the problem collector in
 * `scenario/read.ts`.
 */

import { ScenarioError } from "./errors.ts";
import { KEYS } from "./scenario/fields.ts";
import { checkAcross, readLimits, readPoints } from "./scenario/lists.ts";
import {
  readLimitSet,
  readMolecularWeight,
  readOptions,
  readSource,
  readSpread,
} from "./scenario/options.ts";
import { isObject, type Maybe, Reader } from "./scenario/read.ts";
import { readRelease } from "./scenario/release.ts";
import { readWeather } from "./scenario/weather.ts";
import type { ParsedScenario } from "./types.ts";

export {
  DEFAULTS,
  MAX_LABEL_LENGTH,
  MAX_LIMITS,
  MAX_POINTS,
  MAX_SET_NAME_LENGTH,
  MAX_SOURCE_NOTE_LENGTH,
  RANGES,
  SKY_VALUES,
} from "./scenario/fields.ts";
export { type NumberRange, parseIsoTime, rangeText } from "./scenario/read.ts";

/** The parsed scenario once no problem was found (every field then has its value). */
function complete(draft: Maybe<ParsedScenario>): ParsedScenario {
  for (const value of Object.values(draft)) {
    if (value === undefined) {
      throw new ScenarioError([
        { field: "(scenario)", value: undefined, message: "could not be read (internal check)" },
      ]);
    }
  }
  return draft as ParsedScenario;
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

  const release = readRelease(rd, raw);
  const weather = readWeather(rd, raw);
  const { hot } = release;
  const { airTemperature, mixingHeight } = weather;
  if (hot && airTemperature !== undefined && hot.gasTemperature <= airTemperature) {
    rd.add(
      "release.hot.gas_temperature_k",
      hot.gasTemperature,
      `must be above the air temperature (${airTemperature} K) for a hot release; leave "hot" out for a cold release`,
    );
  }
  const options = readOptions(rd, raw);
  const { limits, firstPpm } = readLimits(rd, raw);
  const molecularWeight = readMolecularWeight(rd, raw, firstPpm);
  const source = readSource(rd, raw);
  const points = readPoints(rd, raw, options.receptorHeight);
  const limitSet = readLimitSet(rd, raw);
  const spread = readSpread(rd, raw);
  checkAcross(rd, raw, limits, mixingHeight, options.receptorHeight);

  if (rd.problems.length > 0) throw new ScenarioError(rd.problems);
  return complete({
    ...release,
    ...weather,
    ...options,
    molecularWeight,
    limits,
    source,
    points,
    limitSet,
    spread,
  });
}
