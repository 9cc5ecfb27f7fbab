// The estimate sheet in Debian's chromium against the built app: "Print this estimate" from the
// screen and from a log entry gives one page on A4 and on US Letter, whose text holds the caution,
// each band's reach and the limit set's source note, and none of the app's controls.
// Run: npm run build && npx vitest run -c vitest.browser.config.ts tests/browser/sheet.test.ts
import { writeFileSync } from "node:fs";
import { join } from "node:path";
import { getDocument } from "pdfjs-dist/legacy/build/pdf.mjs";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { CAUTION } from "../../src/core/caution.ts";
import { DEMO_LIMIT_SET } from "../../src/storage/limit-sets.ts";
import { ensureOutputDir, launchBrowser, startApp } from "./harness.ts";

type App = Awaited<ReturnType<typeof startApp>>;
let app: App;
beforeAll(async () => {
  app = await startApp();
});
afterAll(async () => {
  await app?.close();
});

const squash = (s: string) => s.replace(/\s+/g, " ").trim();

/** Page count and text of a PDF (pdf.js text layer, every page). */
async function readPdf(bytes: Buffer): Promise<{ pages: number; text: string }> {
  const doc = await getDocument({
    data: new Uint8Array(bytes),
    isEvalSupported: false,
    useSystemFonts: false,
    disableFontFace: true,
  }).promise;
  const parts: string[] = [];
  for (let i = 1; i <= doc.numPages; i++) {
    const content = await (await doc.getPage(i)).getTextContent();
    for (const item of content.items) if ("str" in item) parts.push(item.str);
  }
  const pages = doc.numPages;
  await doc.destroy();
  return { pages, text: squash(parts.join(" ")) };
}

/**
 * Both paper sizes: one page each, and the text of each. `show` taps "Print this estimate" before
 * each: printing (page.pdf too) ends with `afterprint`, which takes the sheet away.
 */
async function printBoth(page: Page, name: string, show: () => Promise<void>): Promise<string[]> {
  const texts: string[] = [];
  for (const format of ["A4", "Letter"] as const) {
    await stubPrint(page);
    await show();
    await page.getByTestId("estimate-sheet").waitFor({ state: "attached" });
    const pdf = await page.pdf({ format, printBackground: true });
    writeFileSync(join(ensureOutputDir(), `${name}-${format}.pdf`), pdf);
    const { pages, text } = await readPdf(pdf);
    expect(pages, `${name} on ${format}`).toBe(1);
    texts.push(text);
  }
  return texts;
}

/** Keep the sheet on the page: headless chromium has no print dialog to close. */
async function stubPrint(page: Page): Promise<void> {
  await page.evaluate(() => {
    window.print = () => undefined;
  });
}

