/**
 * The spread (glossary: Spread; issue 13): every band under neighbouring stability classes ×
 * the measured wind ÷ and × a factor. Checks: the classes and winds taken; the spread holds the
 * estimate's own band; off (`classes: 0, wind_factor: 1`) it is the band itself; a ground
 * release reaches farther as the air gets more stable (D → E → F; Pasquill 1961, the curves'
 * ordering, common practice); the envelope contains every variant's swept band; every variant's
 * reach lies within [reach_min_m, reach_max_m] (fast-check, the suite's fixed seed); the calm warning; the
 * scenario field's validation; the GeoJSON features.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { envelopeRing } from "../../src/core/envelope.ts";
import { solveBand } from "../../src/core/footprint.ts";
import { estimate, prepare, ScenarioError } from "../../src/core/index.ts";
import { ringArea } from "../../src/core/numeric.ts";
import { solveSpread, spreadClasses, spreadWinds } from "../../src/core/spread.ts";
import type { Scenario, StabilityClass } from "../../src/core/types.ts";
import { runs, timeout } from "../support/fast-check.ts";
import { pointsOutside } from "./rings.ts";

const base: Scenario = {
  release: { kind: "continuous", rate_g_s: 500, duration_s: 900, height_m: 2 },
  weather: { wind_speed_m_s: 3, wind_from_deg: 250, stability: "D" },
  limits: [
    { label: "A 60 min (invented)", value: 5, unit: "mg/m3", averaging_s: 3600 },
    { label: "B 10 min (invented)", value: 50, unit: "mg/m3", averaging_s: 600 },
  ],
};

const withWeather = (s: Scenario, w: Partial<Scenario["weather"]>, extra: Partial<Scenario> = {}) =>
  ({ ...s, weather: { ...s.weather, ...w }, ...extra }) as Scenario;

describe("the weathers of the spread", () => {
  it("steps one class each way, clamped to A–F without repeats", () => {
    expect(spreadClasses("D", 1)).toEqual(["C", "D", "E"]);
    expect(spreadClasses("A", 1)).toEqual(["A", "B"]);
    expect(spreadClasses("F", 1)).toEqual(["E", "F"]);
    expect(spreadClasses("D", 0)).toEqual(["D"]);
  });
  it("divides and multiplies the wind by the factor; factor 1 and a zero wind give one speed", () => {
    expect(spreadWinds(3, 1.3)).toEqual([3 / 1.3, 3, 3 * 1.3]);
    expect(spreadWinds(3, 1)).toEqual([3]);
    expect(spreadWinds(0, 1.3)).toEqual([0]);
  });
  it("the summary names the classes and speeds (a suggested class varies the same way)", () => {
    expect(estimate(base).spread).toEqual({
      classes: ["C", "D", "E"],
      wind_speeds_m_s: [3 / 1.3, 3, 3 * 1.3],
      variants: 9,
    });
    const auto = estimate(withWeather(base, { stability: "auto", sky: "night-clear" }));
    const used = auto.stability_used as StabilityClass;
    expect(auto.spread?.classes).toEqual(spreadClasses(used, 1));
  });
});

describe("the spread holds the estimate's own band", () => {
  for (const swing of [0, 20]) {
    it(`reach, width, area and outline (swing ${swing}°)`, () => {
      const o = estimate({ ...base, wind_swing_deg: swing });
      o.bands.forEach((b, i) => {
        const s = b.spread;
        if (!s || b.reach_m === null) throw new Error("expected a band with its spread");
        expect(s.reach_min_m as number).toBeLessThanOrEqual(b.reach_m);
        expect(s.reach_max_m as number).toBeGreaterThanOrEqual(b.reach_m);
        expect(s.reach_max_m as number).toBeGreaterThan(s.reach_min_m as number);
        expect(s.width_max_m as number).toBeGreaterThanOrEqual(b.max_width_m as number);
        expect(s.area_max_m2 as number).toBeGreaterThanOrEqual(b.area_m2 as number);
        const fb = o.footprint.bands[i];
        if (!fb?.envelope) throw new Error("expected an envelope");
        expect(pointsOutside(fb.swept, fb.envelope, 1e-6 * b.reach_m)).toEqual([]);
        expect(ringArea(fb.envelope)).toBeGreaterThanOrEqual(s.area_max_m2 as number);
      });
    });
  }

  it("turned off (classes 0, wind factor 1) it is the band itself, to 1e-9", () => {
    for (const swing of [0, 20]) {
      const o = estimate({
        ...base,
        wind_swing_deg: swing,
        spread: { classes: 0, wind_factor: 1 },
      });
      expect(o.spread?.variants).toBe(1);
      o.bands.forEach((b, i) => {
        expect(b.spread?.reach_min_m).toBe(b.reach_m);
        expect(b.spread?.reach_max_m).toBe(b.reach_m);
        expect(b.spread?.area_max_m2).toBe(b.area_m2);
        const fb = o.footprint.bands[i];
        const env = fb?.envelope ?? [];
        expect(env).toHaveLength(fb?.swept.length ?? -1);
        env.forEach((p, k) => {
          const q = fb?.swept[k] as [number, number];
          expect(Math.abs(p[0] - q[0])).toBeLessThanOrEqual(1e-9);
          expect(Math.abs(p[1] - q[1])).toBeLessThanOrEqual(1e-9);
        });
      });
    }
  });

  it("the main figures are the same with and without the spread", () => {
    const a = estimate(base, { spread: false });
    const b = estimate(base);
    expect(b.bands.map((x) => ({ ...x, spread: undefined }))).toEqual(
      a.bands.map((x) => ({ ...x, spread: undefined })),
    );
    expect(a.bands[0]?.spread).toBeUndefined();
    expect(a.spread).toBeUndefined();
  });
});

describe("monotonic cases", () => {
  const ground = {
    ...base,
    release: { kind: "continuous", rate_g_s: 500, height_m: 0 },
    spread: { classes: 0, wind_factor: 1 },
  } as Scenario;
  it("a ground release reaches farther in D → E → F (Pasquill 1961 curves' ordering)", () => {
    const reach = (c: StabilityClass) =>
      estimate(withWeather(ground, { stability: c })).bands[0]?.reach_m as number;
    expect(reach("E")).toBeGreaterThan(reach("D"));
    expect(reach("F")).toBeGreaterThan(reach("E"));
  });
  it("its spread's far end is the more stable class with the slower wind, its near end the other", () => {
    const s = estimate({ ...ground, spread: undefined }).bands[0]?.spread;
    expect(s?.reach_max_variant).toEqual({ stability: "E", wind_speed_m_s: 3 / 1.3 });
    expect(s?.reach_min_variant).toEqual({ stability: "C", wind_speed_m_s: 3 * 1.3 });
  });
});

describe("the envelope contains every variant's swept band", () => {
  const cases: [string, Scenario][] = [
    ["ground, no swing", base],
    ["ground, swing 20°", { ...base, wind_swing_deg: 20 }],
    [
      "elevated 40 m, swing 10°",
      {
        ...base,
        release: { kind: "continuous", rate_g_s: 5000, height_m: 40 },
        wind_swing_deg: 10,
      },
    ],
    [
      "class F, swing 45°",
      withWeather(base, { stability: "F", wind_speed_m_s: 2 }, { wind_swing_deg: 45 }),
    ],
  ];
  for (const [name, s] of cases) {
    it(name, () => {
      const prep = prepare(s);
      const main = prep.limits.map((l) =>
        solveBand(
          prep.plume(l.averaging),
          l.value,
          prep.parsed.receptorHeight,
          prep.parsed.windSwingDeg,
        ),
      );
      const spread = solveSpread(prep, main);
      spread.envelopes.forEach((env, i) => {
        const reach = spread.bands[i]?.reach_max_m as number;
        for (const v of spread.variants) {
          const ring = v.solutions[i]?.swept ?? [];
          expect(pointsOutside(ring, env, 1e-6 * reach), JSON.stringify(v.variant)).toEqual([]);
          if (ring.length >= 3) expect(ringArea(env)).toBeGreaterThanOrEqual(ringArea(ring));
        }
      });
    });
  }
  it("of no band is empty; of one band is that band", () => {
    expect(envelopeRing([[], []])).toEqual([]);
    const one: [number, number][] = [
      [0, 0],
      [10, -1],
      [10, 1],
    ];
    expect(envelopeRing([[], one])).toEqual(one);
  });
});

describe("every variant's reach lies within [reach_min_m, reach_max_m]", () => {
  it(
    "fast-check over weather, release and limit (fixed seed)",
    () => {
      fc.assert(
        fc.property(
          fc.constantFrom<StabilityClass>("A", "B", "C", "D", "E", "F"),
          fc.double({ min: 0.5, max: 15, noNaN: true }),
          fc.double({ min: 1, max: 2, noNaN: true }),
          fc.double({ min: 0, max: 30, noNaN: true }),
          fc.double({ min: -1, max: 3, noNaN: true }),
          (stability, u, factor, height, logLimit) => {
            const s: Scenario = {
              release: { kind: "continuous", rate_g_s: 500, height_m: height },
              weather: { wind_speed_m_s: u, wind_from_deg: 0, stability },
              limits: [
                { label: "L (invented)", value: 10 ** logLimit, unit: "mg/m3", averaging_s: 600 },
              ],
              spread: { classes: 1, wind_factor: factor },
            };
            const o = estimate(s);
            const sp = o.bands[0]?.spread;
            if (!sp || !o.spread) throw new Error("no spread");
            for (const c of o.spread.classes) {
              for (const w of o.spread.wind_speeds_m_s) {
                const v = estimate(
                  withWeather(
                    s,
                    { stability: c, wind_speed_m_s: w },
                    { spread: { classes: 0, wind_factor: 1 } },
                  ),
                ).bands[0]?.reach_m as number | null;
                if (v === null) {
                  expect(sp.reach_min_m).toBeNull();
                  continue;
                }
                if (sp.reach_min_m !== null) expect(v).toBeGreaterThanOrEqual(sp.reach_min_m);
                expect(v).toBeLessThanOrEqual(sp.reach_max_m as number);
              }
            }
          },
        ),
        runs(60),
      );
    },
    timeout(120_000),
  );
});

describe("calm and validation", () => {
  it("a slower variant under 1 m/s keeps the calm warning", () => {
    const o = estimate(withWeather(base, { wind_speed_m_s: 1.1 }));
    expect(o.warnings.some((w) => w.code === "calm-wind")).toBe(false);
    const w = o.warnings.find((x) => x.code === "spread-calm-wind");
    expect(w?.message).toMatch(/0\.846 m\/s/);
    const off = estimate(
      withWeather(base, { wind_speed_m_s: 1.1 }, { spread: { classes: 0, wind_factor: 1 } }),
    );
    expect(off.warnings.some((x) => x.code === "spread-calm-wind")).toBe(false);
  });

  const problem = (spread: unknown) => {
    try {
      estimate({ ...base, spread });
    } catch (e) {
      expect(e).toBeInstanceOf(ScenarioError);
      return (e as ScenarioError).problems;
    }
    return [];
  };
  it.each([
    [{ classes: 2 }, "spread.classes", /0 .*or 1/],
    [{ classes: 0.5 }, "spread.classes", /0 .*or 1/],
    [{ classes: "1" }, "spread.classes", /0 .*or 1/],
    [{ wind_factor: 0.5 }, "spread.wind_factor", /from 1 to 3/],
    [{ wind_factor: Number.NaN }, "spread.wind_factor", /finite/],
    [{ wind: 1.3 }, "spread.wind", /not a known field/],
    ["wide", "spread", /must be an object/],
  ])("%j: one problem naming the field, value and what is allowed", (spread, field, msg) => {
    const ps = problem(spread);
    expect(ps).toHaveLength(1);
    expect(ps[0]?.field).toBe(field);
    expect(ps[0]?.message).toMatch(msg);
  });
});

describe("GeoJSON", () => {
  it("one unfilled spread feature per band, drawn before the bands, in the band's colour", () => {
    const o = estimate({ ...base, source: { lat: 47, lon: 8 }, wind_swing_deg: 20 });
    const feats = o.geojson?.features ?? [];
    const spread = feats.filter((f) => f.properties?.kind === "spread");
    const bands = feats.filter((f) => f.properties?.kind === "band");
    expect(spread).toHaveLength(2);
    for (const f of spread) {
      const band = bands.find((b) => b.properties?.label === f.properties?.label);
      expect(f.properties?.stroke).toBe(band?.properties?.stroke);
      expect(f.properties?.["fill-opacity"]).toBe(0);
      expect(feats.indexOf(f)).toBeLessThan(feats.indexOf(bands[0] as (typeof feats)[0]));
      expect(f.geometry.type).toBe("Polygon");
    }
    const plain = estimate({ ...base, source: { lat: 47, lon: 8 } }, { spread: false });
    expect(plain.geojson?.features.some((f) => f.properties?.kind === "spread")).toBe(false);
  });
});
