/**
 * Field-by-field validation of log entries read from outside (a backup file).
 *
 * Everything read is treated as data: strings are copied, never evaluated or turned into HTML.
 * Objects are rebuilt from the known fields only, so keys such as "__proto__" cannot reach the
 * program. Limits: strings ≤ MAX_STRING chars, nesting ≤ MAX_DEPTH; the file limits are in backup.ts.
 */
import { formatProblem, ScenarioError } from "../core/errors.ts";
import { parseScenario } from "../core/scenario.ts";
import type {
  BandOutput,
  BandSpread,
  PointOutput,
  Scenario,
  SpreadVariant,
  Warning,
} from "../core/types.ts";
import { STABILITY_CLASSES } from "../core/types.ts";
import type { LogEntry, LoggedResults, Place } from "./schema.ts";

export const MAX_STRING = 10_000;
export const MAX_DEPTH = 16;
export const MAX_ID_LENGTH = 100;
const MAX_ARRAY = 10_000;

/** A rejection: the dotted field and why. */
export class Invalid extends Error {
  constructor(
    readonly field: string,
    why: string,
  ) {
    super(`${field}: ${why}`);
    this.name = "Invalid";
  }
}

type Obj = Record<string, unknown>;

function isObj(v: unknown): v is Obj {
  return typeof v === "object" && v !== null && !Array.isArray(v);
}

function shown(v: unknown): string {
  if (typeof v === "string") return JSON.stringify(v.length > 40 ? `${v.slice(0, 37)}...` : v);
  if (v === null || typeof v === "number" || typeof v === "boolean") return String(v);
  return Array.isArray(v) ? "an array" : typeof v === "object" ? "an object" : typeof v;
}

/** Deepest nesting of arrays/objects (iterative: a hostile file cannot blow the stack). */
export function depthOf(root: unknown, limit: number): number {
  let max = 0;
  const stack: [unknown, number][] = [[root, 0]];
  while (stack.length) {
    const [v, d] = stack.pop() as [unknown, number];
    if (typeof v !== "object" || v === null) continue;
    const depth = d + 1;
    if (depth > max) max = depth;
    if (max > limit) return max;
    const children = Array.isArray(v) ? v : Object.values(v as Obj);
    for (const c of children) if (typeof c === "object" && c !== null) stack.push([c, depth]);
  }
  return max;
}

/**
 * A plain JSON value copied from untrusted data: only null, booleans, finite numbers, strings
 * (≤ MAX_STRING), arrays and plain objects; "__proto__", "constructor" and "prototype" keys are
 * refused. Used for the scenario, whose own validation (parseScenario) runs on the copy.
 */
export function jsonCopy(v: unknown, field: string, depth = 0): unknown {
  if (depth > MAX_DEPTH) throw new Invalid(field, `is nested deeper than ${MAX_DEPTH} levels`);
  if (v === null || typeof v === "boolean") return v;
  if (typeof v === "number") {
    if (!Number.isFinite(v)) throw new Invalid(field, `must be a finite number (got ${shown(v)})`);
    return v;
  }
  if (typeof v === "string") return str(v, field, 0, MAX_STRING);
  if (Array.isArray(v)) {
    if (v.length > MAX_ARRAY) throw new Invalid(field, `has more than ${MAX_ARRAY} items`);
    return v.map((x, i) => jsonCopy(x, `${field}[${i}]`, depth + 1));
  }
  if (isObj(v)) {
    const out: Obj = {};
    for (const [k, x] of Object.entries(v)) {
      if (k === "__proto__" || k === "constructor" || k === "prototype") {
        throw new Invalid(`${field}.${k}`, "is not an allowed key");
      }
      str(k, `${field} key`, 0, 200);
      out[k] = jsonCopy(x, `${field}.${k}`, depth + 1);
    }
    return out;
  }
  throw new Invalid(field, `is not JSON data (got ${shown(v)})`);
}

