/**
 * Edge inputs by name (issue 5, "Robustness"). Each test states what model.md or the scenario
 * contract (JSDoc table of src/core/scenario/fields.ts) says should happen, and checks it, on top of
 * the general soundness checks of arbitraries.ts (finite figures, model.md's warnings).
 * All scenarios are invented.
 */

import { check } from "@placemarkio/check-geojson";
import { booleanValid } from "@turf/boolean-valid";
import type { FeatureCollection, Geometry } from "geojson";
import { describe, expect, test } from "vitest";
import { centrelineProfile, estimate, ScenarioError } from "../../src/core/index.ts";
import type { EstimateOutput, Scenario } from "../../src/core/types.ts";
import { ringSignedArea2 } from "../../src/geo/geojson.ts";
import { exteriorRings, positionsOf } from "../geo/validate.ts";
import { expectSoundEstimate } from "./arbitraries.ts";

/** An invented scenario: a 500 g/s ground release in class D, one limit in mg/m³. */
function base(): Scenario {
  return {
    release: { kind: "continuous", rate_g_s: 500, height_m: 0 },
    weather: { wind_speed_m_s: 3, wind_from_deg: 250, stability: "D" },
    limits: [{ label: "Limit A (invented)", value: 40, unit: "mg/m3", averaging_s: 3600 }],
  };
}

function run(s: Scenario): EstimateOutput {
  const out = estimate(s);
  expectSoundEstimate(s, out);
  return out;
}

function rejected(s: unknown): ScenarioError {
  try {
    estimate(s);
  } catch (err) {
    expect(err).toBeInstanceOf(ScenarioError);
    return err as ScenarioError;
  }
  throw new Error("accepted a scenario that should be rejected");
}

const codes = (o: EstimateOutput) => o.warnings.map((w) => w.code);
const band0 = (o: EstimateOutput) => o.bands[0] as EstimateOutput["bands"][0];

describe("release rate", () => {
  test("a rate of zero is rejected, naming release.rate_g_s and the allowed range", () => {
    const s = base();
    (s.release as { rate_g_s: number }).rate_g_s = 0;
    const err = rejected(s);
    expect(err.problems).toHaveLength(1);
    expect(err.problems[0]?.field).toBe("release.rate_g_s");
    expect(err.problems[0]?.message).toContain("greater than 0");
  });

  test("1e-9 g/s gives no band, a no-exceedance warning and finite figures", () => {
    const s = base();
    (s.release as { rate_g_s: number }).rate_g_s = 1e-9;
    const out = run(s);
    expect(band0(out).reach_m).toBeNull();
    expect(codes(out)).toContain("no-exceedance");
    expect(out.footprint.bands[0]?.swept).toEqual([]);
  });

  test("1e9 g/s gives a finite band, capped at 100 km with its warning when it runs past", () => {
    const s = base();
    (s.release as { rate_g_s: number }).rate_g_s = 1e9;
    const out = run(s);
    const b = band0(out);
    expect(b.reach_m).not.toBeNull();
    // 1e9 g/s against 40 mg/m³ in class D: far beyond the 10 km of the curves (model.md).
    expect(codes(out)).toContain("outside-curve-range");
    if ((b.reach_m as number) >= 100_000) expect(codes(out)).toContain("reach-over-100km");
  });
});

describe("wind speed", () => {
  test.each([0, 0.5])("%s m/s: computed with 1 m/s and a calm-wind warning (model.md)", (u) => {
    const s = base();
    s.weather.wind_speed_m_s = u;
    const out = run(s);
    expect(out.wind_speed_used_m_s).toBe(1);
    expect(codes(out)).toContain("calm-wind");
    expect(band0(out).reach_m).not.toBeNull();
  });

  test("60 m/s: no calm warning, a shorter reach than at 3 m/s (dilution ∝ 1/u)", () => {
    const slow = run(base());
    const s = base();
    s.weather.wind_speed_m_s = 60;
    const out = run(s);
    expect(codes(out)).not.toContain("calm-wind");
    expect(out.wind_speed_used_m_s).toBe(60);
    expect(band0(out).reach_m as number).toBeLessThan(band0(slow).reach_m as number);
  });
});

