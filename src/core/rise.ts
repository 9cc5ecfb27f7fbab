/**
 * Briggs' final plume rise for a hot release (Briggs 1975, as in the ISC3 user's guide,
 * EPA-454/B-95-003b, Vol. II §1.1.4). u is the wind at release height.
 */
import type { HotRelease, StabilityClass } from "./types.ts";

export const GRAVITY = 9.80665;

/** Buoyancy flux F_b (m⁴/s³) = g·v·d²·(T_s − T_a)/(4·T_s); 0 when the gas is not warmer than the air. */
export function buoyancyFlux(hot: HotRelease, airTemperature: number): number {
  const dT = hot.gasTemperature - airTemperature;
  if (!(dT > 0)) return 0;
  return (GRAVITY * hot.exitSpeed * hot.diameter ** 2 * dT) / (4 * hot.gasTemperature);
}

/** Potential temperature gradient dθ/dz (K/m) for the stable classes. */
export const STABLE_LAPSE: Partial<Record<StabilityClass, number>> = { E: 0.02, F: 0.035 };

/**
 * Final rise Δh (m). Classes A–D: 21.425·F_b^¾/u if F_b < 55, else 38.71·F_b^⅗/u.
 * Classes E, F: 2.6·(F_b/(u·s))^⅓ with s = g·(dθ/dz)/T_a.
 */
export function plumeRise(
  hot: HotRelease,
  airTemperature: number,
  u: number,
  c: StabilityClass,
): number {
  const fb = buoyancyFlux(hot, airTemperature);
  if (fb <= 0) return 0;
  const lapse = STABLE_LAPSE[c];
  if (lapse !== undefined) {
    const s = (GRAVITY * lapse) / airTemperature;
    return 2.6 * (fb / (u * s)) ** (1 / 3);
  }
  return fb < 55 ? (21.425 * fb ** 0.75) / u : (38.71 * fb ** 0.6) / u;
}
