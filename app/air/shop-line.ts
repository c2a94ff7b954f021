// A shop's air line as the forms describe it (regulator, hose, couplers, an optional whip), laid out
// as the segments of the second-edition line model, in the order the air meets them. Pure.
import type { CouplerProfile } from "~/domain";
import type { Segment } from "./line";

export interface ShopLine {
  hoseIdMm: number;
  hoseLengthM: number;
  couplerProfile: CouplerProfile;
  couplerCount: number;
  /** A short whip hose at the tool end, when there is one. */
  whip?: { idMm: number; lengthM: number } | null;
}

/**
 * Regulator; with two or more couplers, the first at the regulator outlet; the hose; then the rest
 * at the tool end — with a whip, one joins hose and whip and any others sit at the tool inlet. Each coupler
 * is its own segment, so each is solved at the pressure where it sits.
 */
export function shopLineSegments(regulatorKpa: number, line: ShopLine): Segment[] {
  const coupler = (n: number, where: string): Segment => ({
    kind: "coupler",
    profile: line.couplerProfile,
    label: `Coupler ${n} (${where})`,
  });
  const out: Segment[] = [{ kind: "regulator", setKpa: regulatorKpa }];
  let n = 0;
  if (line.couplerCount > 1) out.push(coupler(++n, "at the regulator"));
  out.push({ kind: "hose", idMm: line.hoseIdMm, lengthM: line.hoseLengthM, label: "Hose" });
  if (line.whip && line.whip.lengthM > 0) {
    if (line.couplerCount > n) out.push(coupler(++n, "hose to whip"));
    out.push({ kind: "hose", idMm: line.whip.idMm, lengthM: line.whip.lengthM, label: "Whip hose" });
  }
  while (line.couplerCount > n) out.push(coupler(++n, "at the tool"));
  return out;
}
