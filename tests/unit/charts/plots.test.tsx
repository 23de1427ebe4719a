import { renderToStaticMarkup } from "react-dom/server";
import { makeAbsolute, parseSVG } from "svg-path-parser";
import { describe, expect, it } from "vitest";
import { DischargePlot, FluxPlot, LoadLinePlot } from "@/components/charts";
import { busPeakVoltage, conventionalLoadVoltage, dischargeCurve, dischargeTime, fluxCurve } from "@/lib/engineering";
import { tagsNamed } from "../ui/html";

const text = (html: string) =>
  html
    .replace(/<[^>]+>/g, " ")
    .replace(/\s+/g, " ")
    .trim();

/** x (or y) position of the tick label that reads exactly `label`. */
function tickPosition(html: string, label: string, axis: "x" | "y"): number {
  const match = new RegExp(`<text x="([\\d.]+)" y="([\\d.]+)"[^>]*>${label}</text>`).exec(html);
  if (!match) throw new Error(`no tick labelled ${label}`);
  return Number(axis === "x" ? match[1] : match[2]);
}

function markerLine(html: string, axis: "x" | "y") {
  const group = new RegExp(
    `<g data-marker="${axis}"><line x1="([\\d.]+)" x2="([\\d.]+)" y1="([\\d.]+)" y2="([\\d.]+)"`,
  ).exec(html);
  if (!group) throw new Error(`no ${axis} marker`);
  return { x: Number(group[1]), y: Number(group[3]) };
}

// The worked example of the workbench: 230 V +10 % (IEC 60038) on 680 µF through 100 kΩ.
// RC discharge to 60 V takes t = R·C·ln(V0/60) (PRODUCT.md; the RC decay of any circuits
// textbook, e.g. Horowitz & Hill ch. 1): 100 kΩ · 680 µF · ln(357.8/60) = 121.4 s.
const v0 = busPeakVoltage(230, 0.1);
const rc = { resistanceOhm: 100e3, capacitanceF: 680e-6 };
const wait = dischargeTime({ ...rc, fromV: v0, toV: 60 });
const curve = dischargeCurve({ ...rc, fromV: v0, toV: 60, points: 60 });

describe("DischargePlot", () => {
  const html = renderToStaticMarkup(
    <DischargePlot points={curve} safeV={60} dischargeS={wait} through="through 100 kΩ" />,
  );

  it("labels the 60 V safe level and the computed wait", () => {
    expect(wait).toBeCloseTo(121.4, 1);
    const words = text(html);
    expect(words).toContain("60 V safe level");
    expect(words).toContain("t = 121 s");
  });

  it("draws the curve as one path through every point", () => {
    const path = tagsNamed(html, "path").find((p) => p.attrs["data-series"] === "bus-voltage");
    // Read through svg-path-parser (npm, the SVG 1.1 path grammar): a move, then a line to each of the other 59 points.
    const commands = makeAbsolute(parseSVG(path?.attrs.d ?? ""));
    expect(commands.map((c) => c.code).join("")).toBe(`M${"L".repeat(59)}`);
  });

  it("puts the wait marker at 121 s on the time axis and the safe line at 60 V", () => {
    const marker = markerLine(html, "x");
    const at100 = tickPosition(html, "100 s", "x");
    const at150 = tickPosition(html, "150 s", "x");
    expect(marker.x).toBeGreaterThan(at100);
    expect(marker.x).toBeLessThan(at150);
    expect((marker.x - at100) / (at150 - at100)).toBeCloseTo((wait - 100) / 50, 2);

    const safe = markerLine(html, "y");
    const at0 = tickPosition(html, "0 V", "y");
    const at100V = tickPosition(html, "100 V", "y");
    expect((at0 - safe.y) / (at0 - at100V)).toBeCloseTo(0.6, 2);
  });

  it("is named for assistive tech and carries a hidden data table", () => {
    const svg = tagsNamed(html, "svg")[0];
    expect(svg?.attrs.role).toBe("img");
    const [titleId, descId] = (svg?.attrs["aria-labelledby"] ?? "").split(" ");
    expect(html).toContain(`<title id="${titleId}">Bus voltage after switch-off, through 100 kΩ</title>`);
    expect(html).toMatch(new RegExp(`<desc id="${descId}">[^<]*358 V[^<]*121 s`));
    // Visually hidden through its wrapper (a table will not shrink to .sr-only itself).
    expect(html).toMatch(/<div class="sr-only"><table>/);
    // The first row is the switch-off instant at the bus peak.
    expect(html).toMatch(/<td>0 s<\/td><td>357.8 V<\/td>/);
  });

  it("switches to minutes for long waits: 1 MΩ on the same bus takes 20.2 min", () => {
    const slow = { resistanceOhm: 1e6, capacitanceF: 680e-6 };
    const slowWait = dischargeTime({ ...slow, fromV: v0 });
    const slowHtml = renderToStaticMarkup(
      <DischargePlot points={dischargeCurve({ ...slow, fromV: v0 })} safeV={60} dischargeS={slowWait} />,
    );
    expect(slowWait / 60).toBeCloseTo(20.24, 1);
    expect(text(slowHtml)).toContain("t = 20.2 min");
  });

  it("explains the missing curve when there is no bleeder", () => {
    const none = renderToStaticMarkup(<DischargePlot points={[]} safeV={60} dischargeS={null} />);
    expect(tagsNamed(none, "svg")).toHaveLength(0);
    expect(text(none)).toContain("no discharge path");
  });
});

describe("FluxPlot", () => {
  it("marks the design maximum, saturation and rated current", () => {
    // Invented choke: 92 µH, 24 turns on 240 mm²; B = L·I/(N·Ae) reaches 0.35 T at 24.3 A.
    const shape = { inductanceH: 92e-6, turns: 24, coreAreaM2: 240e-6 };
    const html = renderToStaticMarkup(
      <FluxPlot
        points={fluxCurve({ ...shape, toCurrentA: 24.3 })}
        ratedCurrentA={15}
        designMaxT={0.3}
        saturationT={0.35}
      />,
    );
    const words = text(html);
    expect(words).toContain("Design max 300 mT");
    expect(words).toContain("Saturation 350 mT");
    expect(words).toContain("Rated 15 A");
    expect(tagsNamed(html, "path").some((p) => p.attrs["data-series"] === "flux" && p.attrs.d?.startsWith("M"))).toBe(
      true,
    );
  });
});

describe("LoadLinePlot", () => {
  // IEC 60974-1 (from memory): MMA load line U2 = 20 V + 0.04 V/A · I2; DC no-load limit 113 V peak.
  const line = [0, 80, 160].map((currentA) => ({ currentA, volts: conventionalLoadVoltage(currentA, "mma") }));

  it("draws the load line with the OCV and the limit labelled", () => {
    const html = renderToStaticMarkup(
      <LoadLinePlot points={line} openCircuitV={62} limitV={113} limitLabel="DC limit (peak)" withinLimit />,
    );
    const words = text(html);
    expect(words).toContain("DC limit (peak) 113 V");
    expect(words).toContain("Open circuit 62 V");
    expect(words).not.toContain("over the limit");
  });

  it("says so in words when the OCV is over the limit", () => {
    const html = renderToStaticMarkup(
      <LoadLinePlot points={line} openCircuitV={120} limitV={113} limitLabel="DC limit (peak)" withinLimit={false} />,
    );
    expect(text(html)).toContain("Open circuit 120 V (over the limit)");
  });
});
