// The report form's messages fit the fault (issue 18): an empty field says what it needs, a field
// typed wrong says how to type it; a stored time comes back as a reporter would type it.
import { describe, expect, it } from "vitest";
import { parseDuration } from "~/domain";
import { durationForForm, reportSchema, toFormValues } from "~/reports/form-schema";
import { validReport } from "../support/reports";

const messageFor = (field: string, value: string) => {
  const r = reportSchema.safeParse({ ...validReport(), [field]: value });
  return r.success ? null : r.error.issues.find((i) => i.path[0] === field)?.message;
};

describe("report form messages", () => {
  it("say what an empty field needs, and how to type one typed wrong", () => {
    expect(messageFor("couplerCount", "")).toBe("Enter how many couplers, 0 if none");
    expect(messageFor("couplerCount", "two")).toBe("Couplers come in whole numbers");
    expect(messageFor("attempts", " ")).toBe("Enter how many attempts it took");
    expect(messageFor("time", "")).toBe("Enter the time to result");
    expect(messageFor("time", "soon")).toMatch(/e\.g\. 45 s/);
    expect(messageFor("inlet", "")).toBe("Enter the pressure at the tool inlet");
    expect(messageFor("inlet", "lots")).toMatch(/as a number/);
  });
});

describe("a stored time in the form", () => {
  it("reads as typed and parses back to the same seconds", () => {
    expect(durationForForm(40)).toBe("40 s");
    expect(durationForForm(70)).toBe("70 s");
    expect(durationForForm(180)).toBe("3 min");
    expect(durationForForm(95)).toBe("1:35");
    expect(durationForForm(3725)).toBe("1:02:05");
    expect(durationForForm(7200)).toBe("2 h");
    for (const s of [1, 40, 89, 90, 95, 180, 3599, 3600, 3725, 5400, 28_800])
      expect(parseDuration(durationForForm(s))).toBe(s);
    expect(toFormValues({ time_to_result_s: 40 }, "psi", "in").time).toBe("40 s");
  });
});
