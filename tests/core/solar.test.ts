/**
 * Checks of the hand-written solar position (src/core/solar.ts) against sources outside
 * the project:
 * - Meeus (1991), *Astronomical Algorithms*, Example 25.a (worked value).
 * - astronomy-engine (Don Cross, a reference library used only in tests): its
 *   Equator + Horizon functions give the Sun's altitude; SearchRiseSet gives sunrise and
 *   sunset (upper limb on the horizon with standard refraction).
 */
import * as Astronomy from "astronomy-engine";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  isNightByClock,
  SUNRISE_ELEVATION_DEG,
  solarElevationDeg,
  sunPosition,
} from "../../src/core/solar.ts";
import { runs } from "../support/fast-check.ts";

const MIN = 60_000;
const HOUR = 3_600_000;

/** Sun's altitude (degrees) from astronomy-engine, without or with its "normal" refraction. */
function referenceAltitude(timeMs: number, lat: number, lon: number, refraction = false): number {
  const date = new Date(timeMs);
  const observer = new Astronomy.Observer(lat, lon, 0);
  const eq = Astronomy.Equator(Astronomy.Body.Sun, date, observer, true, true);
  return Astronomy.Horizon(date, observer, eq.ra, eq.dec, refraction ? "normal" : undefined)
    .altitude;
}

const from1950 = Date.UTC(1950, 0, 1);
const to2050 = Date.UTC(2050, 0, 1);

describe("sunPosition", () => {
  it("gives Meeus's declination and right ascension for 1992 Oct 13, 0h TD", () => {
    // Meeus (1991), Astronomical Algorithms, Example 25.a: apparent δ = −7.78507°,
    // α = 198.38083° (low-accuracy method, the one NOAA's equations follow).
    const p = sunPosition(Date.UTC(1992, 9, 13, 0, 0, 0));
    expect(Math.abs(p.declinationDeg - -7.78507)).toBeLessThan(5e-5);
    expect(Math.abs(p.rightAscensionDeg - 198.38083)).toBeLessThan(5e-5);
  });

  it("gives the equation of time near +13.7 min on 1992 Oct 13 (from memory: Meeus Ex. 28)", () => {
    // From memory: Meeus's equation-of-time example for the same date gives about
    // +13 min 42.6 s. Loose tolerance accordingly.
    const p = sunPosition(Date.UTC(1992, 9, 13));
    expect(Math.abs(p.equationOfTimeMin - 13.71)).toBeLessThan(0.05);
  });

  it("keeps the declination within the obliquity, about ±23.44°, over a century", () => {
    fc.assert(
      fc.property(fc.integer({ min: from1950, max: to2050 }), (t) => {
        const { declinationDeg, rightAscensionDeg } = sunPosition(t);
        expect(Math.abs(declinationDeg)).toBeLessThan(23.45);
        expect(rightAscensionDeg).toBeGreaterThanOrEqual(0);
        expect(rightAscensionDeg).toBeLessThan(360);
      }),
      runs(300),
    );
  });
});

describe("solarElevationDeg", () => {
  it("agrees with astronomy-engine's altitude to 0.03° anywhere, 1950–2050", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: from1950, max: to2050 }),
        fc.double({ min: -89.5, max: 89.5, noNaN: true }),
        fc.double({ min: -180, max: 180, noNaN: true }),
        (t, lat, lon) => {
          const ours = solarElevationDeg(t, lat, lon);
          const ref = referenceAltitude(t, lat, lon);
          expect(Math.abs(ours - ref)).toBeLessThan(0.03);
        },
      ),
      runs(1000),
    );
  });

  it("with refraction on, agrees with astronomy-engine's refracted altitude above 5°", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: from1950, max: to2050 }),
        fc.double({ min: -70, max: 70, noNaN: true }),
        fc.double({ min: -180, max: 180, noNaN: true }),
        (t, lat, lon) => {
          const geometric = solarElevationDeg(t, lat, lon);
          fc.pre(geometric > 5);
          const ours = solarElevationDeg(t, lat, lon, true);
          expect(ours).toBeGreaterThanOrEqual(geometric); // NOAA: no correction above 85°
          expect(Math.abs(ours - referenceAltitude(t, lat, lon, true))).toBeLessThan(0.1);
        },
      ),
      runs(300),
    );
  });

  it("puts the noon sun at 90° − |latitude − declination| (closed form, at the sub-solar meridian)", () => {
    // At local apparent noon the hour angle is 0 and the elevation is 90° − |φ − δ|.
    // Choose the UTC instant whose true solar time at lon 0 is 12:00.
    const day = Date.UTC(2024, 2, 1);
    const { equationOfTimeMin, declinationDeg } = sunPosition(day + 12 * HOUR);
    const noon = day + 12 * HOUR - equationOfTimeMin * MIN;
    for (const lat of [-60, -20, 0, 30, 52]) {
      const expected = 90 - Math.abs(lat - declinationDeg);
      expect(Math.abs(solarElevationDeg(noon, lat, 0) - expected)).toBeLessThan(0.01);
    }
  });

  it("names the parameter and the range when the input is bad", () => {
    expect(() => solarElevationDeg(0, 91, 0)).toThrow(/lat: must be between -90 and 90.*91/);
    expect(() => solarElevationDeg(0, 0, -181)).toThrow(/lon: must be between -180 and 180/);
    expect(() => solarElevationDeg(Number.NaN, 0, 0)).toThrow(/time: must be a finite number/);
  });
});