describe("the estimate sheet", () => {
  it("prints one page on A4 and Letter from the screen and from a log entry", async () => {
    const b = await launchBrowser();
    try {
      const { page } = b;
      await page.goto(app.url);
      const field = page.getByLabel("Limit set", { exact: true });
      await field.waitFor({ timeout: 15_000 });
      await field.pressSequentially("su");
      await page
        .getByRole("listbox", { name: "Limit sets" })
        .getByRole("option", { name: /Substance X/ })
        .click();
      await expect
        .poll(() => page.locator("#limit-set-hint").textContent())
        .toContain(DEMO_LIMIT_SET.source_note);
      const print = page.getByRole("button", { name: "Print this estimate" });
      await expect.poll(() => print.isEnabled(), { timeout: 15_000 }).toBe(true);
      const reaches = await page.locator('[data-testid^="band-reach-"]').allTextContents();
      expect(reaches.length).toBe(DEMO_LIMIT_SET.limits.length);

      await stubPrint(page);
      const sheet = page.getByTestId("estimate-sheet");
      // The estimate with the chosen set may still be on its way from the worker: print until the
      // sheet is the one of that estimate (it names the set's source note).
      await expect
        .poll(
          async () => {
            await print.click();
            await sheet.waitFor({ state: "attached" });
            return squash((await sheet.textContent()) ?? "");
          },
          { timeout: 20_000 },
        )
        .toContain(squash(DEMO_LIMIT_SET.source_note));
      expect(await page.locator('[data-testid^="sheet-reach-"]').allTextContents()).toEqual(
        reaches,
      );
      // The caution comes first on the sheet.
      expect(squash((await sheet.textContent()) ?? "").startsWith(squash(CAUTION))).toBe(true);
      for (const text of await printBoth(page, "sheet-screen", () => print.click())) {
        expect(text).toContain(squash(CAUTION));
        for (const r of reaches) expect(text).toContain(squash(r));
        expect(text).toContain(squash(DEMO_LIMIT_SET.source_note));
        expect(text).toContain(DEMO_LIMIT_SET.name);
        for (const l of DEMO_LIMIT_SET.limits) expect(text).toContain(l.label);
        // Nothing of the app's chrome.
        expect(text).not.toContain("Log this estimate");
        expect(text).not.toContain("What this model cannot do");
        expect(text).not.toContain("Zoom");
      }

      // From a log entry: log it, open it, print it.
      await sheet.waitFor({ state: "detached" });
      await page.getByRole("button", { name: "Log this estimate" }).click();
      await page.getByText(/^Logged: estimate of/).waitFor({ timeout: 10_000 });
      await page.locator(".dm-log-rowbtn").first().click();
      const detail = page.getByTestId("log-detail");
      await detail.waitFor();
      expect(await detail.getByTestId("log-limit-set").textContent()).toContain(
        DEMO_LIMIT_SET.source_note,
      );
      const printEntry = detail.getByRole("button", { name: "Print this estimate" });
      for (const text of await printBoth(page, "sheet-log-entry", () => printEntry.click())) {
        expect(text).toContain(squash(CAUTION));
        for (const r of reaches) expect(text).toContain(squash(r));
        expect(text).toContain(squash(DEMO_LIMIT_SET.source_note));
      }
    } finally {
      await b.close();
    }
  });

  it("fits eight limits on one page, every band's reach readable", async () => {
    const b = await launchBrowser();
    try {
      const { page } = b;
      await page.goto(app.url);
      const rows = Array.from(
        { length: 8 },
        (_, i) =>
          `Gas Many (invented),34,Tier ${i + 1} (invented),${(i + 1) * 4},ppm,${[10, 30, 60][i % 3]},Invented eight-tier list`,
      );
      await page.getByLabel("Limit set", { exact: true }).waitFor({ timeout: 15_000 });
      await page.locator("summary", { hasText: "Manage limit sets" }).click();
      await page.getByLabel("Limit sets file").setInputFiles({
        name: "many.csv",
        mimeType: "text/csv",
        buffer: Buffer.from(
          [
            "set_name,molecular_weight_g_mol,limit_label,value,unit,averaging_min,source_note",
            ...rows,
          ].join("\n"),
        ),
      });
      await page.getByText("Imported 1 limit set.").waitFor();
      // No wind swing: eight swept bands with their spread can take longer than the worker's
      // 2 s limit on a loaded machine, and the test is about the page, not the solve.
      await page.locator("#wind-swing").fill("0");
      await page.getByLabel("Limit set", { exact: true }).pressSequentially("ma");
      await page
        .getByRole("listbox", { name: "Limit sets" })
        .getByRole("option", { name: /Gas Many/ })
        .click();
      await expect
        .poll(() => page.locator('[data-testid^="band-reach-"]').count(), { timeout: 15_000 })
        .toBe(8);
      const print = page.getByRole("button", { name: "Print this estimate" });
      await expect.poll(() => print.isEnabled(), { timeout: 15_000 }).toBe(true);
      const reaches = await page.locator('[data-testid^="band-reach-"]').allTextContents();
      // Eight bands are taller than a page: the sheet is scaled down to fit, not cut.
      await stubPrint(page);
      await print.click();
      const zoom = await page
        .getByTestId("estimate-sheet")
        .evaluate((e) => Number((e as HTMLElement).style.zoom || "1"));
      expect(zoom).toBeLessThan(1);
      expect(zoom).toBeGreaterThan(0.4);
      for (const text of await printBoth(page, "sheet-eight", () => print.click())) {
        expect(text).toContain(squash(CAUTION));
        for (const r of reaches) expect(text).toContain(squash(r));
        for (let i = 1; i <= 8; i++) expect(text).toContain(`Tier ${i} (invented)`);
        expect(text).toContain("Invented eight-tier list");
      }
    } finally {
      await b.close();
    }
  });
});
