// A technician at the bay: on a phone-sized screen, fill the report, upload a small video through
// the form's evidence uploader into the fake object store, submit, and find it under "Your reports".
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { describe, expect, inject, it } from "vitest";
import { hydrated, newCheckedPage, sharedBrowser } from "../support/browser";
import { testDb } from "../support/db";
import { tinyMp4 } from "../support/files";

const baseUrl = inject("baseUrl");
const browser = sharedBrowser();

describe("filing a report from the bay", () => {
  it("fills the form, uploads a video, submits, and sees it waiting with its flags", async () => {
    const video = path.join(mkdtempSync(path.join(tmpdir(), "bayproof-e2e-")), "ball-joint.mp4");
    writeFileSync(video, tinyMp4());
    const { page, assertClean, close } = await newCheckedPage(browser(), { width: 390, height: 844 });

    // A new technician signs in through the local provider and lands on the form.
    await page.goto(`${baseUrl}/reports/new`);
    await page.getByRole("link", { name: /Continue with/ }).click();
    await page.getByRole("link", { name: /A new technician/ }).click();
    await page.getByRole("heading", { name: "File a report from the bay" }).waitFor();
    await hydrated(page);

    await page.getByRole("combobox", { name: "Tool" }).fill("BH-150");
    await page.getByRole("option", { name: /Brackwater Pneumatics BH-150/ }).click();
    await page.locator("select[name=jobType]").selectOption("ball-joint-separation");
    await page.locator("select[name=vehicleClass]").selectOption("light_truck");
    await page.locator("select[name=corrosion]").selectOption("severe");
    await page.getByText(/Draft saved/).waitFor();
    await page.getByText("Before you pull the trigger").waitFor(); // percussive job: the cautions show

    await page.getByLabel("Regulator, psi").fill("105");
    await page.getByLabel("At the tool inlet, psi").fill("94");
    await page.getByText("Measured at the tool inlet while it ran").click();
    await page.getByLabel("Hose inside diameter, in").fill("3/8");
    await page.getByLabel("Hose length, ft").fill("35");
    await page.getByLabel("How many couplers").fill("2");
    await page.getByText("Freed it").click();
    await page.getByLabel("Time to result").fill("1:10");
    await page.getByLabel("Attempts").fill("2");

    await page.getByLabel("Choose a file").setInputFiles(video);
    await page
      .getByRole("list", { name: "Attached evidence" })
      .getByText(/Video · MP4 .*received/)
      .waitFor({ timeout: 90_000 });
    // Published with the open data only when the reporter says so.
    const publish = page.getByRole("checkbox", { name: "Publish with the open data" });
    expect(await publish.isChecked()).toBe(false);
    await publish.check();
    await page.waitForFunction(
      () =>
        document.querySelector<HTMLInputElement>("[aria-label='Attached evidence'] input[type=checkbox]")?.disabled ===
        false,
    );
    expect(await publish.isChecked()).toBe(true);

    await page.getByRole("button", { name: "Submit report" }).click();
    await page.waitForURL(/\/me\/reports\?submitted=\d+/);
    const id = new URL(page.url()).searchParams.get("submitted");
    const card = page.getByTestId(`report-${id}`);
    await card.waitFor();
    expect(await page.getByRole("heading", { name: /Waiting for a moderator/ }).isVisible()).toBe(true);
    const text = await card.innerText();
    expect(text).toContain("Brackwater Pneumatics BH-150");
    expect(text).toContain("1 files");
    expect(text).toMatch(/first report/);
    expect(text).not.toMatch(/no evidence/);
    const db = testDb();
    const files = await db
      .selectFrom("evidence")
      .select("is_public")
      .where("report_id", "=", Number(id))
      .execute()
      .finally(() => db.destroy());
    expect(files).toEqual([{ is_public: true }]);
    await assertClean();
    await close();
  });
});
