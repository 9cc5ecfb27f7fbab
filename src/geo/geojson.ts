/**
 * Placing a local footprint on the earth and writing it as RFC 7946 GeoJSON.
 *
 * Pure: no DOM, no clock, no storage. Compiled with the core (src/core/index.ts imports it).
 * Local frame (model.md): x downwind (m), y crosswind positive to the LEFT looking downwind (m).
 * Output positions are [longitude, latitude] in degrees (WGS 84), at most 7 decimals (≈ 1 cm).
 */
import { destination } from "@turf/destination";
import { point } from "@turf/helpers";
import type {
  Feature,
  FeatureCollection,
  Geometry,
  LineString,
  MultiLineString,
  MultiPolygon,
  Point,
  Polygon,
  Position,
} from "geojson";
import type { BandOutput, LocalFootprint, LocalRing } from "../core/types.ts";
import {
  BAND_FILL_OPACITY,
  bandColours,
  CENTRELINE_STYLE,
  NEAR_ZONE_STYLE,
  SOURCE_COLOUR,
} from "./palette.ts";

/** The spread's envelope: the band's colour, unfilled, thinner (simplestyle has no dash). */
const SPREAD_STYLE = { "stroke-width": 1, "stroke-opacity": 0.6, "fill-opacity": 0 } as const;

// WGS 84 ellipsoid (NIMA TR8350.2, 2000): semi-major axis (m) and flattening.
const WGS84_A = 6378137;
const WGS84_F = 1 / 298.257223563;
const WGS84_E2 = WGS84_F * (2 - WGS84_F);

/** Vertices of the near-zone circle. */
export const NEAR_ZONE_VERTICES = 72;
/** Segments of the centreline (so that it follows the geodesic on any map projection). */
const CENTRELINE_SEGMENTS = 16;

/** Round a coordinate to 7 decimals (≈ 1.1 cm of latitude). */
export function round7(v: number): number {
  const r = Math.round(v * 1e7) / 1e7;
  return r === 0 ? 0 : r; // no -0 in files
}

/**
 * Longitude brought into [-180, 180] (degrees). 180 stays 180, -180 stays -180; other values wrap.
 */
export function normaliseLon(lon: number): number {
  if (lon >= -180 && lon <= 180) return lon;
  const l = ((((lon + 180) % 360) + 360) % 360) - 180;
  return l === -180 && lon > 0 ? 180 : l;
}

/**
 * Radius of curvature of the WGS 84 ellipsoid at latitude φ in the direction of a bearing α
 * (Euler's formula, 1/R = cos²α/M + sin²α/N). Turf's destination works on a sphere; dividing
 * the distance by this local radius (instead of turf's mean radius 6,371,008.8 m) keeps short
 * placements (≤ 100 km) within about 0.01% of the ellipsoidal geodesic instead of up to 0.56%.
 *
 * @param latDeg latitude (degrees)
 * @param bearingDeg bearing (degrees true)
 * @returns radius (m)
 */
export function localRadius(latDeg: number, bearingDeg: number): number {
  const phi = (latDeg * Math.PI) / 180;
  const alpha = (bearingDeg * Math.PI) / 180;
  const w = 1 - WGS84_E2 * Math.sin(phi) ** 2;
  const m = (WGS84_A * (1 - WGS84_E2)) / w ** 1.5;
  const n = WGS84_A / Math.sqrt(w);
  return 1 / (Math.cos(alpha) ** 2 / m + Math.sin(alpha) ** 2 / n);
}

/** Place (x, y) with the longitude left continuous around the source's (may pass ±180). */
function placeUnwrapped(
  source: { lat: number; lon: number },
  headingDeg: number,
  x: number,
  y: number,
): [number, number] {
  const distance = Math.hypot(x, y);
  if (!(distance > 0)) return [source.lon, source.lat];
  const bearing = headingDeg - (Math.atan2(y, x) * 180) / Math.PI;
  const radians = distance / localRadius(source.lat, bearing);
  const [lon, lat] = destination(point([source.lon, source.lat]), radians, bearing, {
    units: "radians",
  }).geometry.coordinates as [number, number];
  let dLon = lon - source.lon;
  dLon = ((((dLon + 180) % 360) + 360) % 360) - 180;
  return [source.lon + dLon, lat];
}

