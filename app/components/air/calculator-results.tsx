// What the calculator works out: the pressure at the tool inlet while it runs, where the rest goes
// (segment by segment), the air the tool draws and where that figure came from, the compressor and
// the tank, the chart by hose bore, and how it is all estimated.
import type { CalculatorOutcome } from "~/air/calculator";
import { RUNNING_AIR_FACTOR, type RunningAir } from "~/air/line";
import { formatFlow, formatPressure, formatRunTime } from "~/domain";
import { InletChart } from "~/components/inlet-chart";
import { LineWaterfall } from "./line-waterfall";

type Outcome = Extract<CalculatorOutcome, { ok: true }>;

export function CalculatorResults({ input, result, toolFrom, pressureUnit, metric }: Outcome) {
  const p = (kpa: number) => formatPressure(kpa, pressureUnit);
  const flow = (lps: number) => formatFlow(lps, metric ? "mm" : "in");
  const share = (x: number) => `${Math.round((100 * x) / Math.max(input.supplyKpa, 1e-9))} %`;
  const { point, tank } = result;
  return (
    <>
      <div
        className={`rounded-lg border p-4 ${result.belowRating ? "border-amber-400 bg-amber-50" : "border-bay-600 bg-bay-100"}`}
      >
        <p className="text-sm text-stone-700">Estimated pressure at the tool inlet while it runs</p>
        <p className="text-4xl font-bold" data-testid="inlet-pressure">
          {p(point.inletKpa)}
        </p>
        <p className="mt-1 text-sm">
          {point.stalled
            ? "This line cannot pass what the tool needs: it will barely run."
            : !result.belowRating
              ? `At or above the tool's ${p(result.ratingKpa)} rating.`
              : result.supplyNeededKpa != null
                ? `Below the tool's ${p(result.ratingKpa)} rating. To get it, the line needs about ${p(result.supplyNeededKpa)} at the regulator — if the tool is rated for that, otherwise a bigger hose or fewer couplers.`
                : `Below the tool's ${p(result.ratingKpa)} rating, and no regulator setting gets it there through this line: a bigger hose or fewer couplers.`}
        </p>
      </div>
      <dl className="grid gap-3 sm:grid-cols-3">
        <Figure label="Lost in the hose" value={`${p(result.loss.hose)} (${share(result.loss.hose)})`} />
        <Figure label="Lost in the couplers" value={`${p(result.loss.couplers)} (${share(result.loss.couplers)})`} />
        <Figure
          label="Air the tool draws while running, at that pressure"
          value={flow(point.demandLps)}
          note={runningNote(point.running, toolFrom, flow, input.tool.ratedLps)}
        />
        <Figure
          label="Compressor"
          value={result.compressorShort ? `Short by ${flow(point.demandLps - input.compressorLps)}` : "Keeps up"}
          warn={result.compressorShort}
        />
        <Figure
          label="Run time before it sags below the rating"
          value={
            tank.ending === "below_minimum_from_start"
              ? "Below rating from the start"
              : tank.ending === "compressor_keeps_up"
                ? "Indefinitely (the compressor keeps up)"
                : formatRunTime(tank.seconds)
          }
          warn={
            tank.ending === "below_minimum_from_start" || (tank.ending === "inlet_below_minimum" && tank.seconds < 60)
          }
          note={
            tank.ending === "inlet_below_minimum"
              ? `From a full tank at cut-out; tank at ${p(tank.floorTankKpa)} when it sags. Assumes the ${TANK_NOTE}.`
              : tank.ending === "compressor_keeps_up" && result.compressorShort
                ? `The compressor falls a little short at full pressure, so the tank drains until the inlet nears the rating; there the tool draws less and the compressor keeps up. Assumes the ${TANK_NOTE}.`
                : `Assumes the ${TANK_NOTE}.`
          }
        />
      </dl>
      <LineWaterfall
        supplyKpa={input.supplyKpa}
        segments={result.segments}
        inletKpa={point.inletKpa}
        ratingKpa={result.ratingKpa}
        pressureUnit={pressureUnit}
      />
      <InletChart
        supplyKpa={input.supplyKpa}
        tool={input.tool}
        line={input.line}
        ratingKpa={result.ratingKpa}
        current={{ hoseLengthM: input.line.hoseLengthM, inletKpa: point.inletKpa }}
        pressureUnit={pressureUnit}
        metric={metric}
      />
      <details className="rounded-lg border border-stone-200 bg-white p-4 text-sm text-stone-700">
        <summary className="cursor-pointer font-semibold">How this is worked out</summary>
        <ul className="mt-2 list-disc space-y-1 pl-5">
          <li>
            The line is taken in the order the air meets it: regulator, couplers, hose, whip. Each piece is worked out
            at the pressure where it sits, so couplers near the tool cost more than the same couplers at the regulator.
          </li>
          <li>
            Hose: the empirical line-loss formula of a compressed-air handbook, dp/dx = −450 · q<sup>1.85</sup> / (d
            <sup>5</sup> · p) (bar, l/s free air, m, mm, bar absolute), integrated along the hose: p<sub>2</sub>² = p
            <sub>1</sub>² − 2 · 450 · q<sup>1.85</sup> · l / d<sup>5</sup>. It was fitted to steel pipe; hose charts
            differ from it by up to about 2×.
          </li>
          <li>
            Couplers: each plug-and-socket pair as a short length at its throat bore (throat sizes from memory, length
            our own estimate — not a published table).
          </li>
          <li>
            Air use: what the tool draws while hammering or impacting, not the catalogue average. Where the catalogue
            has no running figure we take {RUNNING_AIR_FACTOR}× the average (from memory: running use is about 2–3× the
            stated average) and say so. It scales with absolute inlet pressure (common practice).
          </li>
          <li>
            Operating pressure: the inlet pressure at which the line, passing what the tool draws at that pressure,
            delivers exactly that pressure — solved by bisection.
          </li>
          <li>
            Run time: the tank's pressure stepped through time, from cut-out with the compressor off, the tool drawing
            its running use at whatever the line leaves it, the compressor's delivery netted off once it cuts in; it
            ends when the inlet falls below the rating.
          </li>
          <li>These are estimates. A gauge at the tool inlet, read while the tool runs, beats every formula here.</li>
        </ul>
      </details>
    </>
  );
}

