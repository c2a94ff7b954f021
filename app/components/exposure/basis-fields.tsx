// The two settings every exposure view takes from the URL: jobs per day and declared or in-use vibration.
import { Form } from "react-router";
import { IN_USE_FACTOR, JOBS_PER_DAY, type VibrationBasis } from "~/exposure";

export function BasisChoice({ basis }: { basis: VibrationBasis }) {
  return (
    <fieldset className="space-y-1">
      <legend className="text-sm font-semibold">Vibration figures</legend>
      <label className="flex items-center gap-2 text-sm">
        <input type="radio" name="vib" value="declared" defaultChecked={basis === "declared"} className="h-5 w-5" />
        Declared (the maker's test)
      </label>
      <label className="flex items-center gap-2 text-sm">
        <input type="radio" name="vib" value="in-use" defaultChecked={basis === "in-use"} className="h-5 w-5" />
        In use (declared × {IN_USE_FACTOR})
      </label>
    </fieldset>
  );
}

function PerDayField({ perDay, id }: { perDay: number; id: string }) {
  return (
    <label htmlFor={id} className="block text-sm font-semibold">
      Jobs a day
      <input
        id={id}
        name="perday"
        type="number"
        inputMode="numeric"
        min={JOBS_PER_DAY.min}
        max={JOBS_PER_DAY.max}
        step={1}
        defaultValue={perDay}
        className="mt-1 block w-24 rounded border border-stone-300 px-2 py-1.5 font-normal"
      />
    </label>
  );
}

export function BasisNote({ basis }: { basis: VibrationBasis }) {
  return (
    <p className="text-xs text-stone-600">
      {basis === "declared"
        ? "Using the declared vibration values as they are."
        : `Using the declared vibration values × ${IN_USE_FACTOR}, for tasks rougher than the standard test (CEN/TR 15350's factors; the figure ${IN_USE_FACTOR} from memory).`}{" "}
      Time on the trigger is taken as the median time to free it, counting give-ups as the time spent before giving up.
    </p>
  );
}

/**
 * The panels' settings form (a GET form, so the settings live in the URL) and the note on the basis;
 * `keep` carries the page's own query along.
 */
export function ExposureSettings({
  perDay,
  basis,
  id,
  keep = [],
}: {
  perDay: number;
  basis: VibrationBasis;
  id: string;
  keep?: readonly (readonly [string, string])[];
}) {
  return (
    <>
      <Form method="get" preventScrollReset className="flex flex-wrap items-end gap-4">
        {keep.map(([name, value]) => (
          <input key={`${name}=${value}`} type="hidden" name={name} value={value} />
        ))}
        <PerDayField perDay={perDay} id={id} />
        <BasisChoice basis={basis} />
        <button type="submit" className="rounded bg-bay-700 px-4 py-2 font-semibold text-white">
          Work out the day
        </button>
      </Form>
      <BasisNote basis={basis} />
    </>
  );
}