/**
 * Position on the earth of a point of the local footprint frame.
 *
 * @param source source position (degrees, WGS 84)
 * @param headingDeg bearing the plume travels toward (degrees true)
 * @param x downwind distance (m)
 * @param y crosswind distance, positive to the left looking downwind (m)
 * @returns [longitude, latitude] (degrees), 7 decimals at most, longitude in [-180, 180]
 * @example localToLonLat({ lat: 0, lon: 0 }, 90, 1000, 0) // → [0.0089832, 0] (1 km east)
 */
export function localToLonLat(
  source: { lat: number; lon: number },
  headingDeg: number,
  x: number,
  y: number,
): [number, number] {
  const [lon, lat] = placeUnwrapped(source, headingDeg, x, y);
  return [round7(normaliseLon(lon)), round7(lat)];
}

/** Twice the signed area of a closed ring in lon/lat (positive = counter-clockwise). */
export function ringSignedArea2(ring: readonly Position[]): number {
  let s = 0;
  for (let i = 0; i + 1 < ring.length; i++) {
    const a = ring[i] as Position;
    const b = ring[i + 1] as Position;
    s += (a[0] as number) * (b[1] as number) - (b[0] as number) * (a[1] as number);
  }
  return s;
}

function roundPos(p: Position): Position {
  return [round7(p[0] as number), round7(p[1] as number)];
}

function samePos(a: Position, b: Position): boolean {
  return a[0] === b[0] && a[1] === b[1];
}

/** Rounded, consecutive duplicates removed, closed, counter-clockwise; null if degenerate. */
function finishRing(open: Position[]): Position[] | null {
  const out: Position[] = [];
  for (const p of open) {
    const r = roundPos(p);
    const last = out[out.length - 1];
    if (!last || !samePos(last, r)) out.push(r);
  }
  while (out.length > 1 && samePos(out[0] as Position, out[out.length - 1] as Position)) out.pop();
  if (out.length < 3) return null;
  out.push(out[0] as Position);
  const a = ringSignedArea2(out);
  if (a === 0) return null;
  if (a < 0) out.reverse();
  return out;
}

/** Sutherland–Hodgman clip of an open ring against the half-plane lon ≤ cut (keep = -1) or ≥ cut (+1). */
function clipLon(ring: Position[], cut: number, keep: 1 | -1): Position[] {
  const inside = (p: Position) => keep * ((p[0] as number) - cut) >= 0;
  const out: Position[] = [];
  for (let i = 0; i < ring.length; i++) {
    const cur = ring[i] as Position;
    const prev = ring[(i + ring.length - 1) % ring.length] as Position;
    const cIn = inside(cur);
    const pIn = inside(prev);
    if (cIn !== pIn) {
      const t = (cut - (prev[0] as number)) / ((cur[0] as number) - (prev[0] as number));
      out.push([cut, (prev[1] as number) + t * ((cur[1] as number) - (prev[1] as number))]);
    }
    if (cIn) out.push(cur);
  }
  return out;
}

function shiftLon(ring: Position[], by: number): Position[] {
  return ring.map((p) => [(p[0] as number) + by, p[1] as number]);
}

/**
 * A ring of unwrapped positions as a Polygon, or as a MultiPolygon cut at the antimeridian when it
 * crosses it (RFC 7946 §3.1.9). Null when nothing is left.
 */
function ringGeometry(unwrapped: Position[]): Polygon | MultiPolygon | null {
  const lons = unwrapped.map((p) => p[0] as number);
  const maxLon = Math.max(...lons);
  const minLon = Math.min(...lons);
  if (maxLon <= 180 && minLon >= -180) {
    const r = finishRing(unwrapped);
    return r ? { type: "Polygon", coordinates: [r] } : null;
  }
  const cut = maxLon > 180 ? 180 : -180;
  const side: 1 | -1 = cut === 180 ? -1 : 1; // the side that is already in range
  const inRange = finishRing(clipLon(unwrapped, cut, side));
  const over = finishRing(
    shiftLon(clipLon(unwrapped, cut, side === 1 ? -1 : 1), cut === 180 ? -360 : 360),
  );
  const parts = [inRange, over].filter((r): r is Position[] => r !== null).map((r) => [r]);
  if (parts.length === 0) return null;
  if (parts.length === 1) return { type: "Polygon", coordinates: parts[0] as Position[][] };
  return { type: "MultiPolygon", coordinates: parts };
}

