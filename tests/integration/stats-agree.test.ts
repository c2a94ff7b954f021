// Issue 16, item 6: the job page, the compare page and the feed say the same thing about every pair
// of tools on every demo job, because one rule (app/stats/standings.ts) decides them all.
import { afterAll, describe, expect, it } from "vitest";
import { testDb } from "../support/db";
import { feedClient } from "../support/feed";
import { Browserish } from "../support/http";
import { compareOnJob } from "~/stats/cells.server";
import { MARK_LABELS, type Mark } from "~/stats/standings";

const db = testDb();
afterAll(() => db.destroy());

/** The job page's tools in page order, with the mark printed beside each. */
function pageRows(html: string) {
  return [...html.matchAll(/data-testid="cell-row" data-slug="([^"]+)" data-mark="([^"]*)"/g)].map((m) => ({
    slug: m[1]!,
    mark: m[2]!.replace(/&#x27;|&#39;/g, "'"),
  }));
}

describe("the job page, the compare page and the feed agree", () => {
  it("on the order and on every tool's mark against the top tool, on every demo job", async () => {
    const jobs = await db
      .selectFrom("job_types as j")
      .select(["j.id", "j.slug"])
      .where((eb) => eb.exists(eb.selectFrom("stats_cells").select("job_type_id").whereRef("job_type_id", "=", "j.id")))
      .orderBy("j.id")
      .execute();
    expect(jobs.length).toBeGreaterThanOrEqual(11);
    const get = feedClient();
    let pairs = 0,
      toldApart = 0;
    for (const job of jobs) {
      const rows = pageRows(await (await new Browserish().get(`/jobs/${job.slug}`)).text());
      expect(rows.length, job.slug).toBeGreaterThan(1);
      const feed = (await (await get(`/api/v1/stats?job=${job.slug}`)).json()).data as {
        model: string;
        order: { position: number; mark: Mark };
      }[];
      // Same order, same marks (the feed's mark in the page's words).
      expect(
        feed.sort((a, b) => a.order.position - b.order.position).map((r) => [r.model, MARK_LABELS[r.order.mark]]),
        job.slug,
      ).toEqual(rows.map((r) => [r.slug, r.mark]));
      const top = rows.find((r) => r.mark === MARK_LABELS.top)?.slug;
      // Every pair of tools on the job: compare's marks are the job page's, and where one of the pair
      // is the top tool, compare's verdict on the pair is the other's mark.
      const markOf = new Map(rows.map((r) => [r.slug, r.mark]));
      for (let i = 0; i < rows.length; i++) {
        for (let j = i + 1; j < rows.length; j++) {
          const [a, b] = [rows[i]!.slug, rows[j]!.slug];
          const c = await compareOnJob(db, job.id, [a, b]);
          expect(c.chosen.map((r) => MARK_LABELS[r.mark])).toEqual([markOf.get(a), markOf.get(b)]);
          const pair = c.pairs[0]!;
          if (pair.distinguishable) toldApart++;
          pairs++;
          const other = a === top ? b : b === top ? a : null;
          if (other && markOf.get(other) !== MARK_LABELS.too_few) {
            expect(pair.distinguishable, `${job.slug}: ${a} vs ${b}`).toBe(
              markOf.get(other) !== MARK_LABELS.not_told_apart,
            );
          }
        }
      }
      // And the compare page as served, for the top tool against each other tool with enough reports.
      for (const r of rows.filter((x) => x.slug !== top && x.mark !== MARK_LABELS.too_few)) {
        const html = await (await new Browserish().get(`/compare?job=${job.slug}&models=${top},${r.slug}`)).text();
        const told = html.match(/data-testid="pair" data-a="[^"]+" data-b="[^"]+" data-told="(true|false)"/)?.[1];
        expect(told, `${job.slug}: ${top} vs ${r.slug}`).toBe(String(r.mark !== MARK_LABELS.not_told_apart));
        expect(html).toContain(`data-slug="${r.slug}" data-mark="${r.mark.replace(/'/g, "&#x27;")}"`);
      }
    }
    expect(pairs).toBeGreaterThan(100);
    expect(toldApart).toBeGreaterThan(0);
  });
});
