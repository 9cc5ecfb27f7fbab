import "fake-indexeddb/auto";
import { afterEach, describe, expect, it } from "vitest";
import { DuplicateEntryError, StorageQuotaError } from "../../src/storage/errors.ts";
import { LogStore, newEntry } from "../../src/storage/log.ts";
import { isoLocal } from "../../src/storage/time.ts";
import { dbName, demoResult, demoScenario, entryAt } from "./fixtures.ts";

const open: LogStore[] = [];
async function store(name = dbName()): Promise<LogStore> {
  const s = await LogStore.open(name);
  open.push(s);
  return s;
}
afterEach(() => {
  for (const s of open.splice(0)) s.close();
});

const T0 = Date.UTC(2024, 4, 1, 12, 0, 0);

describe("a new entry", () => {
  it("carries a random UUID, local and UTC time of the same instant, complete inputs and results", () => {
    const e = newEntry({ scenario: demoScenario, result: demoResult, note: "Engine 3" });
    // RFC 9562 §5.4: version 4 UUID layout.
    expect(e.id).toMatch(/^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/);
    expect(Math.abs(Date.parse(e.time_local) - Date.parse(e.time_utc))).toBeLessThan(1000);
    expect(e.scenario).toEqual(demoScenario);
    expect(e.results.bands).toEqual(demoResult.bands);
    expect(e.results.warnings).toEqual(demoResult.warnings);
    expect(e.model_version).toBe(demoResult.model_version);
    expect("footprint" in e.results).toBe(false);
    expect(e.note).toBe("Engine 3");
  });

  it("writes local time with its offset (ISO 8601)", () => {
    const d = new Date(Date.UTC(2024, 0, 31, 23, 30, 5));
    expect(isoLocal(d, 120)).toBe("2024-02-01T01:30:05+02:00");
    expect(isoLocal(d, -330)).toBe("2024-01-31T18:00:05-05:30");
    expect(isoLocal(d, 0)).toBe("2024-01-31T23:30:05+00:00");
  });
});

describe("LogStore", () => {
  it("stores an entry and gives it back unchanged", async () => {
    const s = await store();
    const e = entryAt(T0, "<b>not html</b>");
    await s.add(e);
    expect(await s.get(e.id)).toEqual(e);
    expect(await s.count()).toBe(1);
  });

  it("never overwrites: adding the same id twice is refused", async () => {
    const s = await store();
    const e = entryAt(T0, "first");
    await s.add(e);
    await expect(s.add({ ...e, note: "second" })).rejects.toBeInstanceOf(DuplicateEntryError);
    expect((await s.get(e.id))?.note).toBe("first");
  });

  it("lists newest first, in pages that neither repeat nor skip (also for equal times)", async () => {
    const s = await store();
    const entries = [];
    for (let i = 0; i < 25; i++) entries.push(entryAt(T0 + Math.floor(i / 3) * 60_000, `n${i}`));
    // Write in a scrambled but fixed order (i·7 mod 25, a permutation): the order of the listing
    // must come from the time, not the insertion.
    for (let i = 0; i < 25; i++) await s.add(entries[(i * 7) % 25] as (typeof entries)[number]);
    const seen: string[] = [];
    let page = await s.list({ limit: 7 });
    seen.push(...page.entries.map((e) => e.id));
    while (page.next) {
      page = await s.list({ limit: 7, after: page.next });
      seen.push(...page.entries.map((e) => e.id));
    }
    expect(seen).toHaveLength(25);
    expect(new Set(seen).size).toBe(25);
    const times = await Promise.all(seen.map(async (id) => (await s.get(id))?.time_utc ?? ""));
    for (let i = 1; i < times.length; i++)
      expect((times[i - 1] as string) >= (times[i] as string)).toBe(true);
    expect((await s.all()).map((e) => e.id)).toEqual(seen);
  });

  it("keeps entries when the database is closed and opened again", async () => {
    const name = dbName();
    const a = await LogStore.open(name);
    const e = entryAt(T0, "before close");
    await a.add(e);
    a.close();
    const b = await store(name);
    expect(await b.get(e.id)).toEqual(e);
  });

  it("deletes one entry, returns it, and undo puts the same entry back", async () => {
    const s = await store();
    const e = entryAt(T0, "keep me");
    const other = entryAt(T0 + 1000, "other");
    await s.add(e);
    await s.add(other);
    const removed = await s.delete(e.id);
    expect(removed).toEqual(e);
    expect(await s.get(e.id)).toBeUndefined();
    expect(await s.count()).toBe(1);
    await s.add(removed as typeof e); // undo
    expect(await s.get(e.id)).toEqual(e);
    expect(await s.delete("no-such-id")).toBeUndefined();
  });

  it("deletes everything on deleteAll and says how many", async () => {
    const s = await store();
    for (let i = 0; i < 4; i++) await s.add(entryAt(T0 + i));
    expect(await s.deleteAll()).toBe(4);
    expect(await s.count()).toBe(0);
  });

  it("exports a versioned backup of all or of chosen entries", async () => {
    const s = await store();
    const a = entryAt(T0);
    const b = entryAt(T0 + 5000);
    await s.add(a);
    await s.add(b);
    const all = await s.exportBackup(undefined, new Date(T0 + 10_000));
    expect(all).toMatchObject({ format: "driftmark-log", version: 1 });
    expect(all.exported_utc).toBe(new Date(T0 + 10_000).toISOString());
    expect(all.entries.map((e) => e.id)).toEqual([b.id, a.id]);
    const some = await s.exportBackup([a.id]);
    expect(some.entries).toEqual([a]);
  });

  it("reports a full device as StorageQuotaError and writes nothing", async () => {
    const s = await store();
    const proto = globalThis.IDBObjectStore.prototype;
    const original = proto.add;
    proto.add = () => {
      throw new DOMException("The quota has been exceeded.", "QuotaExceededError");
    };
    try {
      await expect(s.add(entryAt(T0))).rejects.toBeInstanceOf(StorageQuotaError);
    } finally {
      proto.add = original;
    }
    expect(await s.count()).toBe(0);
  });
});
