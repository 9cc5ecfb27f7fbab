/**
 * The entry point `estimate(scenario)` (src/core/index.ts): the output shape of issue 2, nulls,
 * points' ppm, GeoJSON only with a source (and not with `{ geojson: false }`), and consistency of
 * its figures with the physics underneath.
 */
import { describe, expect, it } from "vitest";
import { CAUTION, estimate, ScenarioError } from "../../src/core/index.ts";
import type { Scenario } from "../../src/core/types.ts";

const base: Scenario = {
  release: { kind: "continuous", rate_g_s: 500, duration_s: 900, height_m: 2 },
  weather: {
    wind_speed_m_s: 3,
    wind_height_m: 10,
    wind_from_deg: 250,
    stability: "D",
    terrain: "open",
    mixing_height_m: 800,
  },
  molecular_weight_g_mol: 34.1,
  limits: [
    { label: "A 60 min (invented)", value: 3, unit: "ppm", averaging_s: 3600 },
    { label: "B 10 min (invented)", value: 50, unit: "mg/m3", averaging_s: 600 },
  ],
  points: [
    { x_m: 1000, y_m: 0 },
    { x_m: 500, y_m: 50, z_m: 2, averaging_s: 3600 },
  ],
};

describe("estimate(): output shape (issue 2)", () => {
  const o = estimate(base);

  it("has the issue's top-level fields and no GeoJSON without a source", () => {
    for (const k of [
      "model_version",
      "wind_speed_used_m_s",
      "release_height_used_m",
      "stability_used",
      "bands",
      "points",
      "warnings",
    ])
      expect(o).toHaveProperty(k);
    expect(o.caution).toBe(CAUTION);
    expect(o.stability_used).toBe("D");
    expect(o.release_height_used_m).toBe(2);
    expect(o.wind_speed_used_m_s).toBe(3); // h = 2 m below z_ref = 10 m: measured speed
    expect(o).not.toHaveProperty("geojson");
  });

  it("bands carry label, limit (mg/m³ from ppm at 24.45 L/mol), reach, start, width and area", () => {
    expect(o.bands).toHaveLength(2);
    const [a, b] = o.bands;
    for (const band of o.bands) {
      for (const k of [
        "label",
        "limit_mg_m3",
        "reach_m",
        "start_m",
        "max_width_m",
        "max_width_at_m",
        "area_m2",
      ])
        expect(band).toHaveProperty(k);
      expect(band.reach_m as number).toBeGreaterThan(band.start_m as number);
      expect(band.max_width_at_m as number).toBeGreaterThan(band.start_m as number);
      expect(band.max_width_at_m as number).toBeLessThan(band.reach_m as number);
    }
    expect(a?.label).toBe("A 60 min (invented)");
    expect(a?.limit_mg_m3).toBeCloseTo((3 * 34.1) / 24.45, 12);
    expect(b?.limit_mg_m3).toBe(50);
  });

  it("points carry the concentration in mg/m³ and ppm, and each limit's arrival and clear", () => {
    expect(o.points).toHaveLength(2);
    const [p, q] = o.points;
    expect(p).toMatchObject({ x_m: 1000, y_m: 0, z_m: 1.5, averaging_s: 600 }); // model.md defaults
    expect(q).toMatchObject({ x_m: 500, y_m: 50, z_m: 2, averaging_s: 3600 });
    for (const pt of o.points) {
      expect(pt.concentration_mg_m3).toBeGreaterThan(0);
      expect(pt.concentration_ppm as number).toBeCloseTo(
        (pt.concentration_mg_m3 * 24.45) / 34.1,
        10,
      );
      expect(pt.limits.map((l) => l.label)).toEqual(o.bands.map((band) => band.label));
    }
  });

  it("a point at a band's reach on the axis, averaged like its limit, is at the limit", () => {
    const a = o.bands[0];
    const at = estimate({
      ...base,
      points: [{ x_m: a?.reach_m as number, y_m: 0, averaging_s: 3600 }],
    }).points[0];
    expect((at?.concentration_mg_m3 as number) / (a?.limit_mg_m3 as number)).toBeCloseTo(1, 6);
  });

  it("concentration_ppm is null without a molecular weight", () => {
    const { molecular_weight_g_mol: _mw, ...rest } = base;
    const noMw = estimate({
      ...rest,
      limits: [{ label: "mg only", value: 50, unit: "mg/m3", averaging_s: 600 }],
    });
    expect(noMw.points[0]?.concentration_ppm).toBeNull();
    expect(noMw.points[0]?.concentration_mg_m3).toBeGreaterThan(0);
  });

  it("a finite release clears; an ongoing one never does (clears_s null)", () => {
    const p = o.points[0]?.limits[0];
    expect(p?.arrives_s as number).toBeGreaterThan(0);
    expect(p?.clears_s as number).toBeGreaterThan(p?.arrives_s as number);
    const ongoing = estimate({
      ...base,
      release: { kind: "continuous", rate_g_s: 500, height_m: 2 },
    });
    const q = ongoing.points[0]?.limits[0];
    expect(q?.arrives_s as number).toBeGreaterThan(0);
    expect(q?.clears_s).toBeNull();
    expect(ongoing.bands[0]?.clears_s).toBeNull();
  });
});

