// Bench figures on a phone (390 px): the force a job takes on a demo job page — the curve with its
// band and an accessible name, the ED50 with its interval, the models placed on it — and the derived
// figures of two compared tools on /compare, the same as their model pages give. No sideways scroll.
import type { Page } from "playwright-core";
import { describe, expect, inject, it } from "vitest";
import { hydrated, newCheckedPage, sharedBrowser } from "../support/browser";

const baseUrl = inject("baseUrl");
const browser = sharedBrowser();
const PHONE = { width: 390, height: 844 };

// The demo's busiest hammer job, and two hammers with accepted bench runs and reports on it.
const JOB = "ball-joint-separation";
const MODELS = ["brackwater-bh-150", "brackwater-bh-260l"] as const;

const pageWidth = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth);
const FIELD_ONLY_ROW = "from field reports only, no bench data";
const FIELD_ONLY_NOTE = "Open dots: no bench data; placed from their field reports only.";
// A figure with its interval below, as the bench tables set it: "809 lbf" then "764 to 863 lbf" (or
// "764 lbf to 863 lbf").
const WITH_INTERVAL = /^-?[\d.,]+ (N|lbf|N·m|ft·lbf)-?[\d.,]+( \1)? to -?[\d.,]+ \1/;

describe("bench figures on a phone", () => {
  it("draws the force a job takes with its band, the ED50 and its interval, and the models placed on it", async () => {
    const { page, assertClean, close } = await newCheckedPage(browser(), PHONE);
    await page.goto(`${baseUrl}/jobs/${JOB}`);
    const panel = page.locator("section[aria-labelledby=job-force-heading]");
    await panel.getByRole("heading", { name: "The force this job takes" }).waitFor();

    const curve = panel.getByRole("img", { name: /^Chance of freeing the job against bench force \((N|lbf)\)/ });
    await curve.waitFor();
    // The band (an area) and the curve (a line) are both drawn.
    expect(await curve.locator("path").count()).toBeGreaterThanOrEqual(2);

    const ed50 = await panel.getByText(/^Half the reports free this job/).textContent();
    expect(ed50).toMatch(/about -?\d+ (N|lbf) \(95 % interval -?\d+ (N|lbf) to -?\d+ (N|lbf)\)\.$/);

    // Every model on the curve is listed; a tool placed without bench data says so in its row, and
    // the figure's note appears exactly when there is one.
    const placed = panel.getByRole("region", { name: "Models on the force curve" });
    const rows = await placed.locator("tbody tr").count();
    expect(rows).toBeGreaterThan(1);
    expect(await curve.locator("circle").count()).toBe(rows);
    const fieldOnly = await placed.getByText(FIELD_ONLY_ROW).count();
    expect(await panel.getByText(FIELD_ONLY_NOTE).count()).toBe(fieldOnly > 0 ? 1 : 0);

    await panel.getByText("How this is worked out").click();
    await panel.getByText(/The force at which half the reports free the job has a 95 %/).waitFor();
    expect(await pageWidth(page)).toBeLessThanOrEqual(PHONE.width);
    await assertClean();
    await close();
  });

  it("shows the derived figures of two compared tools as their model pages give them", async () => {
    const { page, assertClean, close } = await newCheckedPage(browser(), PHONE);
    await page.goto(`${baseUrl}/compare?job=${JOB}&models=${MODELS.join(",")}`);
    const section = page.locator("section[aria-labelledby=compare-derived-heading]");
    await section.getByRole("heading", { name: "Bench figures for size and price" }).waitFor();
    await hydrated(page);

    const perKg: string[] = [];
    for (const slug of MODELS) {
      const row = section.getByTestId(`derived-${slug}`);
      await expect(row.locator("th").textContent()).resolves.toMatch(/From “Full trigger.*”, \d+ runs? on \d+ rigs?/);
      const cells = row.locator("td");
      expect(await cells.count()).toBe(4);
      for (let i = 0; i < 4; i++) {
        const text = await cells.nth(i).textContent();
        // Per kg and per 100 mm always; per $100 and the trigger control range where the demo has them.
        if (i < 2) expect(text).toMatch(WITH_INTERVAL);
        else expect(text).toMatch(new RegExp(`${WITH_INTERVAL.source}|^No `));
      }
      perKg.push(/^[\d.,]+/.exec((await cells.nth(0).textContent()) ?? "")![0]);
    }
    expect(await section.getByText("No bench runs yet").count()).toBe(0);

    await section.getByText("How this is worked out").click();
    await section.getByText(/Dividing it and both ends of its 95 % interval/).waitFor();
    // The table scrolls inside its own frame; the page does not.
    expect(await pageWidth(page)).toBeLessThanOrEqual(PHONE.width);
    await assertClean();

    // The model page works the same figure out by the same function.
    for (const [i, slug] of MODELS.entries()) {
      await page.goto(`${baseUrl}/models/${slug}`);
      const perKgOnModel = page.locator("dt", { hasText: /^Per kg of tool/ }).locator("xpath=following-sibling::dd[1]");
      await expect(perKgOnModel.textContent()).resolves.toMatch(new RegExp(`^${perKg[i]!.replace(".", "\\.")} \\(`));
    }
    await assertClean();
    await close();
  });
});
