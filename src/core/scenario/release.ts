/** Reads the scenario's `release` object (continuous or all at once, height, hot gas). */

import type { HotRelease, ParsedScenario, Release } from "../types.ts";
import { DEFAULTS, KEYS, KINDS, RANGES } from "./fields.ts";
import type { Maybe, Obj, Reader } from "./read.ts";

export type ReleasePart = Maybe<Pick<ParsedScenario, "release" | "height" | "heavyOrCold" | "hot">>;

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

/** `release`: kind, amount, height (m), heavy or cold, hot gas. Problems go to `rd`. */
export function readRelease(rd: Reader, raw: Obj): ReleasePart {
  let release: Release | undefined;
  let height: number | undefined = DEFAULTS.height_m;
  let heavyOrCold: boolean | undefined = false;
  let hot: HotRelease | null | undefined = null;
  const rel = rd.object(raw, "release", "", true, 'e.g. {"kind": "continuous", "rate_g_s": 500}');
  if (!rel) return { release, height, heavyOrCold, hot };
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
  return { release, height, heavyOrCold, hot };
}
