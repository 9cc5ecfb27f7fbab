/**
 * Reading JSON text from a file the user picked, in one place so that every import uses the same
 * guards. Nesting is limited (checked without recursion), and the keys "__proto__", "constructor"
 * and "prototype" are refused, so nothing read can reach an object's prototype.
 */
import { depthOf } from "./validate.ts";

export const MAX_JSON_DEPTH = 8;

export type JsonRead = { ok: true; value: unknown } | { ok: false; message: string };

const BAD_KEYS = new Set(["__proto__", "constructor", "prototype"]);

/** Parses JSON text; never throws. */
export function readJsonText(text: string, maxDepth = MAX_JSON_DEPTH): JsonRead {
  let value: unknown;
  let badKey: string | null = null;
  try {
    value = JSON.parse(text.charCodeAt(0) === 0xfeff ? text.slice(1) : text, (k, v) => {
      if (BAD_KEYS.has(k)) badKey = k;
      return v;
    });
  } catch {
    return { ok: false, message: "the file is not valid JSON" };
  }
  if (badKey !== null) return { ok: false, message: `the key "${badKey}" is not allowed` };
  if (depthOf(value, maxDepth) > maxDepth) {
    return { ok: false, message: `the file is nested deeper than ${maxDepth} levels` };
  }
  return { ok: true, value };
}
