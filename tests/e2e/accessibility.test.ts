// A tour of the site's pages as a visitor, a reporter and a moderator, at phone width and on a desktop.
// newCheckedPage() runs axe (WCAG 2.2 AA) on every page state; a serious or critical finding fails.
import type { Page } from "playwright-core";
import { afterAll, describe, expect, inject, it } from "vitest";
import { accessibilityProblems, newCheckedPage, sharedBrowser } from "../support/browser";
import { testDb } from "../support/db";
import { signedInAs } from "../support/http";

const baseUrl = inject("baseUrl");
const db = testDb();
const browser = sharedBrowser();
afterAll(() => db.destroy());

const PHONE = { width: 390, height: 844 };
const DESKTOP = { width: 1280, height: 900 };

const publicPages = [
  "/",
  "/jobs",
  "/jobs/ball-joint-separation",
  "/models",
  "/models/brackwater-bh-150",
  "/compare",
  "/air",
  "/search?q=impact",
  "/search?q=zzzz-nothing-matches",
  "/sign-in",
  "/data",
];

async function signInPage(page: Page, email: string) {
  const client = await signedInAs(db, email);
  const value = client.cookies.get("bayproof_session")!;
  await page.context().addCookies([{ name: "bayproof_session", value, url: baseUrl }]);
}

/** Visits each path; returns those whose document title is empty (every page must name itself). */
async function tour(page: Page, paths: string[]) {
  const untitled: string[] = [];
  for (const path of paths) {
    await page.goto(`${baseUrl}${path}`);
    if (!(await page.title()).trim()) untitled.push(path);
  }
  return untitled;
}

describe("every page passes axe at WCAG 2.2 AA", () => {
  for (const [name, viewport] of [
    ["phone", PHONE],
    ["desktop", DESKTOP],
  ] as const) {
    it(`public pages on a ${name}`, async () => {
      const { page, assertClean, close } = await newCheckedPage(browser(), viewport);
      const untitled = await tour(page, publicPages);
      await assertClean();
      expect(untitled).toEqual([]);
      await close();
    });
  }

  it("the not-found page", async () => {
    // A bare page, not a checked one: Chromium logs the 404 document itself as a console error.
    const context = await browser().newContext({ viewport: PHONE });
    const page = await context.newPage();
    const response = await page.goto(`${baseUrl}/no-such-page`);
    expect(response?.status()).toBe(404);
    expect(await page.title()).toMatch(/Not found/);
    expect(await accessibilityProblems(page)).toEqual([]);
    await context.close();
  });

  it("a reporter's and a moderator's pages on a phone", async () => {
    const reporter = await newCheckedPage(browser(), PHONE);
    await signInPage(reporter.page, "reporter@demo.bayproof.test");
    const untitled = await tour(reporter.page, ["/me/reports", "/reports/new", "/account"]);
    await reporter.assertClean();
    await reporter.close();

    const moderator = await newCheckedPage(browser(), PHONE);
    await signInPage(moderator.page, "moderator@demo.bayproof.test");
    const firstReport = await db
      .selectFrom("reports")
      .select("id")
      .where("status", "=", "accepted")
      .orderBy("id")
      .executeTakeFirstOrThrow();
    untitled.push(...(await tour(moderator.page, ["/review", "/review/stats", `/reports/${firstReport.id}/history`])));
    await moderator.assertClean();
    await moderator.close();
    expect(untitled).toEqual([]);
  });
});
