// Screenshots for review (not an assertion): the frame and the pages this branch laid out.
import { describe, inject, it } from "vitest";
import { newCheckedPage, sharedBrowser } from "../support/browser";

const baseUrl = inject("baseUrl");
const browser = sharedBrowser();
const out = (name: string) => `.data/shots/${name}.png`;

describe("screenshots", () => {
  it("phone and desktop", async () => {
    for (const [tag, viewport] of [["390", { width: 390, height: 844 }], ["1280", { width: 1280, height: 900 }]] as const) {
      const { page, close } = await newCheckedPage(browser(), viewport);
      for (const [name, path] of [
        ["home", "/"],
        ["job", "/jobs/ball-joint-separation?reg=100&hid=3%2F8&hlen=50&cc=2"],
        ["search", "/search?q=ball+joint"],
        ["compare", "/compare?job=tie-rod-end-release"],
      ]) {
        await page.goto(`${baseUrl}${path}`);
        await page.screenshot({ path: out(`${name}-${tag}`), fullPage: true });
      }
      if (tag === "390") {
        await page.goto(`${baseUrl}/`);
        await page.getByRole("button", { name: "Menu" }).click();
        await page.screenshot({ path: out("menu-open-390") });
        await page.goto(`${baseUrl}/jobs`);
        await page.keyboard.press("Tab");
        await page.screenshot({ path: out("skip-link-390") });
      }
      await close();
    }
  });
});
