// The trade-offs as a picture: each passing tool's chance against its weight (and, as a second view,
// against its share of the day's vibration action value), with the 95 % band of the chance, and the
// tools no other candidate beats on every weighted criterion drawn solid. Server-rendered SVG with a
// title and description, and a table of the same figures.
import { scaleLinear } from "~/components/linear-scale";
import { formatChance, formatShare, formatWeight, KG_PER_LB, type Units } from "~/domain";
import type { Candidate, Shortlist } from "~/exposure/shortlist";
import { CRITERION_LABELS } from "~/exposure/shortlist-form";

const W = 340,
  H = 230,
  L = 40,
  R = 12,
  T = 12,
  B = 40;

interface Point {
  n: number;
  c: Candidate;
  x: number;
}

function Scatter({
  id,
  title,
  desc,
  xLabel,
  points,
  front,
  formatX,
}: {
  id: string;
  title: string;
  desc: string;
  xLabel: string;
  points: Point[];
  front: Set<string>;
  formatX: (x: number) => string;
}) {
  const xs = points.map((p) => p.x);
  const lo = Math.min(...xs),
    hi = Math.max(...xs);
  const pad = hi > lo ? (hi - lo) * 0.08 : Math.max(hi * 0.1, 0.1);
  const x = scaleLinear()
    .domain([Math.max(0, lo - pad), hi + pad])
    .range([L, W - R]);
  const y = scaleLinear()
    .domain([0, 1])
    .range([H - B, T]);
  const ticks = x.ticks(4);
  return (
    <svg viewBox={`0 0 ${W} ${H}`} className="h-auto w-full max-w-xl" role="img" aria-labelledby={`${id}-t ${id}-d`}>
      <title id={`${id}-t`}>{title}</title>
      <desc id={`${id}-d`}>{desc}</desc>
      {[0, 0.25, 0.5, 0.75, 1].map((v) => (
        <g key={v}>
          <line x1={L} x2={W - R} y1={y(v)} y2={y(v)} stroke="#e7e5e4" />
          <text x={L - 4} y={y(v) + 4} textAnchor="end" fontSize="11" fill="#57534e">
            {Math.round(v * 100)}%
          </text>
        </g>
      ))}
      {ticks.map((t) => (
        <text key={t} x={x(t)} y={H - B + 14} textAnchor="middle" fontSize="11" fill="#57534e">
          {formatX(t)}
        </text>
      ))}
      <text x={(L + W - R) / 2} y={H - 6} textAnchor="middle" fontSize="12" fill="#292524">
        {xLabel}
      </text>
      {points.map((p) => {
        const on = front.has(p.c.slug);
        return (
          <g key={p.c.slug}>
            <line
              x1={x(p.x)}
              x2={x(p.x)}
              y1={y(p.c.chance.lower)}
              y2={y(p.c.chance.upper)}
              stroke={on ? "#2f6b5f" : "#a8a29e"}
              strokeWidth="2"
            />
            <circle
              cx={x(p.x)}
              cy={y(p.c.chance.estimate)}
              r="7"
              fill={on ? "#2f6b5f" : "#fff"}
              stroke={on ? "#14302a" : "#57534e"}
              strokeWidth="1.5"
            />
            <text
              x={x(p.x)}
              y={y(p.c.chance.estimate) + 4}
              textAnchor="middle"
              fontSize="10"
              fill={on ? "#fff" : "#292524"}
            >
              {p.n}
            </text>
          </g>
        );
      })}
    </svg>
  );
}

export function TradeOffs({
  shortlist,
  units,
  jobsPerDay,
}: {
  shortlist: Shortlist;
  units: Units;
  jobsPerDay: number;
}) {
  const front = new Set(shortlist.front);
  const numbered = shortlist.passing.map((c, i) => ({ n: i + 1, c }));
  const us = units.system === "us";
  const byWeight = numbered.map((p) => ({ ...p, x: us ? p.c.weightKg / KG_PER_LB : p.c.weightKg }));
  const byVibration = numbered.flatMap((p) => (p.c.day ? [{ ...p, x: p.c.day.shareOfActionValue.estimate }] : []));
  const chosen = shortlist.criteria.map((k) => CRITERION_LABELS[k].toLowerCase()).join(", ");
  const frontNames = numbered.filter((p) => front.has(p.c.slug)).map((p) => `${p.n} ${p.c.label}`);
  const desc = `Chance it frees the job, 0 to 100 %, against the other figure; solid points are not beaten on every one of: ${chosen}. They are ${frontNames.join(", ") || "none"}.`;
  return (
    <section aria-labelledby="tradeoff-heading" className="space-y-2">
      <h3 id="tradeoff-heading" className="font-semibold">
        What each tool trades off
      </h3>
      <p className="text-sm text-stone-700">
        Solid points: no other tool that passes beats them on every criterion you weighed ({chosen || "none"}). Each
        point's line is the 95 % band of its chance; numbers match the table.
      </p>
      <Scatter
        id="tradeoff-weight"
        title="Chance it frees the job against weight"
        desc={desc}
        xLabel={`Weight (${us ? "lb" : "kg"})`}
        points={byWeight}
        front={front}
        formatX={(w) => String(Number(w.toFixed(1)))}
      />
      {byVibration.length > 1 && (
        <details>
          <summary className="cursor-pointer text-sm font-semibold">
            Second view: against the share of the vibration action value ({jobsPerDay} a day)
          </summary>
          <Scatter
            id="tradeoff-vibration"
            title={`Chance it frees the job against the share of the daily vibration action value, ${jobsPerDay} jobs a day`}
            desc={desc}
            xLabel="Share of the daily vibration action value"
            points={byVibration}
            front={front}
            formatX={(s) => formatShare(s)}
          />
        </details>
      )}
      <table className="w-full text-left text-sm">
        <caption className="sr-only">The trade-off picture's figures</caption>
        <thead className="text-xs uppercase text-stone-600">
          <tr>
            <th className="py-1 pr-2">#</th>
            <th className="py-1 pr-2">Tool</th>
            <th className="py-1 pr-2">Chance</th>
            <th className="py-1 pr-2">Weight</th>
            <th className="py-1">Not beaten on all</th>
          </tr>
        </thead>
        <tbody>
          {numbered.map((p) => (
            <tr key={p.c.slug} className="border-t border-stone-100">
              <td className="py-1 pr-2">{p.n}</td>
              <td className="py-1 pr-2">{p.c.label}</td>
              <td className="py-1 pr-2">{formatChance(p.c.chance.estimate)}</td>
              <td className="py-1 pr-2">{formatWeight(p.c.weightKg, units)}</td>
              <td className="py-1">{front.has(p.c.slug) ? "yes" : "no"}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </section>
  );
}