describe("isNightByClock", () => {
  // Mid-latitude site: Paris, 48.8566° N, 2.3522° E; sunrise/sunset from astronomy-engine.
  const lat = 48.8566;
  const lon = 2.3522;
  const observer = new Astronomy.Observer(lat, lon, 0);

  for (const day of [Date.UTC(2024, 2, 20), Date.UTC(2024, 5, 21), Date.UTC(2024, 11, 21)]) {
    const label = new Date(day).toISOString().slice(0, 10);
    const rise = Astronomy.SearchRiseSet(Astronomy.Body.Sun, observer, +1, new Date(day), 1);
    const set = Astronomy.SearchRiseSet(Astronomy.Body.Sun, observer, -1, new Date(day), 1);
    if (rise === null || set === null) throw new Error("astronomy-engine found no rise/set");
    const riseMs = rise.date.getTime();
    const setMs = set.date.getTime();

    it(`switches to night one hour before sunset at Paris on ${label}`, () => {
      expect(isNightByClock(setMs - HOUR - 2 * MIN, lat, lon)).toBe(false);
      expect(isNightByClock(setMs - HOUR + 2 * MIN, lat, lon)).toBe(true);
      expect(isNightByClock(setMs, lat, lon)).toBe(true);
    });

    it(`switches to day one hour after sunrise at Paris on ${label}`, () => {
      expect(isNightByClock(riseMs + HOUR - 2 * MIN, lat, lon)).toBe(true);
      expect(isNightByClock(riseMs + HOUR + 2 * MIN, lat, lon)).toBe(false);
      expect(isNightByClock(riseMs, lat, lon)).toBe(true);
    });

    it(`is day at midday and night at midnight at Paris on ${label}`, () => {
      expect(isNightByClock((riseMs + setMs) / 2, lat, lon)).toBe(false);
      expect(isNightByClock((riseMs + setMs) / 2 + 12 * HOUR, lat, lon)).toBe(true);
    });
  }

  it("uses the −0.833° sunrise convention (Meeus 1991, ch. 15: h₀ = −0°50′)", () => {
    expect(SUNRISE_ELEVATION_DEG).toBeCloseTo(-50 / 60, 3);
  });

  it("is never night in polar day and always night in polar night (Tromsø, 69.65° N)", () => {
    // Tromsø has midnight sun around the June solstice and polar night around the
    // December one (both weeks long at 69.65° N; astronomy-engine finds no rise/set).
    const tromso = new Astronomy.Observer(69.65, 18.96, 0);
    const june = Date.UTC(2024, 5, 21);
    const december = Date.UTC(2024, 11, 21);
    expect(Astronomy.SearchRiseSet(Astronomy.Body.Sun, tromso, -1, new Date(june), 1)).toBeNull();
    expect(
      Astronomy.SearchRiseSet(Astronomy.Body.Sun, tromso, +1, new Date(december), 1),
    ).toBeNull();
    for (let h = 0; h < 24; h += 1) {
      expect(isNightByClock(june + h * HOUR, 69.65, 18.96)).toBe(false);
      expect(isNightByClock(december + h * HOUR, 69.65, 18.96)).toBe(true);
    }
  });

  it("is night whenever the sun is below −0.833° (the dark time between counts as night)", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: from1950, max: to2050 }),
        fc.double({ min: -89, max: 89, noNaN: true }),
        fc.double({ min: -180, max: 180, noNaN: true }),
        (t, la, lo) => {
          fc.pre(solarElevationDeg(t, la, lo) < SUNRISE_ELEVATION_DEG);
          expect(isNightByClock(t, la, lo)).toBe(true);
        },
      ),
      runs(300),
    );
  });
});
