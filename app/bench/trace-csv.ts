// Reading a raw trace file: two columns, time (s) and value (N or N·m), one sample a line. Every
// refusal names the line or the limit; nothing half-read is returned.

/** A trace file refused, with a message for the person who uploaded it. */
export class TraceError extends Error {
  readonly line?: number;
  constructor(message: string, line?: number) {
    super(line === undefined ? message : `line ${formatNumber(line)}: ${message}`);
    this.name = "TraceError";
    if (line !== undefined) this.line = line;
  }
}

export const TRACE_MAX_ROWS = 2_000_000;
/** Sampling must be regular to within this fraction of the trace's mean interval. */
export const TRACE_RATE_TOLERANCE = 0.01;

export interface ParseTraceOptions {
  /** The sensor's capacity, in the value column's unit: a reading beyond it cannot be real. */
  capacity: number;
  maxRows?: number;
  /** Limit on the file's size in bytes (UTF-8). */
  maxBytes?: number;
  /** The sensor's declared sample rate; when given, the timestamps must agree with it to within 1 %. */
  rateHz?: number;
  /** Unit of the value column, for messages: "N" (default) or "N·m". */
  unit?: string;
}

const formatter = new Intl.NumberFormat("en-US", { maximumSignificantDigits: 6 });
function formatNumber(x: number) {
  return formatter.format(x);
}

/**
 * Parses a trace CSV. Header optional (a first line whose first cell is not a number, e.g.
 * "time_s,force_n"); blank lines are skipped; CRLF or LF. Checks, in order: size, row count,
 * column count, numbers, strictly increasing time, regular sampling (every interval within 1 % of
 * the mean interval, and of 1/rateHz when declared), and |value| ≤ capacity. The rate is
 * (rows − 1)/(last time − first time).
 *
 * Walks the text with indexOf (no split into a 600,000-element array, no regular expressions) and
 * fills Float64Arrays sized by a first count of the lines.
 */
export function parseTraceCsv(
  text: string,
  options: ParseTraceOptions,
): { rateHz: number; samples: Float64Array; timesS: Float64Array } {
  const { capacity, maxRows = TRACE_MAX_ROWS, maxBytes, unit = "N" } = options;
  if (!(capacity > 0)) throw new RangeError("capacity must be a positive number");
  if (maxBytes !== undefined && utf8Length(text, maxBytes) > maxBytes) {
    throw new TraceError(`the file is larger than the limit of ${formatNumber(maxBytes)} bytes`);
  }
  if (text.indexOf("\0") !== -1) throw new TraceError("this is not a CSV file (it holds binary data)");

  // Count lines first, stopping as soon as the limit is passed (one header line allowed).
  let lines = 0;
  for (let at = 0; at < text.length;) {
    const nl = text.indexOf("\n", at);
    lines++;
    if (lines > maxRows + 1) {
      throw new TraceError(`the file has more than ${formatNumber(maxRows)} rows, the limit for one trace`);
    }
    at = nl === -1 ? text.length : nl + 1;
  }

  const times = new Float64Array(lines);
  const values = new Float64Array(lines);
  const header = firstLine(text);
  let rows = 0;
  let lineNo = 0;
  let start = text.charCodeAt(0) === 0xfeff ? 1 : 0;
  while (start < text.length) {
    const nl = text.indexOf("\n", start);
    const from = start;
    let end = nl === -1 ? text.length : nl;
    start = end + 1;
    lineNo++;
    if (end > from && text.charCodeAt(end - 1) === 13) end--;
    const comma = text.indexOf(",", from);
    if (comma === -1 || comma >= end) {
      if (text.slice(from, end).trim() === "") continue;
      throw columnsError(1, unit, lineNo);
    }
    const second = text.indexOf(",", comma + 1);
    if (second !== -1 && second < end) throw columnsError(text.slice(from, end).split(",").length, unit, lineNo);
    const t = parseCell(text, from, comma);
    if (rows === 0 && lineNo === header && Number.isNaN(t)) continue; // the header
    if (Number.isNaN(t)) throw new TraceError(`'${text.slice(from, comma).trim()}' is not a number`, lineNo);
    const v = parseCell(text, comma + 1, end);
    if (Number.isNaN(v)) throw new TraceError(`'${text.slice(comma + 1, end).trim()}' is not a number`, lineNo);
    if (rows > 0 && !(t > times[rows - 1]!)) {
      throw new TraceError(
        `time ${formatNumber(t)} s is not after the previous row's ${formatNumber(times[rows - 1]!)} s`,
        lineNo,
      );
    }
    if (Math.abs(v) > capacity) {
      const word = v > 0 ? "above" : "beyond";
      throw new TraceError(
        `${formatNumber(v)} ${unit} is ${word} the sensor's capacity of ${formatNumber(capacity)} ${unit}`,
        lineNo,
      );
    }
    times[rows] = t;
    values[rows] = v;
    rows++;
  }
  if (rows < 2)
    throw new TraceError(`the file holds ${rows} sample${rows === 1 ? "" : "s"}; a trace needs at least two`);

  const mean = (times[rows - 1]! - times[0]!) / (rows - 1);
  checkRegular(text, times, rows, mean);
  const rateHz = 1 / mean;
  if (options.rateHz !== undefined && Math.abs(rateHz / options.rateHz - 1) > TRACE_RATE_TOLERANCE) {
    throw new TraceError(
      `the timestamps give a rate of ${formatNumber(rateHz)} Hz, which does not match the sensor's declared ${formatNumber(options.rateHz)} Hz`,
    );
  }
  return { rateHz, samples: values.subarray(0, rows), timesS: times.subarray(0, rows) };
}

