/**
 * The Gaussian plume / puff concentration for one averaging time (model.md, "Concentration").
 *
 * Continuous: C̄ = Q/(2π u σy,eff σz) · exp(−y²/(2σy,eff²)) · V(z) · F
 * All at once: C̄ = M/(2π u σy,eff σz) · exp(−y²/(2σy,eff²)) · V(z) · erf(u·t_a/(2√2σx))/t_a
 * with σx = σy,eff (common practice), σy,eff from the meander correction.
 * Units: x, y, z in m; concentrations in g/m³.
 */
import { durationFactor, instantaneousFactor, meanderFactor, samplingTime } from "./averaging.ts";
import { sigmas } from "./sigma.ts";
import type { PlumeSetup } from "./types.ts";
import { verticalTerm } from "./vertical.ts";

export interface Plume {
  readonly setup: PlumeSetup;
  /** Averaging time t_a (s). */
  readonly averaging: number;
  /** Sampling time used for the meander correction (s) and whether a clamp was hit. */
  readonly samplingTime: number;
  readonly samplingClamped: boolean;
  /** Factor on σy from the meander correction. */
  readonly meander: number;
  /** σy,eff (m) at x (m). */
  sigmaY(x: number): number;
  /** σz (m) at x (m). */
  sigmaZ(x: number): number;
  /** Time-averaged concentration C̄ (g/m³) at (x, y, z) in m. 0 upwind (x ≤ 0). */
  concentration(x: number, y: number, z: number): number;
  /** C̄(x, 0, z) (g/m³). */
  centreline(x: number, z: number): number;
  /**
   * Steady-plume amplitude before the duration factor (g/m³): Q/(2π u σy σz)·exp·V for a
   * continuous release, or the puff's peak M/((2π)^{3/2} σx σy σz)·exp·V for an all-at-once one.
   */
  amplitude(x: number, y: number, z: number): number;
}

/**
 * Distances between 0 and this (m) are evaluated at it. The point-source form diverges at the source;
 * at distances far below any physical source size the fitted curves stop being numbers: the
 * Pasquill–Gifford σy's tangent passes its pole below about 5 nm (class A), and below about
 * 1e-150 m σy·σz underflows to 0 and C̄ becomes NaN. 1 mm changes nothing a responder can see.
 */
export const MIN_DISTANCE_M = 1e-3;

/** Build the plume for averaging time `averaging` (s). */
export function makePlume(setup: PlumeSetup, averaging: number): Plume {
  const rel = setup.release;
  const T = rel.kind === "continuous" ? rel.duration : 0;
  const { ts, clamped } = samplingTime(averaging, T);
  const meander = meanderFactor(ts);
  const u = setup.windSpeed;
  const H = setup.effectiveHeight;
  const lid = setup.mixingHeight;
  const at = (x: number) =>
    sigmas(setup.scheme, setup.stability, setup.terrain, x > 0 ? Math.max(x, MIN_DISTANCE_M) : x);
  const sy = (x: number) => at(x).y * meander;
  const sz = (x: number) => at(x).z;

  const lidBlocks = lid !== null && H > lid;

  const concentration = (x: number, y: number, z: number): number => {
    if (!(x > 0) || lidBlocks) return 0;
    const s = at(x);
    const syE = s.y * meander;
    const szV = s.z;
    if (!(syE > 0) || !(szV > 0)) return 0;
    const base =
      (Math.exp(-(y * y) / (2 * syE * syE)) * verticalTerm(z, H, szV, lid)) /
      (2 * Math.PI * u * syE * szV);
    if (rel.kind === "continuous")
      return rel.rate * base * durationFactor(rel.duration, averaging, u, syE);
    return rel.mass * base * instantaneousFactor(averaging, u, syE);
  };

  const amplitude = (x: number, y: number, z: number): number => {
    if (!(x > 0) || lidBlocks) return 0;
    const s = at(x);
    const syE = s.y * meander;
    if (!(syE > 0) || !(s.z > 0)) return 0;
    const g = Math.exp(-(y * y) / (2 * syE * syE)) * verticalTerm(z, H, s.z, lid);
    if (rel.kind === "continuous") return (rel.rate * g) / (2 * Math.PI * u * syE * s.z);
    // Puff peak: M/((2π)^{3/2} σx σy σz) with σx = σy,eff.
    return (rel.mass * g) / ((2 * Math.PI) ** 1.5 * syE * syE * s.z);
  };

  return {
    setup,
    averaging,
    samplingTime: ts,
    samplingClamped: clamped,
    meander,
    sigmaY: sy,
    sigmaZ: sz,
    concentration,
    centreline: (x, z) => concentration(x, 0, z),
    amplitude,
  };
}
