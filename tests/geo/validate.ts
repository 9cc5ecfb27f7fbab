// Shared checks for every GeoJSON file Driftmark writes (used by geo and export tests).
import { check } from "@placemarkio/check-geojson";
import { booleanValid } from "@turf/boolean-valid";
import type { FeatureCollection, Geometry, Position } from "geojson";
import { expect } from "vitest";
import { ringSignedArea2 } from "../../src/geo/geojson.ts";

/** Every position of a geometry. */
export function positionsOf(g: Geometry): Position[] {
  switch (g.type) {
    case "Point":
      return [g.coordinates];
    case "LineString":
    case "MultiPoint":
      return g.coordinates;
    case "Polygon":
    case "MultiLineString":
      return g.coordinates.flat();
    case "MultiPolygon":
      return g.coordinates.flat(2);
    case "GeometryCollection":
      return g.geometries.flatMap(positionsOf);
  }
}

/** Exterior rings of a (Multi)Polygon, or none. */
export function exteriorRings(g: Geometry): Position[][] {
  if (g.type === "Polygon") return g.coordinates.slice(0, 1);
  if (g.type === "MultiPolygon") return g.coordinates.map((p) => p[0] as Position[]);
  return [];
}

function decimals(v: number): number {
  // JavaScript writes small numbers in exponent form: 8e-7 has 7 decimals, 1.5e-7 has 8.
  const [mantissa = "", exp = "0"] = String(v).split("e");
  const i = mantissa.indexOf(".");
  const inMantissa = i < 0 ? 0 : mantissa.length - i - 1;
  return Math.max(0, inMantissa - Number(exp));
}

/**
 * Asserts the RFC 7946 rules we promise: passes @placemarkio/check-geojson (an independent
 * validator) and turf's booleanValid; exterior rings counter-clockwise (RFC 7946 §3.1.6);
 * at most 7 decimals; longitudes in [-180, 180], latitudes in [-90, 90]; rings closed.
 */
export function expectValidFootprintFile(fc: FeatureCollection): void {
  const text = JSON.stringify(fc);
  expect(() => check(text)).not.toThrow();
  for (const f of fc.features) {
    expect(f.geometry, "feature without geometry").toBeTruthy();
    const g = f.geometry as Geometry;
    expect(booleanValid(g), `${g.type} of ${String(f.properties?.kind)} is valid (turf)`).toBe(
      true,
    );
    for (const p of positionsOf(g)) {
      expect(p.length).toBe(2);
      const [lon, lat] = p as [number, number];
      expect(Number.isFinite(lon) && Number.isFinite(lat)).toBe(true);
      expect(lon).toBeGreaterThanOrEqual(-180);
      expect(lon).toBeLessThanOrEqual(180);
      expect(lat).toBeGreaterThanOrEqual(-90);
      expect(lat).toBeLessThanOrEqual(90);
      expect(decimals(lon)).toBeLessThanOrEqual(7);
      expect(decimals(lat)).toBeLessThanOrEqual(7);
    }
    for (const ring of exteriorRings(g)) {
      expect(ring.length).toBeGreaterThanOrEqual(4);
      expect(ring[0]).toEqual(ring[ring.length - 1]);
      expect(ringSignedArea2(ring), "exterior ring counter-clockwise").toBeGreaterThan(0);
    }
  }
}
