/**
 * The sun's position in the sky, written by hand from a published algorithm.
 *
 * Method: the equations of NOAA's solar calculator (NOAA Global Monitoring
 * Laboratory, "Solar Calculation Details" and its spreadsheet NOAA_Solar_Calculations),
 * which are the low-accuracy solar coordinates of Meeus (1991), *Astronomical
 * Algorithms*, ch. 24–25 (Sun's apparent longitude, declination, right ascension;
 * Example 25.a) and ch. 27 / Smart's formula for the equation of time. Stated accuracy
 * of the coordinates about 0.01° for years 1800–2100; the elevation is good to a few
 * hundredths of a degree there, far finer than the 15° / 35° / 60° insolation bins
 * and the 1-hour night rule it feeds.
 *
 * Simplifications (documented, deliberate):
 * - Time scale: the same instant is used as UT (for the Earth's rotation) and as TD
 *   (for the Sun's orbit). ΔT (about a minute) moves the Sun by under 0.001°.
 * - Parallax (0.0024°) is ignored.
 * - Atmospheric refraction is NOT applied by default: `solarElevationDeg` returns the
 *   elevation of the Sun's apparent (aberration- and nutation-corrected) centre above
 *   the true horizon. Pass `refraction = true` to add NOAA's refraction correction
 *   (at most about 0.6°, at the horizon; under 0.06° above 15°).
 *
 * Pure: no clock is read; the instant is passed in.
 */

const DEG = Math.PI / 180;
const MS_PER_DAY = 86_400_000;
/** Julian Day of the Unix epoch, 1970-01-01T00:00Z. */
const JD_UNIX_EPOCH = 2_440_587.5;
/** Julian Day of J2000.0. */
const JD_J2000 = 2_451_545.0;

/**
 * Geometric elevation of the Sun's centre at apparent sunrise/sunset (degrees):
 * 34′ of standard refraction plus 16′ of solar semidiameter (Meeus 1991, ch. 15:
 * h₀ = −0°50′ ≈ −0.833°). Below it, the sun is down.
 */
export const SUNRISE_ELEVATION_DEG = -0.833;

/** One hour in milliseconds: the margin of the night rule. */
const HOUR_MS = 3_600_000;

/** Sun's apparent equatorial position at an instant (Meeus 1991, ch. 25, low accuracy). */
export interface SunPosition {
  /** Apparent declination δ (degrees, −90…90). */
  declinationDeg: number;
  /** Apparent right ascension α (degrees, 0…360). */
  rightAscensionDeg: number;
  /** Equation of time, apparent minus mean solar time (minutes). */
  equationOfTimeMin: number;
}

function mod360(x: number): number {
  const r = x % 360;
  return r < 0 ? r + 360 : r;
}

function checkTime(timeMs: number): void {
  if (!Number.isFinite(timeMs)) {
    throw new RangeError(
      `time: must be a finite number of milliseconds since 1970-01-01T00:00Z (got ${timeMs})`,
    );
  }
}

function checkPlace(latDeg: number, lonDeg: number): void {
  if (!Number.isFinite(latDeg) || latDeg < -90 || latDeg > 90) {
    throw new RangeError(`lat: must be between -90 and 90 degrees (got ${latDeg})`);
  }
  if (!Number.isFinite(lonDeg) || lonDeg < -180 || lonDeg > 180) {
    throw new RangeError(`lon: must be between -180 and 180 degrees (got ${lonDeg})`);
  }
}

/**
 * The Sun's apparent declination, right ascension and the equation of time.
 *
 * NOAA solar calculator equations (after Meeus 1991, *Astronomical Algorithms*, ch. 25):
 * mean longitude L₀, mean anomaly M, eccentricity e, equation of centre C, apparent
 * longitude λ = L₀ + C − 0.00569° − 0.00478°·sin Ω, obliquity ε = ε₀ + 0.00256°·cos Ω.
 *
 * @param timeMs instant, milliseconds since 1970-01-01T00:00Z
 * @returns declination and right ascension in degrees, equation of time in minutes
 * @example sunPosition(Date.UTC(1992, 9, 13)).declinationDeg // ≈ −7.785 (Meeus Ex. 25.a)
 */
export function sunPosition(timeMs: number): SunPosition {
  checkTime(timeMs);
  const jd = timeMs / MS_PER_DAY + JD_UNIX_EPOCH;
  const t = (jd - JD_J2000) / 36_525; // Julian centuries from J2000.0

  const l0 = mod360(280.46646 + t * (36_000.76983 + t * 0.0003032)); // geometric mean longitude
  const m = 357.52911 + t * (35_999.05029 - 0.0001537 * t); // mean anomaly
  const e = 0.016708634 - t * (0.000042037 + 0.0000001267 * t); // orbit eccentricity
  const c =
    Math.sin(m * DEG) * (1.914602 - t * (0.004817 + 0.000014 * t)) +
    Math.sin(2 * m * DEG) * (0.019993 - 0.000101 * t) +
    Math.sin(3 * m * DEG) * 0.000289; // equation of centre
  const trueLong = l0 + c;
  const omega = 125.04 - 1934.136 * t; // longitude of the Moon's ascending node
  const appLong = trueLong - 0.00569 - 0.00478 * Math.sin(omega * DEG);
  const eps0 = 23 + (26 + (21.448 - t * (46.815 + t * (0.00059 - t * 0.001813))) / 60) / 60;
  const eps = eps0 + 0.00256 * Math.cos(omega * DEG);

  const sinLam = Math.sin(appLong * DEG);
  const declinationDeg = Math.asin(Math.sin(eps * DEG) * sinLam) / DEG;
  const rightAscensionDeg = mod360(
    Math.atan2(Math.cos(eps * DEG) * sinLam, Math.cos(appLong * DEG)) / DEG,
  );

  const y = Math.tan((eps / 2) * DEG) ** 2;
  const l0r = l0 * DEG;
  const mr = m * DEG;
  const equationOfTimeMin =
    (4 / DEG) *
    (y * Math.sin(2 * l0r) -
      2 * e * Math.sin(mr) +
      4 * e * y * Math.sin(mr) * Math.cos(2 * l0r) -
      0.5 * y * y * Math.sin(4 * l0r) -
      1.25 * e * e * Math.sin(2 * mr));

  return { declinationDeg, rightAscensionDeg, equationOfTimeMin };
}

