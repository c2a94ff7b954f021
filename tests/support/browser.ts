// Headless Debian Chromium through playwright-core, with the flags this machine needs, and a
// page that fails the test on any console error, uncaught page error or serious accessibility fault.
import AxeBuilder from "@axe-core/playwright";
import { type Browser, chromium, type Page } from "playwright-core";
import { afterAll, beforeAll } from "vitest";
import { CHROMIUM } from "./system";

export const CHROMIUM_FLAGS = [
  "--headless",
  "--no-sandbox",
  "--disable-gpu",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
  "--no-first-run",
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

/** WCAG 2.2 AA and below; a finding of these impacts fails the test. */
const AXE_TAGS = ["wcag2a", "wcag2aa", "wcag21a", "wcag21aa", "wcag22aa"];
const FAILING_IMPACTS = new Set(["serious", "critical"]);

/** Runs axe on the page as it stands; returns one line per serious or critical finding. */
export async function accessibilityProblems(page: Page): Promise<string[]> {
  // Legacy mode runs inside the page itself, without opening a helper page in the context.
  const results = await new AxeBuilder({ page }).withTags(AXE_TAGS).setLegacyMode(true).analyze();
  return results.violations
    .filter((v) => FAILING_IMPACTS.has(v.impact ?? ""))
    .map((v) => {
      const where = v.nodes
        .slice(0, 3)
        .map((n) => n.target.join(" "))
        .join(" | ");
      return `axe ${v.impact} ${v.id} on ${page.url()} (${v.nodes.length}): ${v.help} — ${where}`;
    });
}

/** A page moved on or closed while axe ran (axe's script then vanishes with the old document). */
const pageMovedOn = (err: unknown) =>
  /Execution context was destroyed|closed|frame was detached|navigat|reading 'run'|axe is not defined/i.test(
    String(err),
  );

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

  // Every page state the test reaches is checked: each navigation of the main frame (full loads and
  // client-side ones) queues an axe run once the page has loaded, and page.goto() waits for the
  // queued runs first, so a tour of addresses checks each one before leaving it.
  const seen = new Set<string>();
  let checks: Promise<void> = Promise.resolve();
  const check = async () => {
    if (page.isClosed()) return;
    try {
      await page.waitForLoadState("load");
      // One frame after load, so React has painted the route the address now names.
      await page.evaluate(() => new Promise((done) => requestAnimationFrame(() => done(null))));
      for (const line of await accessibilityProblems(page)) {
        if (!seen.has(line)) problems.push(line);
        seen.add(line);
      }
    } catch (err) {
      // A state the test left while axe ran is gone; the state it moved to has a run of its own.
      if (!page.isClosed() && !pageMovedOn(err)) problems.push(`axe could not run on ${page.url()}: ${String(err)}`);
    }
  };
  page.on("framenavigated", (frame) => {
    if (frame === page.mainFrame() && frame.url() !== "about:blank") checks = checks.then(check);
  });
  const goto = page.goto.bind(page);
  page.goto = async (...args) => {
    await checks;
    return goto(...args);
  };

  return {
    page,
    /** Throws if the page logged an error or failed an accessibility check; await at the end of each test. */
    assertClean: async () => {
      // Queued behind any run still going: axe runs one at a time in a page.
      checks = checks.then(check);
      await checks;
      if (problems.length) throw new Error(problems.join("\n"));
    },
    close: async () => {
      await checks;
      await context.close();
    },
  };
}
