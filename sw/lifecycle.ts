/** Message the page posts (workbox-window's messageSkipWaiting) when the user taps "reload". */
export const SKIP_WAITING = "SKIP_WAITING";

/**
 * Lifecycle: claim open pages on activate, so the first visit is controlled and can reload
 * offline; a new version waits until the page asks for it — an update is never forced.
 */
export function registerLifecycle(scope: ServiceWorkerGlobalScope): void {
  scope.addEventListener("activate", (event) => {
    event.waitUntil(scope.clients.claim());
  });
  scope.addEventListener("message", (event) => {
    const data: unknown = event.data;
    if (
      typeof data === "object" &&
      data !== null &&
      (data as { type?: unknown }).type === SKIP_WAITING
    ) {
      void scope.skipWaiting();
    }
  });
}