/**
 * NOAA's atmospheric refraction correction (degrees) for a geometric elevation (degrees):
 * 0 above 85°; 58.1″/tan h − 0.07″/tan³ h + 0.000086″/tan⁵ h above 5°; a polynomial
 * between −0.575° and 5°; −20.772″/tan h below (NOAA solar calculator spreadsheet).
 */
function refractionDeg(elevDeg: number): number {
  if (elevDeg > 85) return 0;
  const te = Math.tan(elevDeg * DEG);
  let arcsec: number;
  if (elevDeg > 5) arcsec = 58.1 / te - 0.07 / te ** 3 + 0.000086 / te ** 5;
  else if (elevDeg > -0.575)
    arcsec = 1735 + elevDeg * (-518.2 + elevDeg * (103.4 + elevDeg * (-12.79 + elevDeg * 0.711)));
  else arcsec = -20.772 / te;
  return arcsec / 3600;
}

/**
 * The Sun's elevation above the horizon (degrees, −90…90) at an instant and place.
 *
 * NOAA solar calculator equations after Meeus (1991), *Astronomical Algorithms*:
 * true solar time = UTC minutes of the day + equation of time + 4·longitude, hour angle
 * = true solar time / 4 − 180°, cos zenith = sin φ sin δ + cos φ cos δ cos H.
 *
 * Refraction: off by default (elevation of the apparent centre above the true horizon,
 * the quantity the −0.833° sunrise convention and the insolation bins refer to); pass
 * `refraction = true` to add NOAA's refraction correction.
 *
 * @param timeMs instant, milliseconds since 1970-01-01T00:00Z
 * @param latDeg latitude, degrees north (−90…90)
 * @param lonDeg longitude, degrees east (−180…180)
 * @param refraction add atmospheric refraction (default false)
 * @returns elevation in degrees; negative below the horizon
 * @throws RangeError naming the parameter when it is not finite or out of range
 * @example solarElevationDeg(Date.UTC(2024, 5, 21, 12), 45, 0) // ≈ 68.4
 */
export function solarElevationDeg(
  timeMs: number,
  latDeg: number,
  lonDeg: number,
  refraction = false,
): number {
  checkTime(timeMs);
  checkPlace(latDeg, lonDeg);
  const { declinationDeg, equationOfTimeMin } = sunPosition(timeMs);
  const dayMs = ((timeMs % MS_PER_DAY) + MS_PER_DAY) % MS_PER_DAY;
  const trueSolarMin = dayMs / 60_000 + equationOfTimeMin + 4 * lonDeg;
  const hourAngleDeg = trueSolarMin / 4 - 180; // any multiple of 360° is harmless in cos
  const phi = latDeg * DEG;
  const dec = declinationDeg * DEG;
  const cosZ =
    Math.sin(phi) * Math.sin(dec) + Math.cos(phi) * Math.cos(dec) * Math.cos(hourAngleDeg * DEG);
  const elev = 90 - Math.acos(Math.min(1, Math.max(-1, cosZ))) / DEG;
  return refraction ? elev + refractionDeg(elev) : elev;
}

/**
 * Whether an instant counts as night by model.md's rule "night is from one hour before
 * sunset to one hour after sunrise".
 *
 * Implemented as: night iff the sun is down (unrefracted elevation below
 * {@link SUNRISE_ELEVATION_DEG}, −0.833°) one hour later OR one hour earlier OR now.
 * So the hour before sunset and the hour after sunrise count as night, and so does the
 * dark time between. This form needs no search for rise/set times and handles polar day
 * (never night) and polar night (always night) without special cases. The "or now" term
 * changes nothing when the sun stays down for two hours or more (every night outside
 * the polar regions); it only keeps a short dip below the horizon (under two hours, near
 * the polar circles in summer) from counting as day while the sun is actually down.
 *
 * @param timeMs instant, milliseconds since 1970-01-01T00:00Z
 * @param latDeg latitude, degrees north (−90…90)
 * @param lonDeg longitude, degrees east (−180…180)
 * @returns true at night by the clock
 */
export function isNightByClock(timeMs: number, latDeg: number, lonDeg: number): boolean {
  return (
    solarElevationDeg(timeMs + HOUR_MS, latDeg, lonDeg) < SUNRISE_ELEVATION_DEG ||
    solarElevationDeg(timeMs - HOUR_MS, latDeg, lonDeg) < SUNRISE_ELEVATION_DEG ||
    solarElevationDeg(timeMs, latDeg, lonDeg) < SUNRISE_ELEVATION_DEG
  );
}
