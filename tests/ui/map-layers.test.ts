// The map's footprint data and layers (src/ui/map/footprint-layers.ts) and the map area display
// helpers (src/ui/map/format.ts): pure, checked on the invented demo scenario.
import type { Feature, Point, Position } from "geojson";
import { describe, expect, it } from "vitest";
import demo from "../../examples/demo.json" with { type: "json" };
import { estimate } from "../../src/core/index.ts";
import type { Scenario } from "../../src/core/types.ts";
import { VIRIDIS } from "../../src/geo/palette.ts";
import { footprintLayers, mapOverlay } from "../../src/ui/map/footprint-layers.ts";
import { formatBounds, formatBytes } from "../../src/ui/map/format.ts";

const scenario = demo as unknown as Scenario;
const out = estimate(scenario);
const shared = out.geojson;
if (!shared) throw new Error("the demo has a source, so a GeoJSON footprint");

/** The coordinates of a feature's geometry (throws when there is none). */
function coords<T>(f: Feature | undefined): T {
  if (!f || !("coordinates" in f.geometry)) throw new Error("no such feature");
  return f.geometry.coordinates as T;
}

/** Great-circle distance (m) on a sphere of 6,371,008.8 m (haversine; common practice). */
function metres(a: Position, b: Position): number {
  const r = Math.PI / 180;
  const [lon1, lat1] = a as [number, number];
  const [lon2, lat2] = b as [number, number];
  const h =
    Math.sin(((lat2 - lat1) * r) / 2) ** 2 +
    Math.cos(lat1 * r) * Math.cos(lat2 * r) * Math.sin(((lon2 - lon1) * r) / 2) ** 2;
  return 2 * 6_371_008.8 * Math.asin(Math.sqrt(h));
}

describe("mapOverlay", () => {
  const fc = mapOverlay({ footprint: shared, units: "metric" });
  const src = (shared.features.find((f) => f.properties?.kind === "source") as Feature<Point>)
    .geometry.coordinates;

  it("carries every shared feature unchanged, in order, before the map-only ones", () => {
    expect(fc.features.slice(0, shared.features.length)).toEqual(shared.features);
    const extra = fc.features.slice(shared.features.length).map((f) => f.properties?.kind);
    expect(extra.every((k) => k === "band-label" || k === "wind-arrow")).toBe(true);
  });

  it("labels each band at its far end with its name and reach", () => {
    const bands = shared.features.filter((f) => f.properties?.kind === "band");
    const labels = fc.features.filter((f) => f.properties?.kind === "band-label");
    expect(labels.length).toBe(bands.length);
    for (const [i, band] of bands.entries()) {
      const label = labels[i] as Feature<Point>;
      expect(String(label.properties?.text)).toContain(String(band.properties?.label));
      const ring = (band.geometry as { coordinates: Position[][] }).coordinates[0] as Position[];
      const far = Math.max(...ring.map((p) => metres(p, src)));
      expect(metres(label.geometry.coordinates, src)).toBeCloseTo(far, 0);
    }
  });

  it("puts the wind arrow upwind of the source, pointing downwind", () => {
    const arrow = fc.features.find(
      (f) => f.properties?.kind === "wind-arrow" && f.geometry.type === "MultiLineString",
    );
    const shaft = coords<Position[][]>(arrow)[0] as Position[];
    const [tail, tip] = shaft as [Position, Position];
    expect(metres(tip, src)).toBeLessThan(metres(tail, src));
    // Upwind: farther from the downwind end of the centreline than the source is.
    const line = shared.features.find((f) => f.properties?.kind === "centreline");
    const end = coords<Position[]>(line).at(-1) as Position;
    expect(metres(tail, end)).toBeGreaterThan(metres(src, end));
    const text = fc.features.find(
      (f) => f.properties?.kind === "wind-arrow" && f.geometry.type === "Point",
    );
    expect(text?.properties?.text).toBe("Wind from WSW"); // demo wind from 250°
  });

  it("adds the device position with an accuracy circle of that radius", () => {
    const withPos = mapOverlay({
      footprint: shared,
      units: "metric",
      position: { lat: 47.001, lon: 8.002, accuracyM: 35 },
    });
    const circle = withPos.features.find((f) => f.properties?.kind === "position-accuracy");
    const ring = coords<Position[][]>(circle)[0] as Position[];
    for (const p of ring) expect(metres(p, [8.002, 47.001])).toBeCloseTo(35, 0);
    expect(withPos.features.some((f) => f.properties?.kind === "position")).toBe(true);
  });
});

describe("footprintLayers", () => {
  it("takes band colours from the features (the palette), never its own", () => {
    for (const night of [false, true]) {
      const text = JSON.stringify(footprintLayers(night)).toLowerCase();
      for (const c of VIRIDIS) expect(text).not.toContain(c.toLowerCase());
      expect(text).toContain('["get","fill"]');
      expect(text).toContain('["get","stroke"]');
    }
  });

  it("draws spread outlines dashed when present", () => {
    const spread = footprintLayers(false).find((l) => l.id === "fp-spread");
    expect(spread?.type).toBe("line");
    expect(JSON.stringify(spread)).toContain('["get","kind"],"spread"');
    expect(spread?.paint).toHaveProperty("line-dasharray");
  });
});

describe("map area display", () => {
  it("formats sizes in decimal units, three digits", () => {
    expect(formatBytes(0)).toBe("0 bytes");
    expect(formatBytes(999)).toBe("999 bytes");
    expect(formatBytes(41_812)).toBe("41.8 kB");
    expect(formatBytes(999_600)).toBe("1 MB");
    expect(formatBytes(73_400_000)).toBe("73.4 MB");
    expect(formatBytes(Number.NaN)).toBe("unknown size");
  });

  it("formats bounds with hemispheres", () => {
    expect(formatBounds([-0.5, 51.25, 0.25, 51.75])).toBe("51.25° N – 51.75° N, 0.5° W – 0.25° E");
  });
});
