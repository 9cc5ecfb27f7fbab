/**
 * The footprint on the map: the map's footprint source is the same RFC 7946 FeatureCollection that
 * Share exports (src/geo/geojson.ts, colours from src/geo/palette.ts carried in each feature's
 * simplestyle properties), plus a few features drawn from it for the map only: a label point at
 * each band's far end, the wind arrow by the source, and the device position with its accuracy.
 * Pure: no DOM, no map library (only its style types).
 */
import type { Feature, FeatureCollection, Geometry, Point, Polygon, Position } from "geojson";
import type { LayerSpecification } from "maplibre-gl";
import { localToLonLat } from "../../geo/geojson.ts";
import { compassPoint, formatReach, type UnitSystem } from "../units.ts";

export const FOOTPRINT_SOURCE = "driftmark-footprint";

/** Kinds added for the map only (never shared). */
export type MapOnlyKind = "band-label" | "wind-arrow" | "position" | "position-accuracy";

export interface MapOverlayArgs {
  /** The shared footprint (FeatureCollection from footprintGeoJSON), extra features allowed. */
  footprint: FeatureCollection;
  units: UnitSystem;
  /** The device's position (degrees) and accuracy (m), when known. */
  position?: { lat: number; lon: number; accuracyM: number } | null;
}

function ringsOf(g: Geometry): Position[][] {
  if (g.type === "Polygon") return g.coordinates.map((r) => r);
  if (g.type === "MultiPolygon") return g.coordinates.flat();
  return [];
}

/** Squared distance in a local flat frame (good enough to pick the farthest vertex). */
function far2(a: Position, b: Position): number {
  const k = Math.cos(((b[1] as number) * Math.PI) / 180);
  return (
    (((a[0] as number) - (b[0] as number)) * k) ** 2 + ((a[1] as number) - (b[1] as number)) ** 2
  );
}

/**
 * The map's footprint data: the shared features as they are, then the map-only ones.
 * @returns a FeatureCollection for the footprint source
 */
export function mapOverlay({ footprint, units, position }: MapOverlayArgs): FeatureCollection {
  const features: Feature[] = [...footprint.features];
  const source = footprint.features.find((f) => f.properties?.kind === "source")?.geometry as
    | Point
    | undefined;
  const centreline = footprint.features.find((f) => f.properties?.kind === "centreline");
  const nearZone = footprint.features.find((f) => f.properties?.kind === "near-zone");
  if (source) {
    const src = source.coordinates;
    for (const f of footprint.features) {
      if (f.properties?.kind !== "band") continue;
      let best: Position | null = null;
      for (const ring of ringsOf(f.geometry)) {
        for (const p of ring) if (!best || far2(p, src) > far2(best, src)) best = p;
      }
      if (!best) continue;
      const reach = typeof f.properties.reach_m === "number" ? f.properties.reach_m : null;
      features.push({
        type: "Feature",
        geometry: { type: "Point", coordinates: best },
        properties: {
          kind: "band-label" satisfies MapOnlyKind,
          text: `${String(f.properties.label ?? f.properties.name ?? "")}\n${formatReach(reach, units)}`,
          stroke: f.properties.stroke,
        },
      });
    }
    const heading = centreline?.properties?.heading_deg;
    if (typeof heading === "number") {
      const r = Math.max(60, Number(nearZone?.properties?.radius_m ?? 100));
      const at = { lon: src[0] as number, lat: src[1] as number };
      const p = (x: number, y: number) => localToLonLat(at, heading, x, y);
      const tail = -2.6 * r;
      const tip = -1.25 * r;
      const head = 0.35 * r;
      features.push({
        type: "Feature",
        geometry: {
          type: "MultiLineString",
          coordinates: [
            [p(tail, 0), p(tip, 0)],
            [p(tip - head, head * 0.6), p(tip, 0), p(tip - head, -head * 0.6)],
          ],
        },
        properties: { kind: "wind-arrow" satisfies MapOnlyKind },
      });
      features.push({
        type: "Feature",
        geometry: { type: "Point", coordinates: p(tail, 0) },
        properties: {
          kind: "wind-arrow",
          text: `Wind from ${compassPoint((heading + 180) % 360)}`,
        },
      });
    }
  }
  if (position) {
    features.push(accuracyCircle(position));
    features.push({
      type: "Feature",
      geometry: { type: "Point", coordinates: [position.lon, position.lat] },
      properties: { kind: "position" satisfies MapOnlyKind, text: "You" },
    });
  }
  return { type: "FeatureCollection", features };
}

function accuracyCircle(p: { lat: number; lon: number; accuracyM: number }): Feature<Polygon> {
  const ring: Position[] = [];
  const n = 48;
  for (let k = 0; k <= n; k++) {
    const a = (360 * (k % n)) / n;
    ring.push(localToLonLat(p, a, Math.max(1, p.accuracyM), 0));
  }
  return {
    type: "Feature",
    geometry: { type: "Polygon", coordinates: [ring] },
    properties: { kind: "position-accuracy" satisfies MapOnlyKind, radius_m: p.accuracyM },
  };
}

