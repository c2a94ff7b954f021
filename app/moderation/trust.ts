// Trust levels from a reporter's decided reports. Pure; shown in the review queue.

export const TRUST_LEVELS = ["new", "building", "trusted", "held"] as const;
export type TrustLevel = (typeof TRUST_LEVELS)[number];

export interface History {
  accepted: number;
  returned: number;
  rejected: number;
  /** Rejections in a row, newest first, before any accept. */
  rejectStreak: number;
}

/** Several rejections in a row hold a reporter's next reports for a second look. */
export const HOLD_AFTER_REJECTIONS = 3;

export function trustLevel(h: History): TrustLevel {
  if (h.rejectStreak >= HOLD_AFTER_REJECTIONS) return "held";
  if (h.accepted === 0) return "new";
  const decided = h.accepted + h.returned + h.rejected;
  const badShare = (h.returned + 2 * h.rejected) / decided;
  return h.accepted >= 10 && badShare < 0.2 ? "trusted" : "building";
}

// Said plainly, as what the reporter's past reports came to: no badges, ranks or numbered levels.
export const TRUST_LABELS: Record<TrustLevel, string> = {
  new: "No report accepted yet",
  building: "Some reports accepted",
  trusted: "10 or more accepted, few sent back",
  held: `Last ${HOLD_AFTER_REJECTIONS} or more reports rejected`,
};

/** A reporter's past in one line for the moderator: "12 of 14 earlier reports accepted". */
export function reporterRecord(h: History): string {
  const decided = h.accepted + h.returned + h.rejected;
  if (decided === 0) return "no earlier report decided";
  const base = `${h.accepted} of ${decided} earlier ${decided === 1 ? "report" : "reports"} accepted`;
  return h.rejectStreak >= HOLD_AFTER_REJECTIONS ? `${base}; the last ${h.rejectStreak} rejected` : base;
}

/** A report needs two accepting moderators when flagged, or when its reporter is new or held. */
export const needsSecondLook = (flags: string[], level: TrustLevel) =>
  flags.length > 0 || level === "new" || level === "held";
