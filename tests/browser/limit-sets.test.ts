// Limit sets in Debian's chromium against the built app: import a file, pick a set by typing two
// letters, the limits and molecular weight fill and the footprint changes; the sets survive an
// offline reload; a bad file changes nothing and names row and column; a clash asks.
// Run: npm run build && npx vitest run -c vitest.browser.config.ts tests/browser/limit-sets.test.ts
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import AxeBuilder from "@axe-core/playwright";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { launchBrowser, startApp, waitForController } from "./harness.ts";

type App = Awaited<ReturnType<typeof startApp>>;
let app: App;
const profiles: string[] = [];

beforeAll(async () => {
  app = await startApp();
});
afterAll(async () => {
  await app?.close();
  for (const d of profiles) rmSync(d, { recursive: true, force: true });
});

// Invented sets: not real substances or exposure values.
const FILE = [
  "set_name,molecular_weight_g_mol,limit_label,value,unit,averaging_min,source_note",
  "Gas Alpha (invented),17,Tier 1 (invented),2,ppm,60,Invented list A 2026-01",
  "Gas Alpha (invented),17,Tier 2 (invented),15,ppm,30,Invented list A 2026-01",
  'Gas Beta (invented),64.1,Tier 1 (invented),0.5,ppm,60,"Invented list B, rev. 2"',
  "Gas Beta (invented),64.1,Tier 2 (invented),4,ppm,30,",
  "Gas Beta (invented),64.1,Tier 3 (invented),40,ppm,10,",
  "Dust Gamma (invented),,Tier 1 (invented),12,mg/m3,480,Invented",
].join("\r\n");

async function importFile(page: Page, name: string, text: string): Promise<void> {
  await page.locator("summary", { hasText: "Manage limit sets" }).click();
  await pickFile(page, name, text);
}

async function pickFile(page: Page, name: string, text: string): Promise<void> {
  await page.getByLabel("Limit sets file").setInputFiles({
    name,
    mimeType: "text/csv",
    buffer: Buffer.from(text, "utf8"),
  });
}

/** Every band outline's path on the footprint drawing (changes when the footprint changes). */
async function footprintPaths(page: Page): Promise<string> {
  return (await page
    .locator(".footprint-svg path")
    .evaluateAll((ps) => ps.map((p) => p.getAttribute("d") ?? "").join("|"))) as string;
}

