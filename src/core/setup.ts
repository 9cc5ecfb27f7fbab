/**
 * The plume setup for one weather (stability class and measured wind) and the plumes built from
 * it, one per averaging time. Shared by the estimate and its spread. Pure.
 */
import { makePlume, type Plume } from "./plume.ts";
import { plumeRise } from "./rise.ts";
import type { ParsedScenario, PlumeSetup, StabilityClass } from "./types.ts";
import { windAtHeight } from "./wind.ts";

/** Plumes of one setup, built once per distinct averaging time t_a (s). */
export function plumeCache(setup: PlumeSetup): (averaging: number) => Plume {
  const cache = new Map<number, Plume>();
  return (averaging) => {
    let p = cache.get(averaging);
    if (!p) {
      p = makePlume(setup, averaging);
      cache.set(averaging, p);
    }
    return p;
  };
}

/**
 * The plume setup for one weather: stability class and measured wind speed (m/s, at the
 * scenario's wind height). Returns the setup (wind at release height after the calm clamp,
 * m/s; effective height with plume rise, m), whether the calm clamp was hit, and the
 * power-law wind before it (m/s).
 */
export function setupFor(
  parsed: ParsedScenario,
  stability: StabilityClass,
  windSpeedRef: number,
): { setup: PlumeSetup; calm: boolean; powerLaw: number } {
  const wind = windAtHeight(
    windSpeedRef,
    parsed.windRefHeight,
    parsed.height,
    stability,
    parsed.terrain,
  );
  const rise = parsed.hot ? plumeRise(parsed.hot, parsed.airTemperature, wind.used, stability) : 0;
  const setup: PlumeSetup = {
    release: parsed.release,
    height: parsed.height,
    windSpeed: wind.used,
    stability,
    terrain: parsed.terrain,
    scheme: parsed.scheme,
    mixingHeight: parsed.mixingHeight,
    effectiveHeight: parsed.height + rise,
  };
  return { setup, calm: wind.calm, powerLaw: wind.powerLaw };
}
