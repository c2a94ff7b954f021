// Our own reason codes for moderation decisions. Shared by the review screen and the server.
export const REASONS = {
  accept: {
    evidence_clear: "Evidence clear: job, tool and gauge match the numbers",
    second_look_agrees: "Second look agrees with the first",
  },
  return: {
    gauge_unreadable: "The gauge or regulator cannot be read",
    inlet_pressure_missing: "Show the pressure at the tool inlet while it runs",
    tool_not_identifiable: "The tool's maker or model cannot be made out",
    numbers_disagree: "The numbers disagree with what the evidence shows",
    wrong_job_type: "The job filed does not match the job shown",
  },
  reject: {
    tool_not_shown: "The evidence does not show the tool named",
    job_not_shown: "The evidence does not show the job",
    evidence_failed: "The evidence failed verification",
    duplicate: "The same job was already reported",
    unsafe_practice: "The job was done unsafely (e.g. a shank adapter, over-rated pressure)",
  },
} as const;

export type DecisionKind = keyof typeof REASONS;

export const isReason = (action: DecisionKind, code: string) => Object.hasOwn(REASONS[action], code);

export const reasonLabel = (code: string) => {
  for (const group of Object.values(REASONS))
    if (Object.hasOwn(group, code)) return (group as Record<string, string>)[code]!;
  return code.replaceAll("_", " ");
};

export const CHECKLIST = {
  job_visible: "The job is visible",
  tool_identifiable: "The tool can be identified",
  gauge_readable: "A gauge or regulator is readable",
  matches_outcome: "It matches the stated outcome",
} as const;
export type ChecklistKey = keyof typeof CHECKLIST;