function str(v: unknown, field: string, min = 0, max = MAX_STRING): string {
  if (typeof v !== "string") throw new Invalid(field, `must be text (got ${shown(v)})`);
  if (v.length < min)
    throw new Invalid(
      field,
      min === 1 ? "must not be empty" : `must have at least ${min} characters`,
    );
  if (v.length > max)
    throw new Invalid(field, `must be at most ${max} characters (got ${v.length})`);
  return v;
}

function num(v: unknown, field: string, lo = -Infinity, hi = Infinity): number {
  if (typeof v !== "number" || !Number.isFinite(v)) {
    throw new Invalid(field, `must be a finite number (got ${shown(v)})`);
  }
  if (v < lo || v > hi) throw new Invalid(field, `must be between ${lo} and ${hi} (got ${v})`);
  return v;
}

function numOrNull(v: unknown, field: string, lo = -Infinity, hi = Infinity): number | null {
  return v === null ? null : num(v, field, lo, hi);
}

function obj(v: unknown, field: string, allowed: readonly string[]): Obj {
  if (!isObj(v)) throw new Invalid(field, `must be an object (got ${shown(v)})`);
  for (const k of Object.keys(v)) {
    if (!allowed.includes(k)) throw new Invalid(`${field}.${k}`, "is not a known field");
  }
  return v;
}

function arr(v: unknown, field: string, max = MAX_ARRAY): unknown[] {
  if (!Array.isArray(v)) throw new Invalid(field, `must be a list (got ${shown(v)})`);
  if (v.length > max) throw new Invalid(field, `must have at most ${max} items (got ${v.length})`);
  return v;
}

// UTC as Date.toISOString writes it (the by-time index sorts these texts).
const ISO_UTC = /^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d\.\d{3}Z$/;
// Local time with an offset (or Z), seconds, optional fraction.
const ISO_LOCAL = /^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d(\.\d{1,9})?(Z|[+-]\d\d:\d\d)$/;

const ENTRY_KEYS = [
  "id",
  "time_local",
  "time_utc",
  "scenario",
  "results",
  "place",
  "model_version",
  "note",
] as const;

const BAND_KEYS = [
  "label",
  "limit_mg_m3",
  "averaging_s",
  "reach_m",
  "start_m",
  "max_width_m",
  "max_width_at_m",
  "area_m2",
  "arrives_s",
  "clears_s",
  "spread",
] as const;

const SPREAD_KEYS = [
  "reach_min_m",
  "reach_max_m",
  "width_max_m",
  "area_max_m2",
  "reach_min_variant",
  "reach_max_variant",
  "widest_variant",
] as const;

function variant(v: unknown, f: string): SpreadVariant {
  const o = obj(v, f, ["stability", "wind_speed_m_s"]);
  if (!STABILITY_CLASSES.includes(o.stability as never)) {
    throw new Invalid(`${f}.stability`, `must be one of A–F (got ${shown(o.stability)})`);
  }
  return {
    stability: o.stability as SpreadVariant["stability"],
    wind_speed_m_s: num(o.wind_speed_m_s, `${f}.wind_speed_m_s`, 0),
  };
}

function bandSpread(v: unknown, f: string): BandSpread {
  const o = obj(v, f, SPREAD_KEYS);
  return {
    reach_min_m: numOrNull(o.reach_min_m, `${f}.reach_min_m`, 0),
    reach_max_m: numOrNull(o.reach_max_m, `${f}.reach_max_m`, 0),
    width_max_m: numOrNull(o.width_max_m, `${f}.width_max_m`, 0),
    area_max_m2: numOrNull(o.area_max_m2, `${f}.area_max_m2`, 0),
    reach_min_variant: variant(o.reach_min_variant, `${f}.reach_min_variant`),
    reach_max_variant: variant(o.reach_max_variant, `${f}.reach_max_variant`),
    widest_variant: variant(o.widest_variant, `${f}.widest_variant`),
  };
}

