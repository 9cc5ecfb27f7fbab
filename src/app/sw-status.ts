// The service worker's state as the page sees it: a tiny store plus a Preact hook.
// Written by register-sw.ts, read by UpdateStatus.tsx. No DOM, no timers.
import { useEffect, useState } from "preact/hooks";

export interface SwStatus {
  /** An active worker exists, so its install (which precaches every built file) completed. */
  offlineReady: boolean;
  /** A new version is installed and waiting; it takes over only when the user asks. */
  updateWaiting: boolean;
  /** Set when registration failed (e.g. private mode); the app still works online. */
  error: string | null;
}

/** Called when the user chooses to switch to the waiting version. Null while none waits. */
export type ApplyUpdate = () => void;

let status: SwStatus = { offlineReady: false, updateWaiting: false, error: null };
let applyUpdate: ApplyUpdate | null = null;
const listeners = new Set<() => void>();

export function getSwStatus(): SwStatus {
  return status;
}

export function setSwStatus(patch: Partial<SwStatus>): void {
  status = { ...status, ...patch };
  for (const listener of listeners) listener();
}

/** Registers the action behind "Update available — reload" (set by register-sw.ts). */
export function setApplyUpdate(fn: ApplyUpdate | null): void {
  applyUpdate = fn;
}

/** Switches to the waiting version (the page reloads once the new worker controls it). */
export function requestUpdate(): void {
  applyUpdate?.();
}

export function subscribeSwStatus(listener: () => void): () => void {
  listeners.add(listener);
  return () => {
    listeners.delete(listener);
  };
}

/** The current service-worker status; re-renders the component when it changes. */
export function useSwStatus(): SwStatus {
  const [value, setValue] = useState(status);
  useEffect(() => {
    setValue(status);
    return subscribeSwStatus(() => setValue(status));
  }, []);
  return value;
}
