import { useLocation } from "react-router";
// The units module alone: the domain barrel brings zod (slug.ts), which the root of every page does not run.
import { UNIT_SYSTEM_LABELS, UNIT_SYSTEMS, type UnitSystem } from "~/domain/units";

/**
 * The footer's unit switch: a plain POST to /units that works without JavaScript and comes back to
 * the same page. Signed in, the choice is kept on the account; otherwise in a cookie.
 */
export function UnitsSwitch({ system }: { system: UnitSystem }) {
  const { pathname, search } = useLocation();
  return (
    <form method="post" action="/units" className="mt-3 flex flex-wrap items-center gap-2" aria-label="Units">
      <input type="hidden" name="back" value={pathname + search} />
      <span id="units-switch-label">Figures in</span>
      {UNIT_SYSTEMS.map((s) => (
        <button
          key={s}
          type="submit"
          name="system"
          value={s}
          aria-pressed={s === system}
          aria-describedby="units-switch-label"
          className={`min-h-11 rounded border px-3 ${s === system ? "border-bay-700 bg-bay-700 font-semibold text-white" : "border-stone-300 bg-white text-stone-800 underline"}`}
        >
          {UNIT_SYSTEM_LABELS[s]}
        </button>
      ))}
    </form>
  );
}
