// One unit system per viewer (issue 18): a German browser reads metric, an American one US units,
// and the footer's switch changes every figure of a row at once and comes back to the same page —
// with JavaScript and without. UNITS_SCREENSHOTS=<folder> keeps a picture of each state.
import type { Browser, BrowserContextOptions, Page } from "playwright-core";
import { afterAll, describe, expect, inject, it } from "vitest";
import { hydrated, sharedBrowser } from "../support/browser";
import { testDb } from "../support/db";
import { signedInAs } from "../support/http";
import { validReport } from "../support/reports";

const baseUrl = inject("baseUrl");
const browser = sharedBrowser();
const db = testDb();
afterAll(() => db.destroy());
const PHONE = { width: 390, height: 844 };
const DESKTOP = { width: 1280, height: 900 };

async function open(b: Browser, options: BrowserContextOptions) {
  const context = await b.newContext(options);
  context.setDefaultTimeout(120_000);
  context.setDefaultNavigationTimeout(120_000);
  const page = await context.newPage();
  const problems: string[] = [];
  page.on("console", (m) => void (m.type() === "error" && problems.push(m.text())));
  page.on("pageerror", (e) => problems.push(e.message));
  return { page, problems, close: () => context.close() };
}

const hoseCells = (page: Page) => page.locator("dt:text-is('Hose') + dd").allTextContents();
const chosen = (page: Page) => page.locator("footer form[action='/units'] button[aria-pressed='true']").textContent();
const snap = async (page: Page, name: string) => {
  const dir = process.env.UNITS_SCREENSHOTS;
  if (!dir) return;
  await hydrated(page); // the screenshot hides the caret with a style; after hydration it cannot upset React
  await page.locator("dt:text-is('Hose')").first().scrollIntoViewIfNeeded();
  await page.screenshot({ path: `${dir}/${name}-rows.png` });
  await page.locator("footer").scrollIntoViewIfNeeded();
  await page.screenshot({ path: `${dir}/${name}-footer.png` });
};

describe("the viewer's unit system", () => {
  for (const javaScriptEnabled of [true, false]) {
    it(`follows the browser's language and switches from the footer (JavaScript ${javaScriptEnabled ? "on" : "off"})`, async () => {
      const { page, problems, close } = await open(browser(), { viewport: PHONE, locale: "de-DE", javaScriptEnabled });
      await page.goto(`${baseUrl}/models/brackwater-bh-150`);
      await expect(chosen(page)).resolves.toBe("Metric");
      const metric = await hoseCells(page);
      expect(metric.length).toBeGreaterThan(0);
      for (const cell of metric) expect(cell).toMatch(/^\d+\.\d mm × \d+(\.\d)? m$/);
      if (javaScriptEnabled) await snap(page, "model-390-metric");

      await page.getByRole("button", { name: "US customary" }).click();
      await page.locator("footer button[aria-pressed='true']", { hasText: "US customary" }).waitFor();
      expect(page.url()).toBe(`${baseUrl}/models/brackwater-bh-150`);
      for (const cell of await hoseCells(page)) expect(cell).toMatch(/^\d+(\/\d+)? in × \d+ ft$/);
      if (javaScriptEnabled) await snap(page, "model-390-us");
      expect(problems).toEqual([]);
      await close();
    });
  }

  it("reads US units for an American browser on a desktop", async () => {
    const { page, problems, close } = await open(browser(), { viewport: DESKTOP, locale: "en-US" });
    await page.goto(`${baseUrl}/jobs/ball-joint-separation`);
    await expect(chosen(page)).resolves.toBe("US customary");
    for (const cell of await hoseCells(page)) expect(cell).toMatch(/^\d+(\/\d+)? in × \d+ ft$/);
    await snap(page, "job-1280-us");
    expect(problems).toEqual([]);
    await close();
  });

  it("shows a metric moderator a report's figures as the reporter typed them, 3/8 in and psi", async () => {
    const stamp = String(Date.now());
    const email = `e2e-units-${stamp}@demo.bayproof.test`;
    await db
      .insertInto("users")
      .values({ email, handle: `units-${stamp.slice(-8)}` })
      .execute();
    const reporter = await signedInAs(db, email);
    const filed = await reporter.post("/reports/new", validReport()); // typed in psi, inches, feet, SCFM, gallons
    expect(filed.status).toBe(302);
    const id = Number(/submitted=(\d+)/.exec(filed.headers.get("location")!)![1]);

    const moderator = await signedInAs(db, "moderator2@demo.bayproof.test"); // reads metric with bar
    const { page, problems, close } = await open(browser(), { viewport: PHONE, locale: "de-DE" });
    await page
      .context()
      .addCookies([{ name: "bayproof_session", value: moderator.cookies.get("bayproof_session")!, url: baseUrl }]);
    await page.goto(`${baseUrl}/review/${id}`);
    const fact = (name: string) => page.locator(`dt:text-is('${name}') + dd`).textContent();
    await expect(fact("Hose")).resolves.toBe("3/8 in × 50 ft");
    await expect(fact("Regulator")).resolves.toBe("100 psi");
    await expect(fact("Tank")).resolves.toBe("60 gal");
    await snap(page, "review-390-as-entered");
    expect(problems).toEqual([]);
    await close();
  });
});
