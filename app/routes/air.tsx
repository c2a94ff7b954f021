import { useMemo, useState } from "react";
import { data, Form } from "react-router";
import { z } from "zod";
import { CALCULATOR_DEFAULTS, calculatorSchema, toSupplyInput } from "~/air/calculator-form";
import { COUPLER_PROFILES } from "~/air/couplers";
import { analyseSupply, type SupplyAnalysis, type SupplyInput } from "~/air/supply";
import { kpaTo, lpsToScfm, type PressureUnit } from "~/air/units";
import { getUser } from "~/auth/session.server";
import { listModels } from "~/catalogue/queries.server";
import { ErrorPage } from "~/components/error-page";
import { Field as FieldPrimitive, inputClass, Select as SelectPrimitive } from "~/components/field";
import { InletChart } from "~/components/inlet-chart";
import { db } from "~/db.server";
import { type FieldErrors } from "~/utils/forms";
import type { Route } from "./+types/air";

export async function loader({ request }: Route.LoaderArgs) {
  const [user, models] = await Promise.all([getUser(request), listModels(db)]);
  const tools = models.map((m) => ({ slug: m.slug, label: `${m.maker_name} ${m.model_code} (${m.category_name})`, ratedLps: m.rated_air_lps }));
  const params = Object.fromEntries(new URL(request.url).searchParams);
  const metric = (params.lu ?? (user?.lengthUnit === "mm" ? "mm" : "in")) === "mm";
  const defaults = { ...CALCULATOR_DEFAULTS[metric ? "mm" : "in"], ...(user && !params.pu ? { pu: user.pressureUnit } : {}) };
  const values: Record<string, string> = { ...defaults, ...params };
  const outcome = evaluate(values, tools);
  // A plain GET with values that make no sense answers 400 with the field messages.
  return data({ tools, values, serverErrors: outcome.ok ? {} : outcome.errors }, { status: outcome.ok || Object.keys(params).length === 0 ? 200 : 400 });
}

type Tool = { slug: string; label: string; ratedLps: number };
type Outcome =
  | { ok: true; input: SupplyInput; result: SupplyAnalysis; pressureUnit: PressureUnit; metric: boolean }
  | { ok: false; errors: FieldErrors };

/** Shared by the loader and the live form: parse the typed values, then analyse the supply. */
function evaluate(values: Record<string, string>, tools: Tool[]): Outcome {
  const parsed = calculatorSchema.safeParse(values);
  if (!parsed.success) return { ok: false, errors: z.flattenError(parsed.error).fieldErrors as FieldErrors };
  const tool = parsed.data.tool ? tools.find((t) => t.slug === parsed.data.tool) : null;
  if (parsed.data.tool && !tool) return { ok: false, errors: { tool: ["No such tool in the catalogue"] } };
  const input = toSupplyInput(parsed.data, tool?.ratedLps ?? null);
  return { ok: true, input, result: analyseSupply(input), pressureUnit: parsed.data.pu, metric: parsed.data.lu === "mm" };
}