describe("limit sets in the browser", () => {
  it("imports a file, fills the limits from two typed letters, and keeps the sets offline", async () => {
    const dir = mkdtempSync(join(tmpdir(), "driftmark-sets-profile-"));
    profiles.push(dir);
    const b = await launchBrowser({ profileDir: dir });
    try {
      const { page, context } = b;
      await page.goto(app.url);
      const field = page.getByLabel("Limit set", { exact: true });
      await field.waitFor({ timeout: 15_000 });
      await importFile(page, "sets.csv", FILE);
      await expect
        .poll(() => page.getByText("Imported 3 limit sets.").isVisible(), { timeout: 10_000 })
        .toBe(true);

      await page.getByTestId("band-reach-0").waitFor();
      const before = await footprintPaths(page);
      expect(before.length).toBeGreaterThan(0);

      await field.fill("");
      await field.pressSequentially("be");
      const option = page
        .getByRole("listbox", { name: "Limit sets" })
        .getByRole("option", { name: /Gas Beta \(invented\)/ });
      await option.waitFor({ timeout: 5_000 });
      // The other sets do not match "be".
      expect(
        await page.getByRole("listbox", { name: "Limit sets" }).getByRole("option").count(),
      ).toBe(1);
      await option.click();

      await expect.poll(() => page.locator("#limit-0-value").inputValue()).toBe("0.5");
      expect(await page.locator("#limit-1-value").inputValue()).toBe("4");
      expect(await page.locator("#limit-2-value").inputValue()).toBe("40");
      expect(await page.locator("#limit-0-name").inputValue()).toBe("Tier 1 (invented)");
      expect(await page.locator("#limit-2-avg").inputValue()).toBe("10");
      expect(await page.locator("#limit-0-unit").inputValue()).toBe("ppm");
      expect(await page.getByLabel("Molecular weight").inputValue()).toBe("64.1");
      expect(await page.locator("#limit-3-value").count()).toBe(0);
      await expect
        .poll(() => page.locator("#limit-set-hint").textContent())
        .toContain("Invented list B, rev. 2");
      await expect.poll(() => footprintPaths(page), { timeout: 10_000 }).not.toBe(before);
      expect(await page.getByTestId("band-0").textContent()).toContain("Tier 1 (invented)");

      // No accessibility violations with the options list open.
      await field.fill("");
      await field.pressSequentially("ga");
      await page.getByRole("listbox", { name: "Limit sets" }).getByRole("option").first().waitFor();
      const axe = await new AxeBuilder({ page }).include(".dm-sets").analyze();
      expect(axe.violations.map((v) => `${v.id}: ${v.help}`)).toEqual([]);
      await page.keyboard.press("Escape");

      // Offline reload: the sets are still there.
      await waitForController(page);
      await context.setOffline(true);
      await page.reload();
      const again = page.getByLabel("Limit set", { exact: true });
      await again.waitFor({ timeout: 15_000 });
      await again.pressSequentially("al");
      await page
        .getByRole("listbox", { name: "Limit sets" })
        .getByRole("option", { name: /Gas Alpha \(invented\)/ })
        .waitFor();
      await page
        .getByRole("listbox", { name: "Limit sets" })
        .getByRole("option", { name: /Gas Alpha \(invented\)/ })
        .click();
      await expect.poll(() => page.locator("#limit-1-value").inputValue()).toBe("15");
      expect(await page.getByLabel("Molecular weight").inputValue()).toBe("17");
      expect(await page.locator("summary", { hasText: "Manage limit sets" }).textContent()).toBe(
        "Manage limit sets (3 saved)",
      );
      await context.setOffline(false);
    } finally {
      await b.close();
    }
  });

  it("a bad file changes nothing and names the row and column; a known name asks", async () => {
    const b = await launchBrowser();
    try {
      const { page } = b;
      await page.goto(app.url);
      await page.getByLabel("Limit set", { exact: true }).waitFor({ timeout: 15_000 });
      await importFile(page, "sets.csv", FILE);
      await page.getByText("Imported 3 limit sets.").waitFor();

      const bad = `${FILE}\r\nGas Delta (invented),30,Tier 1,lots,ppm,60,x`;
      await pickFile(page, "bad.csv", bad);
      const problems = page.getByTestId("limit-sets-problems");
      await problems.waitFor();
      expect(await problems.textContent()).toContain(
        "Row 8, column value: 'lots' is not a positive number",
      );
      expect(await page.locator("summary", { hasText: "Manage limit sets" }).textContent()).toBe(
        "Manage limit sets (3 saved)",
      );

      await pickFile(page, "again.csv", FILE);
      await page.getByRole("button", { name: "Replace" }).click();
      await page.getByText("Imported 3 limit sets (replaced 3).").waitFor();
      expect(await page.locator("summary", { hasText: "Manage limit sets" }).textContent()).toBe(
        "Manage limit sets (3 saved)",
      );
      await pickFile(page, "again.csv", FILE);
      await page.getByRole("button", { name: "Keep both" }).click();
      await page.getByText("Imported 3 limit sets.").waitFor();
      expect(await page.locator("summary", { hasText: "Manage limit sets" }).textContent()).toBe(
        "Manage limit sets (6 saved)",
      );

      // Night theme, the management part open: no accessibility violations, 44 px targets.
      await page.evaluate(() => localStorage.setItem("driftmark.theme", "night"));
      await page.reload();
      await page.getByLabel("Limit set", { exact: true }).waitFor({ timeout: 15_000 });
      expect(await page.evaluate(() => document.documentElement.dataset.theme)).toBe("night");
      await page.locator("summary", { hasText: "Manage limit sets" }).click();
      await page.getByLabel("Limit set", { exact: true }).pressSequentially("ga");
      await page.getByRole("listbox", { name: "Limit sets" }).getByRole("option").first().waitFor();
      const axe = await new AxeBuilder({ page }).include(".dm-sets").analyze();
      expect(axe.violations.map((v) => `${v.id}: ${v.help}`)).toEqual([]);
      const small = await page
        .locator(".dm-sets button, .dm-sets summary, .dm-sets [role='option'], .dm-sets input")
        .evaluateAll((els) =>
          els
            .map((e) => e.getBoundingClientRect())
            .filter((r) => r.width > 0 && r.height < 44)
            .map((r) => r.height),
        );
      expect(small).toEqual([]);
    } finally {
      await b.close();
    }
  });
});
