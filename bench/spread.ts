/**
 * The spread's cost, and the plain solve against a bare analytic floor (issue 13, bench).
 *
 * Floor: what any solve of 3 limits must do at least, written plainly: validate and prepare the
 * scenario (`prepare`), then per limit the centreline scan on the same log grid (40 per decade,
 * 1 m to 100 km), the reach refined by bisection to 1e-11 in ln x, and the half-width profile
 * w(x) = σy·√(2 ln(C̄/C*)) on the same 129 cosine-spaced stations with Simpson's area. No
 * outline polygon, no swing, no widest-point search, no timing, no warnings.
 * Times are wall-clock (performance.now), printed, never asserted.
 */
import { estimate, prepare } from "../src/core/index.ts";
import type { Scenario } from "../src/core/types.ts";
import { caseScenario, type Stats, stats, time } from "./solve.ts";

/** The floor: reach, and area from the half-width profile, of every limit (m, m²). */
export function analyticFloor(s: Scenario): { reach: number; area: number }[] {
  const prep = prepare(s);
  const zr = prep.parsed.receptorHeight;
  return prep.limits.map((l) => {
    const p = prep.plume(l.averaging);
    const f = (lnx: number) => p.centreline(Math.exp(lnx), zr) - l.value;
    const n = 200;
    const lnMax = Math.log(100_000);
    let last = -1;
    let prev = f(0);
    let first = prev >= 0 ? 0 : -1;
    for (let i = 1; i <= n; i++) {
      const v = f((lnMax * i) / n);
      if (prev < 0 && v >= 0 && first < 0) first = i;
      if (prev >= 0 && v < 0) last = i;
      prev = v;
    }
    if (last < 0 || first < 0) return { reach: 0, area: 0 };
    let a = (lnMax * (last - 1)) / n;
    let b = (lnMax * last) / n;
    while (b - a > 1e-11) {
      const m = (a + b) / 2;
      if (f(m) >= 0) a = m;
      else b = m;
    }
    const reach = Math.exp(a);
    const start = first === 0 ? 1 : Math.exp((lnMax * (first - 1)) / n);
    const len = reach - start;
    let area = 0;
    for (let i = 0; i <= 128; i++) {
      const th = (Math.PI * i) / 128;
      const x = start + (len * (1 - Math.cos(th))) / 2;
      const c = p.centreline(x, zr);
      const w = c > l.value ? p.sigmaY(x) * Math.sqrt(2 * Math.log(c / l.value)) : 0;
      const weight = i === 0 || i === 128 ? 1 : i % 2 === 1 ? 4 : 2;
      area += weight * 2 * w * (len / 2) * Math.sin(th);
    }
    return { reach, area: (area * Math.PI) / 128 / 3 };
  });
}

export interface SpreadBench {
  /** 3 limits, ongoing release, open country, swing 20°: plain and with the spread (ms). */
  plain_swing20: Stats;
  spread_swing20: Stats;
  /** 3 limits, no swing: the plain solve, the floor, and their ratio (medians). */
  plain_3_limits: Stats;
  floor_3_limits: Stats;
  plain_over_floor: number;
}

export function spreadBench(runs: number): SpreadBench {
  const swung = caseScenario({
    limits: 3,
    release: "ongoing",
    lid: false,
    swing: 20,
    terrain: "open",
  });
  const still = caseScenario({
    limits: 3,
    release: "ongoing",
    lid: false,
    swing: 0,
    terrain: "open",
  });
  const plainSwing = stats(time(() => estimate(swung, { geojson: false, spread: false }), runs));
  const spreadSwing = stats(time(() => estimate(swung, { geojson: false }), runs));
  const plain = stats(time(() => estimate(still, { geojson: false, spread: false }), runs));
  const floor = stats(time(() => analyticFloor(still), runs));
  return {
    plain_swing20: plainSwing,
    spread_swing20: spreadSwing,
    plain_3_limits: plain,
    floor_3_limits: floor,
    plain_over_floor: plain.median_ms / floor.median_ms,
  };
}
