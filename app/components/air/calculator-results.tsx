// What the calculator works out: the pressure at the tool inlet, where the rest goes, the
// compressor and the tank, the chart by hose bore, and how it is all estimated.
import type { CalculatorOutcome } from "~/air/calculator";
import { formatFlow, formatPressure, formatRunTime } from "~/domain";
import { InletChart } from "~/components/inlet-chart";

export function CalculatorResults({ input, result, pressureUnit, metric }: Extract<CalculatorOutcome, { ok: true }>) {
  const p = (kpa: number) => formatPressure(kpa, pressureUnit);
  const flow = (lps: number) => formatFlow(lps, metric ? "mm" : "in");
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
          value={result.belowRating ? "Below rating from the start" : Number.isFinite(result.runTimeS) ? formatRunTime(result.runTimeS) : "Indefinitely (the compressor keeps up)"}
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

/** The cautions that go with any advice about an air line. */
export function AirSafetyNotes() {
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
