// Registers dist/sw.js with workbox-window and reports its state to sw-status.ts.
// Production builds only (the dev server has no /sw.js): main.tsx checks import.meta.env.PROD.
import { Workbox } from "workbox-window";
import { setApplyUpdate, setSwStatus } from "./sw-status.ts";

export function registerServiceWorker(): void {
  if (!("serviceWorker" in navigator)) return;
  const wb = new Workbox("./sw.js", { scope: "./" });

  // A new version finished installing and waits. Offer the switch; never take it ourselves.
  wb.addEventListener("waiting", () => {
    setApplyUpdate(() => {
      // Reload only after the user's tap, once the new worker has taken control.
      wb.addEventListener("controlling", () => window.location.reload());
      wb.messageSkipWaiting();
    });
    setSwStatus({ updateWaiting: true });
  });

  wb.register()
    .then(() => navigator.serviceWorker.ready)
    .then(() => setSwStatus({ offlineReady: true, error: null }))
    .catch((err: unknown) => {
      setSwStatus({ error: err instanceof Error ? err.message : String(err) });
    });
}
