/**
 * A slug names a maker, tool category, tool model or job type in URLs, filters and the feed.
 * The one pattern is the database's: the CHECK on every slug column (migration
 * 2026-12-01T00.00) allows runs of lower-case letters and digits joined by single hyphens, so that
 * is what every stored slug looks like. The feed once published `[-.]` as the joiner; no stored slug
 * can hold a dot, so a dotted slug named nothing, and the feed now publishes (and checks its
 * parameters against) the same pattern the database enforces. Fittings ("drive-1/2",
 * "shank-0.401") are codes of their own, not slugs: see FITTINGS.
 */
export const SLUG_PATTERN = "^[a-z0-9]+(-[a-z0-9]+)*$";
export const SLUG_MAX_LENGTH = 80;
export const SLUG_RE = new RegExp(SLUG_PATTERN);

export const isSlug = (value: unknown): value is string =>
  typeof value === "string" && value.length <= SLUG_MAX_LENGTH && SLUG_RE.test(value);
