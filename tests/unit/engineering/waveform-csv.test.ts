// Capture files as instruments write them. The layouts below are the general kinds found in
// oscilloscope CSV exports (metadata above a header, units in the header or in their own row,
// comma/semicolon/tab separators, decimal commas, a sample interval instead of a time column);
// they are written by hand here, not copied from any instrument's files.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { EngineeringInputError, parseCaptureCsv } from "@/lib/engineering";
import { toCsv } from "./synthetic-captures";

function expectCaptureError(text: string, pattern: RegExp) {
  let caught: unknown;
  try {
    parseCaptureCsv(text);
  } catch (error) {
    caught = error;
  }
  expect(caught).toBeInstanceOf(EngineeringInputError);
  expect((caught as Error).message).toMatch(pattern);
}

describe("parseCaptureCsv — layouts", () => {
  it("reads metadata lines, a header with units in brackets and two channels", () => {
    const text = [
      "Bench capture",
      "Record length,4",
      "Sample interval,1e-6",
      "",
      "Time (s),CH1 (V),CH2 (V)",
      "0.000000,0.00,1.5",
      "1.0e-6,12.1,1.5",
      "2.0E-06,12.0,-0.25",
      "3e-6,0.05,1.5",
      "",
      "",
    ].join("\n");
    const capture = parseCaptureCsv(text);
    expect(Array.from(capture.timeS)).toEqual([0, 1e-6, 2e-6, 3e-6]);
    expect(capture.channels.map((c) => [c.name, c.unit])).toEqual([["CH1", "V"], ["CH2", "V"]]);
    expect(Array.from(capture.channels[0]!.values)).toEqual([0, 12.1, 12, 0.05]);
    expect(Array.from(capture.channels[1]!.values)).toEqual([1.5, 1.5, -0.25, 1.5]);
    expect(capture.sampleIntervalS).toBeCloseTo(1e-6, 18);
  });

  it("takes units from a row of their own and brings prefixed units to seconds and volts", () => {
    const text = "Time,Gate,Drain\n(ms),(mV),(V)\n\n0,0,400\n0.5,15000,2\n1,0,400\n";
    const capture = parseCaptureCsv(text);
    expect(Array.from(capture.timeS)).toEqual([0, 0.5e-3, 1e-3]);
    expect(capture.channels[0]).toMatchObject({ name: "Gate", unit: "V" });
    expect(Array.from(capture.channels[0]!.values)).toEqual([0, 15, 0]);
    expect(capture.channels[1]).toMatchObject({ name: "Drain", unit: "V" });
  });

  it("reads semicolons with decimal commas", () => {
    const text = "Zeit [us];Kanal 1 [V]\n0,0;0,25\n0,5;11,75\n1,0;12\n1,5;-0,5\n";
    const capture = parseCaptureCsv(text);
    expect(Array.from(capture.timeS)).toEqual([0, 0.5e-6, 1e-6, 1.5e-6]);
    expect(capture.channels[0]!.name).toBe("Kanal 1");
    expect(Array.from(capture.channels[0]!.values)).toEqual([0.25, 11.75, 12, -0.5]);
  });

  it("reads tab-separated text with Windows line ends and a byte-order mark", () => {
    const text = "\uFEFFtime\tch1\tch2\r\n0\t1\t2\r\n1e-9\t3\t4\r\n2e-9\t5\t6\r\n";
    const capture = parseCaptureCsv(text);
    expect(Array.from(capture.timeS)).toEqual([0, 1e-9, 2e-9]);
    expect(capture.channels.map((c) => c.name)).toEqual(["ch1", "ch2"]);
    expect(Array.from(capture.channels[1]!.values)).toEqual([2, 4, 6]);
  });

  it("accepts scientific notation in every form, signs and trailing separators", () => {
    const text = "Time (s),CH1 (V),\n-1.0E-03,+1.25e+01,\n-5.e-4,-.5,\n0,1E1,\n";
    const capture = parseCaptureCsv(text);
    expect(Array.from(capture.timeS)).toEqual([-1e-3, -5e-4, 0]);
    expect(Array.from(capture.channels[0]!.values)).toEqual([12.5, -0.5, 10]);
  });

  it("builds the time axis from a sample-interval line when the file holds only sample values", () => {
    const capture = parseCaptureCsv("Sample interval: 2 us\n0.1\n0.2\n0.3\n0.4\n");
    expect(Array.from(capture.timeS)).toEqual([0, 2e-6, 4e-6, 6e-6]);
    expect(capture.channels).toHaveLength(1);
    expect(capture.channels[0]!.name).toBe("CH1");
    expect(capture.sampleIntervalS).toBeCloseTo(2e-6, 18);
  });

  it("builds the time axis from a sample rate", () => {
    const capture = parseCaptureCsv("Sample rate,250 kSa/s\nCH1 (V),CH2 (V)\n1,2\n3,4\n5,6\n");
    expect(Array.from(capture.timeS)).toEqual([0, 4e-6, 8e-6]);
    expect(capture.channels.map((c) => c.name)).toEqual(["CH1", "CH2"]);
  });

  it("reads a sample-number column with start and increment values beside the unit row", () => {
    const text = "X,CH1,Start,Increment,\nSequence,Volt,-2.0e-06,1.0e-06,\n0,1.2,\n1,1.3,\n2,1.1,\n";
    const capture = parseCaptureCsv(text);
    expect(Array.from(capture.timeS)).toEqual([-2e-6, -1e-6, 0]);
    expect(capture.channels).toEqual([{ name: "CH1", unit: "V", values: Float64Array.from([1.2, 1.3, 1.1]) }]);
  });

  it("reads samples written beside a metadata block, with empty cells below it", () => {
    const text = [
      "Record length,5,points,-2e-6,0.01",
      "Sample interval,1e-6,s,-1e-6,0.02",
      "Vertical units,V,,0,11.9",
      ",,,1e-6,12.0",
      ",,,2e-6,0.03",
    ].join("\r\n");
    const capture = parseCaptureCsv(text);
    expect(Array.from(capture.timeS)).toEqual([-2e-6, -1e-6, 0, 1e-6, 2e-6]);
    expect(Array.from(capture.channels[0]!.values)).toEqual([0.01, 0.02, 11.9, 12, 0.03]);
  });

  it("reads a header that numbers its channels over a row of units", () => {
    const capture = parseCaptureCsv("x-axis,1,2\nsecond,Volt,Volt\n-1e-6,0.1,5\n0,0.2,6\n1e-6,0.3,7\n");
    expect(Array.from(capture.timeS)).toEqual([-1e-6, 0, 1e-6]);
    expect(capture.channels.map((c) => [c.name, c.unit])).toEqual([["CH1", "V"], ["CH2", "V"]]);
  });

  it("reads a headerless two-column file as time and one channel", () => {
    const capture = parseCaptureCsv("0,0\n1e-6,5\n2e-6,0\n");
    expect(Array.from(capture.timeS)).toEqual([0, 1e-6, 2e-6]);
    expect(Array.from(capture.channels[0]!.values)).toEqual([0, 5, 0]);
  });

  it("ignores a text footer after the samples and quoted fields", () => {
    const capture = parseCaptureCsv('"Time (s)","CH1 (V)"\n"0","1"\n"1e-6","2"\nEnd of record\n');
    expect(Array.from(capture.channels[0]!.values)).toEqual([1, 2]);
  });

  it("gives every value exactly as Number() reads it, for any finite sample (property)", () => {
    // Reference: ECMAScript's Number() string-to-number conversion (ECMA-262 StringToNumber).
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.double({ noNaN: true, noDefaultInfinity: true, min: -1e6, max: 1e6 }), fc.double({ noNaN: true, noDefaultInfinity: true })), { minLength: 2, maxLength: 40 }),
        fc.constantFrom<"," | ";" | "\t">(",", ";", "\t"),
        (rows, delimiter) => {
          const times = rows.map((_, i) => i * 1e-6);
          const text = toCsv([`Time (s)${delimiter}CH1 (V)${delimiter}CH2 (V)`], [times, rows.map((r) => r[0]), rows.map((r) => r[1])], { delimiter });
          const capture = parseCaptureCsv(text);
          expect(Array.from(capture.channels[0]!.values)).toEqual(rows.map((r) => Number(String(r[0]))));
          expect(Array.from(capture.channels[1]!.values)).toEqual(rows.map((r) => Number(String(r[1]))));
          for (const c of capture.channels) expect(c.values.every(Number.isFinite)).toBe(true);
        },
      ),
      { numRuns: 150 },
    );
  });

  it("reads decimal commas back exactly too (property)", () => {
    fc.assert(
      fc.property(fc.array(fc.double({ noNaN: true, noDefaultInfinity: true, min: -1e3, max: 1e3 }), { minLength: 2, maxLength: 30 }), (values) => {
        const times = values.map((_, i) => i * 0.5);
        const capture = parseCaptureCsv(toCsv(["Zeit (s);U (V)"], [times, values], { delimiter: ";", decimalComma: true }));
        expect(Array.from(capture.channels[0]!.values)).toEqual(values.map((v) => Number(String(v))));
      }),
      { numRuns: 100 },
    );
  });
});

