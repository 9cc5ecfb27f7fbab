/**
 * The scenario reader's tools: ranges and their wording, the problem collector
 * ({@link Reader}) and the ISO 8601 time parser. Pure: no DOM, no storage, no clock.
 */

import type { ScenarioProblem } from "../types.ts";

/** A numeric range: `[min, max]`, or `(min, max]` when `minOpen`. */
export interface NumberRange {
  min: number;
  max: number;
  minOpen: boolean;
  unit: string;
}

export type Obj = Record<string, unknown>;

/** Shows a range bound: plain below a million, otherwise `1e10` / `3.2e7` style. */
function showBound(n: number): string {
  if (Math.abs(n) < 1e6) return String(n);
  return n.toExponential().replace("e+", "e");
}

/** The "what is allowed" text of a range, e.g. "must be a number greater than 0 and at most 1e10 g/s". */
export function rangeText(range: NumberRange): string {
  const unit = range.unit ? ` ${range.unit}` : "";
  if (range.minOpen) {
    return `must be a number greater than ${showBound(range.min)} and at most ${showBound(range.max)}${unit}`;
  }
  return `must be a number from ${showBound(range.min)} to ${showBound(range.max)}${unit}`;
}

export function isObject(v: unknown): v is Obj {
  return typeof v === "object" && v !== null && !Array.isArray(v);
}

export function oneOfText(values: readonly string[]): string {
  return values.map((v) => JSON.stringify(v)).join(", ");
}

const toInt = (s: string | undefined): number => Number(s ?? "0");

const ISO_TIME =
  /^(\d{4})-(\d{2})-(\d{2})[Tt](\d{2}):(\d{2})(?::(\d{2})(\.\d{1,9})?)?(?:([Zz])|([+-])(\d{2})(?::?(\d{2}))?)$/;

/**
 * Parses an ISO 8601 date-time that carries a zone (`Z`, `±hh`, `±hhmm` or `±hh:mm`),
 * e.g. `2026-06-21T12:00:00+02:00`. Returns ms since 1970-01-01T00:00Z, or null when the
 * text is not such a date-time or names an impossible date (Feb 30, hour 24, …). Pure.
 */
export function parseIsoTime(text: string): number | null {
  const m = ISO_TIME.exec(text);
  if (!m) return null;
  const year = toInt(m[1]);
  const month = toInt(m[2]);
  const day = toInt(m[3]);
  const hour = toInt(m[4]);
  const minute = toInt(m[5]);
  const second = toInt(m[6]);
  const fraction = m[7] ? Number(m[7]) : 0;
  if (month < 1 || month > 12) return null;
  const leap = (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
  const daysInMonth = [31, leap ? 29 : 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31][month - 1] ?? 0;
  if (day < 1 || day > daysInMonth) return null;
  if (hour > 23 || minute > 59 || second > 59) return null;
  let offsetMin = 0;
  if (!m[8]) {
    const oh = toInt(m[10]);
    const om = toInt(m[11]);
    if (oh > 14 || om > 59) return null;
    offsetMin = (m[9] === "-" ? -1 : 1) * (oh * 60 + om);
  }
  const utc = new Date(0);
  utc.setUTCFullYear(year, month - 1, day);
  utc.setUTCHours(hour, minute, second, 0);
  return utc.getTime() + Math.round(fraction * 1000) - offsetMin * 60_000;
}

/** Collects problems while reading one scenario. */
export class Reader {
  readonly problems: ScenarioProblem[] = [];

  add(field: string, value: unknown, message: string): void {
    this.problems.push({ field, value, message });
  }

  /** Reports keys that are not in `allowed` (keys starting with `_` are comments). */
  unknownKeys(obj: Obj, path: string, allowed: readonly string[]): void {
    for (const key of Object.keys(obj)) {
      if (key.startsWith("_") || allowed.includes(key)) continue;
      this.add(
        join(path, key),
        obj[key],
        `is not a known field here (allowed: ${allowed.join(", ")}; prefix a key with "_" for a comment)`,
      );
    }
  }

  /** A number in `range`; undefined when absent (and `required` is false) or invalid. */
  number(
    obj: Obj,
    key: string,
    path: string,
    range: NumberRange,
    required: boolean,
    requiredWhy = "",
  ): number | undefined {
    const field = join(path, key);
    const v = obj[key];
    const text = rangeText(range);
    if (v === undefined) {
      if (required) this.add(field, v, `is required${requiredWhy}; ${text}`);
      return undefined;
    }
    if (typeof v !== "number") {
      const hint =
        typeof v === "string"
          ? " (write it as a JSON number, without quotes)"
          : v === null && !required
            ? " (leave the field out to use the default)"
            : "";
      this.add(field, v, `${text}${hint}`);
      return undefined;
    }
    if (!Number.isFinite(v)) {
      // Shown as text: JSON has no NaN/Infinity and would print them as null.
      this.add(field, String(v), `${text} (a finite number)`);
      return undefined;
    }
    const low = range.minOpen ? v <= range.min : v < range.min;
    if (low || v > range.max) {
      this.add(field, v, text);
      return undefined;
    }
    return v;
  }

  /** One of `values`; undefined when absent (and not required) or invalid. */
  choice<T extends string>(
    obj: Obj,
    key: string,
    path: string,
    values: readonly T[],
    required: boolean,
    requiredWhy = "",
  ): T | undefined {
    const field = join(path, key);
    const v = obj[key];
    const text = `must be one of ${oneOfText(values)}`;
    if (v === undefined) {
      if (required) this.add(field, v, `is required${requiredWhy}; ${text}`);
      return undefined;
    }
    if (typeof v !== "string" || !(values as readonly string[]).includes(v)) {
      this.add(field, v, `${text} (exactly as written)`);
      return undefined;
    }
    return v as T;
  }

  /** An object; undefined when absent (and not required) or not an object. */
  object(obj: Obj, key: string, path: string, required: boolean, what: string): Obj | undefined {
    const field = join(path, key);
    const v = obj[key];
    if (v === undefined) {
      if (required) this.add(field, v, `is required; must be an object (${what})`);
      return undefined;
    }
    if (!isObject(v)) {
      this.add(field, v, `must be an object (${what})`);
      return undefined;
    }
    return v;
  }

  /** An array of at most `max` items; undefined when absent (and not required) or invalid. */
  array(obj: Obj, key: string, path: string, required: boolean, max: number, what: string) {
    const field = join(path, key);
    const v = obj[key];
    const text = `must be a list of 0 to ${max} ${what}`;
    if (v === undefined) {
      if (required) this.add(field, v, `is required; ${text} (may be empty: [])`);
      return undefined;
    }
    if (!Array.isArray(v)) {
      this.add(field, v, text);
      return undefined;
    }
    if (v.length > max) {
      this.add(field, `${v.length} items`, text);
      return undefined;
    }
    return v as unknown[];
  }
}

export function join(path: string, key: string): string {
  return path ? `${path}.${key}` : key;
}

/** A section's reading: each field as parsed, or undefined when it had a problem. */
export type Maybe<T> = { [K in keyof T]: T[K] | undefined };
