/**
 * The JSON backup of the log: `{ format: "driftmark-log", version: 1, exported_utc, caution,
 * entries }`. Reading a backup is pure (no database): the file is checked as a whole first, then
 * entry by entry; the caller writes the accepted entries in one transaction.
 */
import { CAUTION } from "../core/caution.ts";
import { ImportFileError } from "./errors.ts";
import { FORBIDDEN_KEYS, readJsonText } from "./safe-json.ts";
import type { LogEntry } from "./schema.ts";
import { Invalid, validateEntry } from "./validate.ts";

export const BACKUP_FORMAT = "driftmark-log";
export const BACKUP_VERSION = 1;
/** Largest backup file accepted (bytes of UTF-8, or characters of text). */
export const MAX_BACKUP_BYTES = 20 * 1024 * 1024;
export const MAX_BACKUP_ENTRIES = 100_000;
/** Deepest nesting accepted anywhere in a backup (wrapper 2 + entry 20). */
export const MAX_BACKUP_DEPTH = 24;
/**
 * Longest string accepted anywhere in the file; longer refuses the file. Entries' own fields are
 * limited further (validate.ts, MAX_STRING), which rejects that entry only.
 */
export const MAX_BACKUP_STRING = 100_000;

export interface LogBackup {
  format: typeof BACKUP_FORMAT;
  version: typeof BACKUP_VERSION;
  exported_utc: string;
  caution: string;
  entries: LogEntry[];
}

export interface Rejection {
  /** Position of the entry in the file's `entries` (0-based). */
  index: number;
  /** The entry's id when it had a readable one. */
  id?: string;
  reason: string;
}

export interface ImportSummary {
  added: number;
  skipped_duplicates: number;
  rejected: Rejection[];
}

/** The backup wrapper around some entries (newest first, as the log lists them). */
export function makeBackup(entries: LogEntry[], now: Date): LogBackup {
  return {
    format: BACKUP_FORMAT,
    version: BACKUP_VERSION,
    exported_utc: now.toISOString(),
    caution: CAUTION,
    entries,
  };
}

/** File name of a backup: driftmark-log-YYYYMMDD-HHMMSS.json (UTC). */
export function backupFileName(now: Date): string {
  const s = now.toISOString();
  return `driftmark-log-${s.slice(0, 10).replaceAll("-", "")}-${s.slice(11, 19).replaceAll(":", "")}.json`;
}

/**
 * Reads a backup's text. Throws ImportFileError (nothing may be written) when the file as a whole
 * is unusable: too big, not JSON, not a Driftmark log, a newer version, too many entries, nested
 * too deep. Otherwise returns the valid entries and the rejected ones with their reasons.
 */
export function readBackup(text: string): { entries: LogEntry[]; rejected: Rejection[] } {
  // Size, nesting and string length are checked on the text before it is parsed, so a hostile
  // file is refused without exhausting the stack or memory. Keys such as "__proto__" inside an
  // entry reject that entry only (validate.ts rebuilds each entry from its known fields).
  const read = readJsonText(text, {
    maxChars: MAX_BACKUP_BYTES,
    maxDepth: MAX_BACKUP_DEPTH,
    maxStringLength: MAX_BACKUP_STRING,
    refuseForbiddenKeys: false,
  });
  if (!read.ok) throw new ImportFileError(`${sentence(read.message)}.`);
  const data = read.value;
  if (typeof data !== "object" || data === null || Array.isArray(data)) {
    throw new ImportFileError(
      'The file is not a Driftmark log backup (expected {"format": "driftmark-log", …}).',
    );
  }
  const d = data as Record<string, unknown>;
  for (const k of Object.keys(d)) {
    if (FORBIDDEN_KEYS.has(k))
      throw new ImportFileError(`The key "${k}" is not allowed in a log backup.`);
  }
  if (d.format !== BACKUP_FORMAT) {
    throw new ImportFileError(
      `The file is not a Driftmark log backup (format is ${JSON.stringify(String(d.format)).slice(0, 60)}, expected "driftmark-log").`,
    );
  }
  if (d.version !== BACKUP_VERSION) {
    throw new ImportFileError(
      `Backup version ${JSON.stringify(d.version)} cannot be read by this app (it reads version ${BACKUP_VERSION}).`,
    );
  }
  if (!Array.isArray(d.entries)) {
    throw new ImportFileError("The backup has no list of entries (field entries).");
  }
  if (d.entries.length > MAX_BACKUP_ENTRIES) {
    throw new ImportFileError(
      `The backup has ${d.entries.length} entries; at most ${MAX_BACKUP_ENTRIES} can be imported at once.`,
    );
  }
  const entries: LogEntry[] = [];
  const rejected: Rejection[] = [];
  d.entries.forEach((raw, index) => {
    try {
      entries.push(validateEntry(raw));
    } catch (e) {
      const rawId = (raw as { id?: unknown } | null)?.id;
      const rej: Rejection = {
        index,
        reason: e instanceof Invalid ? e.message : "the entry could not be read",
      };
      if (typeof rawId === "string" && rawId.length <= 100) rej.id = rawId;
      rejected.push(rej);
    }
  });
  return { entries, rejected };
}

/** A reader's lower-case message as the start of a sentence. */
function sentence(message: string): string {
  return message.charAt(0).toUpperCase() + message.slice(1);
}
