// `tsx scripts/stats-regulator-check.ts` (DATABASE_URL): may regulator readings, corrected by the
// line loss app/air predicts for the reported hose and couplers, join the inlet-measured reports in
// the pooled pressure fit? Five-fold cross-validation (folds by report id) per job type: each fit's
// log-loss on the held-out inlet-measured reports, with and without the corrected readings, and the
// pooled slopes. Figures for docs/decisions/010; nothing here passes or fails.
import { sql } from "kysely";
import { createDb } from "../db/database";
import { operatingInletPressure } from "../app/air/supply";
import { pooledLogisticFit, pooledPredict } from "../app/stats";
import { pressureX } from "../app/stats/pressure";

const db = createDb(process.env.DATABASE_URL ?? "postgres://bayproof@127.0.0.1:54320/bayproof", 2);
try {
  const rows = (
    await sql<{
      id: number;
      job: number;
      model: number;
      p: number;
      src: string;
      y: boolean;
      lps: number;
      hid: number | null;
      hlen: number | null;
      cp: string | null;
      cc: number | null;
    }>`
    select r.id, r.job_type_id job, r.tool_model_id model, r.inlet_kpa::float8 p, r.inlet_source src, r.outcome = 'freed' y, m.rated_air_lps::float8 lps,
      r.hose_id_mm::float8 hid, r.hose_length_m::float8 hlen, r.coupler_profile cp, r.coupler_count cc
    from reports r join tool_models m on m.id = r.tool_model_id
    where r.status = 'accepted' and not r.flags @> array['above_rated_inlet'] and r.inlet_source in ('measured_at_inlet', 'read_at_regulator')`.execute(
      db,
    )
  ).rows;
  const corrected = rows.flatMap((r) => {
    if (r.src === "measured_at_inlet") return [{ ...r, kpa: r.p }];
    if (r.hid == null || r.hlen == null || r.cp == null || r.cc == null) return [];
    const at = operatingInletPressure(r.p, r.lps, {
      hoseIdMm: r.hid,
      hoseLengthM: r.hlen,
      couplerProfile: r.cp as never,
      couplerCount: r.cc,
    });
    return at.stalled ? [] : [{ ...r, kpa: at.inletKpa }];
  });
  const jobs = [...new Set(rows.map((r) => r.job))];
  const loss = { measured: 0, corrected: 0, raw: 0, heldOut: 0 };
  for (const job of jobs) {
    for (let fold = 0; fold < 5; fold++) {
      const test = corrected.filter((r) => r.job === job && r.src === "measured_at_inlet" && r.id % 5 === fold);
      const variants = {
        measured: corrected.filter((r) => r.job === job && r.src === "measured_at_inlet" && r.id % 5 !== fold),
        corrected: corrected.filter(
          (r) => r.job === job && r.id % 5 !== fold && !(r.src === "measured_at_inlet" && r.id % 5 === fold),
        ),
        raw: corrected
          .filter((r) => r.job === job && r.id % 5 !== fold && !(r.src === "measured_at_inlet" && r.id % 5 === fold))
          .map((r) => ({ ...r, kpa: r.p })),
      };
      const fits = Object.fromEntries(
        Object.entries(variants).map(([k, train]) => {
          try {
            return [
              k,
              train.length >= 20
                ? pooledLogisticFit(train.map((r) => ({ group: r.model, x: pressureX(r.kpa), y: r.y ? 1 : 0 })))
                : null,
            ];
          } catch {
            return [k, null];
          }
        }),
      );
      // Score only held-out reports that every variant can predict (their model is in every fit).
      const scored = test.filter((r) =>
        Object.values(fits).every((f) => f && f.groups.some((g) => g.group === r.model)),
      );
      for (const r of scored) {
        for (const k of ["measured", "corrected", "raw"] as const) {
          const p = Math.min(1 - 1e-9, Math.max(1e-9, pooledPredict(fits[k]!, r.model, pressureX(r.kpa)).estimate));
          loss[k] -= r.y ? Math.log(p) : Math.log(1 - p);
        }
        loss.heldOut++;
      }
    }
  }
  const slopeOf = (set: { job: number; model: number; kpa: number; y: boolean }[]) => {
    const all = jobs
      .map((j) => {
        try {
          return pooledLogisticFit(
            set.filter((r) => r.job === j).map((r) => ({ group: r.model, x: pressureX(r.kpa), y: r.y ? 1 : 0 })),
          );
        } catch {
          return null;
        }
      })
      .filter((f) => f != null);
    const w = all.map((f) => 1 / f.slopeSE ** 2);
    return {
      slope: all.reduce((a, f, i) => a + f.slope * w[i]!, 0) / w.reduce((a, b) => a + b, 0),
      se: 1 / Math.sqrt(w.reduce((a, b) => a + b, 0)),
    };
  };
  const measured = corrected.filter((r) => r.src === "measured_at_inlet");
  console.log(
    `reports: ${measured.length} measured at the inlet, ${corrected.length - measured.length} regulator readings corrected (of ${rows.length - measured.length})`,
  );
  console.log(`held-out inlet-measured reports scored: ${loss.heldOut}`);
  for (const k of ["measured", "corrected", "raw"] as const)
    console.log(`mean log-loss, ${k.padEnd(9)} ${(loss[k] / loss.heldOut).toFixed(4)}`);
  const s1 = slopeOf(measured),
    s2 = slopeOf(corrected),
    s3 = slopeOf(corrected.map((r) => ({ ...r, kpa: r.p })));
  console.log(
    `slope per bar (precision-weighted over jobs): measured ${s1.slope.toFixed(3)} ± ${s1.se.toFixed(3)}; with corrected readings ${s2.slope.toFixed(3)} ± ${s2.se.toFixed(3)}; with raw readings ${s3.slope.toFixed(3)} ± ${s3.se.toFixed(3)}`,
  );
} finally {
  await db.destroy();
}