describe("parseCaptureCsv — bad files say what is wrong and where", () => {
  it("refuses an empty file", () => expectCaptureError("\n\n  \n", /empty/));
  it("refuses text without rows of numbers", () => expectCaptureError("Time,CH1\nabc,def\n", /No rows of numbers/));
  it("names the line and column of a value that is not a number", () =>
    expectCaptureError("Time (s),CH1 (V)\n0,1\n1e-6,2\n2e-6,1.2.3\n3e-6,4\n", /Line 4, column 2: "1\.2\.3" is not a number/));
  it("names the line with a missing value", () => expectCaptureError("Time (s),CH1 (V),CH2 (V)\n0,1,2\n1e-6,,2\n", /Line 3, column 2: "" is not a number \(the value is missing\)/));
  it("names the line with too many or too few values", () => {
    expectCaptureError("Time (s),CH1 (V)\n0,1\n1e-6,2,7\n", /Line 3: expected 2 values separated by commas, found 3/);
    expectCaptureError("Time (s);CH1 (V);CH2 (V)\n0;1;2\n1e-6;2\n", /Line 3: expected 3 values separated by semicolons, found 2/);
  });
  it("refuses time that runs backwards", () => expectCaptureError("Time (s),CH1 (V)\n0,1\n2e-6,2\n1e-6,3\n", /Line 4: time goes backwards/));
  it("refuses samples without a time axis", () => expectCaptureError("0.1\n0.2\n0.3\n", /no sample interval/));
  it("refuses a header without a time column when no interval is given", () => expectCaptureError("CH1,CH2\n1,2\n3,4\n", /no column is named as time/));
  it("refuses a single sample", () => expectCaptureError("Time (s),CH1 (V)\n0,1\n", /at least two are needed/));
  it("refuses a time column that never advances", () => expectCaptureError("Time (s),CH1 (V)\n0,1\n0,2\n", /does not advance/));
  it("refuses binary data", () => expectCaptureError("PK\u0003\u0004\u0000\u0000garbage", /binary/));
  it("refuses hexadecimal, Infinity and NaN written as samples", () => {
    expectCaptureError("Time (s),CH1 (V)\n0,1\n1e-6,0x1F\n", /Line 3, column 2/);
    expectCaptureError("Time (s),CH1 (V)\n0,1\n1e-6,Infinity\n", /Line 3, column 2/);
    expectCaptureError("Time (s),CH1 (V)\n0,1\n1e-6,NaN\n", /Line 3, column 2/);
    expectCaptureError("Time (s),CH1 (V)\n0,1\n1e-6,1e400\n", /Line 3, column 2/);
  });
  it("refuses a sample interval that is not a time", () => expectCaptureError("Sample interval,fast\n0.1\n0.2\n", /no sample interval|not a positive time/));
  it("refuses rows of samples after a text line in the middle", () =>
    expectCaptureError("Time (s),CH1 (V)\n0,1\n1e-6,2\nPaused here\n2e-6,3\n", /Line 5: a row of samples after the text on line 4/));
  it("refuses a time column with no channel", () => expectCaptureError("Time (s)\n0\n1e-6\n", /no channel/));
  it("is an input error, not a crash, for things that are not text", () => {
    expect(() => parseCaptureCsv(42 as unknown as string)).toThrow(EngineeringInputError);
  });
});
