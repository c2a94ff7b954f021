// A shopper on a phone compares tools: the chooser, the pairs by the job page's rule, and the
// figures at another inlet pressure worked out in the browser (no request per row).
import { describe, expect, inject, it } from "vitest";
import { hydrated, newCheckedPage, sharedBrowser } from "../support/browser";

const baseUrl = inject("baseUrl");
const browser = sharedBrowser();

describe("comparing tools", () => {
  it("chooses a job and two tools, then moves the pressure without asking the server", async () => {
    const { page, assertClean, close } = await newCheckedPage(browser(), { width: 390, height: 844 });
    const asked: string[] = [];
    page.on("request", (r) => {
      if (r.url().includes("/api/stats/cell")) asked.push(r.url());
    });
    await page.goto(`${baseUrl}/compare`);
    await page.getByText("Pick the job first").waitFor();
    await page.getByRole("link", { name: "Ball joint separation" }).click();
    await page.getByText("Tick two to four tools").waitFor();
    const boxes = page.locator("input[name=models]");
    await boxes.nth(0).check();
    await boxes.nth(1).check();
    await page.getByRole("button", { name: "Compare" }).click();
    await page.getByRole("heading", { name: "Which frees it more often?" }).waitFor();
    await hydrated(page);
    expect(await page.getByTestId("pair").count()).toBe(1);
    const rows = page.locator("[data-testid^=at-]");
    await expect(rows.first().textContent()).resolves.toMatch(/at 90 psi/);
    await page.locator("select[name=psi]").selectOption("110");
    await rows
      .first()
      .getByText(/at 110 psi/)
      .waitFor();
    expect(asked).toEqual([]);
    await page.getByText("How this is worked out").first().click();
    await page.getByText(/Newcombe's hybrid score method/).waitFor();
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await assertClean();
    await close();
  });

  it("shows the job page's folds on a phone without sideways scrolling", async () => {
    const { page, assertClean, close } = await newCheckedPage(browser(), { width: 390, height: 844 });
    await page.goto(`${baseUrl}/jobs/tie-rod-end-release`);
    await page.getByTestId("order-basis").waitFor();
    await page.getByText("How this is worked out").first().click();
    await page
      .getByText(/Wilson score interval at the effective sample size/)
      .first()
      .waitFor();
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    if (process.env.STATS_SCREENSHOT) await page.screenshot({ path: process.env.STATS_SCREENSHOT, fullPage: false });
    await assertClean();
    await close();
  });
});