const TANK_NOTE = "air in the tank stays at room temperature and the regulator holds its setting without droop";

function runningNote(r: RunningAir, toolFrom: Outcome["toolFrom"], flow: (lps: number) => string, ratedLps: number) {
  const at90 = `${flow(r.lps)} at 90 psi`;
  if (toolFrom === "typed" && r.source !== "estimated") return `${at90}, your figure.`;
  if (r.source === "estimated")
    return `${at90}: an estimate, ${(r.factor ?? r.lps / ratedLps).toFixed(1)}× its rated average of ${flow(ratedLps)}.`;
  return `${at90}, from the catalogue (${r.source === "maker_sheet" ? "maker's sheet" : "measured"}).`;
}

function Figure({ label, value, warn = false, note }: { label: string; value: string; warn?: boolean; note?: string }) {
  return (
    <div className={`rounded-lg border bg-white p-3 ${warn ? "border-amber-400" : "border-stone-200"}`}>
      <dt className="text-xs text-stone-600">{label}</dt>
      <dd className="font-semibold">{value}</dd>
      {note && <dd className="mt-1 text-xs text-stone-600">{note}</dd>}
    </div>
  );
}

/** The cautions that go with any advice about an air line. */
export function AirSafetyNotes() {
  return (
    <aside
      aria-labelledby="air-safety"
      className="rounded-lg border-l-4 border-signal-500 bg-signal-100 p-4 text-sm text-stone-800"
    >
      <h2 id="air-safety" className="mb-2 font-semibold">
        Compressed air can hurt you
      </h2>
      <ul className="list-disc space-y-1 pl-5">
        <li>
          Use hose, couplers and fittings rated for at least the highest pressure the system can reach (the compressor's
          cut-out or its safety valve).
        </li>
        <li>
          A hose that parts or a coupler that lets go under pressure whips hard: secure long runs, check for wear, and
          use whip checks on larger lines.
        </li>
        <li>
          Never blow air at skin or clothing: air can enter the body through the skin. Air for cleaning must be reduced
          below 30 psi, with chip guarding and eye protection (OSHA 29 CFR 1910.242(b)).
        </li>
        <li>
          Do not raise the regulator past the tool's rated inlet pressure to make up for a poor line — fix the line.
        </li>
      </ul>
      <p className="mt-2 text-stone-700">The maker's instructions, local codes and licensed practice come first.</p>
    </aside>
  );
}