describe("mixing lid", () => {
  test("release above the lid: above-lid warning and no band (model.md: no ground concentration)", () => {
    const s = base();
    s.release.height_m = 300;
    s.weather.mixing_height_m = 200;
    const out = run(s);
    expect(codes(out)).toContain("above-lid");
    expect(band0(out).reach_m).toBeNull();
  });

  test("a lid above the release keeps the band and raises no above-lid warning", () => {
    const s = base();
    s.weather.mixing_height_m = 200;
    const out = run(s);
    expect(codes(out)).not.toContain("above-lid");
    expect(band0(out).reach_m).not.toBeNull();
  });
});

describe("limits", () => {
  test("a limit above the highest centreline concentration gives no band; just below, a band", () => {
    // Elevated release: the centreline rises from zero to a maximum and falls (model.md).
    const s = base();
    s.release.height_m = 40;
    const xs = Array.from({ length: 4001 }, (_, i) => 10 ** (i / 800)); // 1 m … 100 km
    const profile = centrelineProfile(s, xs)[0];
    if (!profile) throw new Error("no profile");
    const peak = Math.max(...profile.values_mg_m3);
    expect(peak).toBeGreaterThan(0);
    const above = { ...base(), release: { ...s.release } };
    above.limits = [
      { label: "over (invented)", value: peak * 1.01, unit: "mg/m3", averaging_s: 3600 },
    ];
    const outAbove = run(above);
    expect(band0(outAbove).reach_m).toBeNull();
    expect(codes(outAbove)).toContain("no-exceedance");
    const below = {
      ...above,
      limits: [{ ...above.limits[0], value: peak * 0.99 } as Scenario["limits"][0]],
    };
    const outBelow = run(below);
    const b = band0(outBelow);
    expect(b.reach_m).not.toBeNull();
    expect(b.start_m as number).toBeGreaterThan(1); // the gap near an elevated source
  });

  test("a limit of zero is rejected, naming limits[0].value", () => {
    const s = base();
    (s.limits[0] as { value: number }).value = 0;
    const err = rejected(s);
    expect(err.problems.map((p) => p.field)).toEqual(["limits[0].value"]);
    expect(err.problems[0]?.message).toContain("greater than 0");
  });

  test("50 limits at once: 50 bands in order, reach falling as the limit rises", () => {
    const s = base();
    s.limits = Array.from({ length: 50 }, (_, i) => ({
      label: `Limit ${i + 1} (invented)`,
      value: 10 ** (-2 + (5 * i) / 49), // 0.01 … 1000 mg/m³
      unit: "mg/m3" as const,
      averaging_s: 3600,
    }));
    s.wind_swing_deg = 20;
    const out = run(s);
    expect(out.bands.map((b) => b.label)).toEqual(s.limits.map((l) => l.label));
    const reaches = out.bands.map((b) => b.reach_m ?? 0);
    for (let i = 1; i < reaches.length; i++) {
      expect(reaches[i] as number).toBeLessThanOrEqual(reaches[i - 1] as number);
    }
  }, 60_000); // with the spread: 50 bands under 9 weathers
});

/**
 * RFC 7946 validity: @placemarkio/check-geojson (an independent validator), turf booleanValid,
 * positions in range with at most 7 decimals, exterior rings closed and counter-clockwise
 * (RFC 7946 §3.1.6). Like tests/geo/validate.ts, except that decimals are counted on the number,
 * not its text: JavaScript prints 0.0000008 as "8e-7", which the shared helper counts as 99
 * decimals (reported to the lead).
 */
