// A shopper: picks the job, gives their air supply, filters the tools table, then finds a model
// by name with a typo in the header's search box and opens it.
import { describe, expect, inject, it } from "vitest";
import { hydrated, newCheckedPage, sharedBrowser } from "../support/browser";

const baseUrl = inject("baseUrl");
const browser = sharedBrowser();

describe("shopping by job", () => {
  it("goes from the job and the shop's air to a tool page", async () => {
    const { page, assertClean, close } = await newCheckedPage(browser(), { width: 390, height: 844 });
    await page.goto(`${baseUrl}/jobs`);
    await page.getByRole("link", { name: /Axle nut breakaway/ }).click();
    await page.getByRole("heading", { name: "Which tool, on your air?" }).waitFor();
    await page.getByLabel("Regulator, psi").fill("95");
    await page.getByLabel("Hose ID, in").fill("1/4");
    await page.getByLabel("Hose length, ft").fill("75");
    await page.getByRole("button", { name: "Show tools at my air" }).click();
    await page.getByRole("columnheader", { name: "Reaches the tool" }).waitFor();
    expect(page.url()).toMatch(/reg=95/);

    await page.goto(`${baseUrl}/models`);
    await hydrated(page);
    await page.locator("select[name=job]").selectOption("axle-nut-breakaway");
    await page.locator("input[name=maxPrice]").fill("300");
    await page.locator("input[name=maxPrice]").press("Tab");
    await page.waitForURL(/maxPrice=300/);
    await page.getByText(/^\d+ tools$/).waitFor();

    await page
      .getByRole("searchbox", { name: "Search tools and reports" })
      .or(page.getByLabel("Search tools and reports").first())
      .first()
      .fill("tesaly t-750");
    await page
      .getByTestId("suggestions")
      .getByRole("link", { name: /Tessaly Tool Works T-750/ })
      .first()
      .click();
    await page.getByRole("heading", { level: 1, name: "Tessaly Tool Works T-750" }).waitFor();
    await assertClean();
    await close();
  });
});
