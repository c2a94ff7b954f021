// How the trade types numbers into a form, read leniently and exactly.

/** "3/8", "1 1/4", "0.375" or "9,5" → a number; anything else → NaN. */
export function parseMeasure(raw: unknown): number {
  if (typeof raw !== "string") return typeof raw === "number" ? raw : NaN;
  const s = raw.trim().replace(",", ".");
  if (s === "") return NaN;
  const mixed = s.match(/^(\d+)\s+(\d+)\/(\d+)$/);
  if (mixed) return Number(mixed[1]) + Number(mixed[2]) / Number(mixed[3]);
  const frac = s.match(/^(\d+)\/(\d+)$/);
  if (frac) return Number(frac[1]) / Number(frac[2]);
  return /^-?\d*\.?\d+$/.test(s) ? Number(s) : NaN;
}

/** "45", "45 s", "3 min", "1:30", "1:02:00", "2 h" → seconds; anything else → NaN. */
export function parseDuration(raw: unknown): number {
  if (typeof raw === "number") return raw;
  if (typeof raw !== "string") return NaN;
  const s = raw.trim().toLowerCase().replace(",", ".");
  const clock = s.match(/^(?:(\d+):)?(\d{1,2}):(\d{2})$/);
  if (clock) return Number(clock[1] ?? 0) * 3600 + Number(clock[2]) * 60 + Number(clock[3]);
  const unit = s.match(/^(\d*\.?\d+)\s*(s|sec|secs|seconds?|m|min|mins|minutes?|h|hr|hrs|hours?)?$/);
  if (!unit) return NaN;
  const n = Number(unit[1]);
  const u = unit[2] ?? "s";
  return u.startsWith("h") ? n * 3600 : u.startsWith("m") ? n * 60 : n;
}
