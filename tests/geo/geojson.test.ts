import { area } from "@turf/area";
import { booleanPointInPolygon } from "@turf/boolean-point-in-polygon";
import { Geodesic } from "geographiclib-geodesic";
import type { Feature, Polygon, Position } from "geojson";
import { describe, expect, it } from "vitest";
import { CAUTION, MODEL_VERSION } from "../../src/core/caution.ts";
import type { BandOutput, LocalFootprint, LocalRing } from "../../src/core/types.ts";
import {
  footprintGeoJSON,
  localToLonLat,
  NEAR_ZONE_VERTICES,
  normaliseLon,
} from "../../src/geo/geojson.ts";
import { bandColours, VIRIDIS } from "../../src/geo/palette.ts";
import { expectValidFootprintFile, positionsOf } from "./validate.ts";

// Reference: C. F. F. Karney (2013), "Algorithms for geodesics", J. Geodesy 87:43–55, as
// implemented in geographiclib-geodesic (Geodesic.WGS84.Direct / Inverse). The 0.5% tolerance is
// the requirement of issue 4.
const geod = Geodesic.WGS84;

function errorMetres(a: [number, number], latRef: number, lonRef: number): number {
  return geod.Inverse(a[1], a[0], latRef, lonRef).s12 as number;
}

describe("localToLonLat agrees with the ellipsoidal geodesic (Karney 2013)", () => {
  const lats = [-85, -60, -30, 0, 0.5, 30, 47, 60, 85];
  const lons = [-179.9999, -120, 0, 8, 179.9999];
  const bearings = [0, 37, 90, 135, 180, 225, 270, 333];
  const distances = [10, 100, 1000, 10_000, 50_000];
  it("places downwind points (y = 0) within 0.5% of the distance", () => {
    let worst = 0;
    for (const lat of lats)
      for (const lon of lons)
        for (const b of bearings)
          for (const d of distances) {
            const ours = localToLonLat({ lat, lon }, b, d, 0);
            const ref = geod.Direct(lat, lon, b, d);
            const e = errorMetres(ours, ref.lat2 as number, ref.lon2 as number) / d;
            worst = Math.max(worst, e);
            expect(e, `lat ${lat} lon ${lon} bearing ${b} d ${d}`).toBeLessThan(0.005);
          }
    expect(worst).toBeGreaterThan(0); // the comparison did measure something
  });

  it("puts positive y to the left looking downwind (model.md): bearing = heading − atan2(y, x)", () => {
    for (const heading of [0, 90, 200, 359]) {
      for (const [x, y] of [
        [0, 500],
        [0, -500],
        [300, 400],
        [-300, 400],
        [1000, -2000],
      ] as [number, number][]) {
        const d = Math.hypot(x, y);
        const bearing = heading - (Math.atan2(y, x) * 180) / Math.PI;
        const ref = geod.Direct(47, 8, bearing, d);
        const ours = localToLonLat({ lat: 47, lon: 8 }, heading, x, y);
        expect(errorMetres(ours, ref.lat2 as number, ref.lon2 as number) / d).toBeLessThan(0.005);
      }
    }
    // Looking north (heading 0), left is west: the longitude decreases.
    expect(localToLonLat({ lat: 47, lon: 8 }, 0, 0, 1000)[0]).toBeLessThan(8);
  });

  it("returns longitudes in [-180, 180] across the antimeridian", () => {
    const east = localToLonLat({ lat: 10, lon: 179.995 }, 90, 5000, 0);
    expect(east[0]).toBeLessThan(-179.9);
    const west = localToLonLat({ lat: 10, lon: -179.995 }, 270, 5000, 0);
    expect(west[0]).toBeGreaterThan(179.9);
    expect(normaliseLon(540)).toBe(180);
    expect(normaliseLon(-190)).toBe(170);
    expect(normaliseLon(180)).toBe(180);
    expect(normaliseLon(-180)).toBe(-180);
  });

  it("returns the source itself for x = y = 0", () => {
    expect(localToLonLat({ lat: 47.123456789, lon: 8.5 }, 45, 0, 0)).toEqual([8.5, 47.1234568]);
  });
});

