// Prints the demo world's figures that issue 17 asks for, from the generated reports (the same rows
// the seed loads): `npx tsx scripts/demo-world-figures.ts`. Accepted reports unless said.
import { jobTypes, models } from "../seeds/catalogue";
import { generateReports } from "../seeds/reports";

const KPA_PER_PSI = 6.894757;
const all = generateReports();
const accepted = all.filter((r) => r.status === "accepted");
const psi = (kpa: number) => kpa / KPA_PER_PSI;
const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
};
const mean = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / xs.length;
const maxOf = (r: (typeof all)[number]) => models[r.modelIndex]!.maxInletKpa ?? 689.5;

console.log(`reports ${all.length}, accepted ${accepted.length}`);
for (const [name, set] of [
  ["all", all],
  ["accepted", accepted],
  ["accepted, measured at inlet", accepted.filter((r) => r.inletSource === "measured_at_inlet")],
] as const) {
  console.log(`median inlet pressure (${name}): ${psi(median(set.map((r) => r.inletKpa))).toFixed(1)} psi`);
}
const above = accepted.filter((r) => r.inletKpa > maxOf(r));
console.log(
  `above the rated maximum (accepted): ${((100 * above.length) / accepted.length).toFixed(1)} % (${above.length}); flagged above_rated_inlet: ${accepted.filter((r) => r.flags.includes("above_rated_inlet")).length}; the world's true inlet above: ${((100 * accepted.filter((r) => r.world.inletKpa > maxOf(r)).length) / accepted.length).toFixed(1)} %`,
);
console.log(
  `inlet above the regulator (all): ${all.filter((r) => r.inletKpa > r.regulatorKpa).length}, of them measured at inlet: ${all.filter((r) => r.inletKpa > r.regulatorKpa && r.inletSource === "measured_at_inlet").length}; flagged inlet_above_regulator: ${all.filter((r) => r.flags.includes("inlet_above_regulator")).length}`,
);
for (const id of [...new Set(all.map((r) => r.hoseIdMm))].sort((a, b) => a - b)) {
  const m = accepted.filter((r) => r.hoseIdMm === id && r.inletSource === "measured_at_inlet");
  const t = accepted.filter((r) => r.hoseIdMm === id);
  console.log(
    `hose ${id} mm (${(id / 25.4).toFixed(4)} in): mean regulator-to-inlet drop, measured at inlet ${psi(mean(m.map((r) => r.regulatorKpa - r.inletKpa))).toFixed(1)} psi (n ${m.length}); the world's true drop ${psi(mean(t.map((r) => r.world.regulatorSetKpa - r.world.inletKpa))).toFixed(1)} psi (n ${t.length})`,
  );
}
for (const job of jobTypes) {
  if (job.category === "air-ratchet") continue;
  const rows = accepted.filter((r) => jobTypes[r.jobIndex] === job);
  const parts = [...new Set(rows.map((r) => models[r.modelIndex]!.fitting))].sort().map((f) => {
    const g = rows.filter((r) => models[r.modelIndex]!.fitting === f);
    return `${f} ${((100 * g.filter((r) => r.outcome === "freed").length) / g.length).toFixed(0)} % of ${g.length}`;
  });
  console.log(`${job.slug}: ${parts.join("; ")}`);
}
const cells = new Map<string, typeof all>();
for (const r of all) {
  const k = `${r.modelIndex}:${r.jobIndex}`;
  cells.set(k, [...(cells.get(k) ?? []), r]);
}
let worst = 0;
for (const rows of cells.values()) {
  if (rows.length < 10) continue;
  const per = new Map<number, number>();
  for (const r of rows) per.set(r.reporterIndex, (per.get(r.reporterIndex) ?? 0) + 1);
  worst = Math.max(worst, Math.max(...per.values()) / rows.length);
}
console.log(`largest one reporter's share of a cell of 10 or more: ${(100 * worst).toFixed(1)} %`);
const seized = all.filter((r) => jobTypes[r.jobIndex]!.seized && r.inletSource === "measured_at_inlet");
console.log(
  `seized, measured at inlet: under 580 kPa ${seized.filter((r) => r.inletKpa < 580).length}, over 700 kPa ${seized.filter((r) => r.inletKpa > 700).length}`,
);
