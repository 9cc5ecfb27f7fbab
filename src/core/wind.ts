/**
 * Wind speed at release height by the power law u = u_ref·(max(h, z_ref)/z_ref)^p with the
 * regulatory default exponents (Irwin 1979, *Atmospheric Environment* 13; as used in US EPA
 * EPA-454/R-99-005 §6.2.5 and the ISC3 user's guide, EPA-454/B-95-003b).
 */
import type { StabilityClass, Terrain } from "./types.ts";

export const WIND_EXPONENTS: Record<Terrain, Record<StabilityClass, number>> = {
  open: { A: 0.07, B: 0.07, C: 0.1, D: 0.15, E: 0.35, F: 0.55 },
  urban: { A: 0.15, B: 0.15, C: 0.2, D: 0.25, E: 0.3, F: 0.3 },
};

/** Below this wind speed (m/s) the Gaussian form does not hold; the model computes with it. */
export const CALM_WIND_M_S = 1;

/**
 * Wind speed (m/s) at release height `h` (m) from `uRef` (m/s) measured at `zRef` (m).
 * Returns the power-law speed and the speed used after the calm clamp (≥ 1 m/s).
 */
export function windAtHeight(
  uRef: number,
  zRef: number,
  h: number,
  c: StabilityClass,
  terrain: Terrain,
): { powerLaw: number; used: number; calm: boolean } {
  const p = WIND_EXPONENTS[terrain][c];
  const powerLaw = uRef * (Math.max(h, zRef) / zRef) ** p;
  const calm = powerLaw < CALM_WIND_M_S;
  return { powerLaw, used: calm ? CALM_WIND_M_S : powerLaw, calm };
}
