import "fake-indexeddb/auto";
import { afterEach, describe, expect, it } from "vitest";
import { MAX_BACKUP_BYTES, MAX_BACKUP_ENTRIES } from "../../src/storage/backup.ts";
import { ImportFileError } from "../../src/storage/errors.ts";
import { LogStore } from "../../src/storage/log.ts";
import type { LogEntry } from "../../src/storage/schema.ts";
import { dbName, entryAt } from "./fixtures.ts";

const open: LogStore[] = [];
async function store(): Promise<LogStore> {
  const s = await LogStore.open(dbName());
  open.push(s);
  return s;
}
afterEach(() => {
  for (const s of open.splice(0)) s.close();
});

const T0 = Date.UTC(2024, 4, 1, 12, 0, 0);

function file(entries: unknown[], extra: Record<string, unknown> = {}): string {
  return JSON.stringify({
    format: "driftmark-log",
    version: 1,
    exported_utc: new Date(T0).toISOString(),
    entries,
    ...extra,
  });
}

/** Everything in the store, to prove that a refused import changed nothing. */
async function snapshot(s: LogStore): Promise<LogEntry[]> {
  return s.all();
}

describe("importing a backup", () => {
  it("adds a good file's entries and reports them", async () => {
    const s = await store();
    const a = entryAt(T0, "a");
    const b = entryAt(T0 + 60_000, "b");
    const summary = await s.importBackup(file([a, b]));
    expect(summary).toEqual({ added: 2, skipped_duplicates: 0, rejected: [] });
    expect(await s.get(a.id)).toEqual(a);
    expect(await s.get(b.id)).toEqual(b);
  });

  it("round-trips its own export", async () => {
    const s = await store();
    for (let i = 0; i < 5; i++) await s.add(entryAt(T0 + i * 1000, `n${i}`));
    const backup = JSON.stringify(await s.exportBackup());
    const t = await store();
    expect(await t.importBackup(backup)).toEqual({ added: 5, skipped_duplicates: 0, rejected: [] });
    expect(await t.all()).toEqual(await s.all());
  });

  it("skips entries whose id is already in the log or earlier in the file, never overwriting", async () => {
    const s = await store();
    const a = entryAt(T0, "original");
    await s.add(a);
    const b = entryAt(T0 + 1000, "new");
    const summary = await s.importBackup(
      file([{ ...a, note: "changed" }, b, { ...b, note: "again" }]),
    );
    expect(summary).toEqual({ added: 1, skipped_duplicates: 2, rejected: [] });
    expect((await s.get(a.id))?.note).toBe("original");
    expect((await s.get(b.id))?.note).toBe("new");
  });

  it("rejects entries with wrong types, naming the field and the value, and adds the valid ones", async () => {
    const s = await store();
    const good = entryAt(T0, "good");
    const base = entryAt(T0 + 1000);
    const badReach = structuredClone(base);
    (badReach.results.bands[0] as unknown as Record<string, unknown>).reach_m = "far";
    const cases: [unknown, RegExp][] = [
      [{ ...base, id: 42 }, /^id: must be text \(got 42\)/],
      [{ ...base, id: "x y" }, /^id: may contain only/],
      [
        { ...base, place: { lat: 200, lon: 8, accuracy_m: null } },
        /^place\.lat: must be between -90 and 90 \(got 200\)/,
      ],
      [badReach, /^results\.bands\[0\]\.reach_m: must be a finite number \(got "far"\)/],
      [{ ...base, time_utc: "yesterday" }, /^time_utc: must be like/],
      [
        { ...base, time_local: "2024-05-01T15:00:00+02:00" },
        /^time_local: must be the same instant/,
      ],
      [{ ...base, note: 7 }, /^note: must be text/],
      [{ ...base, note: "x".repeat(10_001) }, /^note: must be at most 10000 characters/],
      [
        { ...base, place: { lat: "47", lon: 8, accuracy_m: null } },
        /^place\.lat: must be a finite number \(got "47"\)/,
      ],
      [
        {
          ...base,
          scenario: {
            ...base.scenario,
            weather: { ...base.scenario.weather, wind_speed_m_s: "3" },
          },
        },
        /^scenario\.weather\.wind_speed_m_s: .*without quotes.*\(got "3"\)/,
      ],
      [
        { ...base, scenario: { ...base.scenario, weather: { wind_speed_m_s: -3 } } },
        /^scenario\.weather/,
      ],
      [{ ...base, extra: 1 }, /^\(entry\)\.extra: is not a known field/],
      ["just a string", /^\(entry\): must be an object/],
      [null, /^\(entry\): must be an object/],
    ];
    const summary = await s.importBackup(file([good, ...cases.map((c) => c[0])]));
    expect(summary.added).toBe(1);
    expect(summary.rejected).toHaveLength(cases.length);
    cases.forEach(([, re], i) => {
      const r = summary.rejected[i];
      expect(r?.index).toBe(i + 1);
      expect(r?.reason).toMatch(re);
    });
    expect(await s.count()).toBe(1);
  });

  it("keeps script strings as plain data: stored verbatim, never run", async () => {
    const s = await store();
    const flag = "__driftmark_test_pwned";
    const hostile = entryAt(
      T0,
      `<script>globalThis.${flag}=1</script><img src=x onerror="globalThis.${flag}=2">`,
    );
    const firstLimit = hostile.scenario.limits[0];
    if (firstLimit) firstLimit.label = "javascript:alert(1)";
    const summary = await s.importBackup(file([hostile]));
    expect(summary.added).toBe(1);
    expect(await s.get(hostile.id)).toEqual(hostile);
    expect((globalThis as Record<string, unknown>)[flag]).toBeUndefined();
  });

  it("refuses keys that could reach the prototype (__proto__) and leaves Object.prototype alone", async () => {
    const s = await store();
    const base = entryAt(T0);
    const text = file([base]).replace('"release":{', '"release":{"__proto__":{"polluted":true},');
    expect(text).toContain("__proto__");
    const summary = await s.importBackup(text);
    expect(summary.added).toBe(0);
    expect(summary.rejected[0]?.reason).toMatch(/__proto__: is not an allowed key/);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  });

  it('rejects an entry with a "constructor" key, naming where, and adds the others', async () => {
    const s = await store();
    const good = entryAt(T0, "good");
    const text = file([entryAt(T0 + 1000), good]).replace(
      '"release":{',
      '"release":{"constructor":{"prototype":{"polluted":true}},',
    );
    const summary = await s.importBackup(text);
    expect(summary.added).toBe(1);
    expect(summary.rejected).toHaveLength(1);
    expect(summary.rejected[0]?.reason).toMatch(
      /^scenario\.release\.constructor: is not an allowed key/,
    );
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  });

  describe("a file that cannot be a backup changes nothing", () => {
    async function refused(text: string, message: RegExp): Promise<void> {
      const s = await store();
      const existing = entryAt(T0 - 1000, "already there");
      await s.add(existing);
      const before = await snapshot(s);
      const err = await s.importBackup(text).catch((e: unknown) => e);
      expect(err).toBeInstanceOf(ImportFileError);
      expect((err as Error).message).toMatch(message);
      expect(await snapshot(s)).toEqual(before);
    }

    it("not JSON", () => refused("{format: driftmark", /not valid JSON/));
    it("JSON but not a log", () =>
      refused('{"type":"FeatureCollection","features":[]}', /not a Driftmark log/));
    it("a list instead of the wrapper", () => refused("[1,2,3]", /not a Driftmark log/));
    it("a newer backup version", () =>
      refused(JSON.stringify({ format: "driftmark-log", version: 2, entries: [] }), /version 2/));
    it("entries not a list", () =>
      refused(
        JSON.stringify({ format: "driftmark-log", version: 1, entries: {} }),
        /no list of entries/,
      ));
    it("over 20 MB", () =>
      refused(file([entryAt(T0)], { padding: "x".repeat(MAX_BACKUP_BYTES) }), /too large/));
    it("over 100,000 entries", () =>
      refused(file(new Array(MAX_BACKUP_ENTRIES + 1).fill(0)), /at most 100000/));
    it("deeply nested (100,000 levels)", () =>
      refused(
        `{"format":"driftmark-log","version":1,"entries":[${"[".repeat(100_000)}${"]".repeat(100_000)}]}`,
        /^The file is nested deeper than 24 levels \(at line 1, column 72\)\.$/,
      ));
    it("a string of a megabyte", () =>
      refused(
        file([entryAt(T0, "x".repeat(1024 * 1024))]),
        /^The file holds a text of 1048576 characters at line 1, column \d+; at most 100000\.$/,
      ));
    it('a "__proto__" key on the wrapper', () =>
      refused(
        file([entryAt(T0)]).replace("{", '{"__proto__":{"polluted":true},'),
        /^The key "__proto__" is not allowed in a log backup\.$/,
      ));
    it("nested a little too deep inside an otherwise good entry", async () => {
      const e = entryAt(T0) as unknown as { scenario: Record<string, unknown> };
      let deep: unknown = 1;
      for (let i = 0; i < 40; i++) deep = { _c: deep };
      e.scenario._comment = deep;
      await refused(file([e]), /nested deeper/);
    });
  });
});
