import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { ElectricityWarningSign, EstimateNote, MainsCaution } from "@/components/caution";
import { tagsNamed } from "./html";

const text = (html: string) => html.replace(/<[^>]+>/g, " ").replace(/\s+/g, " ").trim();

describe("cautions", () => {
  it("the ISO 7010 W012 sign is an image with a text alternative", () => {
    // WCAG 2.2 SC 1.1.1: a meaningful graphic needs a text alternative; role="img" makes the
    // aria-label apply to the whole SVG.
    const svg = tagsNamed(renderToStaticMarkup(<ElectricityWarningSign />), "svg")[0];
    expect(svg?.attrs.role).toBe("img");
    expect(svg?.attrs["aria-label"]).toBe("Warning: electricity");
    // ISO 7010 warning signs: safety yellow triangle, black band and symbol.
    const html = renderToStaticMarkup(<ElectricityWarningSign />);
    expect(html).toContain('fill="#F9A800"');
    expect(html).toContain('stroke="#000000"');
  });

  it("the full caution says each of the product's cautions", () => {
    // Wording required by shared/PRODUCT.md, "Cautions".
    const html = renderToStaticMarkup(<MainsCaution variant="full" />);
    const words = text(html);
    expect(words).toContain("Mains and charged capacitors can kill.");
    expect(words).toContain("Work only de-energised and discharged — verify with a meter.");
    expect(words).toContain("Use an isolation transformer or a series lamp for first power-up.");
    expect(words).toContain("Local electrical codes and licensed practice take precedence over anything on this site.");
    expect(tagsNamed(html, "svg")[0]?.attrs["aria-label"]).toBe("Warning: electricity");
  });

  it("the short caution is one line for the footer", () => {
    const html = renderToStaticMarkup(<MainsCaution variant="short" />);
    expect(tagsNamed(html, "p")).toHaveLength(1);
    expect(text(html)).toBe(
      "Mains and charged capacitors can kill. Local electrical codes and licensed practice take precedence.",
    );
  });

  it("calculators say their results are estimates", () => {
    expect(text(renderToStaticMarkup(<EstimateNote />))).toBe(
      "Results are estimates for checking a design, not a certification.",
    );
  });
});
