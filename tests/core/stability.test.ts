/**
 * Checks of the stability-class suggestion (src/core/stability.ts).
 *
 * Source of the table: Pasquill (1961), Meteorological Magazine 90, as tabulated in
 * Boubel, Fox, Turner & Stern (1994), Fundamentals of Air Pollution, 3rd ed.,
 * Table 19-3, p. 302 ("Boubel 1994 T19-3" below). Calm-night cells, blank in Pasquill,
 * are filled after NOAA ARL's READY stability page ("NOAA READY"). Heavy overcast = D,
 * day or night (footnote to the same table). Split-class resolution to the more stable
 * letter and the bin edges are model.md's conventions.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { ScenarioError } from "../../src/core/errors.ts";
import { solarElevationDeg } from "../../src/core/solar.ts";
import {
  insolationFromElevation,
  pasquillClass,
  suggestStability,
  type TableSky,
  windAt10m,
} from "../../src/core/stability.ts";
import { STABILITY_CLASSES, type StabilityClass } from "../../src/core/types.ts";
import { runs } from "../support/fast-check.ts";

/** [representative wind (m/s), sky, cell as printed, source]. 5 wind bins × 6 skies. */
const CELLS: [number, TableSky, string, string][] = [
  // u < 2 m/s
  [1.0, "strong-sun", "A", "Boubel 1994 T19-3"],
  [1.0, "moderate-sun", "A–B", "Boubel 1994 T19-3"],
  [1.0, "slight-sun", "B", "Boubel 1994 T19-3"],
  [1.0, "overcast", "D", "Boubel 1994 T19-3, heavy overcast footnote"],
  [1.0, "night-cloudy", "E", "NOAA READY (blank in Boubel 1994 T19-3)"],
  [1.0, "night-clear", "F", "NOAA READY (blank in Boubel 1994 T19-3)"],
  // 2–3 m/s
  [2.5, "strong-sun", "A–B", "Boubel 1994 T19-3"],
  [2.5, "moderate-sun", "B", "Boubel 1994 T19-3"],
  [2.5, "slight-sun", "C", "Boubel 1994 T19-3"],
  [2.5, "overcast", "D", "Boubel 1994 T19-3, heavy overcast footnote"],
  [2.5, "night-cloudy", "E", "Boubel 1994 T19-3"],
  [2.5, "night-clear", "F", "Boubel 1994 T19-3"],
  // 3–5 m/s
  [4.0, "strong-sun", "B", "Boubel 1994 T19-3"],
  [4.0, "moderate-sun", "B–C", "Boubel 1994 T19-3"],
  [4.0, "slight-sun", "C", "Boubel 1994 T19-3"],
  [4.0, "overcast", "D", "Boubel 1994 T19-3, heavy overcast footnote"],
  [4.0, "night-cloudy", "D", "Boubel 1994 T19-3"],
  [4.0, "night-clear", "E", "Boubel 1994 T19-3"],
  // 5–6 m/s
  [5.5, "strong-sun", "C", "Boubel 1994 T19-3"],
  [5.5, "moderate-sun", "C–D", "Boubel 1994 T19-3"],
  [5.5, "slight-sun", "D", "Boubel 1994 T19-3"],
  [5.5, "overcast", "D", "Boubel 1994 T19-3, heavy overcast footnote"],
  [5.5, "night-cloudy", "D", "Boubel 1994 T19-3"],
  [5.5, "night-clear", "D", "Boubel 1994 T19-3"],
  // > 6 m/s
  [8.0, "strong-sun", "C", "Boubel 1994 T19-3"],
  [8.0, "moderate-sun", "D", "Boubel 1994 T19-3"],
  [8.0, "slight-sun", "D", "Boubel 1994 T19-3"],
  [8.0, "overcast", "D", "Boubel 1994 T19-3, heavy overcast footnote"],
  [8.0, "night-cloudy", "D", "Boubel 1994 T19-3"],
  [8.0, "night-clear", "D", "Boubel 1994 T19-3"],
];

