import "fake-indexeddb/auto";
import { describe, expect, it } from "vitest";
import { LimitSetStore } from "../../src/storage/limit-set-store.ts";
import { LogStore } from "../../src/storage/log.ts";
import {
  DB_VERSION,
  LIMIT_SETS_STORE,
  type LogEntry,
  type LogEntryV1,
  NAME_INDEX,
  STORE,
  TIME_INDEX,
} from "../../src/storage/schema.ts";
import { dbName, entryAt } from "./fixtures.ts";

/** Creates a schema-v1 database by hand (raw IndexedDB API), as the first layout wrote it. */
function createV1(name: string, entries: LogEntryV1[]): Promise<void> {
  return new Promise((resolve, reject) => {
    const req = indexedDB.open(name, 1);
    req.onupgradeneeded = () => {
      req.result.createObjectStore(STORE, { keyPath: "id" });
    };
    req.onerror = () => reject(req.error);
    req.onsuccess = () => {
      const db = req.result;
      const tx = db.transaction(STORE, "readwrite");
      for (const e of entries) tx.objectStore(STORE).put(e);
      tx.oncomplete = () => {
        db.close();
        resolve();
      };
      tx.onerror = () => reject(tx.error);
    };
  });
}

function v1(ms: number): LogEntryV1 {
  const { note: _note, ...rest } = entryAt(ms);
  return rest;
}

describe("schema migration", () => {
  it("opens version-1 data with the current code: entries kept, note added, time index built", async () => {
    const name = dbName();
    const older = v1(Date.UTC(2023, 11, 31, 23, 59, 0));
    const newer = v1(Date.UTC(2024, 0, 1, 8, 0, 0));
    await createV1(name, [older, newer]);

    const s = await LogStore.open(name);
    try {
      expect(await s.count()).toBe(2);
      const page = await s.list({ limit: 10 });
      expect(page.entries.map((e) => e.id)).toEqual([newer.id, older.id]);
      expect(page.entries[0]).toEqual({ ...newer, note: "" });
      expect(page.entries[1]).toEqual({ ...older, note: "" });
    } finally {
      s.close();
    }

    // The database is now at the current version and has the index.
    await new Promise<void>((resolve, reject) => {
      const req = indexedDB.open(name);
      req.onerror = () => reject(req.error);
      req.onsuccess = () => {
        const db = req.result;
        expect(db.version).toBe(DB_VERSION);
        const names = Array.from(db.transaction(STORE).objectStore(STORE).indexNames);
        expect(names).toContain(TIME_INDEX);
        db.close();
        resolve();
      };
    });
  });

  it("opens version-2 data with the current code: log entries untouched, limit sets store added", async () => {
    const name = dbName();
    const a = entryAt(Date.UTC(2024, 0, 1, 8, 0, 0), "first");
    const b = entryAt(Date.UTC(2024, 0, 2, 9, 0, 0), "second");
    await createV2(name, [a, b]);

    const sets = await LimitSetStore.open(name);
    expect(await sets.count()).toBe(0);
    const s = await LogStore.open(name);
    try {
      expect(await s.count()).toBe(2);
      expect(await s.get(a.id)).toEqual(a);
      expect(await s.get(b.id)).toEqual(b);
      await sets.add({
        name: "Gas (invented)",
        molecular_weight_g_mol: null,
        source_note: "",
        limits: [{ label: "T", value: 1, unit: "mg/m3", averaging_min: 60 }],
      });
      expect(await sets.count()).toBe(1);
    } finally {
      s.close();
    }
    await new Promise<void>((resolve, reject) => {
      const req = indexedDB.open(name);
      req.onerror = () => reject(req.error);
      req.onsuccess = () => {
        const db = req.result;
        expect(db.version).toBe(DB_VERSION);
        expect(DB_VERSION).toBe(3);
        expect(Array.from(db.objectStoreNames).sort()).toEqual([STORE, LIMIT_SETS_STORE].sort());
        const idx = Array.from(
          db.transaction(LIMIT_SETS_STORE).objectStore(LIMIT_SETS_STORE).indexNames,
        );
        expect(idx).toEqual([NAME_INDEX]);
        db.close();
        resolve();
      };
    });
  });
});

/** Creates a schema-v2 database by hand (raw IndexedDB API), as version 2 laid it out. */
function createV2(name: string, entries: LogEntry[]): Promise<void> {
  return new Promise((resolve, reject) => {
    const req = indexedDB.open(name, 2);
    req.onupgradeneeded = () => {
      req.result
        .createObjectStore(STORE, { keyPath: "id" })
        .createIndex(TIME_INDEX, ["time_utc", "id"]);
    };
    req.onerror = () => reject(req.error);
    req.onsuccess = () => {
      const db = req.result;
      const tx = db.transaction(STORE, "readwrite");
      for (const e of entries) tx.objectStore(STORE).put(e);
      tx.oncomplete = () => {
        db.close();
        resolve();
      };
      tx.onerror = () => reject(tx.error);
    };
  });
}
