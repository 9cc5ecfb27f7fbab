/**
 * Reader for the Project Prairie Grass transcription (Barad 1958). Expected counts and layout are
 * those stated in ../shared/data/prairie_grass/README.md (68 experiments × 5 arcs = 340 arc
 * records; 73 of 8246 readings missing; Table 5.4 factors 0.85–1.00 with 0.09 printed for
 * experiment 12 at 200 m; 53 runs with meteorology; release height 1.5 m for runs 65–68).
 */
import { existsSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import {
  ARC_DISTANCES_M,
  arcMaximum,
  classFromSigmaTheta,
  PrairieGrassDataError,
  parseArcs,
  parseCorrections,
  parseMeteorology,
  readPrairieGrass,
} from "../../scripts/validation/prairie-grass.ts";

const repoRoot = path.resolve(import.meta.dirname, "../..");
const DATA_DIR = path.resolve(repoRoot, "../shared/data/prairie_grass");
const exists = existsSync(path.join(DATA_DIR, "PGARCS.txt"));
if (!exists)
  console.warn(`SKIPPED: ${DATA_DIR} not found; the Prairie Grass reader checks did not run`);

describe("parsing small texts", () => {
  const block = [
    "  7,  2,'07/13/56','1100-1110',   100.0",
    "  3,  1,  3,   1,     1.000,    0.0,    0.0,  90.00000,  0.46,  1.50,     1.000",
    "       350        82       100     0.050",
    "       352        84       100    -9.000",
    "       354        86       100    12.500",
    "",
  ].join("\r\n");

  it("reads a block header, the samplers and -9 as missing", () => {
    const [r] = parseArcs(block);
    expect(r).toMatchObject({
      experiment: 7,
      arc: 2,
      date: "07/13/56",
      period: "1100-1110",
      distance_m: 100,
      rate_g_s: 90,
      release_height_m: 0.46,
      sampler_height_m: 1.5,
    });
    expect(r?.readings.map((x) => x.concentration_mg_m3)).toEqual([0.05, null, 12.5]);
  });

  it("names the file and line when a block is cut short", () => {
    expect(() => parseArcs(block.split("\r\n").slice(0, 3).join("\n"))).toThrow(
      /PGARCS\.txt line 4: file ends inside a block/,
    );
  });

  const table = [
    "/*",
    "   Table of SO2 Correction Factors (Table 5.4 )",
    "*/",
    "    Exp        50      100      200      400      800",
    "       7     0.95     0.93     0.91     0.90     0.92",
    "      12     0.95     0.95     0.09     0.93     0.92",
    "      13     0.97              0.95     0.95     0.95",
  ].join("\r\n");

  it("multiplies the largest reading by the arc's factor", () => {
    const [r] = parseArcs(block);
    const t = parseCorrections(table);
    const m = r && arcMaximum(r, t);
    expect(m?.status).toBe("ok");
    expect(m?.printed_max_mg_m3).toBe(12.5);
    expect(m?.corrected_max_mg_m3).toBeCloseTo(12.5 * 0.93, 12);
  });

  it("reads 0.09 for experiment 12 at 200 m as 0.9 and records the change", () => {
    const t = parseCorrections(table);
    expect(t.factors.get(12)?.[2]).toBe(0.9);
    expect(t.amendments).toHaveLength(1);
    expect(t.amendments[0]).toMatchObject({
      experiment: 12,
      distance_m: 200,
      printed: 0.09,
      used: 0.9,
    });
  });

  it("keeps a blank cell as missing (the table's own note: blank = missing)", () => {
    expect(parseCorrections(table).factors.get(13)).toEqual([0.97, null, 0.95, 0.95, 0.95]);
  });

  it("refuses any other factor outside 0.5–1, naming it", () => {
    expect(() => parseCorrections(table.replace("0.91", "0.19"))).toThrow(
      /correction factor 0.19 for experiment 7 at 200 m is outside 0.5–1/,
    );
  });

  it("leaves out an arc whose largest reading is below 0.1 mg/m³ (Barad 1958 Vol. I p. 77)", () => {
    const low = block.replace("12.500", " 0.090");
    const [r] = parseArcs(low);
    const m = r && arcMaximum(r, parseCorrections(table));
    expect(m?.status).toBe("below-threshold");
    expect(m?.corrected_max_mg_m3).toBeNull();
  });

  it("marks an arc with only missing readings as missing", () => {
    const none = block.replace("0.050", "-9.000").replace("12.500", "-9.000");
    const [r] = parseArcs(none);
    expect(r && arcMaximum(r, parseCorrections(table)).status).toBe("missing");
  });

  it("reads the meteorology columns, -999 mixing height as none", () => {
    const [m] = parseMeteorology(
      "17\t 48.0\t0.21\t-999\t184\t0.0000\t0.0000\t0.0000\t5.60\t3.41\n",
    );
    expect(m).toEqual({
      experiment: 17,
      obukhov_m: 48,
      friction_velocity_m_s: 0.21,
      mixing_height_m: null,
      wind_from_deg: 184,
      sigma_theta_deg: 5.6,
      wind_speed_2m_m_s: 3.41,
    });
  });
});

describe("stability class from σθ (EPA-454/R-99-005, Table 6-7 σA ranges)", () => {
  const cases: [number, string][] = [
    [30, "A"],
    [22.5, "A"],
    [22.49, "B"],
    [17.5, "B"],
    [17.49, "C"],
    [12.5, "C"],
    [12.49, "D"],
    [7.5, "D"],
    [7.49, "E"],
    [3.8, "E"],
    [3.79, "F"],
    [0, "F"],
  ];
  for (const [s, c] of cases) {
    it(`σθ ${s}° is class ${c}`, () => expect(classFromSigmaTheta(s)).toBe(c));
  }
  it("refuses a negative or non-finite σθ", () => {
    expect(() => classFromSigmaTheta(-1)).toThrow(/sigma_theta/);
    expect(() => classFromSigmaTheta(Number.NaN)).toThrow(/sigma_theta/);
  });
});

describe("missing data folder", () => {
  it("throws a one-line data error naming the folder", () => {
    const dir = path.join(repoRoot, "no-such-prairie-grass-folder");
    expect(() => readPrairieGrass(dir)).toThrow(PrairieGrassDataError);
    expect(() => readPrairieGrass(dir)).toThrow(`data folder not found: ${dir}`);
  });
});

describe.skipIf(!exists)(
  exists ? "the real files (data README)" : "SKIPPED: ../shared/data/prairie_grass not found",
  () => {
    const data = exists ? readPrairieGrass(DATA_DIR) : null;

    it("has 340 arc records from 68 experiments, 5 arcs each at 50–800 m", () => {
      expect(data?.arcs).toHaveLength(340);
      const exps = new Set(data?.arcs.map((a) => a.experiment));
      expect(exps.size).toBe(68);
      for (const e of exps) {
        const ds = data?.arcs.filter((a) => a.experiment === e).map((a) => a.distance_m);
        expect(ds?.sort((a, b) => a - b)).toEqual([...ARC_DISTANCES_M]);
      }
      // Runs 1–62, 65–68, 70 and 71 (README).
      expect(exps.has(63) || exps.has(64) || exps.has(69)).toBe(false);
      expect(exps.has(70) && exps.has(71)).toBe(true);
    });

    it("has 8246 readings of which 73 are missing", () => {
      const all = data?.arcs.flatMap((a) => a.readings) ?? [];
      expect(all).toHaveLength(8246);
      expect(all.filter((r) => r.concentration_mg_m3 === null)).toHaveLength(73);
    });

    it("has release height 1.5 m for runs 65–68 and 0.46 m otherwise; Q within 38.5–104.1 g/s", () => {
      for (const a of data?.arcs ?? []) {
        expect(a.release_height_m).toBe(a.experiment >= 65 && a.experiment <= 68 ? 1.5 : 0.46);
        expect(a.rate_g_s).toBeGreaterThanOrEqual(38.5);
        expect(a.rate_g_s).toBeLessThanOrEqual(104.1);
        expect(a.sampler_height_m).toBe(1.5);
      }
    });

    it("has a correction factor for every arc, all within 0.85–1.00 after the one amendment", () => {
      const t = data?.corrections;
      expect(t?.amendments.map((a) => [a.experiment, a.distance_m, a.printed, a.used])).toEqual([
        [12, 200, 0.09, 0.9],
      ]);
      expect(t?.factors.get(1)).toEqual([0.97, 0.96, 0.9, 0.93, 0.96]);
      for (const a of data?.arcs ?? []) {
        const f = arcMaximum(a, t ?? { factors: new Map(), amendments: [] }).factor;
        expect(f).toBeGreaterThanOrEqual(0.85);
        expect(f).toBeLessThanOrEqual(1);
      }
    });

    it("has meteorology for 53 runs, none of 1–4, 13, 14, 35, 36, 47, 52, 65–68, 71", () => {
      const runs = data?.meteorology.map((m) => m.experiment) ?? [];
      expect(runs).toHaveLength(53);
      for (const r of [1, 2, 3, 4, 13, 14, 35, 36, 47, 52, 65, 66, 67, 68, 71]) {
        expect(runs).not.toContain(r);
      }
      expect(data?.meteorology.find((m) => m.experiment === 5)).toMatchObject({
        sigma_theta_deg: 9.5,
        wind_speed_2m_m_s: 5.93,
      });
    });
  },
);
