/**
 * When the hazard arrives at and clears a point (model.md, "Arrival and departure at a point").
 *
 * The instantaneous concentration is C(τ) = C_plume·G(τ) with the σ's of the limit's band and
 * σx = σy,eff; for a release of duration T,
 *   G(τ) = ½[erf((uT/2 − uτ)/(√2σx)) + erf((uT/2 + uτ)/(√2σx))], τ from the midpoint x/u + T/2;
 * for an ongoing release G(t) = ½[1 + erf((ut − x)/(√2σx))] (the T → ∞ front), which never clears;
 * for an all-at-once release the puff's Gaussian in time, C(t) = C_peak·exp(−(x − ut)²/(2σx²)).
 * Times are seconds from the start of the release, never below 0.
 */
import { brent, erf } from "./numeric.ts";
import type { Plume } from "./plume.ts";

export interface Passage {
  /** s from release start; null when the limit is never exceeded at the point. */
  arrives: number | null;
  /** s from release start; null when never exceeded, or never clears (ongoing release). */
  clears: number | null;
}

const NONE: Passage = { arrives: null, clears: null };

/** Arrival and clear times (s) of limit C* (g/m³) at (x, y, z) (m) for the plume of that limit. */
export function passageAt(plume: Plume, limit: number, x: number, y: number, z: number): Passage {
  if (!(x > 0)) return NONE;
  const amp = plume.amplitude(x, y, z);
  if (!(amp >= limit) || amp === 0) return NONE;
  const u = plume.setup.windSpeed;
  const sx = plume.sigmaY(x);
  const rel = plume.setup.release;
  const travel = x / u;
  if (rel.kind === "instantaneous") {
    const half = (sx / u) * Math.sqrt(2 * Math.log(amp / limit));
    return { arrives: Math.max(0, travel - half), clears: travel + half };
  }
  const ratio = limit / amp; // in (0, 1]
  const k = Math.SQRT2 * sx;
  if (rel.duration === null) {
    if (ratio >= 1) return NONE; // only approached, never reached
    // ½[1 + erf((ut − x)/k)] = ratio → find t by bracketing (erf has no inverse here).
    const g = (t: number) => 0.5 * (1 + erf((u * t - x) / k)) - ratio;
    let hi = travel + (10 * sx) / u + 1;
    while (g(hi) < 0) hi *= 2;
    const t = g(0) >= 0 ? 0 : brent(g, 0, hi, 1e-6);
    return { arrives: Math.max(0, t), clears: null };
  }
  const T = rel.duration;
  const a = (u * T) / 2;
  const G = (tau: number) => 0.5 * (erf((a - u * tau) / k) + erf((a + u * tau) / k));
  if (!(G(0) >= ratio)) return NONE;
  const f = (tau: number) => G(tau) - ratio;
  let hi = T / 2 + (10 * sx) / u + 1;
  while (f(hi) > 0) hi *= 2;
  const tau = f(0) <= 0 ? 0 : brent(f, 0, hi, 1e-6);
  const mid = travel + T / 2;
  return { arrives: Math.max(0, mid - tau), clears: mid + tau };
}

/**
 * The cloud's front and back at (x, y, z): the times (s from release start) at which the
 * instantaneous concentration there is half its peak. Used for a band's far end, where the
 * t_a-average equals the limit by construction, so that the limit crossing itself is
 * ill-conditioned (a release longer than t_a gives a plateau at the limit). Ongoing release:
 * the front only (x/u), never clears. Duration T: the two ½-peak crossings of G(τ).
 * All at once: x/u ∓ (σx/u)·√(2 ln 2).
 */
export function cloudPassage(plume: Plume, x: number): Passage {
  if (!(x > 0)) return NONE;
  const u = plume.setup.windSpeed;
  const sx = plume.sigmaY(x);
  const rel = plume.setup.release;
  const travel = x / u;
  if (rel.kind === "instantaneous") {
    const half = (sx / u) * Math.sqrt(2 * Math.LN2);
    return { arrives: Math.max(0, travel - half), clears: travel + half };
  }
  if (rel.duration === null) return { arrives: travel, clears: null };
  const T = rel.duration;
  const a = (u * T) / 2;
  const k = Math.SQRT2 * sx;
  const G = (tau: number) => 0.5 * (erf((a - u * tau) / k) + erf((a + u * tau) / k));
  const target = G(0) / 2;
  const f = (tau: number) => G(tau) - target;
  let hi = T / 2 + (10 * sx) / u + 1;
  while (f(hi) > 0) hi *= 2;
  const tau = brent(f, 0, hi, 1e-6);
  const mid = travel + T / 2;
  return { arrives: Math.max(0, mid - tau), clears: mid + tau };
}
