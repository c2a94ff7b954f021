// "How well the rigs agree" on /bench: repeatability and reproducibility from the rigs' readings of
// one reference tool, and each rig's bias against the consensus as a dot with its interval.
import { scaleLinear } from "~/components/linear-scale";
import { benchUnit, formatBench } from "~/bench/terms";
import type { RigAgreementRow } from "~/bench/figures-read.server";
import type { Units } from "~/domain";
import { DataTable } from "../ui";
import { AXIS, Figure, GRID, INK, tick, W } from "./svg";

const ROW = 26;
const LEFT = 120;

export function RigAgreementSection({ rows, units }: { rows: RigAgreementRow[]; units: Units }) {
  const shown = rows.slice(0, 4);
  return (
    <section aria-labelledby="agreement-heading" className="space-y-3">
      <h2 id="agreement-heading" className="text-lg font-semibold">
        How well the rigs agree
      </h2>
      {shown.length === 0 ? (
        <p className="text-stone-600">
          Not yet worked out: it needs readings of one reference tool on two rigs or more.
        </p>
      ) : (
        shown.map((a) => <Agreement key={a.id} a={a} units={units} />)
      )}
      <details className="text-sm">
        <summary className="cursor-pointer text-bay-700">How this is worked out</summary>
        <p className="mt-2 text-stone-700">
          From the one-way layout of an interlaboratory study (ISO 5725-2): s_r is the spread of repeat readings on one
          rig, s_R the spread of single readings taken on different rigs. A rig's bias is its mean minus the consensus
          (the mean of all readings), with a 95 % t interval on p − 1 degrees of freedom that treats the other rigs as a
          sample — our method, since a bench round-robin has no accepted reference value. Readings are the
          check-standard readings of sessions in control, or the trial means of one model's series on several rigs; only
          rigs whose calibration is verified and current count.
        </p>
      </details>
    </section>
  );
}

function Agreement({ a, units }: { a: RigAgreementRow; units: Units }) {
  const u = benchUnit(a.quantity, units);
  const f = (v: number) => formatBench(a.quantity, v, units);
  const H = 20 + ROW * a.rigs.length + 24;
  const ends = a.rigs.flatMap((r) => [r.lower, r.upper, 0]).map((v) => v * u.perSi);
  const x = scaleLinear()
    .domain([Math.min(...ends), Math.max(...ends)])
    .nice()
    .range([LEFT, W - 12]);
  const name = `${a.maker_name} ${a.model_code}`;
  const what = a.source === "check_readings" ? "check-standard readings" : `runs, ${a.series_label ?? "one series"}`;
  return (
    <div className="space-y-2">
      <h3 className="font-semibold">
        {name} <span className="text-sm font-normal text-stone-600">({what})</span>
      </h3>
      <p className="text-sm">
        Repeat readings on one rig spread by s_r = {f(a.repeatability_sd)}; single readings on different rigs by s_R ={" "}
        {f(a.reproducibility_sd)} (between rigs {f(a.between_rig_sd)}). {a.rigs.length} rigs, {a.readings} readings.
      </p>
      <Figure
        id={`agreement-${a.id}`}
        H={H}
        title={`Each rig's bias on ${name} (${u.label})`}
        desc={`Dots are each rig's mean minus the consensus of ${f(a.grand_mean)}; whiskers their 95 % intervals; the line at zero is the consensus.`}
      >
        {x.ticks(4).map((t) => (
          <g key={t} aria-hidden="true">
            <line x1={x(t)} x2={x(t)} y1={10} y2={H - 24} stroke={t === 0 ? AXIS : GRID} />
            <text x={x(t)} y={H - 8} textAnchor="middle" fontSize="11" fill={AXIS}>
              {tick(t)}
            </text>
          </g>
        ))}
        {a.rigs.map((r, i) => {
          const cy = 20 + ROW * i + ROW / 2;
          return (
            <g key={r.rig_id}>
              <text x={LEFT - 6} y={cy} textAnchor="end" dominantBaseline="middle" fontSize="11" fill={AXIS}>
                {r.rig_name.length > 18 ? `${r.rig_name.slice(0, 17)}…` : r.rig_name}
              </text>
              <line x1={x(r.lower * u.perSi)} x2={x(r.upper * u.perSi)} y1={cy} y2={cy} stroke={INK} strokeWidth="2" />
              <circle cx={x(r.bias * u.perSi)} cy={cy} r="4" fill={INK} />
            </g>
          );
        })}
      </Figure>
      <DataTable
        label={`Each rig's bias on ${name}`}
        head={
          <tr>
            <th className="px-3 py-2">Rig</th>
            <th className="px-3 py-2">Bias (95 % interval)</th>
            <th className="px-3 py-2">n</th>
          </tr>
        }
      >
        {a.rigs.map((r) => (
          <tr key={r.rig_id} className="border-t border-stone-100">
            <th scope="row" className="px-3 py-2 font-normal">
              <a className="text-bay-700 underline" href={`/bench/rigs/${r.rig_id}`}>
                {r.rig_name}
              </a>
            </th>
            <td className="px-3 py-2">
              {signed(r.bias * u.perSi)} {u.label}{" "}
              <span className="text-xs text-stone-600">
                ({signed(r.lower * u.perSi)} to {signed(r.upper * u.perSi)})
              </span>
            </td>
            <td className="px-3 py-2">{r.n}</td>
          </tr>
        ))}
      </DataTable>
    </div>
  );
}

const signed = (v: number) => `${v < 0 ? "−" : "+"}${Math.abs(Math.round(v)).toLocaleString("en-US")}`;
