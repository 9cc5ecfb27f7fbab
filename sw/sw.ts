// Driftmark's service worker: wiring only. Each job lives in its own file:
//   precache.ts   — what to cache (the build's full asset list, injected by scripts/build-sw.mjs)
//   navigation.ts — answer every in-scope page navigation with the precached index.html
//   lifecycle.ts  — take control on activate; wait for the page to ask before replacing a version
// Nothing here imports from src/ (the page's code); the page talks to this worker only by messages.
import { registerLifecycle } from "./lifecycle.ts";
import { registerNavigation } from "./navigation.ts";
import { registerPrecache } from "./precache.ts";
import type { DriftmarkWorkerScope } from "./scope.ts";

declare const self: DriftmarkWorkerScope;

// Keep the literal `self.__WB_MANIFEST`: scripts/build-sw.mjs replaces it with the asset list.
registerPrecache(self.__WB_MANIFEST);
registerNavigation();
registerLifecycle(self);
