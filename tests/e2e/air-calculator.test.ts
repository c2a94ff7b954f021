// "What reaches my tool?" with JavaScript (live figures) and without (plain GET form).
import { describe, expect, inject, it } from "vitest";
import { hydrated, newCheckedPage, sharedBrowser } from "../support/browser";

const baseUrl = inject("baseUrl");
const browser = sharedBrowser();

const psi = (text: string | null) => Number(text?.match(/(\d+(\.\d+)?) psi/)?.[1]);

describe("the air calculator", () => {
  it("moves the inlet figure as the hose changes, without a reload", async () => {
    const { page, assertClean, close } = await newCheckedPage(browser(), { width: 390, height: 844 });
    await page.goto(`${baseUrl}/air`);
    await hydrated(page);
    const figure = page.getByTestId("inlet-pressure");
    const before = psi(await figure.textContent());
    expect(before).toBeGreaterThan(0);
    // The pressure along the line, segment by segment, and where the tool's running air use came from.
    const waterfall = page.getByTestId("line-waterfall");
    await waterfall.getByText("Coupler 2 (at the tool)", { exact: true }).waitFor();
    expect(await waterfall.getByText("At the tool inlet", { exact: true }).count()).toBe(1);
    await page.getByText(/an estimate, 2\.5× its rated average/).waitFor();
    await page.getByLabel("Hose inside diameter, in").fill("1/4");
    await page.getByLabel("Hose length, ft").fill("150");
    await page.waitForFunction((b) => {
      const t = document.querySelector("[data-testid=inlet-pressure]")?.textContent ?? "";
      return Number(t.match(/(\d+) psi/)?.[1]) < b;
    }, before);
    expect(psi(await figure.textContent())).toBeLessThan(before);
    expect(page.url()).toBe(`${baseUrl}/air`);

    await page.getByLabel("Hose length, ft").fill("-3");
    await page.getByText("More than 0, at most 330 ft").waitFor();
    await assertClean();
    await close();
  });

  it("works as a plain GET form without JavaScript", async () => {
    const context = await browser().newContext({ javaScriptEnabled: false });
    const page = await context.newPage();
    await page.goto(`${baseUrl}/air`);
    const before = psi(await page.getByTestId("inlet-pressure").textContent());
    await page.getByLabel("Hose inside diameter, in").fill("1/4");
    await page.getByLabel("Hose length, ft").fill("150");
    await page.getByRole("button", { name: /Work it out/ }).click();
    await page.waitForURL(/hid=1%2F4/);
    expect(psi(await page.getByTestId("inlet-pressure").textContent())).toBeLessThan(before);
    const bad = await page.goto(`${baseUrl}/air?hid=abc&hlen=50`);
    expect(bad?.status()).toBe(400);
    await page.getByText("Enter the hose inside diameter, e.g. 3/8").waitFor();
    await context.close();
  });
});
