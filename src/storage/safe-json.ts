/**
 * Guarded reading of JSON text that comes from outside (a file the user picked, a file named on
 * the command line). One place for the guards every import uses; no DOM and no imports, so the
 * command-line estimator and the app share it.
 *
 * Before parsing, one pass over the text (no recursion) checks its size, its nesting depth and
 * the length of every string, so a hostile file cannot exhaust the stack or the memory of what
 * follows; `JSON.parse` runs without a reviver (V8's reviver recurses); afterwards an iterative
 * walk refuses the keys "__proto__", "constructor" and "prototype" anywhere, naming where.
 *
 * Never throws: `{ ok: true, value }` or `{ ok: false, message }`, the message one line, lower
 * case, saying what is wrong and what is allowed (callers prefix the file name or wrap it).
 */

export interface JsonLimits {
  /** Longest text accepted, in UTF-16 code units (characters; bytes for ASCII text). */
  maxChars: number;
  /** Deepest nesting of arrays and objects (a bare value is depth 0, `[]` is 1). */
  maxDepth: number;
  /** Longest string accepted, key or value, in characters. */
  maxStringLength: number;
  /**
   * Refuse {@link FORBIDDEN_KEYS} anywhere (default). A reader that rebuilds every object from
   * its known fields and rejects such keys itself, item by item, may turn this off.
   */
  refuseForbiddenKeys: boolean;
}

/** Defaults: 20 MiB of text, nesting 8, strings of 100,000 characters, forbidden keys refused. */
export const DEFAULT_JSON_LIMITS: Readonly<JsonLimits> = {
  maxChars: 20 * 1024 * 1024,
  maxDepth: 8,
  maxStringLength: 100_000,
  refuseForbiddenKeys: true,
};

export type JsonRead = { ok: true; value: unknown } | { ok: false; message: string };

/** Keys refused anywhere: through them data could reach an object's prototype. */
export const FORBIDDEN_KEYS: ReadonlySet<string> = new Set([
  "__proto__",
  "constructor",
  "prototype",
]);

/** A size in characters as people read it: "512 characters", "1.5 MB" (1 MB = 1,048,576). */
export function describeSize(chars: number): string {
  if (chars < 1024) return `${chars} characters`;
  if (chars < 1024 * 1024) return `${(chars / 1024).toFixed(1)} kB`;
  return `${(chars / (1024 * 1024)).toFixed(1)} MB`;
}

/** Line and column (1-based) of a character offset in `text`. */
function lineCol(text: string, offset: number): string {
  let line = 1;
  let last = -1;
  for (let i = 0; i < offset; i++) {
    if (text.charCodeAt(i) === 10) {
      line++;
      last = i;
    }
  }
  return `line ${line}, column ${offset - last}`;
}

function tooLong(text: string, at: number, chars: number, limits: JsonLimits): string {
  return `the file holds a text of ${chars} characters at ${lineCol(text, at)}; at most ${limits.maxStringLength}`;
}

/** One pass over the raw text: nesting depth and string lengths, strings and escapes skipped. */
function scan(text: string, limits: JsonLimits): string | null {
  let depth = 0;
  let inString = false;
  let stringStart = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (inString) {
      if (c === 92 /* \ */) i++;
      else if (c === 34 /* " */) {
        inString = false;
        if (i - stringStart - 1 > limits.maxStringLength) {
          return tooLong(text, stringStart, i - stringStart - 1, limits);
        }
      }
      continue;
    }
    if (c === 34) {
      inString = true;
      stringStart = i;
    } else if (c === 91 /* [ */ || c === 123 /* { */) {
      if (++depth > limits.maxDepth) {
        return `the file is nested deeper than ${limits.maxDepth} levels (at ${lineCol(text, i)})`;
      }
    } else if (c === 93 /* ] */ || c === 125 /* } */) depth--;
  }
  if (inString && text.length - stringStart - 1 > limits.maxStringLength) {
    return tooLong(text, stringStart, text.length - stringStart - 1, limits);
  }
  return null;
}

/** Dotted path of a forbidden key, found without recursion; null when there is none. */
function forbiddenKey(root: unknown): { key: string; at: string } | null {
  const stack: [unknown, string][] = [[root, ""]];
  while (stack.length > 0) {
    const [v, path] = stack.pop() as [unknown, string];
    if (typeof v !== "object" || v === null) continue;
    if (Array.isArray(v)) {
      for (let i = v.length - 1; i >= 0; i--) stack.push([v[i], `${path}[${i}]`]);
      continue;
    }
    for (const k of Object.keys(v)) {
      const at = path === "" ? k : `${path}.${k}`;
      if (FORBIDDEN_KEYS.has(k)) return { key: k, at: path === "" ? "the top level" : path };
      stack.push([(v as Record<string, unknown>)[k], at]);
    }
  }
  return null;
}

/**
 * Parses JSON text under `limits` (defaults {@link DEFAULT_JSON_LIMITS}); a leading byte-order
 * mark is ignored. Never throws.
 */
export function readJsonText(text: unknown, limits: Partial<JsonLimits> = {}): JsonRead {
  const lim: JsonLimits = { ...DEFAULT_JSON_LIMITS, ...limits };
  if (typeof text !== "string") return { ok: false, message: "the file could not be read as text" };
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  if (body.length > lim.maxChars) {
    let size = describeSize(body.length);
    let most = describeSize(lim.maxChars);
    if (size === most) [size, most] = [`${body.length} characters`, `${lim.maxChars}`];
    return { ok: false, message: `the file is too large (${size}; at most ${most})` };
  }
  const scanned = scan(body, lim);
  if (scanned !== null) return { ok: false, message: scanned };
  let value: unknown;
  try {
    value = JSON.parse(body);
  } catch (err) {
    const why = err instanceof Error ? (err.message.split("\n")[0] ?? "") : "";
    return { ok: false, message: `the file is not valid JSON${why ? ` (${why})` : ""}` };
  }
  const bad = lim.refuseForbiddenKeys ? forbiddenKey(value) : null;
  if (bad !== null) {
    return { ok: false, message: `the key "${bad.key}" is not allowed (in ${bad.at})` };
  }
  return { ok: true, value };
}
