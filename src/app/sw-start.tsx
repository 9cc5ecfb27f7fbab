// Loaded after the page's load event (main.tsx): registers the service worker and shows its
// state in #status. Kept out of the first screen's scripts, with workbox-window.
import { render } from "preact";
import { registerServiceWorker } from "./register-sw.ts";
import { UpdateStatus } from "./UpdateStatus.tsx";

export function startServiceWorker(statusRoot: HTMLElement | null): void {
  if (statusRoot) render(<UpdateStatus />, statusRoot);
  registerServiceWorker();
}
