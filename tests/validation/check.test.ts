/**
 * The check's plumbing, with a stand-in estimator: the scenario it builds (the setup the issue
 * fixes: U at 2 m, receptor 1.5 m, 600 s, open country, no lid, class from σθ by
 * EPA-454/R-99-005 Table 6-7), the pairing of predictions with arcs, the exclusions and the
 * generated about-page module.
 */
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { type Estimator, runCheck } from "../../scripts/validation/check.ts";
import type { ArcRecord, PrairieGrassData } from "../../scripts/validation/prairie-grass.ts";
import {
  aboutModule,
  farthestArcSentence,
  formatTable,
  plainSentence,
} from "../../scripts/validation/report.ts";
import { scatterSvg } from "../../scripts/validation/scatter-svg.ts";
import type { Scenario } from "../../src/core/types.ts";

const DIST = [50, 100, 200, 400, 800];

function arc(experiment: number, j: number, readings: (number | null)[]): ArcRecord {
  return {
    experiment,
    arc: j + 1,
    date: "07/13/56",
    period: "1100-1110",
    distance_m: DIST[j] as number,
    rate_g_s: 80,
    release_height_m: 0.46,
    sampler_height_m: 1.5,
    readings: readings.map((c, k) => ({ azimuth_deg: 2 * k, concentration_mg_m3: c })),
  };
}

/** Two runs: run 5 (σθ 9.5° → D) with a below-threshold 800 m arc; run 9 (σθ 25° → A). */
function data(): PrairieGrassData {
  const peaks5 = [100, 40, 10, 3, 0.09];
  const peaks9 = [50, 20, 5, 1, 0.2];
  return {
    dir: "synthetic",
    arcs: [
      ...peaks5.map((p, j) => arc(5, j, [p / 2, p, null])),
      ...peaks9.map((p, j) => arc(9, j, [p, p / 3])),
    ],
    corrections: {
      factors: new Map([
        [5, [0.9, 0.9, 0.9, 0.9, 0.9]],
        [9, [1, 1, 1, 1, 1]],
      ]),
      amendments: [],
    },
    meteorology: [
      {
        experiment: 5,
        obukhov_m: -28,
        friction_velocity_m_s: 0.39,
        mixing_height_m: 782,
        wind_from_deg: 176,
        sigma_theta_deg: 9.5,
        wind_speed_2m_m_s: 5.93,
      },
      {
        experiment: 9,
        obukhov_m: -5,
        friction_velocity_m_s: 0.3,
        mixing_height_m: null,
        wind_from_deg: 204,
        sigma_theta_deg: 25,
        wind_speed_2m_m_s: 3,
      },
    ],
  };
}

/** A stand-in that predicts `factor` × the corrected arc maximum, looked up by run and distance. */
function scaled(d: PrairieGrassData, factor: number, seen: Scenario[] = []): Estimator {
  return (s) => {
    seen.push(s);
    const run = d.meteorology.find((m) => m.wind_speed_2m_m_s === s.weather.wind_speed_m_s);
    const f = d.corrections.factors.get(run?.experiment ?? -1) ?? [];
    return {
      points: (s.points ?? []).map((p) => {
        const j = DIST.indexOf(p.x_m);
        const a = d.arcs.find((r) => r.experiment === run?.experiment && r.distance_m === p.x_m);
        const max = Math.max(...(a?.readings.map((r) => r.concentration_mg_m3 ?? 0) ?? [0]));
        return { concentration_mg_m3: factor * max * (f[j] ?? 1) };
      }),
    };
  };
}

describe("runCheck with a stand-in estimator", () => {
  it("builds the scenario the issue fixes, once per run and scheme", () => {
    const seen: Scenario[] = [];
    runCheck(data(), scaled(data(), 1, seen));
    // The spread's weathers come on top: 9 for class D, 6 for class A (clamped), per scheme.
    const variants = seen.filter((s) => s.spread !== undefined);
    expect(variants).toHaveLength(2 * 9 + 2 * 6);
    const main = seen.filter((s) => s.spread === undefined);
    expect(main).toHaveLength(4);
    expect(main.map((s) => [s.sigma_scheme, s.weather.stability])).toEqual([
      ["briggs", "D"],
      ["pasquill-gifford", "D"],
      ["briggs", "A"],
      ["pasquill-gifford", "A"],
    ]);
    const s = main[0] as Scenario;
    expect(s.release).toEqual({ kind: "continuous", rate_g_s: 80, height_m: 0.46 });
    expect(s.weather).toMatchObject({ wind_speed_m_s: 5.93, wind_height_m: 2, terrain: "open" });
    expect(s.weather.mixing_height_m).toBeUndefined();
    expect(s.limits).toEqual([]);
    expect(s.points).toEqual(DIST.map((x_m) => ({ x_m, y_m: 0, z_m: 1.5, averaging_s: 600 })));
  });

  it("pairs each prediction with its own arc: a ×2 stand-in scores FAC2 1, MG 0.5, FB −2/3", () => {
    const r = runCheck(data(), scaled(data(), 2));
    for (const scheme of ["briggs", "pasquill-gifford"] as const) {
      const m = r.figures[scheme].overall;
      expect(m.count).toBe(9);
      expect(m.fac2).toBe(1);
      expect(m.mg).toBeCloseTo(0.5, 12);
      expect(m.fb).toBeCloseTo(-2 / 3, 12);
    }
  });

  it("applies the factor, and leaves out the arc below 0.1 mg/m³, counting it", () => {
    const r = runCheck(data(), scaled(data(), 1));
    expect(r.arcsConsidered).toBe(10);
    expect(r.excluded).toEqual([{ experiment: 5, distance_m: 800, status: "below-threshold" }]);
    expect(r.compared.find((c) => c.experiment === 5 && c.distance_m === 50)?.observed_mg_m3).toBe(
      90,
    );
    expect(r.figures.briggs.byDistance.map((g) => g.metrics.count)).toEqual([2, 2, 2, 2, 1]);
    expect(r.figures.briggs.byClass.map((g) => [g.stability, g.metrics.count])).toEqual([
      ["A", 5],
      ["D", 4],
    ]);
  });

  it("refuses a non-positive prediction with a message naming the run and distance", () => {
    expect(() => runCheck(data(), scaled(data(), 0))).toThrow(
      /estimate\(\) gave 0 mg\/m³ for run 5 at 50 m \(briggs\)/,
    );
  });

  it("prints a table with every group for both schemes", () => {
    const t = formatTable(runCheck(data(), scaled(data(), 2)));
    expect(t).toContain("left out: 1 below 0.1 mg/m³, 0 with no reading");
    expect(t.match(/^all arcs\s+9\s+1\.00\s+0\.50/gm)).toHaveLength(2);
    expect(t).toContain("class A");
    expect(t).toContain("800 m");
  });
});

