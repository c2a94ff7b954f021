// Signing in as a person would: through the local provider's picker, and through a mailed link.
import { describe, expect, inject, it } from "vitest";
import { newCheckedPage, sharedBrowser } from "../support/browser";

const baseUrl = inject("baseUrl");
const browser = sharedBrowser();

describe("signing in", () => {
  it("through the provider: picks the demo reporter and lands on the account page", async () => {
    const { page, assertClean, close } = await newCheckedPage(browser());
    await page.goto(`${baseUrl}/account`);
    await page.waitForURL(/\/sign-in\?redirectTo=%2Faccount/);
    await page.getByRole("link", { name: /Continue with/ }).click();
    await page.getByRole("link", { name: /rustbelt-ana/ }).click();
    await page.waitForURL(`${baseUrl}/account`);
    await page.getByRole("heading", { name: "Your account" }).waitFor();
    expect(await page.locator("input[name=handle]").inputValue()).toBe("rustbelt-ana");

    await page.getByRole("button", { name: "Sign out" }).first().click();
    await page.getByRole("link", { name: "Sign in" }).waitFor();
    await assertClean();
    await close();
  });

  it("through an e-mail link read from the local mail page", async () => {
    const { page, assertClean, close } = await newCheckedPage(browser(), { width: 390, height: 844 });
    await page.goto(`${baseUrl}/sign-in`);
    await page.getByLabel("E-mail address").fill("admin@demo.bayproof.test");
    await page.getByRole("button", { name: "Mail me a sign-in link" }).click();
    await page.getByRole("heading", { name: "Check your mail" }).waitFor();

    await page.goto(`${baseUrl}/dev/mail`);
    await page
      .getByRole("link", { name: /Your Bayproof sign-in link.*admin@demo\.bayproof\.test/ })
      .first()
      .click();
    await page.getByRole("link", { name: /\/sign-in\/link\?token=/ }).click();
    await page.getByRole("button", { name: "Sign in" }).click();
    // Issue 18: with no page asked for, a moderator lands on the review queue.
    await page.getByRole("heading", { name: "Review queue" }).waitFor();
    await page.goto(`${baseUrl}/account`);
    await page.getByRole("heading", { name: "Your account" }).waitFor();
    expect(await page.locator("input[name=handle]").inputValue()).toBe("admin-bertil");

    await page.goto(`${baseUrl}/admin/users`);
    await page.getByRole("heading", { name: "Users and roles" }).waitFor();
    await assertClean();
    await close();
  });
});
