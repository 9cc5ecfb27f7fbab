/**
 * Unit conversions and display formatting for the estimate screen.
 *
 * Pure functions, no DOM. Every conversion goes to or from the core's SI units
 * (g, s, m, m/s, K). Exact factors from NIST Special Publication 811 (2008 ed.),
 * *Guide for the Use of the International System of Units*, Appendix B:
 * pound (avoirdupois) = 0.45359237 kg, foot = 0.3048 m, knot = 1852/3600 m/s,
 * mile per hour = 0.44704 m/s, mile (statute) = 1609.344 m, acre = 4046.8564224 m².
 */

export const KG_PER_LB = 0.45359237;
export const M_PER_FT = 0.3048;
export const M_S_PER_KNOT = 1852 / 3600;
export const M_S_PER_MPH = 0.44704;
export const M_PER_MILE = 1609.344;
export const M2_PER_ACRE = 4046.8564224;

export type RateUnit = "g/s" | "kg/s" | "kg/min" | "lb/min";
export type MassUnit = "g" | "kg" | "lb";
export type LengthUnit = "m" | "ft";
export type SpeedUnit = "m/s" | "km/h" | "mph" | "knots";
export type TimeUnit = "s" | "min" | "h";
export type TemperatureUnit = "°C" | "°F" | "K";
export type UnitSystem = "metric" | "us";

export const RATE_UNITS: readonly RateUnit[] = ["g/s", "kg/s", "kg/min", "lb/min"];
export const MASS_UNITS: readonly MassUnit[] = ["g", "kg", "lb"];
export const LENGTH_UNITS: readonly LengthUnit[] = ["m", "ft"];
export const SPEED_UNITS: readonly SpeedUnit[] = ["m/s", "km/h", "mph", "knots"];
export const TIME_UNITS: readonly TimeUnit[] = ["min", "s", "h"];
export const TEMPERATURE_UNITS: readonly TemperatureUnit[] = ["°C", "°F", "K"];

const RATE_TO_G_S: Record<RateUnit, number> = {
  "g/s": 1,
  "kg/s": 1000,
  "kg/min": 1000 / 60,
  "lb/min": (KG_PER_LB * 1000) / 60,
};
const MASS_TO_G: Record<MassUnit, number> = { g: 1, kg: 1000, lb: KG_PER_LB * 1000 };
const LENGTH_TO_M: Record<LengthUnit, number> = { m: 1, ft: M_PER_FT };
const SPEED_TO_M_S: Record<SpeedUnit, number> = {
  "m/s": 1,
  "km/h": 1000 / 3600,
  mph: M_S_PER_MPH,
  knots: M_S_PER_KNOT,
};
const TIME_TO_S: Record<TimeUnit, number> = { s: 1, min: 60, h: 3600 };

/** Release rate in `unit` → g/s. */
export function rateToGPerS(value: number, unit: RateUnit): number {
  return value * RATE_TO_G_S[unit];
}
/** g/s → release rate in `unit`. */
export function rateFromGPerS(gPerS: number, unit: RateUnit): number {
  return gPerS / RATE_TO_G_S[unit];
}
/** Mass in `unit` → g. */
export function massToG(value: number, unit: MassUnit): number {
  return value * MASS_TO_G[unit];
}
export function massFromG(g: number, unit: MassUnit): number {
  return g / MASS_TO_G[unit];
}
/** Length in `unit` → m. */
export function lengthToM(value: number, unit: LengthUnit): number {
  return value * LENGTH_TO_M[unit];
}
export function lengthFromM(m: number, unit: LengthUnit): number {
  return m / LENGTH_TO_M[unit];
}
/** Speed in `unit` → m/s. */
export function speedToMPerS(value: number, unit: SpeedUnit): number {
  return value * SPEED_TO_M_S[unit];
}
export function speedFromMPerS(mPerS: number, unit: SpeedUnit): number {
  return mPerS / SPEED_TO_M_S[unit];
}
/** Time in `unit` → s. */
export function timeToS(value: number, unit: TimeUnit): number {
  return value * TIME_TO_S[unit];
}
export function timeFromS(s: number, unit: TimeUnit): number {
  return s / TIME_TO_S[unit];
}
/** Temperature in `unit` → K (°F by 5/9 of the Fahrenheit interval from 32 °F = 273.15 K). */
export function temperatureToK(value: number, unit: TemperatureUnit): number {
  if (unit === "K") return value;
  if (unit === "°C") return value + 273.15;
  return ((value - 32) * 5) / 9 + 273.15;
}
export function temperatureFromK(k: number, unit: TemperatureUnit): number {
  if (unit === "K") return k;
  if (unit === "°C") return k - 273.15;
  return ((k - 273.15) * 9) / 5 + 32;
}

// ---------------------------------------------------------------------------
// Parsing typed numbers
// ---------------------------------------------------------------------------

/**
 * Parse what the user typed into a number field. Accepts a decimal comma
 * ("2,5") and surrounding spaces. Returns `null` for an empty field and `NaN`
 * never: anything that is not a finite number gives `undefined`.
 */
export function parseNumber(text: string): number | null | undefined {
  const t = text.trim().replace(",", ".");
  if (t === "") return null;
  if (!/^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i.test(t)) return undefined;
  const v = Number(t);
  return Number.isFinite(v) ? v : undefined;
}

