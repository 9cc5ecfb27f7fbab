// The fixture writer (scripts/map-fixture) read back through the `pmtiles` library: the header
// fields, the directory and the tiles must come out as written (PMTiles v3 spec, protomaps/PMTiles).
import { VectorTile } from "@mapbox/vector-tile";
import { PbfReader as Pbf } from "pbf";
import { PMTiles, type RangeResponse, type Source, TileType, zxyToTileId } from "pmtiles";
import { describe, expect, it } from "vitest";
import { buildTownPMTiles, LAYERS, MAX_ZOOM, MIN_ZOOM } from "../../scripts/map-fixture/build.ts";
import { serializeDirectory, writePMTiles } from "../../scripts/map-fixture/pmtiles-writer.ts";

class BytesSource implements Source {
  constructor(private readonly bytes: Uint8Array) {}
  getKey() {
    return "bytes";
  }
  async getBytes(offset: number, length: number): Promise<RangeResponse> {
    const slice = this.bytes.slice(offset, offset + length);
    return { data: slice.buffer };
  }
}

const lonToX = (lon: number, z: number) => Math.floor(((lon + 180) / 360) * 2 ** z);
const latToY = (lat: number, z: number) => {
  const r = (lat * Math.PI) / 180;
  return Math.floor(((1 - Math.log(Math.tan(r) + 1 / Math.cos(r)) / Math.PI) / 2) * 2 ** z);
};

describe("the invented-town fixture", () => {
  const { bytes, tiles } = buildTownPMTiles();
  const pm = new PMTiles(new BytesSource(bytes));

  it("is small (well under 1 MB) and has tiles at every zoom it declares", async () => {
    expect(bytes.length).toBeLessThan(1_000_000);
    const h = await pm.getHeader();
    expect(h.specVersion).toBe(3);
    expect(h.tileType).toBe(TileType.Mvt);
    expect(h.minZoom).toBe(MIN_ZOOM);
    expect(h.maxZoom).toBe(MAX_ZOOM);
    expect(h.numAddressedTiles).toBe(tiles);
    // The demo's source (47.0° N, 8.0° E) lies inside the declared bounds.
    expect(h.minLon).toBeLessThan(8);
    expect(h.maxLon).toBeGreaterThan(8);
    expect(h.minLat).toBeLessThan(47);
    expect(h.maxLat).toBeGreaterThan(47);
  });

  it("carries the Protomaps layer names in its metadata and in the tiles", async () => {
    const meta = (await pm.getMetadata()) as { vector_layers: { id: string }[]; name: string };
    expect(meta.vector_layers.map((l) => l.id)).toEqual(LAYERS);
    expect(meta.name).toMatch(/invented/i);
    const z = 15;
    const tile = await pm.getZxy(z, lonToX(8, z), latToY(47, z));
    expect(tile).toBeDefined();
    const raw = new Uint8Array(tile?.data ?? new ArrayBuffer(0));
    // pmtiles undoes the tile compression the header declares (gzip) before handing it back.
    expect(raw[0]).not.toBe(0x1f);
    const vt = new VectorTile(new Pbf(raw));
    for (const name of ["earth", "roads", "buildings"]) {
      expect(Object.keys(vt.layers)).toContain(name);
    }
    const buildings = vt.layers.buildings;
    expect(buildings?.length ?? 0).toBeGreaterThan(0);
    expect(buildings?.feature(0).properties.kind).toBe("building");
  });

  it("returns nothing for a tile outside the town", async () => {
    expect(await pm.getZxy(MAX_ZOOM, 0, 0)).toBeUndefined();
  });
});

describe("writePMTiles", () => {
  it("stores repeated contents once and run-length codes consecutive ids", async () => {
    const same = Uint8Array.from([1, 2, 3]);
    const other = Uint8Array.from([9]);
    // z=1 tiles have ids 1..4 in Hilbert order; give three of them the same bytes.
    const tiles = [
      { z: 1, x: 0, y: 0, data: same },
      { z: 1, x: 0, y: 1, data: same },
      { z: 1, x: 1, y: 1, data: same },
      { z: 1, x: 1, y: 0, data: other },
    ];
    const bytes = writePMTiles(tiles, {
      tileCompression: 1,
      tileType: 1,
      bounds: [-180, -85, 180, 85],
      center: [0, 0, 1],
      metadata: {},
    });
    const pm = new PMTiles(new BytesSource(bytes));
    const h = await pm.getHeader();
    expect(h.numAddressedTiles).toBe(4);
    expect(h.numTileContents).toBe(2);
    for (const t of tiles) {
      const got = await pm.getZxy(t.z, t.x, t.y);
      expect(new Uint8Array(got?.data ?? new ArrayBuffer(0))).toEqual(t.data);
    }
    expect(zxyToTileId(1, 0, 0)).toBe(1);
  });

  it("writes a directory as the spec's varint columns", () => {
    // One entry: count 1, id delta 5, run 1, length 300 (two varint bytes), offset 0 + 1.
    const d = serializeDirectory([{ tileId: 5, runLength: 1, length: 300, offset: 0 }]);
    expect([...d]).toEqual([1, 5, 1, 0xac, 0x02, 1]);
  });
});