export default function AirCalculator({ loaderData }: Route.ComponentProps) {
  const { tools, serverErrors } = loaderData;
  const [values, setValues] = useState<Record<string, string>>(loaderData.values);
  const [touched, setTouched] = useState(false);
  const outcome = useMemo(() => evaluate(values, tools), [values, tools]);
  const errors: FieldErrors = outcome.ok ? {} : touched ? outcome.errors : serverErrors;
  const metric = values.lu === "mm";
  const pu = (values.pu ?? "psi") as PressureUnit;

  function onChange(event: React.FormEvent<HTMLFormElement>) {
    const form = new FormData(event.currentTarget);
    const next = Object.fromEntries([...form].map(([k, v]) => [k, String(v)]));
    // Switching units starts from that system's defaults rather than misreading the numbers.
    if (next.lu !== values.lu) Object.assign(next, CALCULATOR_DEFAULTS[next.lu === "mm" ? "mm" : "in"], { lu: next.lu, tool: next.tool ?? "" });
    setTouched(true);
    setValues(next);
  }

  return (
    <div className="space-y-6">
      <header>
        <h1 className="text-2xl font-bold">What reaches my tool?</h1>
        <p className="max-w-3xl text-stone-700">
          A regulator at 100 psi does not mean 100 psi at the tool. The hose, the couplers and the compressor decide what the tool
          gets while it runs. Enter your air supply and see the pressure at the inlet — an estimate, with its method below.
        </p>
      </header>

      <div className="grid gap-6 lg:grid-cols-[minmax(0,22rem)_minmax(0,1fr)]">
        <Form method="get" onChange={onChange} className="space-y-4 rounded-lg border border-stone-200 bg-white p-4" key={values.lu}>
          <fieldset className="grid grid-cols-2 gap-3">
            <legend className="mb-1 font-semibold">Units</legend>
            <Select name="lu" label="System" value={values.lu} options={[["in", "in · ft · SCFM · gal"], ["mm", "mm · m · l/s · l"]]} />
            <Select name="pu" label="Pressure" value={pu} options={[["psi", "psi"], ["bar", "bar"], ["kPa", "kPa"]]} />
          </fieldset>
          <fieldset className="space-y-3">
            <legend className="mb-1 font-semibold">Supply and line</legend>
            <Field name="supply" label={`Regulator (or tank) pressure, ${pu}`} values={values} errors={errors} inputMode="decimal" />
            <Field name="hid" label={`Hose inside diameter, ${metric ? "mm" : "in"}`} values={values} errors={errors} list="hose-ids" />
            <datalist id="hose-ids">
              {(metric ? ["6.35", "7.9", "9.5", "12.7"] : ["1/4", "5/16", "3/8", "1/2"]).map((v) => <option key={v} value={v} />)}
            </datalist>
            <Field name="hlen" label={`Hose length, ${metric ? "m" : "ft"}`} values={values} errors={errors} inputMode="decimal" />
            <div className="grid grid-cols-[1fr_6rem] gap-3">
              <Select name="cp" label="Coupler profile" value={values.cp} options={Object.entries(COUPLER_PROFILES).map(([k, c]) => [k, c.label])} />
              <Field name="cc" label="Couplers" values={values} errors={errors} inputMode="numeric" />
            </div>
          </fieldset>
          <fieldset className="space-y-3">
            <legend className="mb-1 font-semibold">Tool</legend>
            <Select name="tool" label="From the catalogue" value={values.tool ?? ""} options={[["", "— type its air use instead —"], ...tools.map((t) => [t.slug, t.label] as [string, string])]} />
            {errors.tool && <p className="text-sm text-red-700">{errors.tool[0]}</p>}
            {!values.tool && <Field name="cons" label={`Rated air use at 90 psi, ${metric ? "l/s" : "SCFM"}`} values={values} errors={errors} inputMode="decimal" />}
          </fieldset>
          <fieldset className="space-y-3">
            <legend className="mb-1 font-semibold">Compressor and tank</legend>
            <Field name="comp" label={`Compressor delivery (free air), ${metric ? "l/s" : "SCFM"}`} values={values} errors={errors} inputMode="decimal" />
            <Field name="tank" label={`Tank size, ${metric ? "l" : "gal"}`} values={values} errors={errors} inputMode="decimal" />
            <div className="grid grid-cols-2 gap-3">
              <Field name="cout" label={`Cut-out, ${pu}`} values={values} errors={errors} inputMode="decimal" />
              <Field name="cin" label={`Cut-in, ${pu}`} values={values} errors={errors} inputMode="decimal" />
            </div>
          </fieldset>
          {/* Without JavaScript this works the figures out; with it they update as you type and this keeps them in the address. */}
          <button type="submit" className="w-full rounded bg-bay-700 px-4 py-3 font-semibold text-white">Work it out and keep as a link</button>
        </Form>

        <section aria-labelledby="results-heading" aria-live="polite" className="space-y-4">
          <h2 id="results-heading" className="sr-only">Results</h2>
          {outcome.ok ? <Results {...outcome} /> : (
            <p className="rounded-lg border border-stone-200 bg-white p-4 text-stone-700">Fix the fields marked in red to see what reaches the tool.</p>
          )}
        </section>
      </div>

      <SafetyNotes />
    </div>
  );
}