const RESULT_KEYS = [
  "model_version",
  "caution",
  "wind_speed_used_m_s",
  "release_height_used_m",
  "effective_height_m",
  "stability_used",
  "stability_reason",
  "bands",
  "points",
  "warnings",
] as const;

function band(v: unknown, f: string): BandOutput {
  const o = obj(v, f, BAND_KEYS);
  const out: BandOutput = {
    label: str(o.label, `${f}.label`, 0, 200),
    limit_mg_m3: num(o.limit_mg_m3, `${f}.limit_mg_m3`, 0),
    averaging_s: num(o.averaging_s, `${f}.averaging_s`, 0),
    reach_m: numOrNull(o.reach_m, `${f}.reach_m`, 0),
    start_m: numOrNull(o.start_m, `${f}.start_m`, 0),
    max_width_m: numOrNull(o.max_width_m, `${f}.max_width_m`, 0),
    max_width_at_m: numOrNull(o.max_width_at_m ?? null, `${f}.max_width_at_m`, 0),
    area_m2: numOrNull(o.area_m2, `${f}.area_m2`, 0),
    arrives_s: numOrNull(o.arrives_s, `${f}.arrives_s`, 0),
    clears_s: numOrNull(o.clears_s, `${f}.clears_s`, 0),
  };
  if (o.spread !== undefined) out.spread = bandSpread(o.spread, `${f}.spread`);
  return out;
}

function warning(v: unknown, f: string): Warning {
  const o = obj(v, f, ["code", "message", "limit"]);
  const w: Warning = {
    code: str(o.code, `${f}.code`, 1, 100) as Warning["code"],
    message: str(o.message, `${f}.message`),
  };
  if (o.limit !== undefined) w.limit = str(o.limit, `${f}.limit`, 0, 200);
  return w;
}

function pointOut(v: unknown, f: string): PointOutput {
  const o = obj(v, f, [
    "x_m",
    "y_m",
    "z_m",
    "averaging_s",
    "concentration_mg_m3",
    "concentration_ppm",
    "limits",
  ]);
  return {
    x_m: num(o.x_m, `${f}.x_m`),
    y_m: num(o.y_m, `${f}.y_m`),
    z_m: num(o.z_m, `${f}.z_m`),
    averaging_s: num(o.averaging_s, `${f}.averaging_s`, 0),
    concentration_mg_m3: num(o.concentration_mg_m3, `${f}.concentration_mg_m3`, 0),
    concentration_ppm: numOrNull(o.concentration_ppm, `${f}.concentration_ppm`, 0),
    limits: arr(o.limits, `${f}.limits`, 1000).map((l, i) => {
      const lf = `${f}.limits[${i}]`;
      const lo = obj(l, lf, ["label", "arrives_s", "clears_s"]);
      return {
        label: str(lo.label, `${lf}.label`, 0, 200),
        arrives_s: numOrNull(lo.arrives_s, `${lf}.arrives_s`, 0),
        clears_s: numOrNull(lo.clears_s, `${lf}.clears_s`, 0),
      };
    }),
  };
}

function results(v: unknown, f: string): LoggedResults {
  const o = obj(v, f, RESULT_KEYS);
  const stab = o.stability_used;
  if (!STABILITY_CLASSES.includes(stab as never)) {
    throw new Invalid(`${f}.stability_used`, `must be one of A–F (got ${shown(stab)})`);
  }
  return {
    model_version: str(o.model_version, `${f}.model_version`, 1, 100),
    caution: str(o.caution, `${f}.caution`, 0, 1000),
    wind_speed_used_m_s: num(o.wind_speed_used_m_s, `${f}.wind_speed_used_m_s`, 0),
    release_height_used_m: num(o.release_height_used_m, `${f}.release_height_used_m`, 0),
    effective_height_m: num(o.effective_height_m, `${f}.effective_height_m`, 0),
    stability_used: stab as LoggedResults["stability_used"],
    stability_reason: str(o.stability_reason, `${f}.stability_reason`, 0, 1000),
    bands: arr(o.bands, `${f}.bands`, 1000).map((b, i) => band(b, `${f}.bands[${i}]`)),
    points: arr(o.points ?? [], `${f}.points`).map((p, i) => pointOut(p, `${f}.points[${i}]`)),
    warnings: arr(o.warnings, `${f}.warnings`, 1000).map((w, i) =>
      warning(w, `${f}.warnings[${i}]`),
    ),
  };
}