/** The more stable letter of a printed cell ("A–B" → "B"), model.md's split rule. */
function expectedLetter(cell: string): StabilityClass {
  return cell.slice(-1) as StabilityClass;
}

const SKIES: TableSky[] = [
  "strong-sun",
  "moderate-sun",
  "slight-sun",
  "overcast",
  "night-cloudy",
  "night-clear",
];

describe("pasquillClass: every cell of the table", () => {
  it("has 30 cells to check (5 wind bins × 6 skies)", () => {
    expect(CELLS.length).toBe(30);
    expect(new Set(CELLS.map(([u, s]) => `${u}|${s}`)).size).toBe(30);
  });

  for (const [u, sky, cell, source] of CELLS) {
    it(`gives ${cell} for ${u} m/s and ${sky} (${source})`, () => {
      const r = pasquillClass(u, sky);
      expect(r.stability).toBe(expectedLetter(cell));
      expect(r.split).toBe(cell.length > 1 ? cell : null);
      const calm = u < 2 && (sky === "night-cloudy" || sky === "night-clear");
      expect(r.calmNight).toBe(calm);
    });
  }
});

describe("pasquillClass: wind bin edges (model.md: u<2; 2≤u<3; 3≤u<5; 5≤u≤6; u>6)", () => {
  // Moderate sun changes letter in every bin (A–B, B, B–C, C–D, D; Boubel 1994 T19-3),
  // so it shows which bin a speed fell in.
  const cases: [number, string][] = [
    [0, "A–B"],
    [1.999, "A–B"],
    [2, "B"],
    [2.999, "B"],
    [3, "B–C"],
    [4.999, "B–C"],
    [5, "C–D"],
    [6, "C–D"],
    [6.001, "D"],
    [30, "D"],
  ];
  for (const [u, cell] of cases) {
    it(`puts ${u} m/s with moderate sun in the ${cell} cell`, () => {
      const r = pasquillClass(u, "moderate-sun");
      expect(r.stability).toBe(expectedLetter(cell));
      expect(r.split).toBe(cell.length > 1 ? cell : null);
    });
  }

  it("treats exactly 2 m/s on a clear night as not calm (F from the 2–3 row)", () => {
    expect(pasquillClass(2, "night-clear")).toEqual({
      stability: "F",
      split: null,
      calmNight: false,
    });
    expect(pasquillClass(1.99, "night-clear").calmNight).toBe(true);
  });
});

describe("pasquillClass: rules across the table", () => {
  it("gives D for heavy overcast at any wind, day or night (Boubel 1994 T19-3 footnote)", () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 50, noNaN: true }), (u) => {
        expect(pasquillClass(u, "overcast")).toEqual({
          stability: "D",
          split: null,
          calmNight: false,
        });
      }),
    );
  });

  it("by day never gets less stable as the wind rises; by night never more stable (table shape)", () => {
    const rank = (c: StabilityClass) => STABILITY_CLASSES.indexOf(c);
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 20, noNaN: true }),
        fc.double({ min: 0, max: 20, noNaN: true }),
        fc.constantFrom(...SKIES),
        (a, b, sky) => {
          const [lo, hi] = a <= b ? [a, b] : [b, a];
          const rLo = rank(pasquillClass(lo, sky).stability);
          const rHi = rank(pasquillClass(hi, sky).stability);
          if (sky.endsWith("-sun")) expect(rHi).toBeGreaterThanOrEqual(rLo);
          else expect(rHi).toBeLessThanOrEqual(rLo);
        },
      ),
    );
  });

  it("resolves a split to the later (more stable) letter (model.md split rule)", () => {
    for (const [u, sky, cell] of CELLS.filter(([, , c]) => c.length > 1)) {
      const r = pasquillClass(u, sky);
      const [first, second] = (r.split as string).split("–") as [StabilityClass, StabilityClass];
      expect(STABILITY_CLASSES.indexOf(second)).toBe(STABILITY_CLASSES.indexOf(first) + 1);
      expect(r.stability).toBe(second);
      expect(r.split).toBe(cell);
    }
  });

  it("rejects a negative or non-finite wind, naming the allowed range", () => {
    expect(() => pasquillClass(-1, "overcast")).toThrow(/≥ 0 m\/s.*-1/);
    expect(() => pasquillClass(Number.NaN, "night-clear")).toThrow(/finite/);
  });
});

