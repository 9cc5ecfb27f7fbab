// Entry: render the estimate screen into #root and the service-worker status into #status.
import { render } from "preact";
import { CAUTION } from "../core/caution.ts";
import { App } from "../ui/App.tsx";
import { registerServiceWorker } from "./register-sw.ts";
import { UpdateStatus } from "./UpdateStatus.tsx";
import "./shell.css";

const root = document.getElementById("root");
const statusRoot = document.getElementById("status");
if (root) render(<App />, root);
if (statusRoot) render(<UpdateStatus />, statusRoot);

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

// The dev server has no /sw.js: register only in production builds.
if (import.meta.env.PROD) registerServiceWorker();
