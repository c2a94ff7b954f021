// A failed form's summary: focused once it appears, each problem a link to its field.
import { useEffect, useRef } from "react";

export function ErrorSummary({
  errors,
  labels,
  message = "Some values need a look:",
}: {
  errors: Record<string, string[] | undefined>;
  /** Field name → its label, in the form's order; only these are listed. */
  labels: Record<string, string>;
  message?: string;
}) {
  const ref = useRef<HTMLDivElement>(null);
  const listed = Object.keys(labels).filter((name) => errors[name]?.length);
  useEffect(() => {
    if (listed.length) ref.current?.focus();
  }, [listed.length]);
  if (listed.length === 0) return null;
  return (
    <div
      ref={ref}
      tabIndex={-1}
      role="alert"
      aria-labelledby="error-summary-heading"
      className="rounded border border-red-700 bg-red-50 p-3 text-red-900"
    >
      <h2 id="error-summary-heading" className="font-semibold">
        {message}
      </h2>
      <ul className="mt-1 list-disc pl-5">
        {listed.map((name) => (
          <li key={name}>
            <a href={`#${name}`} className="underline">
              {labels[name]}: {errors[name]![0]}
            </a>
          </li>
        ))}
      </ul>
    </div>
  );
}