describe("insolationFromElevation (Turner 1964 via EPA-454/R-99-005 T6-5, from memory)", () => {
  const cases: [number, string][] = [
    [89, "strong"],
    [60.001, "strong"],
    [60, "moderate"],
    [35, "moderate"],
    [34.999, "slight"],
    [15, "slight"],
    [5, "slight"],
    [-3, "slight"],
  ];
  for (const [e, cls] of cases) {
    it(`calls ${e}° ${cls}`, () => {
      expect(insolationFromElevation(e)).toBe(cls);
    });
  }
  it("rejects a non-finite elevation", () => {
    expect(() => insolationFromElevation(Number.NaN)).toThrow(/finite/);
  });
});

describe("windAt10m: neutral power law (Irwin 1979 D exponents: open 0.15, urban 0.25)", () => {
  it("leaves a 10 m wind unchanged", () => {
    expect(windAt10m(3.7, 10, "open")).toBe(3.7);
  });
  it("raises a 2 m urban wind by 5^0.25 = √√5 (closed form)", () => {
    expect(windAt10m(4, 2, "urban")).toBeCloseTo(4 * Math.sqrt(Math.sqrt(5)), 12);
  });
  it("lowers a 40 m open-country wind by (1/4)^0.15 = 2^-0.3 (closed form)", () => {
    expect(windAt10m(6, 40, "open")).toBeCloseTo(6 / 2 ** 0.3, 12);
  });
});

const base = {
  windSpeed: 2.5,
  windHeight: 10,
  terrain: "open" as const,
  timeMs: null,
  lat: null,
  lon: null,
};

