// The shopper's air supply as the job page's "Which tool, on your air?" form sends it (imperial,
// as the trade in North America reads its gauges and hoses). Read what parses; say what did not.
import { supplySchema } from "~/air/supply-form";
import type { Supply } from "./which-tool";

/** null when no supply was asked for; otherwise the supply in SI, or a note of what could not be read. */
export function readSupply(search: Record<string, string>): { supply: Supply | null; note: string | null } | null {
  if (search.reg === undefined) return null;
  const parsed = supplySchema.safeParse(search);
  if (!parsed.success)
    return {
      supply: null,
      note: `Could not use your supply: ${parsed.error.issues.map((i) => i.message).join("; ")}.`,
    };
  return { supply: parsed.data, note: null };
}