function place(v: unknown, f: string): Place | null {
  if (v === null || v === undefined) return null;
  const o = obj(v, f, ["lat", "lon", "accuracy_m"]);
  return {
    lat: num(o.lat, `${f}.lat`, -90, 90),
    lon: num(o.lon, `${f}.lon`, -180, 180),
    accuracy_m: numOrNull(o.accuracy_m ?? null, `${f}.accuracy_m`, 0),
  };
}

function scenario(v: unknown, f: string): Scenario {
  const copy = jsonCopy(v, f);
  try {
    parseScenario(copy);
  } catch (e) {
    if (e instanceof ScenarioError) {
      const p = e.problems[0];
      const more = e.problems.length > 1 ? ` (and ${e.problems.length - 1} more)` : "";
      if (p === undefined) throw new Invalid(f, "is not a valid scenario");
      // The core's one-line form names the value found: "field: what is allowed (got VALUE)".
      const line = formatProblem(p);
      throw new Invalid(`${f}.${p.field}`, `${line.slice(p.field.length + 2)}${more}`);
    }
    throw new Invalid(f, "is not a valid scenario");
  }
  return copy as Scenario;
}

/**
 * A log entry rebuilt from untrusted data, or an Invalid naming the first bad field.
 * @param v one element of a backup's `entries`
 */
export function validateEntry(v: unknown): LogEntry {
  const depth = depthOf(v, MAX_DEPTH + 8);
  if (depth > MAX_DEPTH + 4)
    throw new Invalid("(entry)", `is nested deeper than ${MAX_DEPTH + 4} levels`);
  const o = obj(v, "(entry)", ENTRY_KEYS);
  const id = str(o.id, "id", 1, MAX_ID_LENGTH);
  if (!/^[A-Za-z0-9._:-]+$/.test(id)) {
    throw new Invalid("id", `may contain only letters, digits and . _ : - (got ${shown(id)})`);
  }
  const timeUtc = str(o.time_utc, "time_utc", 1, 40);
  if (!ISO_UTC.test(timeUtc) || Number.isNaN(Date.parse(timeUtc))) {
    throw new Invalid("time_utc", `must be like 2024-05-01T12:03:05.123Z (got ${shown(timeUtc)})`);
  }
  const timeLocal = str(o.time_local, "time_local", 1, 40);
  const localMs = Date.parse(timeLocal);
  if (!ISO_LOCAL.test(timeLocal) || Number.isNaN(localMs)) {
    throw new Invalid(
      "time_local",
      `must be like 2024-05-01T14:03:05+02:00 (got ${shown(timeLocal)})`,
    );
  }
  if (Math.abs(localMs - Date.parse(timeUtc)) >= 1000) {
    throw new Invalid(
      "time_local",
      `must be the same instant as time_utc ${timeUtc} (got ${timeLocal})`,
    );
  }
  if (o.scenario === undefined) throw new Invalid("scenario", "is missing");
  if (o.results === undefined) throw new Invalid("results", "is missing");
  return {
    id,
    time_local: timeLocal,
    time_utc: timeUtc,
    scenario: scenario(o.scenario, "scenario"),
    results: results(o.results, "results"),
    place: place(o.place, "place"),
    model_version: str(o.model_version, "model_version", 1, 100),
    note: o.note === undefined ? "" : str(o.note, "note"),
  };
}