describe("suggestStability", () => {
  it("takes the table cell for a given sky and explains a split (Boubel 1994 T19-3: 2–3 m/s strong sun A–B)", () => {
    const r = suggestStability({ ...base, sky: "strong-sun" });
    expect(r.stability).toBe("B");
    expect(r.reason).toBe("Suggested from 2.5 m/s wind and strong sun: A–B, using B");
    expect(r.warnings).toHaveLength(1);
    expect(r.warnings[0]?.code).toBe("split-class");
    expect(r.warnings[0]?.message).toContain("Table gives A–B; using the more stable B");
  });

  it("brings a 2 m wind to 10 m before the table, which can change the class", () => {
    // 2.5 m/s at 2 m, open: u10 = 2.5·5^0.15 ≈ 3.19 m/s → 3–5 row, moderate sun B–C → C;
    // the same reading taken as a 10 m wind is in the 2–3 row → B (Boubel 1994 T19-3).
    const u10 = 2.5 * Math.exp(0.15 * Math.log(5));
    expect(u10).toBeGreaterThan(3);
    const at2 = suggestStability({ ...base, windHeight: 2, sky: "moderate-sun" });
    expect(at2.stability).toBe("C");
    expect(at2.reason).toContain(`${u10.toFixed(1)} m/s wind at 10 m (2.5 m/s measured at 2.0 m)`);
    expect(suggestStability({ ...base, sky: "moderate-sun" }).stability).toBe("B");
  });

  it("on a calm clear night gives F with the low-wind warning (NOAA READY)", () => {
    const r = suggestStability({ ...base, windSpeed: 1.2, sky: "night-clear" });
    expect(r.stability).toBe("F");
    expect(r.warnings.map((w) => w.code)).toEqual(["stable-low-wind"]);
    expect(r.warnings[0]?.message).toMatch(/Pasquill.*blank.*NOAA READY.*long and narrow.*meander/);
  });

  it("gives D and no warnings under heavy overcast", () => {
    const r = suggestStability({ ...base, windSpeed: 1, sky: "overcast" });
    expect(r).toEqual({
      stability: "D",
      reason: "Suggested from 1.0 m/s wind and heavy overcast: D",
      warnings: [],
    });
  });

  it("derives strong sun at midsummer noon at 45° N, so 2.5 m/s gives B (from A–B)", () => {
    // 2024-06-21 12:00 UTC at 45° N, 0° E: the sun is about 90 − 45 + 23.4 ≈ 68° up (> 60°:
    // strong); 2–3 m/s with strong sun is A–B → B (Boubel 1994 T19-3).
    const timeMs = Date.UTC(2024, 5, 21, 12, 0, 0);
    const elev = solarElevationDeg(timeMs, 45, 0);
    expect(elev).toBeGreaterThan(60);
    const r = suggestStability({ ...base, sky: "sun", timeMs, lat: 45, lon: 0 });
    expect(r.stability).toBe("B");
    expect(r.reason).toBe(
      `Suggested from 2.5 m/s wind and strong sun (sun ${elev.toFixed(0)}° up): A–B, using B`,
    );
    expect(r.warnings.map((w) => w.code)).toEqual(["split-class"]);
  });

  it("derives slight sun at midwinter noon at 45° N (sun about 21.6° up), 2.5 m/s → C", () => {
    // 90 − 45 − 23.4 ≈ 21.6°: 15–35° slight; 2–3 m/s slight sun → C (Boubel 1994 T19-3).
    const timeMs = Date.UTC(2024, 11, 21, 12, 0, 0);
    const r = suggestStability({ ...base, sky: "sun", timeMs, lat: 45, lon: 0 });
    expect(r.stability).toBe("C");
    expect(r.reason).toContain("slight sun (sun 22° up)");
  });

  it("treats sky 'sun' at night by the clock as a clear night, with a warning", () => {
    // 2024-06-21 00:00 UTC at 45° N, 0° E: local midnight, sun well below the horizon.
    const timeMs = Date.UTC(2024, 5, 21, 0, 0, 0);
    const r = suggestStability({ ...base, windSpeed: 1.5, sky: "sun", timeMs, lat: 45, lon: 0 });
    expect(r.stability).toBe("F");
    expect(r.warnings.map((w) => w.code)).toEqual(["night-by-clock", "stable-low-wind"]);
    expect(r.reason).toMatch(
      /^Suggested from 1\.5 m\/s wind and a clear night \(night by the clock/,
    );
  });

  it("needs time and place with sky 'sun', naming each missing field", () => {
    try {
      suggestStability({ ...base, sky: "sun" });
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(ScenarioError);
      const fields = (e as ScenarioError).problems.map((p) => p.field);
      expect(fields).toEqual(["weather.time", "source.lat", "source.lon"]);
    }
  });

  it("rejects a bad wind, height or sky with the field, the value and the allowed range", () => {
    try {
      suggestStability({
        ...base,
        windSpeed: -2,
        windHeight: 0,
        sky: "cloudy" as never,
      });
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(ScenarioError);
      const problems = (e as ScenarioError).problems;
      expect(problems.map((p) => [p.field, p.value])).toEqual([
        ["weather.wind_speed_m_s", -2],
        ["weather.wind_height_m", 0],
        ["weather.sky", "cloudy"],
      ]);
      expect(problems[0]?.message).toContain("≥ 0 m/s");
    }
  });

  it("always returns a class letter and a reason, never NaN, for any valid input", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 40, noNaN: true }),
        fc.double({ min: 0.5, max: 200, noNaN: true }),
        fc.constantFrom("open" as const, "urban" as const),
        fc.constantFrom(...SKIES, "sun" as const),
        fc.integer({ min: Date.UTC(1990, 0, 1), max: Date.UTC(2040, 0, 1) }),
        fc.double({ min: -89, max: 89, noNaN: true }),
        fc.double({ min: -180, max: 180, noNaN: true }),
        (windSpeed, windHeight, terrain, sky, timeMs, lat, lon) => {
          const r = suggestStability({ windSpeed, windHeight, terrain, sky, timeMs, lat, lon });
          expect(STABILITY_CLASSES).toContain(r.stability);
          expect(r.reason).not.toMatch(/NaN|undefined/);
          expect(r.reason.endsWith(r.stability)).toBe(true);
        },
      ),
      runs(300),
    );
  });
});
