import { data, Form } from "react-router";
import { calculatorTools, evaluateCalculator, startingValues } from "~/air/calculator";
import { unitsFor } from "~/auth/units.server";
import { listModels } from "~/catalogue/queries.server";
import { CalculatorFields } from "~/components/air/calculator-fields";
import { AirSafetyNotes, CalculatorResults } from "~/components/air/calculator-results";
import { useAirCalculator } from "~/components/air/use-air-calculator";
import { ErrorPage } from "~/components/error-page";
import { readDb } from "~/db.server";
import type { Route } from "./+types/air";

export async function loader({ request }: Route.LoaderArgs) {
  const [units, models] = await Promise.all([unitsFor(request), listModels(readDb)]);
  const tools = calculatorTools(models);
  const params = Object.fromEntries(new URL(request.url).searchParams);
  const values = startingValues(params, { pressureUnit: units.pressure, lengthUnit: units.length });
  const outcome = evaluateCalculator(values, tools);
  // A plain GET with values that make no sense answers 400 with the field messages.
  return data(
    { tools, values, serverErrors: outcome.ok ? {} : outcome.errors },
    { status: outcome.ok || Object.keys(params).length === 0 ? 200 : 400 },
  );
}

export default function AirCalculator({ loaderData }: Route.ComponentProps) {
  const { tools, serverErrors } = loaderData;
  const { values, outcome, errors, onChange, metric, pu } = useAirCalculator(loaderData.values, tools, serverErrors);

  return (
    <div className="space-y-6">
      <header>
        <h1 className="text-2xl font-bold">What reaches my tool?</h1>
        <p className="max-w-3xl text-stone-700">
          A regulator at 100 psi does not mean 100 psi at the tool. The hose, the couplers and the compressor decide
          what the tool gets while it runs. Enter your air supply and see the pressure at the inlet — an estimate, with
          its method below.
        </p>
      </header>

      <div className="grid gap-6 lg:grid-cols-[minmax(0,22rem)_minmax(0,1fr)]">
        <Form
          method="get"
          onChange={onChange}
          className="space-y-4 rounded-lg border border-stone-200 bg-white p-4"
          key={values.lu}
        >
          <CalculatorFields values={values} errors={errors} tools={tools} metric={metric} pu={pu} />
          {/* Without JavaScript this works the figures out; with it they update as you type and this keeps them in the address. */}
          <button type="submit" className="w-full rounded bg-bay-700 px-4 py-3 font-semibold text-white">
            Work it out and keep as a link
          </button>
        </Form>

        <section aria-labelledby="results-heading" aria-live="polite" className="space-y-4">
          <h2 id="results-heading" className="sr-only">
            Results
          </h2>
          {outcome.ok ? (
            <CalculatorResults {...outcome} />
          ) : (
            <p className="rounded-lg border border-stone-200 bg-white p-4 text-stone-700">
              Fix the fields marked in red to see what reaches the tool.
            </p>
          )}
        </section>
      </div>

      <AirSafetyNotes />
    </div>
  );
}

export function meta() {
  return [
    { title: "What reaches my tool? — Bayproof" },
    {
      name: "description",
      content: "Estimate the pressure at an air tool's inlet from your regulator, hose, couplers and compressor.",
    },
  ];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
