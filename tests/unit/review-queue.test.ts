// The review queue's address (filters, sort and page read and written back), a reporter's record in
// plain words, and the acknowledgement a duplicate-evidence flag asks for before an accept.
import { describe, expect, it } from "vitest";
import { DUPLICATE_ACK_MESSAGE, reviewActionSchema, reviewActionSchemaFor } from "../../app/moderation/decision-form";
import { queueCriteria, queueQuery, readQueueFilter } from "../../app/moderation/queue-filter";
import { reporterRecord, TRUST_LABELS } from "../../app/moderation/trust";

const read = (q: string) => readQueueFilter(new URLSearchParams(q));

describe("the queue's address", () => {
  it("reads filters, treats empty fields as 'any' and writes the same address back without the defaults", () => {
    const r = read("sort=newest&second=1&flag=&job=ball-joint-separation&page=3&unknown=x");
    expect(r).toEqual({ ok: true, filter: { sort: "newest", second: "1", job: "ball-joint-separation", page: 3 } });
    if (!r.ok) return;
    expect(queueQuery(r.filter)).toBe("?job=ball-joint-separation&second=1&sort=newest&page=3");
    expect(queueQuery(r.filter, { page: undefined })).toBe("?job=ball-joint-separation&second=1&sort=newest");
    expect(queueQuery({ sort: "oldest", page: 1 })).toBe("");
    expect(queueCriteria(r.filter)).toMatchObject({
      sort: "newest",
      secondLookOnly: true,
      job: "ball-joint-separation",
      olderThanDays: undefined,
    });
    expect(queueCriteria({})).toMatchObject({ sort: "oldest", secondLookOnly: false });
  });

  it("refuses what no form of the page sends, with a reason", () => {
    expect(read("sort=sideways")).toEqual({ ok: false, message: "Sort oldest or newest first" });
    expect(read("page=0")).toEqual({ ok: false, message: "The page is a whole number from 1" });
    expect(read("page=1.5")).toMatchObject({ ok: false });
    expect(read("second=yes")).toMatchObject({ ok: false });
    expect(read("age=2")).toMatchObject({ ok: false });
    expect(read("reporter=gold")).toMatchObject({ ok: false });
  });
});

describe("a reporter's record", () => {
  it("is said as what their earlier reports came to, with no badge words", () => {
    expect(reporterRecord({ accepted: 0, returned: 0, rejected: 0, rejectStreak: 0 })).toBe(
      "no earlier report decided",
    );
    expect(reporterRecord({ accepted: 12, returned: 1, rejected: 1, rejectStreak: 0 })).toBe(
      "12 of 14 earlier reports accepted",
    );
    expect(reporterRecord({ accepted: 1, returned: 0, rejected: 0, rejectStreak: 0 })).toBe(
      "1 of 1 earlier report accepted",
    );
    expect(reporterRecord({ accepted: 2, returned: 0, rejected: 3, rejectStreak: 3 })).toBe(
      "2 of 5 earlier reports accepted; the last 3 rejected",
    );
    for (const label of Object.values(TRUST_LABELS)) expect(label).not.toMatch(/trusted|tier|level|rank|badge/i);
  });
});

describe("a duplicate-evidence flag", () => {
  const accept = { action: "accept", reasonCode: "evidence_clear", version: "2", seenDecisions: "0" };
  it("needs the acknowledgement for an accept, and only then", () => {
    const schema = reviewActionSchemaFor({ flags: ["duplicate_evidence"] });
    expect(schema.safeParse(accept).error?.issues[0]).toMatchObject({
      path: ["ack_duplicate"],
      message: DUPLICATE_ACK_MESSAGE,
    });
    expect(schema.safeParse({ ...accept, ack_duplicate: "on" }).success).toBe(true);
    expect(schema.safeParse({ ...accept, action: "reject", reasonCode: "duplicate" }).success).toBe(true);
    expect(schema.parse({ intent: "claim" })).toEqual({ intent: "claim" });
    expect(reviewActionSchemaFor({ flags: ["first_report"] })).toBe(reviewActionSchema);
  });
});
