// The review page's form schema: a claim, or a decision with its checklist and file verdicts read
// from the same form (no field read by hand), and the report form kept on the device.
import { describe, expect, it } from "vitest";
import { reviewActionSchema } from "../../app/moderation/decision-form";
import { differsFromSaved, offlineDraftKey } from "../../app/reports/offline-draft";

const decision = {
  action: "return",
  reasonCode: "gauge_unreadable",
  note: "Show the gauge",
  version: "3",
  seenDecisions: "1",
};

describe("the review page's actions", () => {
  it("reads a claim", () => {
    expect(reviewActionSchema.parse({ intent: "claim" })).toEqual({ intent: "claim" });
  });

  it("reads a decision with its checklist and a verdict per file", () => {
    const parsed = reviewActionSchema.parse({
      ...decision,
      check_job_visible: "on",
      check_gauge_readable: "on",
      evidence_12: "verified",
      evidence_40: "failed",
    });
    expect(parsed).toEqual({
      intent: "decide",
      action: "return",
      reasonCode: "gauge_unreadable",
      note: "Show the gauge",
      version: 3,
      seenDecisions: 1,
      checklist: { job_visible: true, tool_identifiable: false, gauge_readable: true, matches_outcome: false },
      evidence: { 12: "verified", 40: "failed" },
    });
  });

  it("takes a decision without an intent, and leaves the note empty when none is sent", () => {
    const parsed = reviewActionSchema.parse({ ...decision, note: undefined });
    expect(parsed).toMatchObject({ intent: "decide", note: null, evidence: {} });
  });

  it("refuses a file verdict that is neither, a file that is not a row id, and an unknown intent", () => {
    const bad = (values: Record<string, string>) => reviewActionSchema.safeParse(values).error?.issues[0];
    expect(bad({ ...decision, evidence_12: "maybe" })).toMatchObject({
      path: ["evidence_12"],
      message: "Mark each file verified or failed",
    });
    expect(bad({ ...decision, evidence_0x10: "verified" })).toMatchObject({
      path: ["evidence_0x10"],
      message: "Mark each file verified or failed",
    });
    expect(bad({ intent: "take-over" })).toMatchObject({ path: ["intent"] });
    expect(bad({ ...decision, action: "approve" })).toMatchObject({
      path: ["action"],
      message: "Pick accept, return or reject",
    });
  });
});

describe("the report form kept on the device", () => {
  it("is kept per report, and offered back only when it holds something the saved report does not", () => {
    expect(offlineDraftKey(null)).toBe("bayproof:report-form:new");
    expect(offlineDraftKey(42)).toBe("bayproof:report-form:42");
    const saved = { toolModel: "brackwater-bh-150", inlet: "90", pu: "psi" };
    expect(
      differsFromSaved(
        { at: "", values: { toolModel: "brackwater-bh-150", inlet: "90", pu: "bar", intent: "autosave" } },
        saved,
      ),
    ).toBe(false);
    expect(differsFromSaved({ at: "", values: { toolModel: "brackwater-bh-150", inlet: "" } }, saved)).toBe(false);
    expect(differsFromSaved({ at: "", values: { inlet: "94" } }, saved)).toBe(true);
  });
});
