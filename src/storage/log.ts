/**
 * The estimate log in IndexedDB (through idb). Append-only: entries are added or deleted, never
 * changed.
 *
 * Promise contract: every method resolves once its transaction has committed (so a resolved `add`
 * survives a page close) and rejects with a typed error from errors.ts: StorageQuotaError when the
 * device is full (the caller keeps the entry on screen), DuplicateEntryError for an id already
 * stored, StorageUnavailableError otherwise. Transactions are short and never await other work.
 */
import { type IDBPDatabase, openDB } from "idb";
import type { EstimateOutput, Scenario } from "../core/types.ts";
import { type ImportSummary, type LogBackup, makeBackup, readBackup } from "./backup.ts";
import { StorageUnavailableError, storageError } from "./errors.ts";
import {
  DB_NAME,
  DB_VERSION,
  type DriftmarkDB,
  LIMIT_SETS_STORE,
  type LogEntry,
  loggedResults,
  NAME_INDEX,
  type Place,
  STORE,
  TIME_INDEX,
} from "./schema.ts";
import { isoLocal } from "./time.ts";

/** Where the next page of a newest-first listing starts (exclusive). */
export interface LogCursor {
  time_utc: string;
  id: string;
}

export interface LogPage {
  entries: LogEntry[];
  /** Pass to `list` for the next (older) page; null at the end. */
  next: LogCursor | null;
}

/** Builds a new entry (the clock and the random id are taken here, not in the core). */
export function newEntry(args: {
  scenario: Scenario;
  result: EstimateOutput;
  place?: Place | null;
  note?: string;
  now?: Date;
  id?: string;
}): LogEntry {
  const now = args.now ?? new Date();
  return {
    id: args.id ?? crypto.randomUUID(),
    time_local: isoLocal(now),
    time_utc: now.toISOString(),
    scenario: structuredClone(args.scenario),
    results: structuredClone(loggedResults(args.result)),
    place: args.place ?? null,
    model_version: args.result.model_version,
    note: args.note ?? "",
  };
}

type DB = IDBPDatabase<DriftmarkDB>;

/**
 * Opens (creating or upgrading) the log database. Migrations happen here and only here.
 * @param name database name (tests use their own)
 */
export async function openLogDB(name = DB_NAME): Promise<DB> {
  if (typeof indexedDB === "undefined") {
    throw new StorageUnavailableError("This browser offers no IndexedDB: the log cannot be kept.");
  }
  try {
    return await openDB<DriftmarkDB>(name, DB_VERSION, {
      upgrade(db, oldVersion, _newVersion, tx) {
        if (oldVersion < 1) {
          db.createObjectStore(STORE, { keyPath: "id" });
        }
        if (oldVersion < 2) {
          const store = tx.objectStore(STORE);
          store.createIndex(TIME_INDEX, ["time_utc", "id"]);
          // v1 entries had no note: give them "" (inside the upgrade transaction).
          void (async () => {
            let cursor = await store.openCursor();
            while (cursor) {
              const v = cursor.value as Partial<LogEntry>;
              if (typeof v.note !== "string") await cursor.update({ ...(v as LogEntry), note: "" });
              cursor = await cursor.continue();
            }
          })();
        }
        if (oldVersion < 3) {
          db.createObjectStore(LIMIT_SETS_STORE, { keyPath: "id" }).createIndex(NAME_INDEX, "name");
        }
      },
      blocking() {
        // A newer version of the app wants to upgrade: let it (this tab reopens on next use).
        logDbCache.get(name)?.then((db) => db.close());
        logDbCache.delete(name);
      },
    });
  } catch (e) {
    throw storageError(e);
  }
}

const logDbCache = new Map<string, Promise<DB>>();

/** The database connection, opened once per name and shared by the log and the limit sets. */
export function sharedDB(name = DB_NAME): Promise<DB> {
  let p = logDbCache.get(name);
  if (!p) {
    p = openLogDB(name);
    logDbCache.set(name, p);
    p.catch(() => logDbCache.delete(name));
  }
  return p;
}

/** The append-only log. Create with `LogStore.open()`. */
export class LogStore {
  private constructor(
    private readonly db: DB,
    readonly name: string,
  ) {}

  static async open(name = DB_NAME): Promise<LogStore> {
    return new LogStore(await sharedDB(name), name);
  }

