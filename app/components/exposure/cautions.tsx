// What the exposure figures mean and what they do not, beside every one of them. Deference to local
// rules and occupational-health practice; sources as in the exposure module.
import { IN_USE_FACTOR } from "~/exposure";

export function ExposureCautions({ headingLevel = 3 }: { headingLevel?: 2 | 3 }) {
  const Heading = headingLevel === 2 ? "h2" : "h3";
  return (
    <aside
      aria-label="About these exposure figures"
      className="rounded-lg border-l-4 border-signal-500 bg-signal-100 p-3 text-sm text-stone-800"
    >
      <Heading className="mb-1 font-semibold">Read these figures with care</Heading>
      <ul className="list-disc space-y-1 pl-5">
        <li>
          The <strong>action value</strong> (2.5 m/s² A(8)) is where an employer must act to cut exposure; the{" "}
          <strong>limit value</strong> (5 m/s² A(8)) is not to be passed on any day (Directive 2002/44/EC).
        </li>
        <li>
          Declared values come from a standard test, not from a seized ball joint: many real tasks vibrate more. The
          in-use view multiplies them by {IN_USE_FACTOR}; a measurement on your own task is better still.
        </li>
        <li>
          Anti-vibration gloves are no substitute for less time on the trigger, a smoother tool or a better method.
        </li>
        <li>
          Wear hearing protection around air hammers and impact wrenches; a noise dose above 100 % means too much
          unprotected noise for one day.
        </li>
        <li>
          Tingling, numbness or white fingers, and ringing ears, are reasons for health surveillance and a word with an
          occupational-health professional.
        </li>
      </ul>
      <p className="mt-1 text-stone-700">
        These are estimates to compare tools, not an assessment: local regulations, occupational-health practice and the
        maker's instructions come first.
      </p>
    </aside>
  );
}
