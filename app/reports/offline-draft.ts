// A report form left unsent (the network dropped, the phone slept) is kept in the browser under
// this key until the report is submitted; the editor offers it back once.
export const offlineDraftKey = (reportId: number | null) => `bayproof:report-form:${reportId ?? "new"}`;

export interface OfflineDraft {
  at: string;
  values: Record<string, string>;
}

/** Fields that say nothing about the report itself. */
const BOOKKEEPING = new Set(["intent", "reportId", "pu", "lu"]);

/** Whether a kept form holds anything the saved report does not. */
export function differsFromSaved(kept: OfflineDraft, saved: Record<string, string>): boolean {
  return Object.entries(kept.values).some(([k, v]) => v && (saved[k] ?? "") !== v && !BOOKKEEPING.has(k));
}
