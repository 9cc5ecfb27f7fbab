import { cleanupOutdatedCaches, type PrecacheEntry, precacheAndRoute } from "workbox-precaching";

/**
 * What to cache: every file of the build (html, js, css, icons, manifest), listed with a revision
 * by scripts/build-sw.mjs. Served cache-first; a new build's list replaces the old caches.
 */
export function registerPrecache(entries: Array<PrecacheEntry | string>): void {
  precacheAndRoute(entries);
  cleanupOutdatedCaches();
}
