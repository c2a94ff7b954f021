// The words the pages put beside a job's tools: plain constants, no statistics library, so the
// browser can have them without the code that computes the standings (standings.ts).

/** Fewest reports for a tool to be compared with the top tool on a job. */
export const FEW_REPORTS = 10;

export type Mark = "top" | "not_told_apart" | "behind" | "ahead" | "too_few";

export const MARK_LABELS: Record<Mark, string> = {
  top: "top tool",
  not_told_apart: "can't be told apart from the top tool yet",
  behind: "behind the top tool",
  ahead: "frees it more often than the top tool, though ordered below it",
  too_few: "too few to compare",
};
