// The trade-offs between candidate tools: the ones no other candidate beats on every chosen criterion
// (the Pareto front). Pure.

export interface TradeOffCriterion {
  key: string;
  better: "higher" | "lower";
}

export interface TradeOffItem {
  id: string;
  /** The item's value on each criterion; a missing value (null or absent) counts as the worst. */
  values: Record<string, number | null | undefined>;
}

/** −1, 0 or 1: how `a` stands against `b` on one criterion (1 = a is better). */
function compare(a: number | null | undefined, b: number | null | undefined, better: TradeOffCriterion["better"]) {
  const known = (x: number | null | undefined): x is number => x != null && Number.isFinite(x);
  if (!known(a)) return known(b) ? -1 : 0;
  if (!known(b)) return 1;
  if (a === b) return 0;
  return (better === "higher" ? a > b : a < b) ? 1 : -1;
}

/** Whether `b` dominates `a`: at least as good on every criterion and better on one. */
export function dominates(b: TradeOffItem, a: TradeOffItem, criteria: readonly TradeOffCriterion[]): boolean {
  let strictly = false;
  for (const c of criteria) {
    const s = compare(b.values[c.key], a.values[c.key], c.better);
    if (s < 0) return false;
    if (s > 0) strictly = true;
  }
  return strictly;
}

/** The ids of the items no other item dominates, in the items' order. */
export function nonDominated(items: readonly TradeOffItem[], criteria: readonly TradeOffCriterion[]): string[] {
  if (criteria.length === 0) return items.map((i) => i.id);
  return items.filter((a) => !items.some((b) => b !== a && dominates(b, a, criteria))).map((a) => a.id);
}
