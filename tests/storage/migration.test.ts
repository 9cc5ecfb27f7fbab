import "fake-indexeddb/auto";
import { describe, expect, it } from "vitest";
import { LogStore } from "../../src/storage/log.ts";
import { DB_VERSION, type LogEntryV1, STORE, TIME_INDEX } from "../../src/storage/schema.ts";
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
});
