import { check } from "@placemarkio/check-geojson";
import { describe, expect, it } from "vitest";
import { CAUTION } from "../../src/core/caution.ts";
import { estimate } from "../../src/core/index.ts";
import {
  backupFile,
  footprintFile,
  footprintFileName,
  logGeoJSON,
} from "../../src/export/files.ts";
import { readBackup } from "../../src/storage/backup.ts";
import { expectValidFootprintFile } from "../geo/validate.ts";
import { demoResult, demoScenario, entryAt } from "../storage/fixtures.ts";

const STAMP = "2024-05-01T14:03:05+02:00";

describe("footprint file", () => {
  it("names the limit set used, with its source note, on the collection and every feature", () => {
    const used = { name: "Gas Q (invented)", source_note: "Invented list, rev. 2" };
    const scenario = { ...demoScenario, limit_set: used };
    const out = footprintFile(scenario, estimate(scenario), STAMP);
    const parsed = JSON.parse(out?.file.text ?? "{}");
    expect(parsed.limit_set).toEqual(used);
    expect(parsed.features.length).toBeGreaterThan(0);
    for (const f of parsed.features) expect(f.properties.limit_set).toEqual(used);
    expect(
      JSON.parse(footprintFile(demoScenario, demoResult, STAMP)?.file.text ?? "{}").limit_set,
    ).toBeUndefined();
  });

  it("is named with the estimate's local time stamp", () => {
    expect(footprintFileName(STAMP)).toBe("driftmark-footprint-20240501-140305.geojson");
  });

  it("is valid GeoJSON (check-geojson, turf booleanValid) with the time stamp and caution", () => {
    const out = footprintFile(demoScenario, demoResult, STAMP);
    expect(out).not.toBeNull();
    const { file, geojson } = out as NonNullable<typeof out>;
    expect(file.mime).toBe("application/geo+json");
    expectValidFootprintFile(JSON.parse(file.text));
    expect(geojson.caution).toBe(CAUTION);
    for (const f of geojson.features) expect(f.properties?.timestamp).toBe(STAMP);
    const bands = geojson.features.filter((f) => f.properties?.kind === "band");
    expect(bands.map((f) => f.properties?.label).sort()).toEqual(
      demoResult.bands
        .filter((b) => b.reach_m !== null)
        .map((b) => b.label)
        .sort(),
    );
  });

  it("is not made without a source position", () => {
    const { source: _s, ...noSource } = demoScenario;
    expect(footprintFile(noSource, demoResult, STAMP)).toBeNull();
  });

  it("the core's own geojson (when a source is given) passes the same checks", () => {
    expect(demoResult.geojson).toBeDefined();
    expectValidFootprintFile(demoResult.geojson as NonNullable<typeof demoResult.geojson>);
  });
});

describe("log exports", () => {
  const T0 = Date.UTC(2024, 4, 1, 12, 0, 0);
  const withPlace = entryAt(T0, "north gate");
  const noPlace = { ...entryAt(T0 + 1000, "no place"), place: null };

  it("GeoJSON: one valid Point per entry with a place, with its figures and the caution", () => {
    const fc = logGeoJSON([withPlace, noPlace], new Date(T0));
    expect(() => check(JSON.stringify(fc))).not.toThrow();
    expect(fc.features).toHaveLength(1);
    const p = fc.features[0]?.properties;
    expect(p?.note).toBe("north gate");
    expect(p?.caution).toBe(CAUTION);
    expect(p?.bands).toHaveLength(withPlace.results.bands.length);
    expect(fc.features[0]?.geometry).toEqual({ type: "Point", coordinates: [8, 47] });
  });

  it("JSON backup: reads back to the same entries", () => {
    const f = backupFile([withPlace, noPlace], new Date(T0));
    expect(f.name).toBe("driftmark-log-20240501-120000.json");
    const back = readBackup(f.text);
    expect(back.rejected).toEqual([]);
    expect(back.entries).toEqual([withPlace, noPlace]);
  });
});
