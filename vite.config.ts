import preact from "@preact/preset-vite";
import { defineConfig, type Plugin } from "vite";

/**
 * Links manifest.webmanifest (kept at the repository top level) from index.html as-is. Vite would
 * otherwise hash it into assets/, where its relative icon paths would no longer resolve.
 * scripts/build-sw.mjs copies the file into dist/; the dev server serves it from the top level.
 */
function linkManifest(): Plugin {
  return {
    name: "driftmark-link-manifest",
    transformIndexHtml: {
      order: "post",
      handler: () => [
        {
          tag: "link",
          attrs: { rel: "manifest", href: "./manifest.webmanifest" },
          injectTo: "head",
        },
      ],
    },
  };
}

// The page build. The service worker is built afterwards by scripts/build-sw.mjs, which also
// injects the precache list into dist/sw.js.
export default defineConfig({
  base: "./",
  plugins: [preact(), linkManifest()],
  build: {
    outDir: "dist",
    emptyOutDir: true,
    // Keep every asset a file of its own: inlined data: URLs would need a wider CSP.
    assetsInlineLimit: 0,
    sourcemap: false,
    target: "es2022",
  },
});
