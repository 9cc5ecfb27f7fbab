// Map areas kept on the device (src/storage/map-areas.ts), on fake-indexeddb, with the invented
// town fixture (scripts/map-fixture) as the good file.
import "fake-indexeddb/auto";
import { describe, expect, it } from "vitest";
import { buildTownPMTiles } from "../../scripts/map-fixture/build.ts";
import {
  addMapArea,
  areaContaining,
  inspectMapArea,
  listMapAreas,
  MapAreaError,
  mapAreaFile,
  removeMapArea,
} from "../../src/storage/map-areas.ts";

const town = buildTownPMTiles().bytes;
const file = (bytes: Uint8Array<ArrayBuffer>, name: string) => new File([bytes], name);

describe("inspectMapArea", () => {
  it("reads the name, bounds, zooms and size of a PMTiles v3 vector extract", async () => {
    const facts = await inspectMapArea(new Blob([town]), "town.pmtiles");
    expect(facts.name).toMatch(/Ostervale/);
    expect(facts.bytes).toBe(town.length);
    expect(facts.minZoom).toBeLessThan(facts.maxZoom);
    const [w, s, e, n] = facts.bounds;
    expect(w < 8 && 8 < e && s < 47 && 47 < n).toBe(true);
  });

  it("refuses a file that is not PMTiles, naming it", async () => {
    const bytes = new TextEncoder().encode(`{"type":"FeatureCollection"}${" ".repeat(200)}`);
    await expect(inspectMapArea(new Blob([bytes]), "notes.geojson")).rejects.toThrow(
      /"notes.geojson" is not a map area file/,
    );
  });

  it("refuses another PMTiles version", async () => {
    const v2 = town.slice();
    v2[7] = 2;
    await expect(inspectMapArea(new Blob([v2]), "old.pmtiles")).rejects.toThrow(/version 2/);
  });

  it("refuses a damaged directory and a file cut short", async () => {
    const damaged = town.slice();
    damaged.fill(0xff, 127, 400); // root directory and metadata overwritten
    await expect(inspectMapArea(new Blob([damaged]), "bad.pmtiles")).rejects.toBeInstanceOf(
      MapAreaError,
    );
    await expect(inspectMapArea(new Blob([town.slice(0, 2000)]), "cut.pmtiles")).rejects.toThrow(
      /damaged|cut short/,
    );
  });
});

describe("kept map areas", () => {
  it("adds, lists, reads back and removes an area; a refused file changes nothing", async () => {
    const a = await addMapArea(file(town, "town.pmtiles"), new Date("2026-01-01T10:00:00Z"));
    await expect(
      addMapArea(file(new Uint8Array(300), "zeros.pmtiles"), new Date()),
    ).rejects.toBeInstanceOf(MapAreaError);
    const list = await listMapAreas();
    expect(list.map((x) => x.id)).toEqual([a.id]);
    expect(list[0]?.bytes).toBe(town.length);
    const kept = await mapAreaFile(a.id);
    expect(kept?.size).toBe(town.length);
    await removeMapArea(a.id);
    expect(await listMapAreas()).toEqual([]);
    expect(await mapAreaFile(a.id)).toBeNull();
  });

  it("picks the latest area whose bounds hold a place", () => {
    const base = { name: "", fileName: "", bytes: 1, minZoom: 0, maxZoom: 1, addedAt: "" };
    const areas = [
      { ...base, id: "wide", bounds: [0, 40, 20, 50] as [number, number, number, number] },
      { ...base, id: "town", bounds: [7.9, 46.9, 8.1, 47.1] as [number, number, number, number] },
    ];
    expect(areaContaining(areas, 47, 8)?.id).toBe("town");
    expect(areaContaining(areas, 45, 3)?.id).toBe("wide");
    expect(areaContaining(areas, 10, 8)).toBeNull();
  });
});
