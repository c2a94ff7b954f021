// One trial's trace: the CSV is read and analysed in the browser (the same functions the server
// runs on submit) and drawn with its blows marked, then sent straight to storage through a presigned
// PUT; the hidden field carries the upload's key. Without JavaScript the typed peaks are the way.
import { useState } from "react";
import { analyseTrace, decimateForDrawing, parseTraceCsv, TraceError } from "~/bench/trace";
import { benchUnit, formatBench, type BenchQuantity } from "~/bench/terms";
import type { Units } from "~/domain";
import { FieldError } from "../field";
import { presignedUpload } from "./presigned-upload";
import { TracePlot, type TraceDrawing } from "./trace-plot";

const MAX_BYTES = 40 * 1024 * 1024;

type State =
  | { stage: "idle" }
  | { stage: "sending" | "sent"; drawing: TraceDrawing; bpm: number | null; median: number }
  | { stage: "failed"; problem: string; drawing?: TraceDrawing };

export function TraceUpload({
  name,
  label,
  rigId,
  capacity,
  discardBlows,
  quantity,
  units,
  initialKey,
  error,
}: {
  name: string;
  label: string;
  rigId: number;
  capacity: number;
  discardBlows: number;
  quantity: BenchQuantity;
  units: Units;
  initialKey: string;
  error?: string;
}) {
  const [key, setKey] = useState(initialKey);
  const [state, setState] = useState<State>({ stage: "idle" });
  const { label: unit, perSi } = benchUnit(quantity, units);
  const id = `${name}-file`;

  async function onFile(file: File | undefined) {
    setKey("");
    if (!file) return setState({ stage: "idle" });
    if (file.size > MAX_BYTES) return setState({ stage: "failed", problem: "A trace file may be at most 40 MB." });
    let drawing: TraceDrawing;
    let bpm: number | null;
    let median: number;
    try {
      const { samples, rateHz } = parseTraceCsv(await file.text(), {
        capacity,
        maxBytes: MAX_BYTES,
        unit: quantity === "peak_force_n" ? "N" : "N·m",
      });
      const analysis = analyseTrace(samples, rateHz, { capacity, discardBlows });
      drawing = {
        buckets: decimateForDrawing(samples, rateHz, 600),
        blows: analysis.blows,
        baseline: analysis.baseline,
        capacity,
      };
      bpm = analysis.blowsPerMinute;
      median = analysis.summary.median;
    } catch (e) {
      const problem =
        e instanceof TraceError || e instanceof RangeError ? e.message : "This file could not be read as a trace.";
      return setState({ stage: "failed", problem: `${file.name}: ${problem}` });
    }
    setState({ stage: "sending", drawing, bpm, median });
    try {
      setKey(await presignedUpload("/api/bench/traces", { rigId, size: file.size }, file));
      setState({ stage: "sent", drawing, bpm, median });
    } catch (e) {
      setState({ stage: "failed", problem: (e as Error).message, drawing });
    }
  }

  const problem = state.stage === "failed" ? state.problem : error;
  return (
    <div className="space-y-2">
      <input type="hidden" name={name} value={key} />
      <label htmlFor={id} className="block text-sm font-semibold">
        {label}
      </label>
      <input
        id={id}
        type="file"
        accept=".csv,text/csv"
        aria-invalid={problem ? true : undefined}
        aria-describedby={problem ? `${id}-error` : undefined}
        onChange={(e) => void onFile(e.currentTarget.files?.[0])}
        className="block w-full text-sm"
      />
      <FieldError id={id} message={problem} />
      <p aria-live="polite" className="text-sm text-stone-700">
        {state.stage === "sending" && "Sending the trace…"}
        {state.stage === "sent" &&
          `Trace uploaded: ${state.drawing.blows.length} blows, median ${formatBench(quantity, state.median, units)}${
            state.bpm ? `, ${Math.round(state.bpm)} blows per minute` : ""
          }. The server checks it again on submit.`}
        {state.stage === "idle" && key && "A trace is attached to this trial."}
      </p>
      {"drawing" in state && state.drawing && (
        <TracePlot drawing={state.drawing} unit={unit} perSi={perSi} title={`Preview of ${label}`} />
      )}
    </div>
  );
}
