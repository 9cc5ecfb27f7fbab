/**
 * What the log view keeps in memory per entry: a few short fields, not the whole entry, so that
 * 10,000 entries stay light. The full entry is read from storage when it is opened.
 */
import type { LogEntry } from "../../storage/schema.ts";
import { localDay } from "../../storage/time.ts";

export interface LogSummary {
  id: string;
  time_local: string;
  time_utc: string;
  day: string;
  place: string;
  note: string;
  figures: string;
  model_version: string;
  /** Lower-case text the filter searches. */
  haystack: string;
}

/** Distance for the list: 850 m, 1.2 km, "over 100 km". */
export function distanceText(m: number | null): string {
  if (m === null || !Number.isFinite(m)) return "none";
  if (m >= 100_000) return "over 100 km";
  if (m < 1000) return `${Math.round(m)} m`;
  return `${(m / 1000).toFixed(m < 10_000 ? 2 : 1)} km`;
}

/** 2024-05-01 14:03 (+02:00) */
export function timeText(isoLocal: string): string {
  const m = /^(\d{4}-\d\d-\d\d)T(\d\d:\d\d)(?::\d\d(?:\.\d+)?)?(Z|[+-]\d\d:\d\d)$/.exec(isoLocal);
  return m ? `${m[1]} ${m[2]} (${m[3] === "Z" ? "UTC" : m[3]})` : isoLocal;
}

export function placeText(p: LogEntry["place"]): string {
  if (!p) return "No place";
  const acc = p.accuracy_m === null ? "" : ` ±${Math.round(p.accuracy_m)} m`;
  return `${p.lat.toFixed(5)}, ${p.lon.toFixed(5)}${acc}`;
}

export function summarise(e: LogEntry): LogSummary {
  const figures = e.results.bands
    .map((b) => `${b.label}: reach ${distanceText(b.reach_m)}`)
    .join("; ");
  const place = placeText(e.place);
  return {
    id: e.id,
    time_local: e.time_local,
    time_utc: e.time_utc,
    day: localDay(e.time_local),
    place,
    note: e.note,
    figures: `Class ${e.results.stability_used}. ${figures || "No limits."}`,
    model_version: e.model_version,
    haystack: `${e.time_local} ${place} ${e.note} ${figures} ${e.model_version}`.toLowerCase(),
  };
}

/** Whether a summary passes the filter (text: every word must appear; day: YYYY-MM-DD or ""). */
export function matches(s: LogSummary, text: string, day: string): boolean {
  if (day && s.day !== day) return false;
  const words = text.toLowerCase().split(/\s+/).filter(Boolean);
  return words.every((w) => s.haystack.includes(w));
}

/** Inserts a summary into a newest-first list (by time_utc, then id, like the store's index). */
export function insertSorted(list: LogSummary[], s: LogSummary): LogSummary[] {
  const out = list.filter((x) => x.id !== s.id);
  const key = (x: LogSummary) => `${x.time_utc}\u0000${x.id}`;
  const k = key(s);
  let i = 0;
  while (i < out.length && key(out[i] as LogSummary) > k) i++;
  out.splice(i, 0, s);
  return out;
}
