// Turns the invented town (tests/fixtures/map/town.geojson) into a small vector PMTiles v3 file in
// the Protomaps basemap layer schema: geojson-vt cuts each layer into tiles, @maplibre/vt-pbf
// encodes them as Mapbox Vector Tiles, scripts/map-fixture/pmtiles-writer.ts writes the archive.
//
// Run: npx tsx scripts/map-fixture/build.ts [OUT.pmtiles]   (default tests/output/town.pmtiles)
import { readFileSync, writeFileSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { gzipSync } from "node:zlib";
import { fromGeojsonVt } from "@maplibre/vt-pbf";
import type { Feature, FeatureCollection } from "geojson";
import GeoJSONVT from "geojson-vt";
import { type TileIn, writePMTiles } from "./pmtiles-writer.ts";
import { TOWN_GEOJSON } from "./town.ts";

const HERE = dirname(fileURLToPath(import.meta.url));
export const DEFAULT_OUT = join(HERE, "..", "..", "tests", "output", "town.pmtiles");

export const MIN_ZOOM = 10;
export const MAX_ZOOM = 15;
export const LAYERS = ["earth", "water", "landuse", "roads", "buildings", "places", "pois"];

/** Tile x of a longitude and tile y of a latitude at zoom z (Web Mercator). */
function tileX(lon: number, z: number): number {
  return Math.floor(((lon + 180) / 360) * 2 ** z);
}
function tileY(lat: number, z: number): number {
  const r = (lat * Math.PI) / 180;
  return Math.floor(((1 - Math.log(Math.tan(r) + 1 / Math.cos(r)) / Math.PI) / 2) * 2 ** z);
}

function boundsOf(fc: FeatureCollection): [number, number, number, number] {
  let w = 180;
  let s = 90;
  let e = -180;
  let n = -90;
  const visit = (c: unknown): void => {
    if (Array.isArray(c) && typeof c[0] === "number") {
      w = Math.min(w, c[0] as number);
      e = Math.max(e, c[0] as number);
      s = Math.min(s, c[1] as number);
      n = Math.max(n, c[1] as number);
    } else if (Array.isArray(c)) for (const k of c) visit(k);
  };
  for (const f of fc.features)
    if (f.geometry && "coordinates" in f.geometry) visit(f.geometry.coordinates);
  return [w, s, e, n];
}

/** The fixture as bytes, with the number of tiles written. */
export function buildTownPMTiles(geojsonPath = TOWN_GEOJSON): {
  bytes: Uint8Array<ArrayBuffer>;
  tiles: number;
} {
  const fc = JSON.parse(readFileSync(geojsonPath, "utf8")) as FeatureCollection;
  const bounds = boundsOf(fc);
  const indexes = new Map<string, GeoJSONVT>();
  for (const layer of LAYERS) {
    const features = fc.features
      .filter((f) => f.properties?.layer === layer)
      .map((f): Feature => {
        const { layer: _drop, ...props } = f.properties ?? {};
        return { ...f, properties: props };
      });
    indexes.set(
      layer,
      new GeoJSONVT(
        { type: "FeatureCollection", features },
        { maxZoom: MAX_ZOOM, indexMaxZoom: MAX_ZOOM, tolerance: 3, extent: 4096, buffer: 64 },
      ),
    );
  }
  const tiles: TileIn[] = [];
  for (let z = MIN_ZOOM; z <= MAX_ZOOM; z++) {
    for (let x = tileX(bounds[0], z); x <= tileX(bounds[2], z); x++) {
      for (let y = tileY(bounds[3], z); y <= tileY(bounds[1], z); y++) {
        const layers: Record<string, NonNullable<ReturnType<GeoJSONVT["getTile"]>>> = {};
        for (const [name, index] of indexes) {
          const t = index.getTile(z, x, y);
          if (t && t.features.length > 0) layers[name] = t;
        }
        if (Object.keys(layers).length === 0) continue;
        const pbf = fromGeojsonVt(layers as Parameters<typeof fromGeojsonVt>[0], {
          version: 2,
          extent: 4096,
        });
        tiles.push({ z, x, y, data: gzipSync(pbf) });
      }
    }
  }
  const centre: [number, number, number] = [
    (bounds[0] + bounds[2]) / 2,
    (bounds[1] + bounds[3]) / 2,
    14,
  ];
  const bytes = writePMTiles(tiles, {
    tileCompression: 2,
    tileType: 1,
    bounds,
    center: centre,
    metadata: {
      name: "Ostervale (invented test town)",
      description: "An invented town for Driftmark's tests. Not real map data.",
      attribution: "Invented test data",
      type: "baselayer",
      vector_layers: LAYERS.map((id) => ({ id, fields: {} })),
    },
  });
  return { bytes, tiles: tiles.length };
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  const out = process.argv[2] ?? DEFAULT_OUT;
  const { bytes, tiles } = buildTownPMTiles();
  writeFileSync(out, bytes);
  console.log(`wrote ${out}: ${tiles} tiles, ${(bytes.length / 1024).toFixed(1)} kB`);
}
