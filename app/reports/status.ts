import type { ReportStatus } from "../../db/schema";

/** A reporter may change a report only while it is a draft or returned to them. */
export const EDITABLE: ReportStatus[] = ["draft", "returned"];
/** Withdrawing is possible until a moderator has decided. */
export const WITHDRAWABLE: ReportStatus[] = ["draft", "submitted", "returned"];