function expectValidGeoJSON(fc: FeatureCollection): void {
  expect(() => check(JSON.stringify(fc))).not.toThrow();
  for (const f of fc.features) {
    const g = f.geometry as Geometry;
    expect(booleanValid(g), `${g.type} valid (turf)`).toBe(true);
    for (const [lon, lat] of positionsOf(g) as [number, number][]) {
      expect(Math.abs(lon) <= 180 && Math.abs(lat) <= 90, `${lon}, ${lat} in range`).toBe(true);
      for (const v of [lon, lat])
        expect(Math.abs(Math.round(v * 1e7) - v * 1e7)).toBeLessThan(1e-6);
    }
    for (const ring of exteriorRings(g)) {
      expect(ring[0]).toEqual(ring[ring.length - 1]);
      expect(ringSignedArea2(ring)).toBeGreaterThan(0);
    }
  }
}

describe("places at the edges of the map: the GeoJSON stays valid (RFC 7946)", () => {
  const places: [string, number, number, number][] = [
    ["lon 180, plume heading east across the antimeridian", 0, 180, 270],
    ["lon -180, plume heading west across the antimeridian", 0, -180, 90],
    ["lat 85, plume heading north", 85, 10, 180],
    ["lat -85, plume heading south", -85, 10, 0],
    ["lat 85, lon 180, heading north-east", 85, 180, 225],
  ];
  test.each(places)("%s", (_name, lat, lon, from) => {
    const s = base();
    s.weather.wind_from_deg = from;
    s.wind_swing_deg = 20;
    s.limits.push({ label: "Limit B (invented)", value: 1, unit: "mg/m3", averaging_s: 3600 });
    s.source = { lat, lon };
    const out = run(s);
    expect(out.geojson).toBeDefined();
    expect(out.bands[1]?.reach_m as number).toBeGreaterThan(5000); // long enough to cross the line
    expectValidGeoJSON(out.geojson as FeatureCollection);
  });
});

describe("release duration", () => {
  test("1 s: finite, smaller reach than ongoing, and the averaging clamp warning (t_s = 180 s)", () => {
    const ongoing = run(base());
    const s = base();
    (s.release as { duration_s?: number }).duration_s = 1;
    const out = run(s);
    expect(codes(out)).toContain("averaging-clamped");
    const b = band0(out);
    if (b.reach_m !== null) expect(b.reach_m).toBeLessThan(band0(ongoing).reach_m as number);
    expect(b.clears_s === null || Number.isFinite(b.clears_s)).toBe(true);
  });

  test("30 days: within a fraction of a percent of the ongoing plume, and it clears", () => {
    // Palazzi et al. (1982): F → 1 as T → ∞, so a 30-day release matches the steady plume.
    const ongoing = run(base());
    const s = base();
    (s.release as { duration_s?: number }).duration_s = 30 * 86400;
    const out = run(s);
    const r = band0(out).reach_m as number;
    const r0 = band0(ongoing).reach_m as number;
    expect(Math.abs(r - r0) / r0).toBeLessThan(0.005);
    expect(band0(ongoing).clears_s).toBeNull(); // an ongoing release never clears (model.md)
    expect(band0(out).clears_s as number).toBeGreaterThan(30 * 86400);
  });
});

describe("points a hair from the source", () => {
  // Found by the property test of valid-scenarios.test.ts: at 0 < x_m ≲ 1e-150 m σy² underflowed
  // to 0 and the point concentration was NaN (exp(−0/0)), clears_s Infinity. Fixed in the core
  // (b55a0fa: distances below 1 mm are evaluated at 1 mm); these pin it.
  test.each([1e-170, 5e-324, 1e-3, 1e-9])("a point at x = %s m gives finite figures", (x) => {
    for (const release of [
      { kind: "continuous" as const, rate_g_s: 500, duration_s: 60 },
      { kind: "instantaneous" as const, mass_g: 1000 },
    ]) {
      const s = { ...base(), release };
      s.points = [
        { x_m: x, y_m: 0, z_m: 0 },
        { x_m: x, y_m: 1e-200 },
      ];
      run(s);
    }
  });
});
