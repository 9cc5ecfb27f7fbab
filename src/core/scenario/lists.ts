/** Reads the scenario's lists (`limits`, `points`) and the checks across fields. */

import type { ParsedScenario } from "../types.ts";
import {
  DEFAULTS,
  KEYS,
  MAX_LABEL_LENGTH,
  MAX_LIMITS,
  MAX_POINTS,
  RANGES,
  UNITS,
} from "./fields.ts";
import { isObject, type Obj, type Reader } from "./read.ts";

type Limit = ParsedScenario["limits"][number];
type Point = ParsedScenario["points"][number];

/** A limit's `label`: non-empty text of at most {@link MAX_LABEL_LENGTH} characters. */
function readLabel(rd: Reader, item: Obj, path: string): string | undefined {
  const labelText = `must be a non-empty text of at most ${MAX_LABEL_LENGTH} characters`;
  if (item.label === undefined) {
    rd.add(`${path}.label`, undefined, `is required; ${labelText}`);
    return undefined;
  }
  if (
    typeof item.label !== "string" ||
    item.label.trim() === "" ||
    item.label.length > MAX_LABEL_LENGTH
  ) {
    rd.add(`${path}.label`, item.label, labelText);
    return undefined;
  }
  return item.label;
}

/** One limit: label, value (in its unit), unit, averaging time (s). */
function readLimit(rd: Reader, item: Obj, path: string): Limit | undefined {
  rd.unknownKeys(item, path, KEYS.limit);
  const label = readLabel(rd, item, path);
  const value = rd.number(item, "value", path, RANGES.limit_value, true);
  const unit = rd.choice(item, "unit", path, UNITS, true);
  const averaging = rd.number(item, "averaging_s", path, RANGES.averaging_s, true);
  if (label === undefined || value === undefined || unit === undefined) return undefined;
  if (averaging === undefined) return undefined;
  return { label, value, unit, averaging };
}

/**
 * `limits`: the valid limits, and `firstPpm`, the index of the first limit in ppm (-1: none),
 * which makes the molecular weight required.
 */
export function readLimits(rd: Reader, raw: Obj): { limits: Limit[]; firstPpm: number } {
  const limits: Limit[] = [];
  let firstPpm = -1;
  const rawLimits = rd.array(raw, "limits", "", true, MAX_LIMITS, "limits");
  rawLimits?.forEach((item, i) => {
    const path = `limits[${i}]`;
    if (!isObject(item)) {
      rd.add(path, item, "must be an object with label, value, unit and averaging_s");
      return;
    }
    if (item.unit === "ppm" && firstPpm < 0) firstPpm = i;
    const limit = readLimit(rd, item, path);
    if (limit) limits.push(limit);
  });
  return { limits, firstPpm };
}

/** One point: x, y (m), z (m; default the receptor height), averaging time (s; default 600). */
function readPoint(
  rd: Reader,
  item: Obj,
  path: string,
  receptorHeight: number | undefined,
): Point | undefined {
  rd.unknownKeys(item, path, KEYS.point);
  const x = rd.number(item, "x_m", path, RANGES.x_m, true);
  const y = rd.number(item, "y_m", path, RANGES.y_m, true);
  const z =
    item.z_m === undefined ? receptorHeight : rd.number(item, "z_m", path, RANGES.z_m, false);
  const averaging =
    item.averaging_s === undefined
      ? DEFAULTS.point_averaging_s
      : rd.number(item, "averaging_s", path, RANGES.averaging_s, false);
  if (x === undefined || y === undefined || z === undefined || averaging === undefined) {
    return undefined;
  }
  return { x, y, z, averaging };
}

/** `points`: the valid points (empty when absent). */
export function readPoints(rd: Reader, raw: Obj, receptorHeight: number | undefined): Point[] {
  const points: Point[] = [];
  const rawPoints = rd.array(raw, "points", "", false, MAX_POINTS, "points");
  rawPoints?.forEach((item, i) => {
    const path = `points[${i}]`;
    if (!isObject(item)) {
      rd.add(path, item, "must be an object with x_m, y_m and optionally z_m, averaging_s");
      return;
    }
    const point = readPoint(rd, item, path, receptorHeight);
    if (point) points.push(point);
  });
  return points;
}

/**
 * Checks across fields: unique limit labels (bands, warnings and point results are matched
 * to their limit by label); receptor and points below the mixing lid (the reflection between
 * ground and lid describes the layer below the lid only).
 */
export function checkAcross(
  rd: Reader,
  raw: Obj,
  limits: readonly Limit[],
  mixingHeight: number | null | undefined,
  receptorHeight: number | undefined,
): void {
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
  if (typeof mixingHeight !== "number") return;
  if (typeof receptorHeight === "number" && receptorHeight >= mixingHeight) {
    rd.add(
      "receptor_height_m",
      receptorHeight,
      `must be below the mixing height (${mixingHeight} m)`,
    );
  }
  if (!Array.isArray(raw.points) || raw.points.length > MAX_POINTS) return;
  raw.points.forEach((item: unknown, i) => {
    if (isObject(item) && typeof item.z_m === "number" && item.z_m >= mixingHeight) {
      rd.add(`points[${i}].z_m`, item.z_m, `must be below the mixing height (${mixingHeight} m)`);
    }
  });
}