function Results({ input, result, pressureUnit, metric }: Extract<Outcome, { ok: true }>) {
  const p = (kpa: number) => `${kpaTo(kpa, pressureUnit).toFixed(pressureUnit === "bar" ? 2 : 0)} ${pressureUnit}`;
  const flow = (lps: number) => (metric ? `${lps.toFixed(2)} l/s` : `${lpsToScfm(lps).toFixed(1)} SCFM`);
  const share = (x: number) => `${Math.round((100 * x) / Math.max(input.supplyKpa, 1e-9))} %`;
  return (
    <>
      <div className={`rounded-lg border p-4 ${result.belowRating ? "border-amber-400 bg-amber-50" : "border-bay-600 bg-bay-100"}`}>
        <p className="text-sm text-stone-700">Estimated pressure at the tool inlet while it runs</p>
        <p className="text-4xl font-bold" data-testid="inlet-pressure">{p(result.inletKpa)}</p>
        <p className="mt-1 text-sm">
          {result.stalled ? "This line cannot pass what the tool needs: it will barely run."
            : result.belowRating ? `Below the tool's ${p(result.ratingKpa)} rating. To get it, the line needs about ${p(result.supplyNeededKpa)} at the regulator — or a bigger hose.`
              : `At or above the tool's ${p(result.ratingKpa)} rating.`}
        </p>
      </div>
      <dl className="grid gap-3 sm:grid-cols-3">
        <Figure label="Lost in the hose" value={`${p(result.loss.hose)} (${share(result.loss.hose)})`} />
        <Figure label="Lost in the couplers" value={`${p(result.loss.couplers)} (${share(result.loss.couplers)})`} />
        <Figure label="Tool's air use at that pressure" value={flow(result.demandLps)} />
        <Figure
          label="Compressor"
          value={result.compressorShort ? `Short by ${flow(result.demandLps - input.tank.compressorLps)}` : "Keeps up"}
          warn={result.compressorShort}
        />
        <Figure
          label="Run time before it sags below the rating"
          value={result.belowRating ? "Below rating from the start" : Number.isFinite(result.runTimeS) ? formatRun(result.runTimeS) : "Indefinitely (the compressor keeps up)"}
          warn={result.belowRating || (Number.isFinite(result.runTimeS) && result.runTimeS < 60)}
        />
      </dl>
      <LossBar hose={result.loss.hose} couplers={result.loss.couplers} supply={input.supplyKpa} />
      <InletChart
        supplyKpa={input.supplyKpa} ratedLps={input.ratedLps} couplerProfile={input.line.couplerProfile} couplerCount={input.line.couplerCount}
        ratingKpa={result.ratingKpa} current={{ hoseLengthM: input.line.hoseLengthM, inletKpa: result.inletKpa }} pressureUnit={pressureUnit} metric={metric}
      />
      <details className="rounded-lg border border-stone-200 bg-white p-4 text-sm text-stone-700">
        <summary className="cursor-pointer font-semibold">How this is worked out</summary>
        <ul className="mt-2 list-disc space-y-1 pl-5">
          <li>Hose loss: Δp = 450 · q<sup>1.85</sup> · l / (d<sup>5</sup> · p) (bar, l/s free air, m, mm, bar absolute at the regulator), the empirical line-loss formula of a compressed-air handbook. It was fitted to steel pipe; hose charts differ from it by up to about 2×.</li>
          <li>Couplers: each plug-and-socket pair counted as a few metres of pipe at the coupler's throat bore (our rough figures per profile, not a published table).</li>
          <li>Air use: the tool's rating at 90 psi scaled with absolute inlet pressure (common practice).</li>
          <li>Operating pressure: the inlet pressure at which regulator pressure minus line loss at the tool's demand balances, solved by bisection.</li>
          <li>Run time: free air stored in the tank between cut-out and the pressure the line needs for the rating, V·Δp/p<sub>atm</sub>, drained by the tool; below cut-in the compressor's delivery is netted off.</li>
          <li>These are estimates. A gauge at the tool inlet, read while the tool runs, beats every formula here.</li>
        </ul>
      </details>
    </>
  );
}

