// Headless Debian Chromium through playwright-core, with the flags this machine needs, and a
// page that fails the test on any console error or uncaught page error.
import { type Browser, chromium, type Page } from "playwright-core";
import { afterAll, beforeAll } from "vitest";
import { CHROMIUM } from "./system";

export const CHROMIUM_FLAGS = [
  "--headless", "--no-sandbox", "--disable-gpu", "--disable-background-networking",
  "--disable-component-update", "--disable-sync", "--no-first-run",
];

export async function launchBrowser(): Promise<Browser> {
  // Playwright gives every launch a new, empty profile folder of its own.
  return chromium.launch({ executablePath: CHROMIUM, args: CHROMIUM_FLAGS });
}

/** One browser for a test file: launched before its tests, closed after. Call at the top level. */
export function sharedBrowser(): () => Browser {
  let browser: Browser | undefined;
  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(() => browser?.close());
  return () => browser!;
}

/** Waits until React has hydrated the page, so typed input reaches its handlers. */
export const hydrated = (page: Page) => page.waitForSelector("html[data-hydrated]", { state: "attached" });

export async function newCheckedPage(browser: Browser, viewport = { width: 1280, height: 900 }) {
  const context = await browser.newContext({ viewport });
  // Waits end when their state is reached; the bound is for a busy machine, where a page can take
  // far longer than Playwright's 30 s default.
  context.setDefaultTimeout(120_000);
  context.setDefaultNavigationTimeout(120_000);
  const page = await context.newPage();
  const problems: string[] = [];
  page.on("console", (msg) => {
    if (msg.type() === "error") problems.push(`console error: ${msg.text()}`);
  });
  page.on("pageerror", (err) => problems.push(`page error: ${err.message}`));
  return {
    page,
    /** Throws if the page logged an error; call at the end of each test. */
    assertClean: () => {
      if (problems.length) throw new Error(problems.join("\n"));
    },
    close: () => context.close(),
  };
}
