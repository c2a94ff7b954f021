// A rig owner files a bench run with a raw trace (upload, preview with the blows marked, submit),
// and a moderator accepts it with the bench checklist; the run is then public.
import type { Page } from "playwright-core";
import { afterAll, describe, expect, inject, it } from "vitest";
import { synthesizeTrace } from "../../app/bench";
import { listRigs } from "../../app/bench/rigs.server";
import { hydrated, newCheckedPage, sharedBrowser } from "../support/browser";
import { testDb } from "../support/db";

const baseUrl = inject("baseUrl");
const db = testDb();
const browser = sharedBrowser();
afterAll(() => db.destroy());

async function signIn(page: Page, redirectTo: string, account: RegExp) {
  await page.goto(`${baseUrl}/sign-in?redirectTo=${encodeURIComponent(redirectTo)}`);
  await page.getByRole("link", { name: /Continue with/ }).click();
  await page.getByRole("link", { name: account }).click();
}

/** A 2 s trace at 10 kHz with 100 blows a second's worth of known blows (synthetic, fixed seed). */
function traceCsv() {
  const { samples } = synthesizeTrace({
    rateHz: 10_000,
    seconds: 2,
    blowsPerMinute: 3000,
    peak: 9000,
    peakSD: 600,
    noiseSD: 30,
    driftPerS: 15,
    seed: 7,
    capacity: 50_000,
  });
  const lines = ["time_s,force_n"];
  samples.forEach((v, i) => lines.push(`${(i / 10_000).toFixed(5)},${v.toFixed(1)}`));
  return `${lines.join("\n")}\n`;
}

describe("filing and accepting a bench run", () => {
  it("files a run with a trace previewed in the browser, and a moderator accepts it", async () => {
    const rig = (await listRigs(db)).find((r) => r.name === "Cinderlane drop-anvil force rig")!;
    const owner = await newCheckedPage(browser());
    await signIn(owner.page, `/bench/runs/new?rig=${rig.id}&protocol=hammer-blow-force@2`, /rustbelt-ana/);
    const page = owner.page;
    await page.getByRole("heading", { name: "File a bench run" }).waitFor();
    await hydrated(page);
    await page.getByLabel("Tool", { exact: true }).selectOption({ label: "Brackwater Pneumatics BH-150" });
    await page.getByLabel("Unit serial number").fill("E2E-4411");
    await page.getByLabel("Day of the run").fill("2026-11-30");
    await page.getByLabel("Operator", { exact: true }).fill("E2E Operator");
    await page.getByLabel("Room temperature (°C)").fill("20");
    for (const p of [1, 2, 3]) {
      await page.locator(`input[name=s${p}_static]`).fill(p === 3 ? "120" : "90");
      await page.locator(`input[name=s${p}_running]`).fill(p === 3 ? "110" : "88");
      for (let t = 1; t <= 5; t++) {
        if (p === 1 && t === 1) continue;
        await page.locator(`textarea[name=s${p}_t${t}_peaks]`).fill("2000 2050 1990 2100 2030");
      }
    }
    await page.locator("#s1_t1_trace-file").setInputFiles({
      name: "trial-1.csv",
      mimeType: "text/csv",
      buffer: Buffer.from(traceCsv()),
    });
    await page.getByText(/Trace uploaded: \d+ blows/).waitFor();
    expect(await page.locator("[data-blow]").count()).toBeGreaterThan(80);
    await page.getByRole("button", { name: "Submit for review" }).click();
    await page.getByRole("heading", { name: /Brackwater Pneumatics BH-150 on the bench/ }).waitFor();
    const runId = Number(/\/bench\/runs\/(\d+)/.exec(page.url())![1]);
    await page
      .getByText(/blows detected/)
      .first()
      .waitFor();
    await owner.assertClean();
    await owner.close();

    const stored = await db
      .selectFrom("bench_trials as t")
      .innerJoin("bench_run_series as rs", "rs.id", "t.run_series_id")
      .select(["t.trace_key", "t.peaks", "t.blows_per_minute"])
      .where("rs.run_id", "=", runId)
      .where("t.trace_key", "is not", null)
      .executeTakeFirstOrThrow();
    expect(stored.trace_key).toMatch(/^bench\/traces\//);
    expect(stored.blows_per_minute).toBeGreaterThan(2800);

    const mod = await newCheckedPage(browser());
    await signIn(mod.page, `/review/bench/${runId}`, /mod-harriet/);
    await mod.page.getByRole("heading", { name: new RegExp(`Bench run ${runId}`) }).waitFor();
    for (const box of await mod.page.locator("fieldset input[type=checkbox]").all()) await box.check();
    await mod.page.locator("input[name=action][value=accept]").check();
    await mod.page.getByLabel("Reason").selectOption("bench_checks_pass");
    await mod.page.getByRole("button", { name: "Record the decision" }).click();
    await mod.page.getByRole("heading", { name: "Review queue" }).waitFor();
    await mod.assertClean();
    await mod.close();

    const run = await db.selectFrom("bench_runs").select("status").where("id", "=", runId).executeTakeFirstOrThrow();
    expect(run.status).toBe("accepted");
    const log = await db.selectFrom("bench_decisions").select("action").where("run_id", "=", runId).execute();
    expect(log.map((d) => d.action)).toEqual(["accept"]);
  }, 240_000);
});