  /** Closes the connection (tests; the app keeps it open). */
  close(): void {
    logDbCache.delete(this.name);
    this.db.close();
  }

  /** Adds one entry; rejects with DuplicateEntryError if the id exists (never overwrites). */
  async add(entry: LogEntry): Promise<void> {
    try {
      const tx = this.db.transaction(STORE, "readwrite");
      await Promise.all([tx.store.add(entry), tx.done]);
    } catch (e) {
      throw storageError(e, entry.id);
    }
  }

  async get(id: string): Promise<LogEntry | undefined> {
    try {
      return await this.db.get(STORE, id);
    } catch (e) {
      throw storageError(e);
    }
  }

  async count(): Promise<number> {
    try {
      return await this.db.count(STORE);
    } catch (e) {
      throw storageError(e);
    }
  }

  /**
   * Newest first, `limit` entries, starting after `after` (exclusive) when given.
   * Equal times are ordered by id, so paging never repeats or skips an entry.
   */
  async list(opts: { limit?: number; after?: LogCursor | null } = {}): Promise<LogPage> {
    const limit = Math.max(1, Math.min(opts.limit ?? 100, 100_000));
    try {
      const tx = this.db.transaction(STORE, "readonly");
      const range = opts.after
        ? IDBKeyRange.upperBound([opts.after.time_utc, opts.after.id], true)
        : undefined;
      const entries: LogEntry[] = [];
      let cursor = await tx.store.index(TIME_INDEX).openCursor(range, "prev");
      while (cursor && entries.length < limit) {
        entries.push(cursor.value);
        cursor = await cursor.continue();
      }
      await tx.done;
      const last = entries[entries.length - 1];
      const next = cursor && last ? { time_utc: last.time_utc, id: last.id } : null;
      return { entries, next };
    } catch (e) {
      throw storageError(e);
    }
  }

  /** Every entry, newest first. */
  async all(): Promise<LogEntry[]> {
    try {
      const rows = await this.db.getAllFromIndex(STORE, TIME_INDEX);
      return rows.reverse();
    } catch (e) {
      throw storageError(e);
    }
  }

  /** Deletes one entry and returns it (undo = `add` it again), or undefined if it was not there. */
  async delete(id: string): Promise<LogEntry | undefined> {
    try {
      const tx = this.db.transaction(STORE, "readwrite");
      const entry = await tx.store.get(id);
      if (entry) await tx.store.delete(id);
      await tx.done;
      return entry;
    } catch (e) {
      throw storageError(e);
    }
  }

  /** Deletes every entry; returns how many there were. The UI asks for a typed confirmation first. */
  async deleteAll(): Promise<number> {
    try {
      const tx = this.db.transaction(STORE, "readwrite");
      const n = await tx.store.count();
      await tx.store.clear();
      await tx.done;
      return n;
    } catch (e) {
      throw storageError(e);
    }
  }

  /** The backup object of the whole log, or of the given ids (in log order, newest first). */
  async exportBackup(ids?: readonly string[], now = new Date()): Promise<LogBackup> {
    const all = await this.all();
    const wanted = ids ? new Set(ids) : null;
    return makeBackup(wanted ? all.filter((e) => wanted.has(e.id)) : all, now);
  }

  /**
   * Imports a backup file's text. The whole file is validated before anything is written; the
   * accepted entries are then written in ONE transaction (all or none). Entries whose id is already
   * in the log (or earlier in the same file) are skipped, never overwritten.
   * @throws ImportFileError when the file as a whole is unusable (nothing changed)
   * @throws StorageQuotaError when the device is full (nothing changed)
   */
  async importBackup(text: string): Promise<ImportSummary> {
    const { entries, rejected } = readBackup(text);
    let added = 0;
    let skipped = 0;
    if (entries.length > 0) {
      try {
        const tx = this.db.transaction(STORE, "readwrite");
        const existing = new Set(await tx.store.getAllKeys());
        const writes: Promise<unknown>[] = [];
        for (const e of entries) {
          if (existing.has(e.id)) {
            skipped++;
            continue;
          }
          existing.add(e.id);
          writes.push(tx.store.add(e));
          added++;
        }
        await Promise.all([...writes, tx.done]);
      } catch (e) {
        throw storageError(e);
      }
    }
    return { added, skipped_duplicates: skipped, rejected };
  }
}
