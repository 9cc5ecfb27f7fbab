/**
 * The user's limit sets in IndexedDB (store `limit-sets` of the log's database, schema v3).
 *
 * Promise contract: every method resolves once its transaction has committed and rejects with a
 * typed error from errors.ts (StorageQuotaError when the device is full, StorageUnavailableError
 * otherwise). An import is written in ONE transaction: all of it or none.
 */
import { storageError } from "./errors.ts";
import { dataOf, type LimitSet, type LimitSetData } from "./limit-sets.ts";
import { sharedDB } from "./log.ts";
import { DB_NAME, LIMIT_SETS_STORE, NAME_INDEX } from "./schema.ts";

/** What to do with an imported set whose name is already stored. */
export type NameClash = "keep-both" | "replace";

export interface LimitSetImportSummary {
  added: number;
  /** Stored sets replaced by an imported one of the same name. */
  replaced: number;
}

type DB = Awaited<ReturnType<typeof sharedDB>>;

const byName = (a: LimitSet, b: LimitSet) =>
  a.name.localeCompare(b.name, "en", { sensitivity: "base" }) || a.id.localeCompare(b.id);

export class LimitSetStore {
  private constructor(private readonly db: DB) {}

  static async open(name = DB_NAME): Promise<LimitSetStore> {
    return new LimitSetStore(await sharedDB(name));
  }

  /** Every stored set, by name (case-insensitive). */
  async all(): Promise<LimitSet[]> {
    try {
      return (await this.db.getAllFromIndex(LIMIT_SETS_STORE, NAME_INDEX)).sort(byName);
    } catch (e) {
      throw storageError(e);
    }
  }

  async get(id: string): Promise<LimitSet | undefined> {
    try {
      return await this.db.get(LIMIT_SETS_STORE, id);
    } catch (e) {
      throw storageError(e);
    }
  }

  async count(): Promise<number> {
    try {
      return await this.db.count(LIMIT_SETS_STORE);
    } catch (e) {
      throw storageError(e);
    }
  }

  /** Stores a new set; returns it with its id. */
  async add(data: LimitSetData, now = new Date()): Promise<LimitSet> {
    const set: LimitSet = {
      ...dataOf(data),
      id: crypto.randomUUID(),
      updated_utc: now.toISOString(),
    };
    try {
      await this.db.add(LIMIT_SETS_STORE, set);
    } catch (e) {
      throw storageError(e);
    }
    return set;
  }

  /** Replaces the set with this id (edit); returns the stored set. */
  async update(id: string, data: LimitSetData, now = new Date()): Promise<LimitSet> {
    const set: LimitSet = { ...dataOf(data), id, updated_utc: now.toISOString() };
    try {
      await this.db.put(LIMIT_SETS_STORE, set);
    } catch (e) {
      throw storageError(e);
    }
    return set;
  }

  /** Deletes one set and returns it (undo = `restore` it), or undefined if it was not there. */
  async delete(id: string): Promise<LimitSet | undefined> {
    try {
      const tx = this.db.transaction(LIMIT_SETS_STORE, "readwrite");
      const set = await tx.store.get(id);
      if (set) await tx.store.delete(id);
      await tx.done;
      return set;
    } catch (e) {
      throw storageError(e);
    }
  }

  /** Puts a deleted set back as it was (undo of `delete`). */
  async restore(set: LimitSet): Promise<void> {
    try {
      await this.db.put(LIMIT_SETS_STORE, set);
    } catch (e) {
      throw storageError(e);
    }
  }

  /** Names of the given sets that are already stored (to ask: keep both, or replace). */
  async clashes(sets: readonly LimitSetData[]): Promise<string[]> {
    try {
      const stored = new Set((await this.db.getAll(LIMIT_SETS_STORE)).map((s) => s.name));
      return [...new Set(sets.map((s) => s.name).filter((n) => stored.has(n)))];
    } catch (e) {
      throw storageError(e);
    }
  }

  /**
   * Stores imported sets in one transaction. A set whose name is stored already is added beside it
   * ("keep-both") or takes the place of every stored set of that name ("replace").
   */
  async importSets(
    sets: readonly LimitSetData[],
    clash: NameClash,
    now = new Date(),
  ): Promise<LimitSetImportSummary> {
    const time = now.toISOString();
    let replaced = 0;
    try {
      const tx = this.db.transaction(LIMIT_SETS_STORE, "readwrite");
      const writes: Promise<unknown>[] = [];
      if (clash === "replace") {
        const names = new Set(sets.map((s) => s.name));
        let cursor = await tx.store.openCursor();
        while (cursor) {
          if (names.has(cursor.value.name)) {
            writes.push(cursor.delete());
            replaced++;
          }
          cursor = await cursor.continue();
        }
      }
      for (const s of sets) {
        writes.push(tx.store.add({ ...dataOf(s), id: crypto.randomUUID(), updated_utc: time }));
      }
      await Promise.all([...writes, tx.done]);
    } catch (e) {
      throw storageError(e);
    }
    return { added: sets.length, replaced };
  }

  /** Sets whose name contains the text (see searchSets). */
  async search(text: string, limit = 20): Promise<LimitSet[]> {
    return searchSets(await this.all(), text, limit);
  }

  /** Deletes every set (tests). */
  async clear(): Promise<void> {
    try {
      await this.db.clear(LIMIT_SETS_STORE);
    } catch (e) {
      throw storageError(e);
    }
  }
}

/** Case- and accent-insensitive search: names starting with the text first, then containing it. */
export function searchSets<T extends { name: string }>(
  sets: readonly T[],
  text: string,
  limit = 20,
): T[] {
  const fold = (s: string) =>
    s
      .normalize("NFD")
      .replace(/[\u0300-\u036f]/g, "")
      .toLowerCase();
  const q = fold(text.trim());
  if (q === "") return sets.slice(0, limit);
  const starts: T[] = [];
  const contains: T[] = [];
  for (const s of sets) {
    const n = fold(s.name);
    const at = n.indexOf(q);
    if (at === 0) starts.push(s);
    else if (at > 0) contains.push(s);
  }
  return [...starts, ...contains].slice(0, limit);
}
