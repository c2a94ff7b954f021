// Reading trace files: a good file in its usual shapes, and every refusal with the message a rig
// owner sees (naming the line or the limit).
import { describe, expect, it } from "vitest";
import { parseTraceCsv, TraceError } from "~/bench";

const RATE = 10_000;
/** A file of `rows` samples at 10 kHz, values from `value(i)`, with an optional header. */
function traceFile(rows: number, value: (i: number) => string = (i) => String(i % 7), header = "time_s,force_n") {
  const lines = header ? [header] : [];
  for (let i = 0; i < rows; i++) lines.push(`${(i / RATE).toFixed(4)},${value(i)}`);
  return lines.join("\n") + "\n";
}

function refusal(text: string, options: Parameters<typeof parseTraceCsv>[1] = { capacity: 10_000 }) {
  try {
    parseTraceCsv(text, options);
  } catch (e) {
    expect(e).toBeInstanceOf(TraceError);
    return e as TraceError;
  }
  throw new Error("the file was accepted");
}

describe("parseTraceCsv reads a trace", () => {
  it("with a header: the rate from the timestamps, the values in order", () => {
    const parsed = parseTraceCsv(traceFile(1000), { capacity: 10_000 });
    expect(parsed.rateHz).toBeCloseTo(RATE, 6);
    expect(parsed.samples).toHaveLength(1000);
    expect(parsed.samples[8]).toBe(1);
    expect(parsed.timesS[999]).toBeCloseTo(0.0999, 12);
  });

  it("without a header, with CRLF line ends, a byte-order mark, spaces and a blank last line", () => {
    const text = "\ufeff" + traceFile(50, (i) => ` ${i * 1.5} `, "").replace(/\n/g, "\r\n") + "\r\n";
    const parsed = parseTraceCsv(text, { capacity: 10_000 });
    expect(parsed.samples).toHaveLength(50);
    expect(parsed.samples[49]).toBe(73.5);
    expect(parsed.timesS[0]).toBe(0);
  });

  it("a reading exactly at the capacity is kept (the analysis marks it clipped)", () => {
    const parsed = parseTraceCsv(
      traceFile(10, (i) => (i === 5 ? "10000" : "1")),
      { capacity: 10_000 },
    );
    expect(parsed.samples[5]).toBe(10_000);
  });

  it("negative readings and exponent notation", () => {
    const parsed = parseTraceCsv("t,F\n0,-1.5e2\n1e-4,2.5E1\n2e-4,0\n", { capacity: 10_000 });
    expect(Array.from(parsed.samples)).toEqual([-150, 25, 0]);
  });
});

describe("parseTraceCsv refuses a bad file with a message naming the line or the limit", () => {
  it("not CSV at all", () => {
    const e = refusal("This is a note about the run.\nIt has no numbers.\n");
    expect(e.message).toBe(
      "line 1: expected two comma-separated columns, time (s) and value (N); found 1 — is this a CSV trace?",
    );
    expect(e.line).toBe(1);
  });

  it("binary data", () => {
    expect(refusal("\u0089PNG\r\n\u001a\n\0\0\0\rIHDR").message).toBe("this is not a CSV file (it holds binary data)");
  });

  it("the wrong number of columns", () => {
    const e = refusal(traceFile(20).replace("0.0005,5", "0.0005,5,5"));
    expect(e.message).toMatch(/^line 7: expected two comma-separated columns.*found 3/);
    expect(e.line).toBe(7);
  });

  it("a cell that is not a number", () => {
    const e = refusal(traceFile(20, (i) => (i === 12 ? "abc" : "1")));
    expect(e.message).toBe("line 14: 'abc' is not a number");
    expect(e.line).toBe(14);
    expect(refusal(traceFile(20, (i) => (i === 3 ? "" : "1"))).message).toBe("line 5: '' is not a number");
    expect(refusal(traceFile(20, (i) => (i === 3 ? "0x10" : "1"))).message).toBe("line 5: '0x10' is not a number");
    expect(refusal(traceFile(20).replace("0.0002,", "zero,")).message).toBe("line 4: 'zero' is not a number");
  });

  it("time that does not increase", () => {
    const e = refusal(traceFile(20).replace("0.0006,", "0.0005,"));
    expect(e.message).toBe("line 8: time 0.0005 s is not after the previous row's 0.0005 s");
    expect(e.line).toBe(8);
  });

  it("a rate that does not match its timestamps: a gap in the sampling", () => {
    const text = traceFile(200)
      .split("\n")
      .filter((_, i) => i !== 101)
      .join("\n");
    const e = refusal(text);
    expect(e.line).toBe(102);
    expect(e.message).toMatch(/^line 102: the interval of 0\.0002 s before this row differs by more than 1 %/);
    expect(e.message).toMatch(/a rate that does not match its timestamps$/);
  });

  it("a rate that does not match the sensor's declared rate", () => {
    const e = refusal(traceFile(100), { capacity: 10_000, rateHz: 5000 });
    expect(e.message).toBe(
      "the timestamps give a rate of 10,000 Hz, which does not match the sensor's declared 5,000 Hz",
    );
    expect(e.line).toBeUndefined();
  });

  it("too many rows: 50 million is refused at the limit, without reading them all", () => {
    const e = refusal("0,0\n".repeat(2_000_002));
    expect(e.message).toBe("the file has more than 2,000,000 rows, the limit for one trace");
    expect(refusal(traceFile(1001), { capacity: 10_000, maxRows: 1000 }).message).toMatch(/more than 1,000 rows/);
    expect(() => parseTraceCsv(traceFile(1000), { capacity: 10_000, maxRows: 1000 })).not.toThrow();
  });

  it("a file over the size limit", () => {
    const e = refusal(traceFile(100), { capacity: 10_000, maxBytes: 500 });
    expect(e.message).toBe("the file is larger than the limit of 500 bytes");
  });

  it("a reading above the sensor's capacity", () => {
    const e = refusal(traceFile(9000, (i) => (i === 8999 ? "12400" : "3")));
    expect(e.message).toBe("line 9,001: 12,400 N is above the sensor's capacity of 10,000 N");
    expect(e.line).toBe(9001);
    const torque = refusal(
      traceFile(10, (i) => (i === 2 ? "-2500" : "1")),
      { capacity: 2000, unit: "N·m" },
    );
    expect(torque.message).toBe("line 4: -2,500 N·m is beyond the sensor's capacity of 2,000 N·m");
  });

  it("too few samples", () => {
    expect(refusal("").message).toBe("the file holds 0 samples; a trace needs at least two");
    expect(refusal("time_s,force_n\n0,1\n").message).toBe("the file holds 1 sample; a trace needs at least two");
  });
});