const kind = (k: string) => ["==", ["get", "kind"], k] as ["==", ["get", string], string];

/**
 * The footprint layers, drawn over the base map in this order: band fills, spread outlines, band
 * outlines, near zone, centreline, wind arrow, position, source, labels.
 * @param night night theme (light text on a dark halo)
 */
export function footprintLayers(night: boolean): LayerSpecification[] {
  const ink = night ? "#f2f2f2" : "#111111";
  const halo = night ? "#111111" : "#ffffff";
  const s = FOOTPRINT_SOURCE;
  const text = { "text-font": ["Noto Sans Regular"], "text-size": 13 };
  const textPaint = { "text-color": ink, "text-halo-color": halo, "text-halo-width": 2 };
  return [
    {
      id: "fp-band-fill",
      type: "fill",
      source: s,
      filter: kind("band"),
      paint: { "fill-color": ["get", "fill"], "fill-opacity": ["get", "fill-opacity"] },
    },
    {
      id: "fp-spread",
      type: "line",
      source: s,
      filter: kind("spread"),
      paint: {
        "line-color": ["coalesce", ["get", "stroke"], ink],
        "line-width": 1.5,
        "line-opacity": 0.6,
        "line-dasharray": [3, 3],
      },
    },
    {
      id: "fp-band-casing",
      type: "line",
      source: s,
      filter: kind("band"),
      paint: { "line-color": halo, "line-width": ["+", ["get", "stroke-width"], 2] },
    },
    {
      id: "fp-band-line",
      type: "line",
      source: s,
      filter: kind("band"),
      paint: { "line-color": ["get", "stroke"], "line-width": ["get", "stroke-width"] },
    },
    {
      id: "fp-near-zone-fill",
      type: "fill",
      source: s,
      filter: kind("near-zone"),
      paint: { "fill-color": ink, "fill-opacity": 0.12 },
    },
    {
      id: "fp-near-zone-casing",
      type: "line",
      source: s,
      filter: kind("near-zone"),
      paint: { "line-color": halo, "line-width": 5 },
    },
    {
      id: "fp-near-zone-line",
      type: "line",
      source: s,
      filter: kind("near-zone"),
      paint: { "line-color": ink, "line-width": 2.5 },
    },
    {
      id: "fp-centreline",
      type: "line",
      source: s,
      filter: kind("centreline"),
      paint: { "line-color": ink, "line-width": 1.5, "line-dasharray": [4, 3] },
    },
    {
      id: "fp-wind-arrow",
      type: "line",
      source: s,
      filter: ["all", kind("wind-arrow"), ["==", ["geometry-type"], "MultiLineString"]],
      layout: { "line-cap": "round", "line-join": "round" },
      paint: { "line-color": ink, "line-width": 3 },
    },
    {
      id: "fp-position-accuracy",
      type: "fill",
      source: s,
      filter: kind("position-accuracy"),
      paint: { "fill-color": "#1f6fd1", "fill-opacity": 0.15, "fill-outline-color": "#1f6fd1" },
    },
    {
      id: "fp-position",
      type: "circle",
      source: s,
      filter: kind("position"),
      paint: {
        "circle-radius": 7,
        "circle-color": "#1f6fd1",
        "circle-stroke-color": "#ffffff",
        "circle-stroke-width": 2,
      },
    },
    {
      id: "fp-place",
      type: "circle",
      source: s,
      filter: kind("place"),
      paint: {
        "circle-radius": 6,
        "circle-color": halo,
        "circle-stroke-color": ink,
        "circle-stroke-width": 3,
      },
    },
    {
      id: "fp-source",
      type: "circle",
      source: s,
      filter: kind("source"),
      paint: {
        "circle-radius": 6,
        "circle-color": ink,
        "circle-stroke-color": halo,
        "circle-stroke-width": 2,
      },
    },
    {
      id: "fp-labels",
      type: "symbol",
      source: s,
      filter: [
        "any",
        kind("band-label"),
        kind("position"),
        ["all", kind("wind-arrow"), ["==", ["geometry-type"], "Point"]],
      ],
      layout: {
        ...text,
        "text-field": ["get", "text"],
        "text-anchor": "top",
        "text-offset": [0, 0.6],
      },
      paint: textPaint,
    },
    {
      id: "fp-point-labels",
      type: "symbol",
      source: s,
      filter: ["any", kind("source"), kind("place")],
      layout: {
        ...text,
        "text-field": ["get", "name"],
        "text-anchor": "left",
        "text-offset": [0.9, 0],
        "text-allow-overlap": true,
      },
      paint: textPaint,
    },
  ];
}
