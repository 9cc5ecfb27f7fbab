/**
 * src/storage/safe-json.ts: every guard gives its one-line message instead of an exception, and
 * good JSON within the limits reads back as JSON.parse reads it.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { DEFAULT_JSON_LIMITS, describeSize, readJsonText } from "../../src/storage/safe-json.ts";
import { runs, timeout } from "../support/fast-check.ts";

function refused(text: unknown, limits = {}): string {
  const r = readJsonText(text, limits);
  if (r.ok) throw new Error("expected a refusal");
  return r.message;
}

describe("readJsonText refuses bad text with one line saying what is wrong", () => {
  it("100,000 nested arrays: nesting, found before parsing", () => {
    expect(refused(`${"[".repeat(100_000)}${"]".repeat(100_000)}`)).toBe(
      "the file is nested deeper than 8 levels (at line 1, column 9)",
    );
  });
  it("nesting one over the limit, on a later line; brackets inside strings do not count", () => {
    const text = `{"a": "[[[[[[[[[[",\n "b": [[[[[[[[1]]]]]]]]}`;
    expect(refused(text, { maxDepth: 8 })).toBe(
      "the file is nested deeper than 8 levels (at line 2, column 14)",
    );
    expect(readJsonText(text, { maxDepth: 9 }).ok).toBe(true);
  });
  it("too large: the size and the limit", () => {
    expect(refused("[1, 2, 3]", { maxChars: 8 })).toBe(
      "the file is too large (9 characters; at most 8 characters)",
    );
    expect(refused(`"${"x".repeat(3 * 1024 * 1024)}"`)).not.toContain("too large");
    expect(refused(" ".repeat(21 * 1024 * 1024))).toBe(
      "the file is too large (21.0 MB; at most 20.0 MB)",
    );
    expect(refused(" ".repeat(20 * 1024 * 1024 + 1))).toBe(
      "the file is too large (20971521 characters; at most 20971520)",
    );
  });
  it("a string of a megabyte, key or value, escapes counted as written", () => {
    expect(refused(`{"note": "${"x".repeat(1024 * 1024)}"}`)).toBe(
      "the file holds a text of 1048576 characters at line 1, column 10; at most 100000",
    );
    expect(refused(`{"${"k".repeat(11)}": 1}`, { maxStringLength: 10 })).toBe(
      "the file holds a text of 11 characters at line 1, column 2; at most 10",
    );
    expect(readJsonText(`["${"\\n".repeat(5)}"]`, { maxStringLength: 10 }).ok).toBe(true);
    expect(refused(`["${"\\n".repeat(6)}"]`, { maxStringLength: 10 })).toContain("12 characters");
  });
  it("an unterminated string of a megabyte", () => {
    expect(refused(`["${"x".repeat(200_000)}`)).toBe(
      "the file holds a text of 200000 characters at line 1, column 2; at most 100000",
    );
  });
  it.each([
    ['{"__proto__": {"polluted": true}}', '"__proto__" is not allowed (in the top level)'],
    ['{"a": [{"constructor": 1}]}', '"constructor" is not allowed (in a[0])'],
    ['{"a": {"b": {"prototype": {}}}}', '"prototype" is not allowed (in a.b)'],
  ])("the key in %s", (text, message) => {
    expect(refused(text)).toBe(`the key ${message}`);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  });
  it("forbidden keys may be left to a reader that checks them itself", () => {
    const r = readJsonText('{"a": {"__proto__": 1}}', { refuseForbiddenKeys: false });
    expect(r.ok).toBe(true);
  });
  it("not JSON, and not text at all", () => {
    expect(refused("{format: 1}")).toMatch(/^the file is not valid JSON \(.+\)$/);
    expect(refused("")).toMatch(/^the file is not valid JSON/);
    expect(refused(42)).toBe("the file could not be read as text");
  });
  it("a byte-order mark is ignored", () => {
    expect(readJsonText('\uFEFF{"a": 1}')).toEqual({ ok: true, value: { a: 1 } });
  });
  it("sizes are written as people read them", () => {
    expect(describeSize(512)).toBe("512 characters");
    expect(describeSize(1536)).toBe("1.5 kB");
    expect(describeSize(DEFAULT_JSON_LIMITS.maxChars)).toBe("20.0 MB");
  });
});

describe("readJsonText on any input (fast-check)", () => {
  it(
    "never throws, and one line when it refuses",
    () => {
      fc.assert(
        fc.property(
          fc.oneof(fc.string({ unit: "binary" }), fc.json({ maxDepth: 4 })),
          fc.integer({ min: 0, max: 12 }),
          (text, maxDepth) => {
            const r = readJsonText(text, { maxDepth, maxStringLength: 50 });
            if (!r.ok) expect(r.message).not.toContain("\n");
          },
        ),
        runs(300),
      );
    },
    timeout(60_000),
  );
  it(
    "JSON within the limits reads back as JSON.parse reads it",
    () => {
      fc.assert(
        fc.property(fc.json({ maxDepth: 6 }), (text) => {
          const r = readJsonText(text, { maxDepth: 8, refuseForbiddenKeys: false });
          expect(r).toEqual({ ok: true, value: JSON.parse(text) });
        }),
        runs(500),
      );
    },
    timeout(60_000),
  );
});
