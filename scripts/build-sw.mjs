// Second half of `npm run build` (after `vite build` has written dist/):
//   1. copy manifest.webmanifest (kept at the repository top level) into dist/;
//   2. bundle sw/sw.ts with vite's build API (library mode, one classic-script file);
//   3. inject the precache list of every built file into it with workbox-build → dist/sw.js.
import { copyFileSync, existsSync, mkdtempSync, rmSync, statSync } from "node:fs";
import { tmpdir } from "node:os";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { build } from "vite";
import { injectManifest } from "workbox-build";

const ROOT = join(dirname(fileURLToPath(import.meta.url)), "..");
const DIST = join(ROOT, "dist");
const SW_ENTRY = join(ROOT, "sw", "sw.ts");

if (!existsSync(join(DIST, "index.html"))) {
  console.error("build-sw: dist/index.html not found — run `vite build` first (npm run build).");
  process.exit(1);
}

copyFileSync(join(ROOT, "manifest.webmanifest"), join(DIST, "manifest.webmanifest"));

const tmp = mkdtempSync(join(tmpdir(), "driftmark-sw-"));
try {
  await build({
    configFile: false,
    root: ROOT,
    publicDir: false,
    logLevel: "warn",
    // Workbox strips its development logging when NODE_ENV is "production".
    define: { "process.env.NODE_ENV": JSON.stringify("production") },
    build: {
      outDir: tmp,
      emptyOutDir: false,
      copyPublicDir: false,
      target: "es2022",
      minify: true,
      sourcemap: false,
      lib: {
        entry: SW_ENTRY,
        formats: ["iife"],
        name: "driftmarkServiceWorker",
        fileName: () => "sw.js",
      },
    },
  });

  const { count, size, warnings } = await injectManifest({
    swSrc: join(tmp, "sw.js"),
    swDest: join(DIST, "sw.js"),
    globDirectory: DIST,
    globPatterns: ["**/*.{html,js,mjs,css,png,svg,ico,webmanifest,json,woff2,txt}"],
    globIgnores: ["sw.js"],
    // Vite's hashed files under assets/ are revisioned by name; the rest get a content hash.
    dontCacheBustURLsMatching: /^assets\//,
  });
  for (const w of warnings) console.warn(`build-sw: ${w}`);
  if (count === 0) throw new Error("build-sw: the precache list is empty");
  const swBytes = statSync(join(DIST, "sw.js")).size;
  console.log(
    `build-sw: dist/sw.js (${(swBytes / 1024).toFixed(1)} kB) precaches ${count} files, ${(size / 1024).toFixed(1)} kB`,
  );
} finally {
  rmSync(tmp, { recursive: true, force: true });
}
