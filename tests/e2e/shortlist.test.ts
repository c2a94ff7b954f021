// The buyer's shortlist at phone width: a technician with 0.498 bits, six ball joints a day and their
// own air sees the list change, the best-pick chances and the day's exposure, without sideways scroll,
// then ticks two of the tools that pass to compare them.
import { describe, expect, inject, it } from "vitest";
import type { Page } from "playwright-core";
import { newCheckedPage, sharedBrowser } from "../support/browser";

const baseUrl = inject("baseUrl");
const browser = sharedBrowser();

const passCount = async (page: Page) => {
  const text = await page.getByRole("heading", { name: /tools pass$/ }).textContent();
  return Number(/^(\d+) of/.exec(text ?? "")?.[1]);
};

const noSidewaysScroll = (page: Page) =>
  page.evaluate(() => document.documentElement.scrollWidth <= document.documentElement.clientWidth);

describe("the buyer's shortlist", () => {
  it("0.498 bits, six ball joints a day, my air: the list changes", async () => {
    const { page, assertClean, close } = await newCheckedPage(browser(), { width: 390, height: 844 });
    await page.goto(`${baseUrl}/jobs/ball-joint-separation`);
    await page.getByRole("heading", { name: "Which tool, on your air?" }).waitFor();
    const before = await passCount(page);
    expect(before).toBeGreaterThan(1);
    expect(await noSidewaysScroll(page)).toBe(true);
    await assertClean();

    await page.getByLabel("Regulator, psi").fill("100");
    await page.getByLabel("Hose ID, in").fill("3/8");
    await page.getByLabel("Hose length, ft").fill("50");
    await page.getByLabel("Bits you own").selectOption("shank-0.498");
    await page.getByRole("textbox", { name: "Jobs a day" }).fill("6");
    await page.getByRole("button", { name: "Show tools at my air" }).click();
    await page.waitForURL(
      (url) => url.searchParams.get("bits") === "shank-0.498" && url.searchParams.get("jobs") === "6",
    );
    await page.getByRole("heading", { name: "A day of 6 jobs: hands and ears" }).waitFor();
    await page.getByRole("columnheader", { name: "Reaches the tool" }).waitFor();

    const after = await passCount(page);
    expect(after).toBeLessThan(before);
    expect(after).toBeGreaterThan(0);
    // The 0.401 tools are out, each saying why.
    await expect
      .poll(() => page.getByTestId("excluded").textContent())
      .toMatch(/takes 0\.401 in shank bits \(yours will not fit; never use a shank adapter\)/);
    // Best-pick chances with their simulation size and seed, and the trade-off picture.
    await page.getByTestId("best-pick").waitFor();
    await expect.poll(() => page.getByText(/From 4,000 draws \(seed 1\)/).count()).toBe(1);
    await page.getByRole("img", { name: /Chance it frees the job against weight/ }).waitFor();
    expect(await noSidewaysScroll(page)).toBe(true);
    await assertClean();

    // Any two of the tools that pass go to the comparison.
    const boxes = page.getByTestId("shortlist").getByRole("checkbox");
    await boxes.nth(0).check();
    await boxes.nth(1).check();
    await page.getByRole("button", { name: "Compare the ticked tools →" }).click();
    await page.getByRole("heading", { level: 1, name: /Side by side: Ball joint separation/i }).waitFor();
    expect(new URL(page.url()).searchParams.getAll("models")).toHaveLength(2);
    await assertClean();
    await close();
  }, 900_000);
});
