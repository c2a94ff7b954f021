// A dose against its reference values, drawn on the server (no JavaScript): the interval as a band, the
// estimate as a bar, and each reference value as a labelled line. The same figures are given as text.
interface DoseMark {
  at: number;
  label: string;
}

export function DoseBar({
  title,
  estimate,
  lower,
  upper,
  marks,
  unit,
}: {
  title: string;
  estimate: number;
  lower: number | null;
  upper: number | null;
  marks: DoseMark[];
  /** How a value reads, for the picture's text alternative. */
  unit: (value: number) => string;
}) {
  const top = Math.max(...marks.map((m) => m.at)) * 1.25;
  const max = Math.max(top, (upper ?? estimate) * 1.05);
  const pct = (v: number) => `${Math.min(100, Math.max(0, (v / max) * 100))}%`;
  const over = marks.filter((m) => estimate >= m.at).map((m) => m.label);
  const alt =
    `${title}: ${unit(estimate)}` +
    (lower != null && upper != null ? `, interval ${unit(lower)} to ${unit(upper)}` : "") +
    (over.length ? `; at or past the ${over.join(" and the ")}` : `; below the ${marks[0]!.label}`);
  return (
    <figure className="space-y-1">
      <figcaption className="text-xs text-stone-700">{title}</figcaption>
      <div role="img" aria-label={alt} className="relative h-6 w-full rounded bg-stone-100">
        {lower != null && upper != null && (
          <div
            className="absolute top-0 h-6 rounded bg-bay-600 opacity-25"
            style={{ left: pct(lower), width: `calc(${pct(upper)} - ${pct(lower)})` }}
          />
        )}
        <div className="absolute top-1.5 left-0 h-3 rounded-r bg-bay-700" style={{ width: pct(estimate) }} />
        {marks.map((m) => (
          <div key={m.label} className="absolute -top-1 h-8 w-0.5 bg-signal-500" style={{ left: pct(m.at) }} />
        ))}
      </div>
      <div className="relative h-4 text-[11px] text-stone-700" aria-hidden>
        {marks.map((m) => (
          <span key={m.label} className="absolute -translate-x-1/2 whitespace-nowrap" style={{ left: pct(m.at) }}>
            {m.label}
          </span>
        ))}
      </div>
    </figure>
  );
}