/** The 16 compass points, clockwise from north, 22.5° apart. */
export const COMPASS_POINTS = [
  "N",
  "NNE",
  "NE",
  "ENE",
  "E",
  "ESE",
  "SE",
  "SSE",
  "S",
  "SSW",
  "SW",
  "WSW",
  "W",
  "WNW",
  "NW",
  "NNW",
] as const;

/**
 * Parse a wind-from direction: degrees ("270", "270°") or one of the 16
 * compass points ("W", "wsw"). Returns degrees true, or `null` when empty,
 * `undefined` when not understood. Range checks are the core's job.
 */
export function parseDirection(text: string): number | null | undefined {
  const t = text.trim().replace(/°$/, "").trim();
  if (t === "") return null;
  const i = COMPASS_POINTS.indexOf(t.toUpperCase() as (typeof COMPASS_POINTS)[number]);
  if (i >= 0) return i * 22.5;
  return parseNumber(t);
}

/** Nearest of the 16 compass points to a bearing in degrees. */
export function compassPoint(deg: number): string {
  const i = Math.round((((deg % 360) + 360) % 360) / 22.5) % 16;
  return COMPASS_POINTS[i] ?? "N";
}

// ---------------------------------------------------------------------------
// Display formatting
// ---------------------------------------------------------------------------

export type Rounding = "up" | "down" | "nearest";

/**
 * Round to `digits` significant figures. "up" and "down" round away from or
 * toward zero in magnitude for positive numbers (used so that a shown reach is
 * never shorter than the computed one). 0 stays 0; non-finite values pass through.
 */
export function roundSig(value: number, digits: number, mode: Rounding = "nearest"): number {
  if (value === 0 || !Number.isFinite(value)) return value;
  const exp = Math.floor(Math.log10(Math.abs(value))) - digits + 1;
  const scale = 10 ** exp;
  const q = value / scale;
  // Guard against 1.0000000002-style float noise before ceil/floor.
  const qClean = Math.abs(q - Math.round(q)) < 1e-9 ? Math.round(q) : q;
  const r =
    mode === "up" ? Math.ceil(qClean) : mode === "down" ? Math.floor(qClean) : Math.round(q);
  const out = r * scale;
  // Re-express with the right number of decimals to avoid 0.30000000000000004.
  return exp < 0 ? Number(out.toFixed(-exp)) : out;
}

function group(n: number): string {
  return n.toLocaleString("en-US", { maximumFractionDigits: 6 });
}

/** Significant figures used for every displayed figure. Screening output: two is honest. */
export const SIG_DIGITS = 2;

/**
 * A distance for display: metric shows m below 1 km and km above; US customary
 * shows ft below 1000 ft and miles above. `mode` chooses the rounding direction.
 */
export function formatDistance(m: number, system: UnitSystem, mode: Rounding = "nearest"): string {
  if (system === "metric") {
    if (Math.abs(m) < 1000) {
      const v = roundSig(m, SIG_DIGITS, mode);
      if (Math.abs(v) < 1000) return `${group(v)} m`;
    }
    return `${group(roundSig(m / 1000, SIG_DIGITS, mode))} km`;
  }
  const ft = m / M_PER_FT;
  if (Math.abs(ft) < 1000) {
    const v = roundSig(ft, SIG_DIGITS, mode);
    if (Math.abs(v) < 1000) return `${group(v)} ft`;
  }
  return `${group(roundSig(m / M_PER_MILE, SIG_DIGITS, mode))} mi`;
}

/** An area for display: m² / km² (metric), acres / mi² (US customary). */
export function formatArea(m2: number, system: UnitSystem, mode: Rounding = "nearest"): string {
  if (system === "metric") {
    if (m2 < 100_000) return `${group(roundSig(m2, SIG_DIGITS, mode))} m²`;
    return `${group(roundSig(m2 / 1e6, SIG_DIGITS, mode))} km²`;
  }
  const acres = m2 / M2_PER_ACRE;
  if (acres < 640) return `${group(roundSig(acres, SIG_DIGITS, mode))} acres`;
  return `${group(roundSig(m2 / (M_PER_MILE * M_PER_MILE), SIG_DIGITS, mode))} mi²`;
}

/**
 * A time since release start: "40 s", "12 min", "1 h 05 min". Rounded to the
 * second below 1 min, to the minute above (`mode` picks the direction).
 */
export function formatDuration(s: number, mode: Rounding = "nearest"): string {
  const r = (v: number) =>
    mode === "up" ? Math.ceil(v) : mode === "down" ? Math.floor(v) : Math.round(v);
  if (s < 60) return `${r(s)} s`;
  const min = r(s / 60);
  if (min < 60) return `${min} min`;
  const h = Math.floor(min / 60);
  const rest = min - h * 60;
  return rest === 0 ? `${h} h` : `${h} h ${String(rest).padStart(2, "0")} min`;
}

/** A concentration in mg/m³ with two significant figures. */
export function formatConcentration(mgM3: number): string {
  return `${group(roundSig(mgM3, SIG_DIGITS))} mg/m³`;
}

/** The reach in the form shown on each band (the browser tests compare with this). */
export function formatReach(reachM: number | null, system: UnitSystem): string {
  if (reachM === null) return "Not exceeded";
  if (reachM >= 100_000) return `over ${formatDistance(100_000, system, "down")}`;
  return formatDistance(reachM, system, "up");
}
