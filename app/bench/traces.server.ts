// Raw traces in object storage: read back, analysed and decimated for drawing. The analysis here is
// the authoritative one (the filing form's preview runs the same functions in the browser).
import { GetObjectCommand } from "@aws-sdk/client-s3";
import { s3, storageConfig } from "../storage/s3.server";
import { analyseTrace, decimateForDrawing, parseTraceCsv } from "./index";

/** The largest trace file read back: 60 s at 20 kHz, about 30 bytes a line. */
export const MAX_TRACE_BYTES = 40 * 1024 * 1024;

export async function readTraceText(key: string): Promise<string> {
  const res = await s3.send(new GetObjectCommand({ Bucket: storageConfig.bucket, Key: key }));
  return res.Body!.transformToString("utf-8");
}

export interface TraceOptions {
  capacity: number;
  discardBlows: number;
  unit?: string;
}

/** A trace's text analysed: the blows, the blow rate and the drawing's buckets. Throws TraceError on bad input. */
export function analyseTraceText(text: string, options: TraceOptions) {
  const { rateHz, samples } = parseTraceCsv(text, {
    capacity: options.capacity,
    maxBytes: MAX_TRACE_BYTES,
    unit: options.unit,
  });
  const analysis = analyseTrace(samples, rateHz, { capacity: options.capacity, discardBlows: options.discardBlows });
  return { rateHz, analysis, buckets: decimateForDrawing(samples, rateHz, 600) };
}

/** The drawings of a run's traced trials, by trial id; null where storage did not answer. */
export async function traceDrawings(
  trials: { id: number; trace_key: string | null }[],
  options: TraceOptions,
): Promise<
  Record<
    number,
    {
      buckets: { timeS: number; min: number; max: number }[];
      blows: { timeS: number; peak: number; clipped: boolean }[];
      baseline: number;
      capacity: number;
    } | null
  >
> {
  const out: Record<number, Awaited<ReturnType<typeof traceDrawings>>[number]> = {};
  await Promise.all(
    trials.map(async (t) => {
      if (!t.trace_key) return;
      try {
        const { analysis, buckets } = analyseTraceText(await readTraceText(t.trace_key), options);
        out[t.id] = { buckets, blows: analysis.blows, baseline: analysis.baseline, capacity: options.capacity };
      } catch (error) {
        console.warn(`[bench] trace ${t.trace_key} unreadable: ${(error as Error).message}`);
        out[t.id] = null;
      }
    }),
  );
  return out;
}
