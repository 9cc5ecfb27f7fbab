/**
 * The log database: its typed schema, its version and its history.
 *
 * Version history (migrations live only in `upgrade`, see log.ts):
 * - v1 (first layout): store `estimates`, key path `id`, no index; entries had no `note`.
 * - v2: index `by-time` on [time_utc, id] (newest-first paging, stable for equal times);
 *   every entry has a `note` ("" when none was given; v1 entries get "").
 * - v3 (current): new store `limit-sets` (key path `id`, index `by-name` on `name`); the log's
 *   entries are untouched.
 */
import type { DBSchema } from "idb";
import type { EstimateOutput, Scenario } from "../core/types.ts";
import type { LimitSet } from "./limit-sets.ts";

export const DB_NAME = "driftmark";
export const DB_VERSION = 3;
export const STORE = "estimates";
export const TIME_INDEX = "by-time";
export const LIMIT_SETS_STORE = "limit-sets";
export const NAME_INDEX = "by-name";

/** Where the estimate was made, when known. */
export interface Place {
  /** Degrees, WGS 84. */
  lat: number;
  lon: number;
  /** Horizontal accuracy (m) as reported by the device; null when typed in or not known. */
  accuracy_m: number | null;
}

/**
 * The results kept with an entry: everything of EstimateOutput except the geometry
 * (`footprint` rings and `geojson`). The geometry is large (hundreds of points per band) and is
 * recomputed from `scenario` when the footprint is needed again; the figures a responder acts on
 * (bands, points, warnings, stability, model version) are kept exactly as they were shown.
 */
export type LoggedResults = Omit<EstimateOutput, "footprint" | "geojson">;

/** One logged estimate. Never edited: only added or deleted (glossary: Log). */
export interface LogEntry {
  /** Random UUID (crypto.randomUUID) or an id from an imported backup. */
  id: string;
  /** ISO 8601 with the device's local offset, e.g. 2024-05-01T14:03:05+02:00. */
  time_local: string;
  /** ISO 8601 in UTC as Date.toISOString writes it, e.g. 2024-05-01T12:03:05.123Z. */
  time_utc: string;
  /** The complete inputs, as entered. */
  scenario: Scenario;
  results: LoggedResults;
  place: Place | null;
  model_version: string;
  /** Free text (who, where); "" when none. */
  note: string;
}

/** The entry layout of schema v1 (kept for the migration and its test). */
export type LogEntryV1 = Omit<LogEntry, "note">;

export interface DriftmarkDB extends DBSchema {
  estimates: {
    key: string;
    value: LogEntry;
    indexes: { "by-time": [string, string] };
  };
  "limit-sets": {
    key: string;
    value: LimitSet;
    indexes: { "by-name": string };
  };
}

/** The results to keep from an estimate (see LoggedResults). */
export function loggedResults(out: EstimateOutput): LoggedResults {
  return {
    model_version: out.model_version,
    caution: out.caution,
    wind_speed_used_m_s: out.wind_speed_used_m_s,
    release_height_used_m: out.release_height_used_m,
    effective_height_m: out.effective_height_m,
    stability_used: out.stability_used,
    stability_reason: out.stability_reason,
    bands: out.bands,
    points: out.points,
    warnings: out.warnings,
  };
}
