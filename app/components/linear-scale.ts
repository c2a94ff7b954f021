// A two-point linear scale for the site's SVG charts: the part of d3-scale's scaleLinear the charts
// use (domain, range, nice, ticks, calling it), with d3-array's tick rule (steps of 1, 2 or 5 × 10ⁿ),
// so the charts draw the same without shipping d3-scale and its interpolators to every page that
// has a chart (the client budget, scripts/client-budget.ts).

const E10 = Math.sqrt(50);
const E5 = Math.sqrt(10);
const E2 = Math.sqrt(2);

function tickSpec(start: number, stop: number, count: number): [number, number, number] {
  const step = (stop - start) / Math.max(0, count);
  const power = Math.floor(Math.log10(step));
  const error = step / Math.pow(10, power);
  const factor = error >= E10 ? 10 : error >= E5 ? 5 : error >= E2 ? 2 : 1;
  let i1: number;
  let i2: number;
  let inc: number;
  if (power < 0) {
    inc = Math.pow(10, -power) / factor;
    i1 = Math.round(start * inc);
    i2 = Math.round(stop * inc);
    if (i1 / inc < start) ++i1;
    if (i2 / inc > stop) --i2;
    inc = -inc;
  } else {
    inc = Math.pow(10, power) * factor;
    i1 = Math.round(start / inc);
    i2 = Math.round(stop / inc);
    if (i1 * inc < start) ++i1;
    if (i2 * inc > stop) --i2;
  }
  if (i2 < i1 && 0.5 <= count && count < 2) return tickSpec(start, stop, count * 2);
  return [i1, i2, inc];
}

/** Round numbers between start and stop, about `count` of them. */
export function ticks(start: number, stop: number, count: number): number[] {
  if (!(count > 0)) return [];
  if (start === stop) return [start];
  const reverse = stop < start;
  const [i1, i2, inc] = reverse ? tickSpec(stop, start, count) : tickSpec(start, stop, count);
  if (!(i2 >= i1)) return [];
  const n = i2 - i1 + 1;
  const out = new Array<number>(n);
  for (let i = 0; i < n; ++i) {
    const k = reverse ? i2 - i : i1 + i;
    out[i] = inc < 0 ? k / -inc : k * inc;
  }
  return out;
}

function tickIncrement(start: number, stop: number, count: number) {
  return tickSpec(start, stop, count)[2];
}

export interface LinearScale {
  (value: number): number;
  domain(): [number, number];
  domain(d: readonly [number, number] | readonly number[]): LinearScale;
  range(): [number, number];
  range(r: readonly [number, number] | readonly number[]): LinearScale;
  nice(count?: number): LinearScale;
  ticks(count?: number): number[];
  copy(): LinearScale;
}

export function scaleLinear<_R = number, _O = number>(): LinearScale {
  let d0 = 0;
  let d1 = 1;
  let r0 = 0;
  let r1 = 1;
  const scale = ((value: number) =>
    d1 === d0 ? (r0 + r1) / 2 : r0 + ((value - d0) / (d1 - d0)) * (r1 - r0)) as LinearScale;
  scale.domain = ((d?: readonly number[]) => {
    if (d === undefined) return [d0, d1];
    d0 = Number(d[0]);
    d1 = Number(d[d.length - 1]);
    return scale;
  }) as LinearScale["domain"];
  scale.range = ((r?: readonly number[]) => {
    if (r === undefined) return [r0, r1];
    r0 = Number(r[0]);
    r1 = Number(r[r.length - 1]);
    return scale;
  }) as LinearScale["range"];
  scale.ticks = (count = 10) => ticks(d0, d1, count);
  scale.copy = () => scaleLinear().domain([d0, d1]).range([r0, r1]);
  scale.nice = (count = 10) => {
    let start = d0;
    let stop = d1;
    const reverse = stop < start;
    if (reverse) [start, stop] = [stop, start];
    let prestep: number | undefined;
    for (let iter = 0; iter < 10; iter++) {
      const step = tickIncrement(start, stop, count);
      if (step === prestep) break;
      if (step > 0) {
        start = Math.floor(start / step) * step;
        stop = Math.ceil(stop / step) * step;
      } else if (step < 0) {
        start = Math.ceil(start * step) / step;
        stop = Math.floor(stop * step) / step;
      } else break;
      prestep = step;
    }
    [d0, d1] = reverse ? [stop, start] : [start, stop];
    return scale;
  };
  return scale;
}
