/** Reads the scenario's top-level options: curves, receptor, swing, near zone, weight, source. */

import type { ParsedScenario, SigmaScheme } from "../types.ts";
import {
  DEFAULTS,
  KEYS,
  MAX_SET_NAME_LENGTH,
  MAX_SOURCE_NOTE_LENGTH,
  RANGES,
  SCHEMES,
} from "./fields.ts";
import type { Maybe, Obj, Reader } from "./read.ts";

export type OptionsPart = Maybe<
  Pick<ParsedScenario, "scheme" | "receptorHeight" | "windSwingDeg" | "nearZone">
>;

/** `sigma_scheme`, `receptor_height_m` (m), `wind_swing_deg` (degrees), `near_zone_m` (m). */
export function readOptions(rd: Reader, raw: Obj): OptionsPart {
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
  return { scheme, receptorHeight, windSwingDeg, nearZone };
}

/**
 * `molecular_weight_g_mol` (g/mol): required when a limit is in ppm (`firstPpm` is the index
 * of the first such limit, or -1). Null when absent and not needed.
 */
export function readMolecularWeight(
  rd: Reader,
  raw: Obj,
  firstPpm: number,
): number | null | undefined {
  const needMw = firstPpm >= 0;
  const molecularWeight = rd.number(
    raw,
    "molecular_weight_g_mol",
    "",
    RANGES.molecular_weight_g_mol,
    needMw,
    needMw ? ` when a limit is in ppm (limits[${firstPpm}] is)` : "",
  );
  if (molecularWeight !== undefined) return molecularWeight;
  return raw.molecular_weight_g_mol === undefined ? null : undefined;
}

/** `source`: latitude and longitude (degrees); null when absent. */
export function readSource(rd: Reader, raw: Obj): ParsedScenario["source"] | undefined {
  const src = rd.object(raw, "source", "", false, 'e.g. {"lat": 47.0, "lon": 8.0}');
  if (!src) return raw.source === undefined ? null : undefined;
  rd.unknownKeys(src, "source", KEYS.source);
  const lat = rd.number(src, "lat", "source", RANGES.lat, true);
  const lon = rd.number(src, "lon", "source", RANGES.lon, true);
  return lat !== undefined && lon !== undefined ? { lat, lon } : undefined;
}

/** `limit_set`: the name (1–120 characters) and source note (0–1000) of the set used; null when absent. */
export function readLimitSet(rd: Reader, raw: Obj): ParsedScenario["limitSet"] | undefined {
  const set = rd.object(raw, "limit_set", "", false, "name and source_note");
  if (!set) return raw.limit_set === undefined ? null : undefined;
  rd.unknownKeys(set, "limit_set", KEYS.limitSet);
  let ok = true;
  for (const [key, min, max] of [
    ["name", 1, MAX_SET_NAME_LENGTH],
    ["source_note", 0, MAX_SOURCE_NOTE_LENGTH],
  ] as const) {
    const v = set[key];
    if (typeof v !== "string" || v.trim().length < min || v.length > max) {
      const req = v === undefined ? "is required; " : "";
      rd.add(`limit_set.${key}`, v, `${req}must be a text of ${min} to ${max} characters`);
      ok = false;
    }
  }
  return ok ? { name: set.name as string, source_note: set.source_note as string } : undefined;
}

/**
 * `spread`: classes stepped each way (0 or 1) and the wind factor (1 to 3); neighbouring classes
 * × wind ±30% by default, `{ classes: 0, wind_factor: 1 }` = off.
 */
export function readSpread(rd: Reader, raw: Obj): ParsedScenario["spread"] | undefined {
  const sp =
    raw.spread === undefined ? {} : rd.object(raw, "spread", "", false, "classes, wind_factor");
  if (!sp) return undefined;
  rd.unknownKeys(sp, "spread", KEYS.spread);
  const c = sp.classes;
  const classes =
    c === undefined || c === 0 || c === 1 ? (c ?? DEFAULTS.spread_classes) : undefined;
  if (classes === undefined)
    rd.add("spread.classes", c, "must be 0 (this class only) or 1 (a class either side)");
  const windFactor =
    sp.wind_factor === undefined
      ? DEFAULTS.spread_wind_factor
      : rd.number(sp, "wind_factor", "spread", RANGES.spread_wind_factor, false);
  return classes === undefined || windFactor === undefined ? undefined : { classes, windFactor };
}