describe("plain-language sentence (direction from MG: over-prediction when MG < 1)", () => {
  const m = (fac2: number, mg: number) => ({ count: 10, fac2, mg, vg: 1, fb: 0, nmse: 0 });
  it("says over-predict by 100% for MG 0.5", () =>
    expect(plainSentence(m(0.8, 0.5))).toBe(
      "On these 1956 measurements the default curves predict within a factor of two 80% of the time; on average they over-predict by about 100%, which errs on the side of caution.",
    ));
  it("says under-predict by 50% for MG 2", () =>
    expect(plainSentence(m(0.55, 2))).toContain("under-predict by about 50%"));
  it("says neither when MG is 1", () =>
    expect(plainSentence(m(1, 1))).toContain("neither over- nor under-predict"));
});

describe("farthest-arc sentence", () => {
  it("reports FAC2 of the largest distance with any pairs", () => {
    const m = (count: number, fac2: number) => ({ count, fac2, mg: 1, vg: 1, fb: 0, nmse: 0 });
    const s = farthestArcSentence([
      { distance_m: 400, metrics: m(10, 0.6) },
      { distance_m: 800, metrics: m(4, 0.25) },
      { distance_m: 100, metrics: m(10, 0.9) },
    ]);
    expect(s).toMatch(/^At 800 m, the farthest arcs, 25% are within a factor of two/);
  });
});

describe("generated about-page module", () => {
  it("is valid TypeScript exporting both schemes' figures, counts, citation and sentence", async () => {
    const r = runCheck(data(), scaled(data(), 2));
    const dir = mkdtempSync(path.join(tmpdir(), "driftmark-about-"));
    const file = path.join(dir, "model-check.ts");
    writeFileSync(file, aboutModule(r, "test-version"));
    const mod = await import(file);
    expect(mod.MODEL_CHECK).toMatchObject({
      modelVersion: "test-version",
      runs: 2,
      arcsCompared: 9,
      arcsBelowThreshold: 1,
      arcsWithoutReading: 0,
      briggs: { count: 9, fac2: 1, mg: 0.5, fb: -0.667 },
      pasquillGifford: { count: 9, fac2: 1, mg: 0.5 },
    });
    expect(mod.MODEL_CHECK.citation).toMatch(
      /^Barad, M\. L\. \(ed\.\) \(1958\)\. Project Prairie Grass/,
    );
    expect(mod.MODEL_CHECK.summary).toContain("over-predict by about 100%");
  });
});

describe("scatter SVG", () => {
  it("draws one marker per point, the 1:1 line and two dashed factor-of-two lines", () => {
    const svg = scatterSvg(
      [
        {
          label: "first",
          points: [
            [1, 2],
            [10, 5],
            [0.5, 0.4],
          ],
        },
        {
          label: "second",
          points: [
            [1, 1],
            [100, 30],
          ],
        },
      ],
      { title: "t", xLabel: "Observed (mg/m³)", yLabel: "Predicted (mg/m³)" },
    );
    expect(svg.startsWith("<svg")).toBe(true);
    expect(svg.match(/<circle /g)).toHaveLength(3 + 1); // points of series 1 + legend marker
    expect(svg.match(/<rect x="[\d.]+" y="[\d.]+" width="6"/g)).toHaveLength(2 + 1);
    expect(svg.match(/<line clip-path/g)).toHaveLength(3);
    expect(svg.match(/stroke-dasharray="6 4"\/>/g)?.length).toBeGreaterThanOrEqual(2);
    expect(svg).toContain("Observed (mg/m³)");
    expect(svg).toContain("Predicted (mg/m³)");
    expect(svg).not.toContain("NaN");
  });
});
