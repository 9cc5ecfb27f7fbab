/** Persistent storage (StorageManager): ask, and report whether it was granted and space used. */

export interface StorageStatus {
  /** False when the browser has no StorageManager (then the other fields are null). */
  supported: boolean;
  /** Whether the browser promised not to evict the log without asking. */
  persisted: boolean | null;
  usage_bytes: number | null;
  quota_bytes: number | null;
}

function manager(): StorageManager | null {
  return typeof navigator !== "undefined" && navigator.storage ? navigator.storage : null;
}

/** Current status; never throws. */
export async function storageStatus(): Promise<StorageStatus> {
  const m = manager();
  if (!m) return { supported: false, persisted: null, usage_bytes: null, quota_bytes: null };
  let persisted: boolean | null = null;
  let usage: number | null = null;
  let quota: number | null = null;
  try {
    persisted = typeof m.persisted === "function" ? await m.persisted() : null;
  } catch {
    persisted = null;
  }
  try {
    if (typeof m.estimate === "function") {
      const e = await m.estimate();
      usage = typeof e.usage === "number" ? e.usage : null;
      quota = typeof e.quota === "number" ? e.quota : null;
    }
  } catch {
    // leave unknown
  }
  return { supported: true, persisted, usage_bytes: usage, quota_bytes: quota };
}

/** Asks for persistent storage; resolves to whether it is granted (null when not supported). */
export async function requestPersistence(): Promise<boolean | null> {
  const m = manager();
  if (!m || typeof m.persist !== "function") return null;
  try {
    return await m.persist();
  } catch {
    return false;
  }
}

/** Bytes as a short text: 512 B, 3.4 kB, 12 MB. */
export function formatBytes(n: number | null): string {
  if (n === null || !Number.isFinite(n) || n < 0) return "unknown";
  if (n < 1000) return `${Math.round(n)} B`;
  if (n < 1e6) return `${(n / 1e3).toFixed(1)} kB`;
  if (n < 1e9) return `${(n / 1e6).toFixed(1)} MB`;
  return `${(n / 1e9).toFixed(1)} GB`;
}
