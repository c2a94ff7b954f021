// `npm run bench:trace`: reading and analysing one raw bench trace at the size the issue names —
// 60 s at 10 kHz (600,000 samples), synthesized with blows at 3,000 per minute, noise and drift.
// Prints the median of several runs of parseTraceCsv and of analyseTrace (goal: analysis < 100 ms),
// wall-clock and CPU time (the CPU time is what the run cost when other work shares the cores), and
// what the analysis found. Figures only; nothing here passes or fails.
import { analyseTrace, parseTraceCsv, synthesizeTrace } from "../app/bench";

const RUNS = Number(process.env.BENCH_RUNS ?? 9);
const RATE = 10_000;
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[xs.length >> 1]!;
/** Wall-clock and CPU time of one call, in ms: on a shared machine the CPU time is the steadier figure. */
const time = (f: () => void) => {
  const c0 = process.cpuUsage();
  const t0 = performance.now();
  f();
  const cpu = process.cpuUsage(c0);
  return { wall: performance.now() - t0, cpu: (cpu.user + cpu.system) / 1000 };
};

const { samples, blows } = synthesizeTrace({
  rateHz: RATE,
  seconds: 60,
  blowsPerMinute: 3000,
  peak: 5000,
  peakSD: 300,
  noiseSD: 20,
  driftPerS: 2,
  seed: 1,
  capacity: 20_000,
});
const lines = ["time_s,force_n"];
for (let i = 0; i < samples.length; i++) lines.push(`${(i / RATE).toFixed(4)},${samples[i]!.toFixed(2)}`);
const csv = lines.join("\n") + "\n";
console.log(
  `Trace: ${samples.length.toLocaleString("en-US")} samples (60 s at 10 kHz), ${blows.length.toLocaleString("en-US")} blows, CSV ${(csv.length / 1e6).toFixed(1)} MB`,
);

const parseTimes: { wall: number; cpu: number }[] = [];
const analyseTimes: { wall: number; cpu: number }[] = [];
let parsed = parseTraceCsv(csv, { capacity: 20_000 });
let result = analyseTrace(parsed.samples, parsed.rateHz, { capacity: 20_000 });
for (let r = 0; r < RUNS; r++) {
  parseTimes.push(time(() => (parsed = parseTraceCsv(csv, { capacity: 20_000 }))));
  analyseTimes.push(time(() => (result = analyseTrace(parsed.samples, parsed.rateHz, { capacity: 20_000 }))));
}
const fmt = (runs: { wall: number; cpu: number }[]) => {
  const wall = runs.map((r) => r.wall);
  const cpu = runs.map((r) => r.cpu);
  return `median ${median(wall).toFixed(1)} ms wall (min ${Math.min(...wall).toFixed(1)}), ${median(cpu).toFixed(1)} ms CPU`;
};
console.log(`parseTraceCsv, ${RUNS} runs: ${fmt(parseTimes)}`);
console.log(`analyseTrace,  ${RUNS} runs: ${fmt(analyseTimes)}   goal < 100 ms`);
console.log(
  `Found ${result.blows.length.toLocaleString("en-US")} blows, ${result.blowsPerMinute?.toFixed(0)} per minute, ` +
    `median peak ${result.summary.median.toFixed(0)} N (p10 ${result.summary.p10.toFixed(0)}, p90 ${result.summary.p90.toFixed(0)})`,
);
