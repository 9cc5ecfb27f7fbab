/**
 * The suggested stability class for what is on the form, shown beside the
 * class picker whether or not the user overrides it. Calls the core's
 * `suggestStability`; any input it cannot use yet gives no suggestion.
 */
import { suggestStability } from "../core/stability.ts";
import type { StabilityClass } from "../core/types.ts";
import { buildScenario, type FormState } from "./form.ts";

export function suggestionFor(
  form: FormState,
  timeIso: string,
): { stability: StabilityClass; reason: string } | null {
  const built = buildScenario({ ...form, stability: "auto" }, { timeIso });
  if (!built.ok) return null;
  const w = built.scenario.weather;
  try {
    const s = suggestStability({
      windSpeed: w.wind_speed_m_s,
      windHeight: w.wind_height_m ?? 10,
      terrain: w.terrain ?? "open",
      sky: w.sky ?? "overcast",
      timeMs: Date.parse(timeIso),
      lat: built.scenario.source?.lat ?? null,
      lon: built.scenario.source?.lon ?? null,
    });
    return { stability: s.stability, reason: s.reason };
  } catch {
    return null;
  }
}
