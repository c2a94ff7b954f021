import type { ReportStatus } from "../../db/schema";

/**
 * A draft is the reporter's own until they submit it, and a withdrawn report has been taken back:
 * neither is shown to moderators (404, as if it did not exist), claimed or decided.
 */
export const HIDDEN_FROM_MODERATORS: ReportStatus[] = ["draft", "withdrawn"];
export const moderatorsMaySee = (status: ReportStatus) => !HIDDEN_FROM_MODERATORS.includes(status);
