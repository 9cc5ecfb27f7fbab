/** Errors of the log storage, typed so that the UI can react (keep the entry on screen, …). */

/** The browser refused to store more (QuotaExceededError). The entry was NOT written. */
export class StorageQuotaError extends Error {
  constructor(cause?: unknown) {
    super("The device has no space left for the log: the entry was not saved.");
    this.name = "StorageQuotaError";
    this.cause = cause;
  }
}

/** IndexedDB is not available or failed (private mode, blocked, disk error). */
export class StorageUnavailableError extends Error {
  constructor(message: string, cause?: unknown) {
    super(message);
    this.name = "StorageUnavailableError";
    this.cause = cause;
  }
}

/** An entry with this id is already in the log (entries are never overwritten). */
export class DuplicateEntryError extends Error {
  readonly id: string;
  constructor(id: string) {
    super(`An entry with id ${JSON.stringify(id)} is already in the log.`);
    this.name = "DuplicateEntryError";
    this.id = id;
  }
}

/** A backup file that cannot be imported at all; nothing was changed. */
export class ImportFileError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "ImportFileError";
  }
}

function errorName(e: unknown): string {
  if (e && typeof e === "object" && "name" in e) return String((e as { name: unknown }).name);
  return "";
}

/** Maps an IndexedDB failure to a typed error. */
export function storageError(e: unknown, id?: string): Error {
  const name = errorName(e);
  if (name === "QuotaExceededError") return new StorageQuotaError(e);
  if (name === "ConstraintError" && id !== undefined) return new DuplicateEntryError(id);
  if (
    e instanceof StorageQuotaError ||
    e instanceof DuplicateEntryError ||
    e instanceof StorageUnavailableError
  ) {
    return e;
  }
  const msg = e instanceof Error ? e.message : String(e);
  return new StorageUnavailableError(`The log could not be read or written: ${msg}`, e);
}