// A synthetic footprint: a teardrop band (like a plume outline, counter-clockwise in x-y), a wider
// lower band, and one band with no exceedance (empty ring).
function teardrop(reach: number, halfWidth: number, n = 40): LocalRing {
  const right: [number, number][] = [];
  for (let i = 0; i <= n; i++) {
    const x = (reach * i) / n;
    const w = halfWidth * Math.sin((Math.PI * i) / n) ** 0.7;
    right.push([x, -w]);
  }
  const left = right
    .slice(1, -1)
    .reverse()
    .map(([x, y]) => [x, -y] as [number, number]);
  return [...right, ...left];
}

function band(label: string, limit: number, reach: number | null): BandOutput {
  return {
    label,
    limit_mg_m3: limit,
    averaging_s: 600,
    reach_m: reach,
    start_m: reach === null ? null : 0,
    max_width_m: reach === null ? null : reach / 5,
    max_width_at_m: reach === null ? null : reach / 2,
    area_m2: reach === null ? null : reach * reach * 0.1,
    arrives_s: reach === null ? null : 60,
    clears_s: null,
  };
}

function synthetic(heading: number): { footprint: LocalFootprint; bands: BandOutput[] } {
  return {
    footprint: {
      heading_deg: heading,
      wind_swing_deg: 10,
      near_zone_m: 100,
      centreline_m: 8000,
      bands: [
        { label: "Low", outline: teardrop(8000, 800), swept: teardrop(8000, 1400) },
        { label: "High", outline: teardrop(2000, 200), swept: teardrop(2000, 400) },
        { label: "None", outline: [], swept: [] },
      ],
    },
    bands: [band("Low", 5, 8000), band("High", 200, 2000), band("None", 5000, null)],
  };
}

function build(source: { lat: number; lon: number }, heading = 70) {
  const { footprint, bands } = synthetic(heading);
  return footprintGeoJSON({
    footprint,
    bands,
    source,
    inputs: { note: "<script>alert(1)</script>" },
    modelVersion: MODEL_VERSION,
    caution: CAUTION,
    timestamp: "2024-05-01T12:00:00+02:00",
  });
}

