// Entry: render the estimate screen into #root and the service-worker status into #status.
import { render } from "preact";
import { CAUTION } from "../core/caution.ts";
import type { AsyncEstimator } from "../ui/App.tsx";
import { App } from "../ui/App.tsx";
import "./shell.css";

const root = document.getElementById("root");
const statusRoot = document.getElementById("status");
/**
 * The off-thread estimator, its client code loaded on the first change after start (the first
 * estimate is computed on the page). Calls keep their order, so latest-wins still holds.
 */
function lazyEstimator(): AsyncEstimator {
  let real: Promise<AsyncEstimator> | null = null;
  const get = () => {
    real ??= import("./worker/client.ts").then((m) => m.createEstimator());
    return real;
  };
  return {
    run: (scenario, options) => get().then((e) => e.run(scenario, options)),
    dispose: () => {
      real?.then((e) => e.dispose());
    },
  };
}

if (root) {
  render(<App makeEstimator={lazyEstimator} />, root);
  // The first estimate is computed during that render: mark the moment (the size budget test
  // counts the scripts fetched before it).
  performance.mark("driftmark-first-render", {
    detail: { estimate: root.querySelector('[data-testid="band-reach-0"]') !== null },
  });
}

// index.html carries the caution as static text so it shows before (and without) the script.
// Hide that copy only while the rendered app shows the caution itself — never leave none.
const staticCaution = document.getElementById("static-caution");
if (root && staticCaution) {
  const sync = () => {
    staticCaution.hidden = (root.textContent ?? "").includes(CAUTION);
  };
  sync();
  new MutationObserver(sync).observe(root, { childList: true, subtree: true, characterData: true });
}

// The dev server has no /sw.js: register only in production builds. Registration (and
// workbox-window with it) waits for the page's load event, so it never competes with the
// first estimate for the phone's CPU.
if (import.meta.env.PROD) {
  const register = () => {
    import("./sw-start.tsx").then((m) => m.startServiceWorker(statusRoot));
  };
  if (document.readyState === "complete") register();
  else window.addEventListener("load", register, { once: true });
}