function LossBar({ hose, couplers, supply }: { hose: number; couplers: number; supply: number }) {
  const pct = (x: number) => `${Math.min(100, (100 * x) / Math.max(supply, 1e-9))}%`;
  return (
    <div aria-hidden className="rounded-lg border border-stone-200 bg-white p-3">
      <p className="mb-1 text-xs text-stone-600">Where the regulator's pressure goes</p>
      <div className="flex h-4 w-full overflow-hidden rounded bg-bay-600">
        <div className="ml-auto bg-amber-500" style={{ width: pct(hose) }} />
        <div className="bg-red-600" style={{ width: pct(couplers) }} />
      </div>
      <p className="mt-1 flex gap-4 text-xs text-stone-700">
        <span><span className="inline-block h-2 w-3 bg-bay-600" /> reaches the tool</span>
        <span><span className="inline-block h-2 w-3 bg-amber-500" /> hose</span>
        <span><span className="inline-block h-2 w-3 bg-red-600" /> couplers</span>
      </p>
    </div>
  );
}

function Figure({ label, value, warn = false }: { label: string; value: string; warn?: boolean }) {
  return (
    <div className={`rounded-lg border bg-white p-3 ${warn ? "border-amber-400" : "border-stone-200"}`}>
      <dt className="text-xs text-stone-600">{label}</dt>
      <dd className="font-semibold">{value}</dd>
    </div>
  );
}

const formatRun = (s: number) => (s < 120 ? `${Math.round(s)} s` : `${(s / 60).toFixed(1)} min`);

/** A calculator field: the shared Field, bound to the typed values and their errors. */
function Field({ name, label, values, errors, ...rest }: { name: string; label: string; values: Record<string, string>; errors: FieldErrors } & React.InputHTMLAttributes<HTMLInputElement>) {
  return (
    <FieldPrimitive id={name} label={label} labelClassName="text-sm font-semibold" error={errors[name]?.[0]}>
      {(control) => <input name={name} defaultValue={values[name] ?? ""} {...control} className={inputClass} autoComplete="off" {...rest} />}
    </FieldPrimitive>
  );
}

function Select({ name, label, value, options }: { name: string; label: string; value: string | undefined; options: [string, string][] }) {
  return <SelectPrimitive id={name} name={name} label={label} labelClassName="text-sm font-semibold" defaultValue={value} options={options} />;
}

function SafetyNotes() {
  return (
    <aside aria-labelledby="air-safety" className="rounded-lg border-l-4 border-signal-500 bg-signal-100 p-4 text-sm text-stone-800">
      <h2 id="air-safety" className="mb-2 font-semibold">Compressed air can hurt you</h2>
      <ul className="list-disc space-y-1 pl-5">
        <li>Use hose, couplers and fittings rated for at least the highest pressure the system can reach (the compressor's cut-out or its safety valve).</li>
        <li>A hose that parts or a coupler that lets go under pressure whips hard: secure long runs, check for wear, and use whip checks on larger lines.</li>
        <li>Never blow air at skin or clothing: air can enter the body through the skin. Air for cleaning must be reduced below 30 psi, with chip guarding and eye protection (OSHA 29 CFR 1910.242(b)).</li>
        <li>Do not raise the regulator past the tool's rated inlet pressure to make up for a poor line — fix the line.</li>
      </ul>
      <p className="mt-2 text-stone-700">The maker's instructions, local codes and licensed practice come first.</p>
    </aside>
  );
}

export function meta() {
  return [
    { title: "What reaches my tool? — Bayproof" },
    { name: "description", content: "Estimate the pressure at an air tool's inlet from your regulator, hose, couplers and compressor." },
  ];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
