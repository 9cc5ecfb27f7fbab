/**
 * Unit conversions and display formatting of the estimate screen (src/ui/units.ts).
 * Exact factors: NIST Special Publication 811 (2008 ed.), Guide for the Use of the
 * International System of Units, Appendix B.8 ("Factors for units listed alphabetically"):
 * pound (avoirdupois) = 0.45359237 kg; foot = 0.3048 m; knot = 1852/3600 m/s (0.5144444 m/s);
 * mile per hour = 0.44704 m/s; mile = 1609.344 m; °F → K: T = (t + 459.67)/1.8.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  compassPoint,
  formatArea,
  formatDistance,
  formatDuration,
  formatReach,
  LENGTH_UNITS,
  lengthFromM,
  lengthToM,
  MASS_UNITS,
  massFromG,
  massToG,
  parseDirection,
  parseNumber,
  RATE_UNITS,
  rateFromGPerS,
  rateToGPerS,
  roundSig,
  SPEED_UNITS,
  speedFromMPerS,
  speedToMPerS,
  TEMPERATURE_UNITS,
  temperatureFromK,
  temperatureToK,
  timeToS,
} from "../../src/ui/units.ts";

describe("conversions to SI match NIST SP 811 (2008) Appendix B", () => {
  it("converts release rates to g/s", () => {
    expect(rateToGPerS(1, "g/s")).toBe(1);
    expect(rateToGPerS(2, "kg/s")).toBe(2000);
    expect(rateToGPerS(60, "kg/min")).toBeCloseTo(1000, 10);
    // 1 lb/min = 453.59237 g / 60 s (lb = 0.45359237 kg, NIST SP 811 B.8).
    expect(rateToGPerS(60, "lb/min")).toBeCloseTo(453.59237, 9);
  });

  it("converts masses to g", () => {
    expect(massToG(1, "lb")).toBeCloseTo(453.59237, 9);
    expect(massToG(2.5, "kg")).toBe(2500);
  });

  it("converts lengths to m (ft = 0.3048 m exactly)", () => {
    expect(lengthToM(1000, "ft")).toBeCloseTo(304.8, 10);
    expect(lengthToM(7, "m")).toBe(7);
  });

  it("converts wind speeds to m/s (knot = 1852/3600 m/s, mph = 0.44704 m/s)", () => {
    expect(speedToMPerS(10, "knots")).toBeCloseTo(5.144444, 6);
    expect(speedToMPerS(60, "mph")).toBeCloseTo(26.8224, 10);
    expect(speedToMPerS(36, "km/h")).toBeCloseTo(10, 10);
  });

  it("converts temperatures to K (0 °C = 273.15 K; °F by T = (t + 459.67)/1.8)", () => {
    expect(temperatureToK(0, "°C")).toBeCloseTo(273.15, 10);
    expect(temperatureToK(32, "°F")).toBeCloseTo(273.15, 10);
    expect(temperatureToK(212, "°F")).toBeCloseTo((212 + 459.67) / 1.8, 10);
    expect(temperatureToK(300, "K")).toBe(300);
  });

  it("converts times to s", () => {
    expect(timeToS(15, "min")).toBe(900);
    expect(timeToS(2, "h")).toBe(7200);
  });

  it("round-trips every unit (invariant)", () => {
    const v = fc.double({ min: 1e-6, max: 1e9, noNaN: true });
    fc.assert(
      fc.property(v, (x) => {
        for (const u of RATE_UNITS)
          expect(rateFromGPerS(rateToGPerS(x, u), u) / x).toBeCloseTo(1, 12);
        for (const u of MASS_UNITS) expect(massFromG(massToG(x, u), u) / x).toBeCloseTo(1, 12);
        for (const u of LENGTH_UNITS)
          expect(lengthFromM(lengthToM(x, u), u) / x).toBeCloseTo(1, 12);
        for (const u of SPEED_UNITS)
          expect(speedFromMPerS(speedToMPerS(x, u), u) / x).toBeCloseTo(1, 12);
      }),
    );
    // Temperatures: offsets make tiny values lose digits, so test the range a fire or vent has.
    fc.assert(
      fc.property(fc.double({ min: 1, max: 3000, noNaN: true }), (t) => {
        for (const u of TEMPERATURE_UNITS) {
          expect(temperatureFromK(temperatureToK(t, u), u)).toBeCloseTo(t, 9);
        }
      }),
    );
  });
});

describe("parsing what the user typed", () => {
  it("reads plain and decimal-comma numbers, and says when a field is empty", () => {
    expect(parseNumber(" 2.5 ")).toBe(2.5);
    expect(parseNumber("2,5")).toBe(2.5);
    expect(parseNumber("-3")).toBe(-3);
    expect(parseNumber("1e3")).toBe(1000);
    expect(parseNumber("")).toBeNull();
    expect(parseNumber("   ")).toBeNull();
  });

  it("rejects anything that is not a finite number, never returning NaN", () => {
    for (const bad of ["abc", "1.2.3", "5 kg", "--1", "Infinity", "NaN", "1e999", "0x10"]) {
      expect(parseNumber(bad), bad).toBeUndefined();
    }
  });

  it("reads wind-from as degrees or one of the 16 compass points, 22.5° apart (common practice)", () => {
    expect(parseDirection("270")).toBe(270);
    expect(parseDirection("270°")).toBe(270);
    expect(parseDirection("N")).toBe(0);
    expect(parseDirection("e")).toBe(90);
    expect(parseDirection("WSW")).toBe(247.5);
    expect(parseDirection("NNW")).toBe(337.5);
    expect(parseDirection("")).toBeNull();
    expect(parseDirection("west")).toBeUndefined();
  });

  it("names the nearest compass point of a bearing", () => {
    expect(compassPoint(0)).toBe("N");
    expect(compassPoint(359)).toBe("N");
    expect(compassPoint(250)).toBe("WSW");
    expect(compassPoint(-90)).toBe("W");
  });
});

describe("display rounding never makes the hazard look smaller", () => {
  it("rounds to significant figures in the direction asked", () => {
    expect(roundSig(1234, 2)).toBe(1200);
    expect(roundSig(1234, 2, "up")).toBe(1300);
    expect(roundSig(1299, 2, "down")).toBe(1200);
    expect(roundSig(0.0123, 2, "up")).toBe(0.013);
    expect(roundSig(1200, 2, "up")).toBe(1200); // already round: no step up
    expect(roundSig(0, 2, "up")).toBe(0);
  });

  it("shows metres below 1 km and kilometres above; feet below 1000 ft and miles above", () => {
    expect(formatDistance(856, "metric", "up")).toBe("860 m");
    expect(formatDistance(1004.6, "metric", "up")).toBe("1.1 km");
    expect(formatDistance(996, "metric", "up")).toBe("1 km");
    expect(formatDistance(100, "us", "up")).toBe("330 ft"); // 328.08 ft
    expect(formatDistance(1609.344, "us", "up")).toBe("1 mi");
  });

  it("formats a reach: none, over 100 km, or rounded up", () => {
    expect(formatReach(null, "metric")).toBe("Not exceeded");
    expect(formatReach(100_000, "metric")).toBe("over 100 km");
    expect(formatReach(100_000, "us")).toBe("over 62 mi"); // 62.14 mi, rounded down
    expect(formatReach(2345, "metric")).toBe("2.4 km");
  });

  it("never shows a reach shorter than the computed one (property)", () => {
    fc.assert(
      fc.property(fc.double({ min: 0.5, max: 99_999, noNaN: true }), (m) => {
        const text = formatReach(m, "metric");
        const [num, unit] = text.split(" ");
        const shown = Number((num ?? "").replace(/,/g, "")) * (unit === "km" ? 1000 : 1);
        expect(shown).toBeGreaterThanOrEqual(m * (1 - 1e-12));
      }),
    );
  });

  it("formats areas and durations", () => {
    expect(formatArea(67_732, "metric", "up")).toBe("68,000 m²");
    expect(formatArea(274_715, "metric", "up")).toBe("0.28 km²");
    // acre = 43 560 ft² = 4046.8564224 m² with the international foot.
    expect(formatArea(4046.8564224 * 10, "us")).toBe("10 acres");
    expect(formatDuration(45)).toBe("45 s");
    expect(formatDuration(334.9, "down")).toBe("5 min");
    expect(formatDuration(3600)).toBe("1 h");
    expect(formatDuration(4500)).toBe("1 h 15 min");
  });
});