function checkRegular(text: string, times: Float64Array, rows: number, mean: number) {
  for (let i = 1; i < rows; i++) {
    const dt = times[i]! - times[i - 1]!;
    if (Math.abs(dt - mean) > TRACE_RATE_TOLERANCE * mean) {
      throw new TraceError(
        `the interval of ${formatNumber(dt)} s before this row differs by more than 1 % from the trace's ` +
          `mean interval of ${formatNumber(mean)} s — a rate that does not match its timestamps`,
        lineOfRow(text, i),
      );
    }
  }
}

/** Number of the first non-blank line (1-based). */
function firstLine(text: string): number {
  let lineNo = 0;
  for (let at = 0; at < text.length;) {
    const nl = text.indexOf("\n", at);
    const end = nl === -1 ? text.length : nl;
    lineNo++;
    if (text.slice(at, end).replace("\ufeff", "").trim() !== "") return lineNo;
    at = end + 1;
  }
  return lineNo;
}

/** Line number of the data row `row` (0-based), found again only when a message needs it. */
function lineOfRow(text: string, row: number): number {
  const first = firstLine(text);
  let lineNo = 0;
  let seen = -1;
  for (let at = 0; at < text.length;) {
    const nl = text.indexOf("\n", at);
    const end = nl === -1 ? text.length : nl;
    lineNo++;
    const line = text.slice(at, end).replace("\ufeff", "");
    at = end + 1;
    if (line.trim() === "") continue;
    if (lineNo === first && Number.isNaN(toNumber(line.slice(0, line.indexOf(",")).trim()))) continue;
    if (++seen === row) return lineNo;
  }
  return lineNo;
}

function columnsError(found: number, unit: string, line: number) {
  return new TraceError(
    `expected two comma-separated columns, time (s) and value (${unit}); found ${found} — is this a CSV trace?`,
    line,
  );
}

const POW10 = Array.from({ length: 23 }, (_, k) => 10 ** k);

/**
 * The number in text[from, to), spaces around it allowed, or NaN. Plain decimals with at most 15
 * digits take the fast path: the digits as an exact integer divided once by an exact power of ten,
 * which is the correctly rounded value, the same as Number() gives (Clinger 1990). Anything else
 * (an exponent, more digits) goes through Number() after the checks of toNumber.
 */
function parseCell(text: string, from: number, to: number): number {
  let i = from;
  let end = to;
  while (i < end && (text.charCodeAt(i) === 32 || text.charCodeAt(i) === 9)) i++;
  while (end > i && (text.charCodeAt(end - 1) === 32 || text.charCodeAt(end - 1) === 9)) end--;
  let c = text.charCodeAt(i);
  const negative = c === 45;
  if (negative || c === 43) i++;
  let mantissa = 0;
  let decimals = 0;
  let digits = 0;
  let dot = false;
  for (; i < end; i++) {
    c = text.charCodeAt(i);
    if (c >= 48 && c <= 57) {
      if (mantissa >= 9e14) break;
      mantissa = mantissa * 10 + (c - 48);
      digits++;
      if (dot) decimals++;
    } else if (c === 46 && !dot) dot = true;
    else break;
  }
  if (i < end || digits === 0 || decimals > 22) return toNumber(text.slice(from, to).trim());
  const x = decimals ? mantissa / POW10[decimals]! : mantissa;
  return negative ? -x : x;
}

/** A decimal number or NaN; unlike Number(), an empty cell is not zero and hex is not a number. */
function toNumber(cell: string): number {
  if (cell === "") return NaN;
  const c = cell.charCodeAt(0);
  const c1 = cell.charCodeAt(1);
  const digitStart =
    (c >= 48 && c <= 57) || c === 46 || ((c === 45 || c === 43) && ((c1 >= 48 && c1 <= 57) || c1 === 46));
  if (!digitStart || (cell.length > 1 && (cell[1] === "x" || cell[1] === "X"))) return NaN;
  const x = Number(cell);
  return Number.isFinite(x) ? x : NaN;
}

/** UTF-8 length, exact only as far as needed to compare with the limit. */
function utf8Length(text: string, limit: number): number {
  if (text.length > limit) return text.length;
  if (text.length * 3 <= limit) return text.length;
  let bytes = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    bytes += c < 0x80 ? 1 : c < 0x800 ? 2 : c >= 0xd800 && c < 0xdc00 ? (i++, 4) : 3;
  }
  return bytes;
}
