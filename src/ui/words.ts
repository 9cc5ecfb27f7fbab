/**
 * Small plain-language helpers for the screen (no math beyond unit lookups).
 */
import { compassPoint, parseDirection } from "./units.ts";

/** "From W (270°), drifting toward E" for a typed wind-from value, or null when not understood. */
export function directionWords(text: string): string | null {
  const d = parseDirection(text);
  if (d === null || d === undefined || d < 0 || d > 360) return null;
  const toward = (d + 180) % 360;
  return `From ${compassPoint(d)} (${Math.round(d)}°), drifting toward ${compassPoint(toward)}.`;
}
