import { createHandlerBoundToURL } from "workbox-precaching";
import { NavigationRoute, registerRoute } from "workbox-routing";

/** The app is a single page: any navigation in scope gets the precached index.html (offline too). */
export function registerNavigation(): void {
  registerRoute(new NavigationRoute(createHandlerBoundToURL("index.html")));
}