/** A polyline of unwrapped positions, cut at the antimeridian when it crosses it. */
function lineGeometry(unwrapped: Position[]): LineString | MultiLineString {
  const parts: Position[][] = [[]];
  for (let i = 0; i < unwrapped.length; i++) {
    const p = unwrapped[i] as Position;
    if (i > 0) {
      const q = unwrapped[i - 1] as Position;
      const qs = Math.floor(((q[0] as number) + 180) / 360);
      const ps = Math.floor(((p[0] as number) + 180) / 360);
      if (qs !== ps) {
        const cut = ps > qs ? 180 + 360 * qs : -180 + 360 * qs;
        const t = (cut - (q[0] as number)) / ((p[0] as number) - (q[0] as number));
        const lat = (q[1] as number) + t * ((p[1] as number) - (q[1] as number));
        (parts[parts.length - 1] as Position[]).push([normaliseLon(cut), lat]);
        parts.push([[cut > 0 ? -180 : 180, lat]]);
      }
    }
    (parts[parts.length - 1] as Position[]).push([normaliseLon(p[0] as number), p[1] as number]);
  }
  const clean = parts
    .map((line) => {
      const out: Position[] = [];
      for (const p of line) {
        const r = roundPos(p);
        const last = out[out.length - 1];
        if (!last || !samePos(last, r)) out.push(r);
      }
      return out;
    })
    .filter((l) => l.length >= 2);
  if (clean.length === 1) return { type: "LineString", coordinates: clean[0] as Position[] };
  return { type: "MultiLineString", coordinates: clean };
}

export interface FootprintGeoJSONArgs {
  footprint: LocalFootprint;
  bands: BandOutput[];
  source: { lat: number; lon: number };
  /** The inputs that matter (the scenario), copied into every feature's properties. */
  inputs: Record<string, unknown>;
  modelVersion: string;
  caution: string;
  /** ISO 8601 time stamp of the estimate, or null when not known (the core has no clock). */
  timestamp: string | null;
  /** The limit set the limits came from (name and source note), when one was used. */
  limitSet?: { name: string; source_note: string } | null;
}

/** The FeatureCollection with Driftmark's foreign members (RFC 7946 §6.1). */
export interface FootprintCollection extends FeatureCollection {
  caution: string;
  model_version: string;
  timestamp: string | null;
  /** Present when the limits came from a limit set. */
  limit_set?: { name: string; source_note: string };
}

export type FeatureKind = "source" | "spread" | "band" | "near-zone" | "centreline";

function localRingToUnwrapped(
  ring: LocalRing,
  source: { lat: number; lon: number },
  heading: number,
): Position[] {
  return ring.map(([x, y]) => placeUnwrapped(source, heading, x, y));
}

/**
 * The footprint as an RFC 7946 FeatureCollection: the source Point, one Polygon per band's spread
 * envelope (`kind: "spread"`, when the spread was solved; unfilled, before the bands so that they
 * are drawn over it), one Polygon per band (from the
 * swept outline; bands without exceedance are left out), the near-zone Polygon and the downwind
 * centreline. Exterior rings are counter-clockwise; shapes crossing the antimeridian are cut in
 * two (MultiPolygon / MultiLineString). Each feature carries `kind`, the common fields (inputs,
 * timestamp, model_version, caution) and simplestyle hints (`stroke`, `stroke-width`, `fill`,
 * `fill-opacity`) from the viridis ramp in palette.ts (darkest = highest limit).
 *
 * @example footprintGeoJSON({ footprint, bands, source: { lat: 51.5, lon: -0.1 }, inputs: scenario,
 *   modelVersion: MODEL_VERSION, caution: CAUTION, timestamp: "2024-05-01T12:00:00+01:00" })
 */
