// Two moderators and a reporter: the oldest flagged report is opened, its video played, the
// checklist ticked and the report accepted; a second moderator gives the second look; the report
// is then public on its model page and the reporter's mail is in the mail catcher. After the first
// accept, "Next report" opens the next report of the same filtered queue.
import { readFileSync } from "node:fs";
import path from "node:path";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { newCheckedPage, sharedBrowser } from "../support/browser";
import { testDb } from "../support/db";
import { newDraft, upload } from "../support/evidence";
import { signedInAs } from "../support/http";
import { latestMailTo } from "../support/mail";
import { validReport } from "../support/reports";

const baseUrl = inject("baseUrl");
const db = testDb();
const browser = sharedBrowser();
let reportId: number;
let nextId: number;
let reporterEmail: string;
const clip = readFileSync(path.resolve(import.meta.dirname, "../../seeds/media/demo-clip.webm"));

beforeAll(async () => {
  // A new reporter files a report with a real video; it is made the oldest in the queue.
  const stamp = String(Date.now());
  reporterEmail = `e2e-mod-${stamp}@demo.bayproof.test`;
  await db
    .insertInto("users")
    .values({ email: reporterEmail, handle: `e2e-${stamp.slice(-8)}` })
    .execute();
  const reporter = await signedInAs(db, reporterEmail);
  reportId = await newDraft(reporter);
  const { check } = await upload(reporter, reportId, clip, "video/webm");
  expect(check.status).toBe(200);
  const res = await reporter.post(`/reports/${reportId}/edit`, { ...validReport(), reportId: String(reportId) });
  expect(res.status).toBe(302);
  await db
    .updateTable("reports")
    .set({ submitted_at: new Date("2024-06-01T08:00:00Z") })
    .where("id", "=", reportId)
    .execute();

  // Another new reporter's first report, a second after it: next in the same flagged queue.
  const nextEmail = `e2e-next-${stamp}@demo.bayproof.test`;
  await db
    .insertInto("users")
    .values({ email: nextEmail, handle: `e2n-${stamp.slice(-8)}` })
    .execute();
  const next = await (await signedInAs(db, nextEmail)).post("/reports/new", validReport());
  nextId = Number(next.headers.get("location")!.match(/submitted=(\d+)/)![1]);
  await db
    .updateTable("reports")
    .set({ submitted_at: new Date("2024-06-01T08:00:01Z") })
    .where("id", "=", nextId)
    .execute();
});
afterAll(() => db.destroy());

async function signIn(page: Page, account: RegExp) {
  await page.goto(`${baseUrl}/sign-in?redirectTo=%2Freview%3Fflag%3Dfirst_report`);
  await page.getByRole("link", { name: /Continue with/ }).click();
  await page.getByRole("link", { name: account }).click();
  await page.getByRole("heading", { name: "Review queue" }).waitFor();
}

async function acceptOldest(page: Page, reason: string) {
  await page.getByTestId("queue-row").first().click();
  await page.getByRole("heading", { name: new RegExp(`Report #${reportId}`) }).waitFor();
  await page.getByRole("button", { name: "Start this review" }).click();
  await page.getByText(/Held for you until/).waitFor();
  const video = page.locator("video").first();
  await video.evaluate((v: HTMLVideoElement) => v.play());
  await page.waitForFunction(() => (document.querySelector("video")?.currentTime ?? 0) > 0.2);
  for (const box of await page.locator("input[type=checkbox][name^=check_]").all()) await box.check();
  await page.locator("input[name^=evidence_][value=verified]").first().check();
  await page.locator("input[name=action][value=accept]").check();
  // The demo clip is on other reports too: the duplicate-evidence flag asks to be acknowledged.
  const duplicate = page.locator("input[name=ack_duplicate]");
  if (await duplicate.count()) await duplicate.check();
  await page.locator("select[name=reasonCode]").selectOption(reason);
  await page.getByRole("button", { name: "Record the decision" }).click();
}

describe("moderating a report", () => {
  it("takes two moderators to accept a flagged report, then shows it and mails the reporter", async () => {
    const since = Date.now();
    const first = await newCheckedPage(browser());
    await signIn(first.page, /mod-harriet/);
    await acceptOldest(first.page, "evidence_clear");
    await first.page.getByText(/needs a second look from another moderator/).waitFor();
    await first.page.getByRole("link", { name: "Next report →", exact: true }).click();
    await first.page.getByRole("heading", { name: new RegExp(`Report #${nextId}`) }).waitFor();
    expect(new URL(first.page.url()).search).toBe("?flag=first_report"); // still the same filtered queue
    await first.assertClean();
    await first.close();

    const second = await newCheckedPage(browser());
    await signIn(second.page, /mod-quentin/);
    await acceptOldest(second.page, "second_look_agrees");
    await second.page.getByText(/Decision recorded: accepted/).waitFor();

    await second.page.goto(`${baseUrl}/models/brackwater-bh-150`);
    const newest = second.page.locator("section[aria-labelledby=reports-heading] li").first();
    expect(await newest.innerText()).toMatch(/by e2e-\d{8}/);
    await second.assertClean();
    await second.close();

    const mail = await latestMailTo(reporterEmail, since, 30_000);
    expect(mail.subject).toBe(`Your Bayproof report #${reportId} was accepted`);
  }, 90_000);
});
