import type { PrecacheEntry } from "workbox-precaching";

/** The worker's global scope, with the placeholder that workbox-build's injectManifest replaces. */
export type DriftmarkWorkerScope = ServiceWorkerGlobalScope & {
  __WB_MANIFEST: Array<PrecacheEntry | string>;
};
