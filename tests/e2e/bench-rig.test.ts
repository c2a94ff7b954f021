// On a phone (390 px): a signed-in user registers a rig, files its calibration with its certificate,
// sees the fit and its residuals before saving, and the rig then waits for a moderator. No page scrolls sideways.
// Bad input is covered over HTTP in tests/integration/bench-rigs.test.ts.
import type { Page } from "playwright-core";
import { afterAll, describe, expect, inject, it } from "vitest";
import { hydrated, newCheckedPage, sharedBrowser } from "../support/browser";
import { testDb } from "../support/db";

const baseUrl = inject("baseUrl");
const db = testDb();
const browser = sharedBrowser();
const NAME = `E2E phone rig ${Date.now() % 1e6}`;
afterAll(async () => {
  await db.deleteFrom("rigs").where("name", "=", NAME).execute();
  await db.destroy();
});

const fitsWidth = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth);

describe("registering a rig on a phone", () => {
  it("registers a rig and files its calibration, shown fitted before it is saved", async () => {
    const { page, assertClean, close } = await newCheckedPage(browser(), { width: 390, height: 844 });
    await page.goto(`${baseUrl}/sign-in?redirectTo=${encodeURIComponent("/bench/rigs/new")}`);
    await page.getByRole("link", { name: /Continue with/ }).click();
    await page.getByRole("link", { name: /rustbelt-ana/ }).click();
    await page.getByRole("heading", { name: "Register your rig" }).waitFor();
    await hydrated(page);
    await page.getByText("No shank adapters").waitFor();
    expect(await fitsWidth(page)).toBe(true);

    await page.getByLabel("Name of the rig").fill(NAME);
    await page.getByLabel("What it measures").selectOption("percussive_force");
    await page.getByLabel("Sensor capacity").fill("5000");
    await page.getByLabel("Sample rate (Hz)").fill("20000");
    await page.getByLabel("Anvil or fixture").fill("A 40 kg anvil on a load cell, bolted to the slab");
    await page.getByLabel("Check-standard tool").selectOption({ label: "Brackwater Pneumatics BH-150" });
    await page.getByLabel("A calibration counts for (months)").fill("12");
    await page.getByRole("button", { name: "Register the rig" }).click();
    await page.getByRole("heading", { name: NAME }).waitFor();
    await page.getByRole("link", { name: "File a calibration" }).click();
    await page.getByRole("heading", { name: "File a calibration" }).waitFor();
    await page
      .getByLabel(/Reference loads and readings/)
      .fill("reference,reading\n500,500.2\n1000,1000.9\n2000,2000.6\n3000,3001.3\n4000,4000.8");
    await page.getByLabel("Day of the calibration").fill("2026-11-01");
    // The certificate goes straight to the store from the browser.
    await page.getByLabel("Calibration certificate (optional)").setInputFiles({
      name: "certificate.pdf",
      mimeType: "application/pdf",
      buffer: Buffer.from("%PDF-1.4\n1 0 obj<</Type/Catalog>>endobj\ntrailer<</Root 1 0 R>>\n%%EOF\n", "latin1"),
    });
    await page.getByText("certificate.pdf is attached").waitFor();
    await page.getByRole("button", { name: "Fit and show" }).click();
    await page.getByText(/A straight line: no significant curvature/).waitFor();
    await page.getByRole("img", { name: /Residuals of the calibration fit/ }).waitFor();
    expect(await fitsWidth(page)).toBe(true);
    await page.getByRole("button", { name: "Save the calibration" }).click();
    await page.getByText("Calibration awaiting a moderator").first().waitFor();
    await page.getByRole("link", { name: /^Certificate of the calibration of/ }).waitFor();
    expect(await fitsWidth(page)).toBe(true);
    await assertClean();
    await close();
  });
});
