// The report form's broken paths, kept fixed (issue 18): moving through the form marks nothing,
// an empty field says what it needs, "Save draft" and "Withdraw" take an incomplete draft as it
// stands (no field check, no 500), withdrawing from "Your reports" works, a typed time comes back
// as typed, and /reports/new offers to continue the draft.
import type { Page } from "playwright-core";
import { describe, expect, inject, it } from "vitest";
import { hydrated, newCheckedPage, sharedBrowser } from "../support/browser";

const baseUrl = inject("baseUrl");
const browser = sharedBrowser();

async function signInToForm(page: Page) {
  await page.goto(`${baseUrl}/reports/new`);
  await page.getByRole("link", { name: /Continue with/ }).click();
  await page.getByRole("link", { name: /A new technician/ }).click();
  await page.getByRole("heading", { name: "File a report from the bay" }).waitFor();
  await hydrated(page);
}

/** Starts a draft: the tool and the job, then waits for the autosave to give it a number. */
async function startDraft(page: Page) {
  await page.getByRole("combobox", { name: "Tool" }).fill("BH-150");
  await page.getByRole("option", { name: /Brackwater Pneumatics BH-150/ }).click();
  await page.locator("select[name=jobType]").selectOption("ball-joint-separation");
  await page.getByText(/Draft saved/).waitFor();
}

const invalid = (page: Page) => page.locator("[aria-invalid=true]").count();

/** Every answer of 500 or above the page received. */
function serverErrors(page: Page) {
  const seen: string[] = [];
  page.on("response", (r) => {
    if (r.status() >= 500) seen.push(`${r.status()} ${r.url()}`);
  });
  return seen;
}

describe("the report form's checks", () => {
  it("marks nothing while tabbing through, checks a field after a real edit, and names what an empty field needs", async () => {
    const { page, assertClean, close } = await newCheckedPage(browser(), { width: 390, height: 844 });
    await signInToForm(page);
    await page.getByRole("combobox", { name: "Tool" }).focus();
    for (let i = 0; i < 30; i++) await page.keyboard.press("Tab");
    expect(await invalid(page)).toBe(0);

    const couplers = page.getByLabel("How many couplers");
    await couplers.fill("two");
    await page.getByLabel("Time to result").focus();
    await page.getByText("Couplers come in whole numbers").waitFor();
    expect(await invalid(page)).toBe(1);
    await couplers.fill("");
    await page.getByText("Couplers come in whole numbers").waitFor({ state: "detached" });

    await page.getByRole("button", { name: "Submit report" }).click();
    await page.getByText("Enter how many couplers, 0 if none").waitFor();
    expect(await page.getByText("Couplers come in whole numbers").count()).toBe(0);
    expect(await page.getByText("Enter the time to result").count()).toBe(1);
    // Focus goes to the first field with an error: the tool box.
    expect(await page.getByRole("combobox", { name: "Tool" }).evaluate((el) => el === document.activeElement)).toBe(
      true,
    );
    expect(page.url()).toBe(`${baseUrl}/reports/new`);
    await assertClean();
    await close();
  });
});

describe("drafts", () => {
  it("saves and withdraws an incomplete draft from the form and from the list, without a field check or a 500", async () => {
    const { page, assertClean, close } = await newCheckedPage(browser(), { width: 390, height: 844 });
    const errors = serverErrors(page);
    await signInToForm(page);
    await startDraft(page);

    // Incomplete, with one field typed wrong and one edited away: saved as it stands.
    await page.getByLabel("Time to result").fill("40 s");
    await page.getByLabel("At the tool inlet, psi").fill("lots");
    await page.getByLabel("Regulator, psi").fill("90");
    await page.getByLabel("Regulator, psi").fill("");
    await page.getByRole("button", { name: "Save draft" }).click();
    await page.waitForURL(/\/reports\/\d+\/edit\?saved=1/);
    await hydrated(page);
    const draftId = Number(page.url().match(/\/reports\/(\d+)\/edit/)![1]);
    expect(await invalid(page)).toBe(0);
    expect(await page.getByLabel("Time to result").inputValue()).toBe("40 s");

    // /reports/new offers to continue it.
    await page.goto(`${baseUrl}/reports/new`);
    const resume = page.getByRole("link", { name: `Continue draft #${draftId}` });
    await resume.waitFor();
    await resume.click();
    await page.waitForURL(new RegExp(`/reports/${draftId}/edit$`));
    await hydrated(page);

    // Withdraw on the form: the incomplete draft goes, with a wrong value still typed in.
    await page.getByLabel("Attempts").fill("many");
    await page.getByLabel("Hose length, ft").focus();
    await page.getByText("Attempts in whole numbers").waitFor();
    await page.getByRole("button", { name: "Withdraw" }).click();
    await page.waitForURL(/\/me\/reports\?withdrawn=1/);
    await page.getByText("The report is withdrawn.").waitFor();
    expect(await page.getByTestId(`report-${draftId}`).count()).toBe(1);

    // A second draft, withdrawn from "Your reports" (it answered 500 before).
    await page.goto(`${baseUrl}/reports/new`);
    await hydrated(page);
    await startDraft(page);
    await page.getByRole("button", { name: "Save draft" }).click();
    await page.waitForURL(/\/reports\/\d+\/edit\?saved=1/);
    const secondId = Number(page.url().match(/\/reports\/(\d+)\/edit/)![1]);
    await page.goto(`${baseUrl}/me/reports`);
    await hydrated(page);
    const card = page.getByTestId(`report-${secondId}`);
    await card.getByRole("button", { name: "Withdraw" }).click();
    await page.waitForURL(/\/me\/reports\?withdrawn=1/);
    await page.getByText("The report is withdrawn.").waitFor();
    const withdrawn = page.locator("section", { has: page.getByRole("heading", { name: /^Withdrawn/ }) });
    await withdrawn.getByTestId(`report-${secondId}`).waitFor();
    expect(await withdrawn.getByTestId(`report-${draftId}`).count()).toBe(1);

    // Nothing left to continue.
    await page.goto(`${baseUrl}/reports/new`);
    await hydrated(page);
    expect(await page.getByText("Continue where you left off").count()).toBe(0);
    expect(errors).toEqual([]);
    await assertClean();
    await close();
  });
});
