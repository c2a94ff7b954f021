// A visitor's first journey: the home page, then a tool model's page, on a desktop and a phone.
import { describe, expect, inject, it } from "vitest";
import { hydrated, newCheckedPage, sharedBrowser } from "../support/browser";

const baseUrl = inject("baseUrl");
const browser = sharedBrowser();

describe("browsing as a visitor", () => {
  it("opens the home page and follows a report to its tool's page", async () => {
    const { page, assertClean, close } = await newCheckedPage(browser());
    await page.goto(baseUrl);
    await expect(page.getByRole("heading", { level: 1 }).textContent()).resolves.toMatch(/free that joint/);
    await expect(page.getByRole("heading", { name: "Recently accepted reports" }).isVisible()).resolves.toBe(true);

    const firstTool = page.locator("ul li a[href^='/models/']").first();
    const toolName = (await firstTool.textContent())!.trim();
    await firstTool.click();
    await page.waitForURL(/\/models\/[a-z0-9-]+$/);
    // Client-side navigation: wait for the new page to render rather than for the address.
    await page.getByRole("heading", { level: 1, name: toolName, exact: true }).waitFor();
    await page.getByRole("heading", { name: "Specifications" }).waitFor();
    await expect(page.getByText("Before you pull the trigger").isVisible()).resolves.toBe(true);
    await assertClean();
    await close();
  });

  it("opens a job page and pages through its reports", async () => {
    const { page, assertClean, close } = await newCheckedPage(browser());
    await page.goto(`${baseUrl}/jobs`);
    await page.getByRole("link", { name: /Ball joint separation/ }).click();
    await page.waitForURL(/\/jobs\/ball-joint-separation$/);
    await page.getByRole("heading", { name: "Tools used on this job" }).waitFor();
    await page.getByRole("link", { name: "Older →" }).click();
    await page.waitForURL(/page=2/);
    await page.getByText(/^Page 2 of \d+$/).waitFor();
    await assertClean();
    await close();
  });

  it("filters and sorts the tools table in place, with the filters in the address", async () => {
    const { page, assertClean, close } = await newCheckedPage(browser());
    await page.goto(`${baseUrl}/models`);
    await hydrated(page);
    await page.locator("select[name=job]").selectOption("ball-joint-separation");
    await page.waitForURL(/job=ball-joint-separation/);
    await page.getByRole("button", { name: /Freed on ball joint separation/ }).waitFor();
    await page.getByRole("button", { name: /Freed on ball joint separation/ }).click();
    await page.waitForURL(/sort=success&dir=(asc|desc)/);
    const rows = await page.getByTestId("model-row").count();
    expect(rows).toBeGreaterThan(3);
    await page.goBack();
    await page.waitForURL((u) => !u.search.includes("sort="));
    await assertClean();
    await close();
  });

  it("fits a phone screen without sideways scrolling", async () => {
    const { page, assertClean, close } = await newCheckedPage(browser(), { width: 390, height: 844 });
    for (const path of ["/", "/models/brackwater-bh-150", "/jobs/lug-nut-breakaway"]) {
      await page.goto(`${baseUrl}${path}`);
      const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
      expect(overflow, path).toBeLessThanOrEqual(0);
    }
    await assertClean();
    await close();
  });

  it("shows a 404 page for a model that does not exist", async () => {
    const { page, close } = await newCheckedPage(browser());
    const response = await page.goto(`${baseUrl}/models/no-such-model`);
    expect(response?.status()).toBe(404);
    await expect(page.getByRole("heading", { level: 1 }).textContent()).resolves.toBe("Not found");
    await close();
  });
});