export function footprintGeoJSON(args: FootprintGeoJSONArgs): FootprintCollection {
  const { footprint, bands, source, inputs, modelVersion, caution, timestamp } = args;
  const heading = footprint.heading_deg;
  const limitSet = args.limitSet
    ? { limit_set: { name: args.limitSet.name, source_note: args.limitSet.source_note } }
    : {};
  const common = { inputs, timestamp, model_version: modelVersion, caution, ...limitSet };
  const features: Feature<Geometry>[] = [];

  const src: Feature<Point> = {
    type: "Feature",
    geometry: {
      type: "Point",
      coordinates: [round7(normaliseLon(source.lon)), round7(source.lat)],
    },
    properties: {
      kind: "source" satisfies FeatureKind,
      name: "Source",
      ...common,
      "marker-color": SOURCE_COLOUR,
    },
  };
  features.push(src);

  const colours = bandColours(bands.map((b) => b.limit_mg_m3));
  // Most severe last so that it is drawn on top by viewers that paint in order.
  const order = bands
    .map((b, i) => ({ b, i }))
    .sort((p, q) => p.b.limit_mg_m3 - q.b.limit_mg_m3 || p.i - q.i);
  // Same index as in `bands`; fall back to the label if the two lists are ever out of step.
  const localOf = (b: BandOutput, i: number) => {
    const byIndex = footprint.bands[i];
    return byIndex?.label === b.label
      ? byIndex
      : (footprint.bands.find((lb) => lb.label === b.label) ?? byIndex);
  };
  for (const { b, i } of order) {
    const envelope = localOf(b, i)?.envelope;
    if (!envelope || envelope.length < 3 || !b.spread) continue;
    const geometry = ringGeometry(localRingToUnwrapped(envelope, source, heading));
    if (!geometry) continue;
    const s = b.spread;
    features.push({
      type: "Feature",
      geometry,
      properties: {
        kind: "spread" satisfies FeatureKind,
        name: `${b.label}: spread`,
        label: b.label,
        limit_mg_m3: b.limit_mg_m3,
        averaging_s: b.averaging_s,
        reach_min_m: s.reach_min_m,
        reach_max_m: s.reach_max_m,
        width_max_m: s.width_max_m,
        area_max_m2: s.area_max_m2,
        reach_min_variant: s.reach_min_variant,
        reach_max_variant: s.reach_max_variant,
        widest_variant: s.widest_variant,
        wind_swing_deg: footprint.wind_swing_deg,
        ...common,
        stroke: colours[i] as string,
        ...SPREAD_STYLE,
      },
    });
  }
  for (const { b, i } of order) {
    const local = localOf(b, i);
    if (!local || local.swept.length < 3) continue;
    const geometry = ringGeometry(localRingToUnwrapped(local.swept, source, heading));
    if (!geometry) continue;
    const colour = colours[i] as string;
    features.push({
      type: "Feature",
      geometry,
      properties: {
        kind: "band" satisfies FeatureKind,
        name: b.label,
        label: b.label,
        limit_mg_m3: b.limit_mg_m3,
        averaging_s: b.averaging_s,
        reach_m: b.reach_m,
        start_m: b.start_m,
        max_width_m: b.max_width_m,
        area_m2: b.area_m2,
        arrives_s: b.arrives_s,
        clears_s: b.clears_s,
        wind_swing_deg: footprint.wind_swing_deg,
        ...common,
        stroke: colour,
        "stroke-width": 2,
        fill: colour,
        "fill-opacity": BAND_FILL_OPACITY,
      },
    });
  }

  if (footprint.near_zone_m > 0) {
    const ring: Position[] = [];
    for (let k = 0; k < NEAR_ZONE_VERTICES; k++) {
      const a = (2 * Math.PI * k) / NEAR_ZONE_VERTICES; // counter-clockwise from downwind
      ring.push(
        placeUnwrapped(
          source,
          heading,
          footprint.near_zone_m * Math.cos(a),
          footprint.near_zone_m * Math.sin(a),
        ),
      );
    }
    const geometry = ringGeometry(ring);
    if (geometry) {
      features.push({
        type: "Feature",
        geometry,
        properties: {
          kind: "near-zone" satisfies FeatureKind,
          name: "Near zone",
          description: "Near zone: the model does not hold here and the hazard is highest.",
          radius_m: footprint.near_zone_m,
          ...common,
          ...NEAR_ZONE_STYLE,
        },
      });
    }
  }

  if (footprint.centreline_m > 0) {
    const line: Position[] = [];
    for (let k = 0; k <= CENTRELINE_SEGMENTS; k++) {
      line.push(
        placeUnwrapped(source, heading, (footprint.centreline_m * k) / CENTRELINE_SEGMENTS, 0),
      );
    }
    features.push({
      type: "Feature",
      geometry: lineGeometry(line),
      properties: {
        kind: "centreline" satisfies FeatureKind,
        name: "Downwind centreline",
        length_m: footprint.centreline_m,
        heading_deg: heading,
        ...common,
        ...CENTRELINE_STYLE,
      },
    });
  }

  return {
    type: "FeatureCollection",
    caution,
    model_version: modelVersion,
    timestamp,
    ...limitSet,
    features,
  };
}