describe("estimate(): nulls and the swing", () => {
  it("a limit never exceeded gives null figures and a no-exceedance warning", () => {
    const o = estimate({
      ...base,
      limits: [{ label: "high", value: 1e8, unit: "mg/m3", averaging_s: 600 }],
    });
    const band = o.bands[0];
    expect(band).toMatchObject({
      reach_m: null,
      start_m: null,
      max_width_m: null,
      max_width_at_m: null,
      area_m2: null,
      arrives_s: null,
      clears_s: null,
    });
    expect(o.points[0]?.limits[0]).toEqual({ label: "high", arrives_s: null, clears_s: null });
    expect(o.warnings.some((w) => w.code === "no-exceedance" && w.limit === "high")).toBe(true);
  });

  it("with a wind swing, width and area are of the swept band and reach is unchanged", () => {
    const still = estimate({ ...base, wind_swing_deg: 0 });
    const swung = estimate({ ...base, wind_swing_deg: 15 });
    still.bands.forEach((band, i) => {
      const s = swung.bands[i];
      expect(s?.reach_m).toBe(band.reach_m);
      expect(s?.max_width_m as number).toBeGreaterThan(band.max_width_m as number);
      expect(s?.area_m2 as number).toBeGreaterThan(band.area_m2 as number);
    });
    expect(swung.footprint.wind_swing_deg).toBe(15);
  });

  it("with a wind swing, the widest point is where the swept outline is widest", () => {
    const swung = estimate({ ...base, wind_swing_deg: 15 });
    swung.bands.forEach((band, i) => {
      const ring = swung.footprint.bands[i]?.swept ?? [];
      // The vertex of largest crosswind offset: its offset is half the width, its x the place.
      const widest = ring.reduce((a, p) => (p[1] > a[1] ? p : a), [0, 0] as [number, number]);
      expect(band.max_width_m).toBeCloseTo(2 * widest[1], 9);
      expect(band.max_width_at_m).toBeCloseTo(widest[0], 9);
      expect(band.max_width_at_m as number).toBeLessThanOrEqual(band.reach_m as number);
    });
  });

  it("the footprint heads toward wind-from + 180° (model.md Coordinates)", () => {
    expect(estimate(base).footprint.heading_deg).toBe(70);
    expect(
      estimate({ ...base, weather: { ...base.weather, wind_from_deg: 90 } }).footprint.heading_deg,
    ).toBe(270);
    expect(
      estimate({ ...base, weather: { ...base.weather, wind_from_deg: 360 } }).footprint.heading_deg,
    ).toBe(180);
  });

  it("an all-at-once release gives bands and finite arrival and clear times", () => {
    const o = estimate({
      ...base,
      release: { kind: "instantaneous", mass_g: 50_000, height_m: 0 },
    });
    expect(o.bands[0]?.reach_m as number).toBeGreaterThan(0);
    const t = o.points[0]?.limits[0];
    expect(t?.arrives_s).not.toBeNull();
    expect(t?.clears_s as number).toBeGreaterThan(t?.arrives_s as number);
    // all at once: the cloud passes and clears, centred on the travel time x/u = 1000/3 s
    expect(((t?.arrives_s as number) + (t?.clears_s as number)) / 2).toBeCloseTo(1000 / 3, 3);
  });
});

describe("estimate(): warnings about the points", () => {
  const out = (xs: number[]) =>
    estimate({ ...base, points: xs.map((x_m) => ({ x_m, y_m: 0 })) }).warnings;

  it("a point outside 100 m – 10 km downwind gets outside-curve-range naming that point (model.md)", () => {
    const w = out([1000, 50, 20_000]);
    const about = w.filter((x) => x.code === "outside-curve-range" && x.point !== undefined);
    expect(about.map((x) => x.point)).toEqual([1, 2]);
    expect(about[0]?.message).toMatch(/Point 2 \(50 m downwind\)/);
  });

  it("a point at or upwind of the source gets upwind-point, and its concentration is 0", () => {
    const o = estimate({
      ...base,
      points: [
        { x_m: -200, y_m: 0 },
        { x_m: 0, y_m: 5 },
      ],
    });
    expect(o.warnings.filter((x) => x.code === "upwind-point").map((x) => x.point)).toEqual([0, 1]);
    expect(o.points.map((p) => p.concentration_mg_m3)).toEqual([0, 0]);
  });

  it("points inside the range raise no point warning", () => {
    expect(out([100, 1000, 10_000]).filter((x) => x.point !== undefined)).toEqual([]);
  });
});

describe("estimate(): GeoJSON", () => {
  const withSource: Scenario = { ...base, source: { lat: 47, lon: 8 } };

  it("is present with a source: a FeatureCollection with the caution in every feature", () => {
    const o = estimate(withSource);
    expect(o.geojson?.type).toBe("FeatureCollection");
    const features = o.geojson?.features ?? [];
    expect(features.length).toBeGreaterThan(o.bands.length);
    for (const f of features) expect(f.properties?.caution).toBe(CAUTION);
  });

  it("is omitted with { geojson: false }, the rest unchanged", () => {
    const a = estimate(withSource, { geojson: false });
    expect(a).not.toHaveProperty("geojson");
    const { geojson: _g, ...b } = estimate(withSource);
    expect(a).toEqual(b);
  });
});

describe("estimate(): bad input", () => {
  it("throws ScenarioError naming the field, the value and the allowed range", () => {
    let err: unknown;
    try {
      estimate({ ...base, receptor_height_m: 900 });
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(ScenarioError);
    const problems = (err as ScenarioError).problems;
    const p = problems.find((q) => q.field === "receptor_height_m");
    expect(p?.value).toBe(900);
    expect(p?.message).toMatch(/100/); // allowed [0, 100] m (scenario/fields.ts table)
  });

  it("rejects a receptor above the mixing lid (the model would give nothing there)", () => {
    expect(() =>
      estimate({
        ...base,
        receptor_height_m: 50,
        weather: { ...base.weather, mixing_height_m: 40 },
      }),
    ).toThrow(ScenarioError);
  });
});
