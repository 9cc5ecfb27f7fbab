/**
 * Averaging time and release duration (model.md, "Averaging time and release duration").
 *
 * 1. Plume meander: σy,eff = σy·(t_s/600 s)^0.2 with t_s = clamp(min(t_a, T), 180 s, 3600 s)
 *    (Turner 1970, *Workbook of Atmospheric Dispersion Estimates*, ch. 3, p = 0.2).
 * 2. Finite duration (Palazzi, De Faveri, Fumarola & Ferraiolo 1982, *Atmospheric Environment* 16):
 *    the highest t_a-average of a release of duration T, window centred on the passage midpoint.
 */
import { clamp, erf } from "./numeric.ts";

export const SAMPLING_MIN_S = 180;
export const SAMPLING_MAX_S = 3600;
export const REFERENCE_AVERAGING_S = 600;
export const MEANDER_EXPONENT = 0.2;

/**
 * Sampling time t_s (s) for the meander correction, and whether a clamp was hit.
 * `duration` (s): null for an ongoing release (T = ∞), 0 for an instantaneous one.
 */
export function samplingTime(
  averaging: number,
  duration: number | null,
): { ts: number; clamped: boolean } {
  const raw = Math.min(averaging, duration ?? Number.POSITIVE_INFINITY);
  const ts = clamp(raw, SAMPLING_MIN_S, SAMPLING_MAX_S);
  return { ts, clamped: ts !== raw };
}

/** Factor on σy for sampling time t_s (s): (t_s / 600)^0.2. */
export function meanderFactor(ts: number): number {
  return (ts / REFERENCE_AVERAGING_S) ** MEANDER_EXPONENT;
}

/** Φ(s) = s·erf(s) + exp(−s²)/√π, an antiderivative of erf (even in s). */
export function phi(s: number): number {
  const a = Math.abs(s);
  return a * erf(a) + Math.exp(-a * a) / Math.sqrt(Math.PI);
}

/**
 * Palazzi window-average factor F (dimensionless, 0 < F ≤ 1) for a release of duration T (s),
 * averaging time t_a (s), wind u (m/s) and along-wind spread σx (m):
 * F = b/(u·t_a)·[Φ((a+h)/b) − Φ((a−h)/b)], a = uT/2, h = u·t_a/2, b = √2·σx.
 * T = null (ongoing) → 1. σx = 0 → min(1, T/t_a) (the no-spread limit).
 */
export function durationFactor(T: number | null, ta: number, u: number, sigmaX: number): number {
  if (T === null) return 1;
  const a = (u * T) / 2;
  const h = (u * ta) / 2;
  if (!(sigmaX > 0)) return Math.min(1, T / ta);
  const b = Math.SQRT2 * sigmaX;
  const f = (b / (u * ta)) * (phi((a + h) / b) - phi((a - h) / b));
  return clamp(f, 0, 1);
}

/**
 * The all-at-once counterpart of Q·F: mass M (g) over averaging t_a (s) gives the factor
 * erf(u·t_a/(2√2·σx))/t_a (1/s), so that C̄ = M/(2π u σy σz)·…·this.
 */
export function instantaneousFactor(ta: number, u: number, sigmaX: number): number {
  if (!(sigmaX > 0)) return 1 / ta;
  return erf((u * ta) / (2 * Math.SQRT2 * sigmaX)) / ta;
}
