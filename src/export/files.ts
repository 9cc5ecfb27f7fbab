/**
 * The contents of the files Driftmark hands out: one footprint as GeoJSON, the log as a JSON backup
 * and as GeoJSON. Pure (no DOM): the clock is passed in.
 */
import type { FeatureCollection } from "geojson";
import { CAUTION, MODEL_VERSION } from "../core/caution.ts";
import type { EstimateOutput, Scenario } from "../core/types.ts";
import { type FootprintCollection, footprintGeoJSON, round7 } from "../geo/geojson.ts";
import { SOURCE_COLOUR } from "../geo/palette.ts";
import { backupFileName, makeBackup } from "../storage/backup.ts";
import type { LogEntry } from "../storage/schema.ts";
import { fileStamp } from "../storage/time.ts";

/** RFC 7946 §12 media type. */
export const GEOJSON_MIME = "application/geo+json";
export const JSON_MIME = "application/json";

export interface OutFile {
  name: string;
  mime: string;
  text: string;
}

/** driftmark-footprint-YYYYMMDD-HHMMSS.geojson from the estimate's local time stamp. */
export function footprintFileName(timeLocal: string): string {
  return `driftmark-footprint-${fileStamp(timeLocal)}.geojson`;
}

/**
 * The footprint collection that Share exports (and the map draws). Needs a source position
 * (scenario.source); null without one.
 * @param timeLocal the estimate's time stamp (ISO 8601 with offset), or null when not logged
 */
export function footprintCollection(
  scenario: Scenario,
  result: EstimateOutput,
  timeLocal: string | null,
): FootprintCollection | null {
  const source = scenario.source;
  if (!source) return null;
  return footprintGeoJSON({
    footprint: result.footprint,
    bands: result.bands,
    source,
    inputs: scenario as unknown as Record<string, unknown>,
    modelVersion: result.model_version,
    caution: CAUTION,
    timestamp: timeLocal,
    limitSet: result.limit_set ?? scenario.limit_set ?? null,
  });
}

/**
 * One footprint as a GeoJSON file. Needs a source position (scenario.source); null without one.
 * @param timeLocal the estimate's time stamp (ISO 8601 with offset), written into every feature
 */
export function footprintFile(
  scenario: Scenario,
  result: EstimateOutput,
  timeLocal: string,
): { file: OutFile; geojson: FootprintCollection } | null {
  const geojson = footprintCollection(scenario, result, timeLocal);
  if (!geojson) return null;
  return {
    geojson,
    file: {
      name: footprintFileName(timeLocal),
      mime: GEOJSON_MIME,
      text: `${JSON.stringify(geojson, null, 1)}\n`,
    },
  };
}

/** The JSON backup of some entries as a file. */
export function backupFile(entries: LogEntry[], now: Date): OutFile {
  return {
    name: backupFileName(now),
    mime: JSON_MIME,
    text: `${JSON.stringify(makeBackup(entries, now))}\n`,
  };
}

/**
 * The log as one FeatureCollection: a Point per entry that has a place, carrying the entry's
 * time, note, model version, caution and each band's figures. Entries without a place are left
 * out (they cannot be put on a map). Footprint polygons are not included: a log entry keeps the
 * figures as shown, and re-drawing its polygons with a newer model could disagree with them.
 */
export function logGeoJSON(
  entries: readonly LogEntry[],
  now: Date,
): FeatureCollection & {
  caution: string;
  model_version: string;
  exported_utc: string;
} {
  return {
    type: "FeatureCollection",
    caution: CAUTION,
    model_version: MODEL_VERSION,
    exported_utc: now.toISOString(),
    features: entries
      .filter((e) => e.place !== null)
      .map((e) => {
        const place = e.place as NonNullable<LogEntry["place"]>;
        const reaches = e.results.bands
          .map((b) => b.reach_m)
          .filter((r): r is number => r !== null);
        return {
          type: "Feature" as const,
          id: e.id,
          geometry: { type: "Point" as const, coordinates: [round7(place.lon), round7(place.lat)] },
          properties: {
            kind: "logged-estimate",
            id: e.id,
            time_local: e.time_local,
            time_utc: e.time_utc,
            note: e.note,
            place_accuracy_m: place.accuracy_m,
            model_version: e.model_version,
            caution: CAUTION,
            stability_used: e.results.stability_used,
            wind_from_deg: e.scenario.weather.wind_from_deg,
            wind_speed_m_s: e.scenario.weather.wind_speed_m_s,
            longest_reach_m: reaches.length ? Math.max(...reaches) : null,
            bands: e.results.bands.map((b) => ({
              label: b.label,
              limit_mg_m3: b.limit_mg_m3,
              averaging_s: b.averaging_s,
              reach_m: b.reach_m,
              max_width_m: b.max_width_m,
              area_m2: b.area_m2,
            })),
            warnings: e.results.warnings.map((w) => w.code),
            "marker-color": SOURCE_COLOUR,
          },
        };
      }),
  };
}

/** driftmark-log-YYYYMMDD-HHMMSS.geojson (UTC). */
export function logGeoJSONFileName(now: Date): string {
  return backupFileName(now).replace(/\.json$/, ".geojson");
}
