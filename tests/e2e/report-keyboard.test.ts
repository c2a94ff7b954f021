// A technician files a whole report on a phone-sized screen with the keyboard alone: Tab to move,
// typing and type-ahead in the boxes and lists, arrows and Enter in the tool box, Space on the
// radios and buttons. The file is handed to the file input (a keyboard cannot pick one from disk).
// On the way: Enter in the tool box picks and never sends the form, focus stays in the box, and no
// field the keyboard lands on is hidden behind the sticky buttons.
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import type { Locator, Page } from "playwright-core";
import { describe, expect, inject, it } from "vitest";
import { hydrated, newCheckedPage, sharedBrowser } from "../support/browser";
import { tinyMp4 } from "../support/files";

const baseUrl = inject("baseUrl");
const browser = sharedBrowser();

const isFocused = (target: Locator) => target.evaluate((el) => el === document.activeElement);

/** Presses Tab until `target` has focus (at most `max` times), as a keyboard user moves on. */
async function tabTo(page: Page, target: Locator, max = 12) {
  for (let i = 0; i < max; i++) {
    await page.keyboard.press("Tab");
    if (await isFocused(target)) return;
  }
  throw new Error(`Tab never reached ${target.toString()}`);
}

/** The focused control can be seen: nothing (such as the sticky buttons) lies over its middle. */
async function expectFocusVisible(page: Page) {
  const covered = await page.evaluate(() => {
    const el = document.activeElement as HTMLElement;
    const r = el.getBoundingClientRect();
    const hit = document.elementFromPoint(r.left + r.width / 2, r.top + r.height / 2);
    return hit && (hit === el || el.contains(hit) || hit.contains(el) || hit === el.closest("label"))
      ? null
      : `${el.outerHTML.slice(0, 80)} under ${hit?.outerHTML.slice(0, 80)}`;
  });
  expect(covered).toBeNull();
}

describe("filing a report with the keyboard at phone width", () => {
  it("goes from the tool box to the submitted report without a pointer", async () => {
    const video = path.join(mkdtempSync(path.join(tmpdir(), "bayproof-e2e-")), "gauge.mp4");
    writeFileSync(video, tinyMp4());
    const { page, assertClean, close } = await newCheckedPage(browser(), { width: 390, height: 844 });

    // Signing in is not part of the form: the local provider's links.
    await page.goto(`${baseUrl}/reports/new`);
    await page.getByRole("link", { name: /Continue with/ }).click();
    await page.getByRole("link", { name: /A new technician/ }).click();
    await page.getByRole("heading", { name: "File a report from the bay" }).waitFor();
    await hydrated(page);
    const formUrl = page.url();

    // The tool box, a combobox: type, ↓ through the suggestions, Enter picks.
    const tool = page.getByRole("combobox", { name: "Tool" });
    await tabTo(page, tool, 40);
    await page.keyboard.type("brackwater bh");
    const options = page.getByRole("listbox", { name: "Matching tools" }).getByRole("option");
    await options.nth(1).waitFor();
    expect(await tool.getAttribute("aria-expanded")).toBe("true");
    await page.keyboard.press("ArrowDown");
    expect(await tool.getAttribute("aria-activedescendant")).toBe(await options.nth(0).getAttribute("id"));
    expect(await options.nth(0).getAttribute("aria-selected")).toBe("true");
    await page.keyboard.press("ArrowDown");
    await page.keyboard.press("ArrowUp");
    expect(await tool.getAttribute("aria-activedescendant")).toBe(await options.nth(0).getAttribute("id"));
    const first = (await options.nth(0).innerText()).split("\n")[0]!;
    expect(first).toBe("Brackwater Pneumatics BH-150");
    await page.keyboard.press("Enter");
    expect(await tool.inputValue()).toBe(first);
    expect(await isFocused(tool)).toBe(true);
    expect(await tool.getAttribute("aria-expanded")).toBe("false");
    expect(page.url()).toBe(formUrl); // Enter picked; nothing was sent
    expect(await page.locator("[aria-invalid=true]").count()).toBe(0);

    // Escape closes the list without picking.
    await page.keyboard.press("End");
    await page.keyboard.type(" ");
    await options.first().waitFor();
    await page.keyboard.press("Escape");
    await page.getByRole("listbox", { name: "Matching tools" }).waitFor({ state: "hidden" });
    expect(await isFocused(tool)).toBe(true);
    await page.keyboard.press("Backspace");
    await options.first().waitFor();
    await page.keyboard.press("ArrowDown");
    await page.keyboard.press("Enter");
    expect(await tool.inputValue()).toBe(first);

    // The lists by type-ahead; the radios with Space and the arrows.
    await tabTo(page, page.getByLabel("Job", { exact: true }));
    await page.keyboard.type("Ball");
    await tabTo(page, page.getByLabel("Vehicle", { exact: true }));
    await page.keyboard.type("Light");
    await tabTo(page, page.getByLabel("Corrosion", { exact: true }));
    await page.keyboard.type("severe");
    await page.getByText(/Draft saved/).waitFor();
    expect(await page.locator("select[name=jobType]").inputValue()).toBe("ball-joint-separation");

    const typeInto = async (label: string, text: string) => {
      await tabTo(page, page.getByLabel(label, { exact: true }));
      await expectFocusVisible(page);
      await page.keyboard.type(text);
    };
    await typeInto("Regulator, psi", "105");
    await typeInto("At the tool inlet, psi", "94");
    await tabTo(page, page.getByRole("radio", { name: "Measured at the tool inlet while it ran" }));
    await page.keyboard.press("Space");
    await typeInto("Hose inside diameter, in", "3/8");
    await typeInto("Hose length, ft", "35");
    await typeInto("How many couplers", "2");
    await tabTo(page, page.getByRole("radio", { name: "Freed it" }));
    await expectFocusVisible(page);
    await page.keyboard.press("Space");
    await typeInto("Time to result", "40 s");
    await typeInto("Attempts", "1");
    await tabTo(page, page.getByRole("radio", { name: "1", exact: true }));
    await page.keyboard.press("Space");
    for (let i = 0; i < 3; i++) await page.keyboard.press("ArrowRight");
    expect(await page.getByRole("radio", { name: "4", exact: true }).isChecked()).toBe(true);
    expect(await page.locator("[aria-invalid=true]").count()).toBe(0);

    // Evidence: the file input takes focus like a button; the file itself is handed over.
    const chooser = page.getByLabel("Choose a file");
    await tabTo(page, chooser);
    await expectFocusVisible(page);
    await chooser.setInputFiles(video);
    await page
      .getByRole("list", { name: "Attached evidence" })
      .getByText(/received/)
      .waitFor({ timeout: 90_000 });

    await typeInto("Notes", "Gauge filmed at the inlet while it ran.");
    const submit = page.getByRole("button", { name: "Submit report" });
    await tabTo(page, submit);
    await page.keyboard.press("Enter");
    await page.waitForURL(/\/me\/reports\?submitted=\d+/);
    const id = new URL(page.url()).searchParams.get("submitted");
    const card = page.getByTestId(`report-${id}`);
    await card.waitFor();
    const text = await card.innerText();
    expect(text).toContain("Brackwater Pneumatics BH-150");
    expect(text).toContain("1 files");
    await assertClean();
    await close();
  });
});
