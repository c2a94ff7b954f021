// "A day on the tools" (/day) at phone width, with JavaScript and without; the exposure panels of the
// model and compare pages; bad settings answered 400 with the reason and the values as typed.
import { describe, expect, inject, it } from "vitest";
import { hydrated, newCheckedPage, sharedBrowser } from "../support/browser";

const baseUrl = inject("baseUrl");
const browser = sharedBrowser();
const PHONE = { width: 390, height: 844 };

describe("a day on the tools", () => {
  it("works out an example day at phone width, then switches to in-use vibration, without sideways scroll", async () => {
    const { page, assertClean, close } = await newCheckedPage(browser(), PHONE);
    await page.goto(`${baseUrl}/day`);
    await hydrated(page);
    await page.getByRole("link", { name: /Try an example day/ }).click();
    await page.getByRole("heading", { name: "The whole day" }).waitFor();
    expect(page.url()).toContain("job=ball-joint-separation");
    const day = page.getByRole("region", { name: "The whole day" });
    for (const label of ["Vibration A(8)", "Share of the daily action dose", "Noise L_EX,8h", "OSHA noise dose"])
      await day.getByText(label, { exact: true }).waitFor();
    await day.getByRole("img", { name: /share of the daily action dose/ }).waitFor();
    const declaredA8 = await day
      .getByText(/m\/s² \(/)
      .first()
      .textContent();
    expect(await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)).toBeLessThanOrEqual(0);

    await page.getByLabel(/In use \(declared × 2\)/).check();
    await page.getByRole("button", { name: "Work out the day" }).click();
    await page.waitForURL(/vib=in-use/);
    await page.getByText(/Using the declared vibration values × 2/).waitFor();
    expect(
      await day
        .getByText(/m\/s² \(/)
        .first()
        .textContent(),
    ).not.toBe(declaredA8);
    expect(await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)).toBeLessThanOrEqual(0);
    await assertClean();
    await close();
  });

  it("works as a plain GET form without JavaScript, and keeps a bad row as typed with its message", async () => {
    const context = await browser().newContext({ javaScriptEnabled: false, viewport: PHONE });
    const page = await context.newPage();
    await page.goto(`${baseUrl}/day`);
    await page.locator("#tool-0").selectOption("brackwater-bh-150");
    await page.locator("#job-0").selectOption("ball-joint-separation");
    await page.locator("#n-0").fill("6");
    await page.getByRole("button", { name: "Work out the day" }).click();
    await page.waitForURL(/n=6/);
    await page.getByRole("heading", { name: "The whole day" }).waitFor();

    const bad = await page.goto(`${baseUrl}/day?tool=brackwater-bh-150&job=lug-nut-breakaway&n=six`);
    expect(bad?.status()).toBe(400);
    await page.getByText("Lug nut breakaway is not a job for this tool").waitFor();
    await page.getByText("Jobs per day: a whole number from 1 to 200").waitFor();
    expect(await page.locator("#n-0").inputValue()).toBe("six");
    expect(await page.locator("#tool-0").inputValue()).toBe("brackwater-bh-150");
    expect(await page.getByRole("heading", { name: "The whole day" }).count()).toBe(0);
    await context.close();
  });
});

describe("exposure beside the tools", () => {
  it("shows the declared values and a day of jobs on the model page; a bad setting is a 400 with its reason", async () => {
    const ok = await fetch(`${baseUrl}/models/brackwater-bh-150?perday=6&vib=in-use`);
    expect(ok.status).toBe(200);
    const html = await ok.text();
    expect(html).toContain("Hands and ears: a day with this tool");
    expect(html).toContain("ISO 28927-10");
    expect(html).toContain("6 × Ball joint separation");
    const bad = await fetch(`${baseUrl}/models/brackwater-bh-150?perday=lots`);
    expect(bad.status).toBe(400);
    expect(await bad.text()).toContain("Jobs per day: a whole number from 1 to 200");
    expect((await fetch(`${baseUrl}/models/brackwater-bh-150?vib=loud`)).status).toBe(400);
  });

  it("puts the exposure columns beside the tools on /compare", async () => {
    const { page, assertClean, close } = await newCheckedPage(browser(), PHONE);
    await page.goto(`${baseUrl}/compare?job=ball-joint-separation`);
    const boxes = page.getByRole("checkbox");
    await boxes.nth(0).check();
    await boxes.nth(1).check();
    await page.getByRole("button", { name: "Compare" }).click();
    const panel = page.getByRole("region", { name: /Hands and ears: 6 × Ball joint separation a day/ });
    await panel.getByRole("columnheader", { name: "Share of action dose" }).waitFor();
    expect(await panel.getByRole("row").count()).toBe(3);
    expect(await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)).toBeLessThanOrEqual(0);
    await assertClean();
    await close();
  });
});