describe("footprintGeoJSON", () => {
  it("writes a valid RFC 7946 file: source, one polygon per band with exceedance, near zone, centreline", () => {
    const fc = build({ lat: 47, lon: 8 });
    expectValidFootprintFile(fc);
    const kinds = fc.features.map((f) => f.properties?.kind);
    expect(kinds.filter((k) => k === "source")).toHaveLength(1);
    expect(kinds.filter((k) => k === "band")).toHaveLength(2); // "None" has no ring
    expect(kinds.filter((k) => k === "near-zone")).toHaveLength(1);
    expect(kinds.filter((k) => k === "centreline")).toHaveLength(1);
  });

  it("carries caution, model version, time stamp and inputs on every feature and on the collection", () => {
    const fc = build({ lat: 47, lon: 8 });
    expect(fc.caution).toBe(CAUTION);
    expect(fc.model_version).toBe(MODEL_VERSION);
    for (const f of fc.features) {
      expect(f.properties?.caution).toBe(CAUTION);
      expect(f.properties?.model_version).toBe(MODEL_VERSION);
      expect(f.properties?.timestamp).toBe("2024-05-01T12:00:00+02:00");
      expect(f.properties?.inputs).toEqual({ note: "<script>alert(1)</script>" });
    }
    const high = fc.features.find((f) => f.properties?.label === "High");
    expect(high?.properties).toMatchObject({ limit_mg_m3: 200, reach_m: 2000, averaging_s: 600 });
  });

  it("gives the darkest ramp colour to the highest limit and distinct colours to the others", () => {
    const fc = build({ lat: 47, lon: 8 });
    const fill = (label: string) =>
      fc.features.find((f) => f.properties?.label === label)?.properties?.fill;
    // Colours are ranked over all bands (also those not drawn) so screen and file agree.
    expect(bandColours([5, 200, 5000])[2]).toBe(VIRIDIS[0]);
    expect(fill("High")).toBe(bandColours([5, 200, 5000])[1]);
    expect(fill("Low")).toBe(bandColours([5, 200, 5000])[0]);
    const lum = (hex: string) => {
      const n = Number.parseInt(hex.slice(1), 16);
      // Rec. 709 luma weights (ITU-R BT.709).
      return 0.2126 * ((n >> 16) & 255) + 0.7152 * ((n >> 8) & 255) + 0.0722 * (n & 255);
    };
    expect(lum(fill("High"))).toBeLessThan(lum(fill("Low")));
    const cols = bandColours([1, 10, 100, 1000]);
    for (let i = 0; i + 1 < cols.length; i++) {
      expect(lum(cols[i] as string)).toBeGreaterThan(lum(cols[i + 1] as string));
    }
  });

  it("points the band downwind: the band holds a point 1 km along the heading, not 1 km upwind", () => {
    const source = { lat: 47, lon: 8 };
    const fc = build(source, 70);
    const low = fc.features.find((f) => f.properties?.label === "Low") as Feature<Polygon>;
    const down = localToLonLat(source, 70, 1000, 0);
    const up = localToLonLat(source, 70, -1000, 0);
    expect(booleanPointInPolygon(down, low)).toBe(true);
    expect(booleanPointInPolygon(up, low)).toBe(false);
  });

  it("keeps the area of the local ring (turf area on the sphere, within 1%)", () => {
    const fc = build({ lat: 47, lon: 8 });
    const high = fc.features.find((f) => f.properties?.label === "High") as Feature<Polygon>;
    const ring = teardrop(2000, 400);
    let a2 = 0;
    for (let i = 0; i < ring.length; i++) {
      const p = ring[i] as [number, number];
      const q = ring[(i + 1) % ring.length] as [number, number];
      a2 += p[0] * q[1] - q[0] * p[1];
    }
    expect(Math.abs(area(high) / (a2 / 2) - 1)).toBeLessThan(0.01);
  });

  it("draws the near zone as a 72-vertex circle of the near-zone radius", () => {
    const source = { lat: 47, lon: 8 };
    const fc = build(source);
    const nz = fc.features.find((f) => f.properties?.kind === "near-zone") as Feature<Polygon>;
    const ring = nz.geometry.coordinates[0] as Position[];
    expect(ring).toHaveLength(NEAR_ZONE_VERTICES + 1);
    for (const p of ring) {
      const d = geod.Inverse(47, 8, p[1] as number, p[0] as number).s12 as number;
      expect(Math.abs(d - 100)).toBeLessThan(0.5);
    }
  });

  it("cuts shapes that cross the antimeridian in two (RFC 7946 §3.1.9), and stays valid", () => {
    const fc = build({ lat: -16.5, lon: 179.97 }, 90);
    expectValidFootprintFile(fc);
    const low = fc.features.find((f) => f.properties?.label === "Low");
    expect(low?.geometry.type).toBe("MultiPolygon");
    expect(fc.features.find((f) => f.properties?.kind === "centreline")?.geometry.type).toBe(
      "MultiLineString",
    );
    // No segment jumps across the map: consecutive longitudes differ by less than 1°.
    for (const f of fc.features) {
      if (f.geometry.type === "MultiPolygon") {
        for (const poly of f.geometry.coordinates) {
          const ring = poly[0] as Position[];
          for (let i = 1; i < ring.length; i++) {
            const a = ring[i - 1] as Position;
            const b = ring[i] as Position;
            expect(Math.abs((a[0] as number) - (b[0] as number))).toBeLessThan(1);
          }
        }
      }
    }
  });

  it("stays valid near the poles (±85°) and for every heading", () => {
    for (const lat of [-85, 85]) {
      for (const heading of [0, 90, 180, 270, 315]) {
        const fc = build({ lat, lon: -60 }, heading);
        expectValidFootprintFile(fc);
        expect(positionsOf(fc.features[0]?.geometry as never)).toEqual([[-60, lat]]);
      }
    }
  });
});

describe("the limit set used travels with the estimate and its GeoJSON", () => {
  it("is in the output, on the collection and on every feature; absent when none was used", async () => {
    const { estimate } = await import("../../src/core/index.ts");
    const demo = (await import("../../examples/demo.json", { with: { type: "json" } })).default;
    const used = { name: "Substance X (invented demo)", source_note: "Invented list, rev. 1" };
    const out = estimate({ ...demo, limit_set: used });
    expect(out.limit_set).toEqual(used);
    const fc = out.geojson as unknown as { limit_set?: unknown; features: Feature[] };
    expect(fc.limit_set).toEqual(used);
    for (const f of fc.features) expect(f.properties?.limit_set).toEqual(used);
    const plain = estimate(demo);
    expect(plain.limit_set).toBeUndefined();
    expect((plain.geojson as unknown as { limit_set?: unknown }).limit_set).toBeUndefined();
    expect(plain.geojson?.features[0]?.properties?.limit_set).toBeUndefined();
  });
});
