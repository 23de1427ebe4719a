// The window route's query: what it accepts, the 422 field errors for everything else, and the
// window clamped to the capture. Numbers follow ECMAScript's numeric literal grammar (ECMA-262
// §12.9.3, decimal and exponent forms); the WHATWG URL standard's URLSearchParams gives strings.
import { describe, expect, it } from "vitest";
import { clampWindow, DEFAULT_POINTS, MAX_POINTS, parseWindowQuery, windowUrl } from "@/lib/captures/window-params";

const parse = (query: string) => parseWindowQuery(new URLSearchParams(query));

describe("window parameters", () => {
  it("reads seconds in decimal and exponent form, with the default point count", () => {
    expect(parse("from=0.00025&to=2.5e-3")).toEqual({ ok: true, query: { from: 0.00025, to: 0.0025, points: DEFAULT_POINTS, channel: undefined } });
    expect(parse("from=-1e-4&to=+1e-4&points=800&channel=1")).toEqual({ ok: true, query: { from: -1e-4, to: 1e-4, points: 800, channel: 1 } });
    // No window at all is the whole capture.
    expect(parse("")).toEqual({ ok: true, query: { from: undefined, to: undefined, points: DEFAULT_POINTS, channel: undefined } });
  });

  it("refuses empty, non-numeric, infinite and reversed windows with a message per field", () => {
    expect(parse("from=&to=1")).toMatchObject({ ok: false, fieldErrors: { from: [expect.stringContaining("in seconds")] } });
    expect(parse("from=abc&to=1")).toMatchObject({ ok: false, fieldErrors: { from: [expect.stringContaining("number of seconds")] } });
    expect(parse("from=0&to=Infinity")).toMatchObject({ ok: false, fieldErrors: { to: [expect.any(String)] } });
    expect(parse("from=0&to=1e999")).toMatchObject({ ok: false, fieldErrors: { to: [expect.any(String)] } });
    expect(parse("from=2&to=1")).toMatchObject({ ok: false, fieldErrors: { to: ["The window's end must be after its start."] } });
    expect(parse("from=1&to=1")).toMatchObject({ ok: false });
  });

  it("keeps points between 2 (LTTB keeps the two ends) and the maximum, as whole numbers", () => {
    expect(parse("points=1")).toMatchObject({ ok: false, fieldErrors: { points: ["points must be at least 2."] } });
    expect(parse(`points=${MAX_POINTS + 1}`)).toMatchObject({ ok: false, fieldErrors: { points: [`points must be at most ${MAX_POINTS}.`] } });
    expect(parse("points=12.5")).toMatchObject({ ok: false, fieldErrors: { points: ["points must be a whole number."] } });
    expect(parse("channel=-1")).toMatchObject({ ok: false, fieldErrors: { channel: ["channel must be a whole number."] } });
    expect(parse("points=2")).toMatchObject({ ok: true, query: { points: 2 } });
  });

  it("refuses unknown and repeated parameters", () => {
    expect(parse("from=0&to=1&zoom=2")).toMatchObject({ ok: false, fieldErrors: { zoom: [expect.stringContaining("Unknown parameter: zoom")] } });
    expect(parse("from=0&from=1&to=2")).toMatchObject({ ok: false, fieldErrors: { from: ["from may be given only once."] } });
  });

  it("clamps the window to the capture and refuses one wholly outside it", () => {
    const capture = { from: 0, to: 1e-3 };
    expect(clampWindow({ from: -1, to: 5e-4 }, capture)).toEqual({ from: 0, to: 5e-4 });
    expect(clampWindow({ from: 2e-4 }, capture)).toEqual({ from: 2e-4, to: 1e-3 });
    expect(clampWindow({}, capture)).toEqual(capture);
    expect(clampWindow({ from: 2e-3, to: 3e-3 }, capture)).toBeNull();
  });

  it("writes the URL the viewer asks and the route reads back the same window", () => {
    const url = new URL(windowUrl("7d3c1a8e-0000-4000-8000-000000000001", { from: 1.25e-5, to: 3.5e-5 }, 600, 1), "http://localhost");
    expect(url.pathname).toBe("/api/captures/7d3c1a8e-0000-4000-8000-000000000001/window");
    expect(parseWindowQuery(url.searchParams)).toEqual({ ok: true, query: { from: 1.25e-5, to: 3.5e-5, points: 600, channel: 1 } });
  });
});
