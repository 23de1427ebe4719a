import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { Alert } from "@/components/ui/alert";
import { FormMessage } from "@/components/ui/form-message";
import { TD, TH, TRow, Table, TBody, THead } from "@/components/ui/table";
import { tagsNamed } from "./html";

// Roles and states per WAI-ARIA 1.2: aria-sort on column headers, role="alert" (assertive) vs
// role="status" (polite), aria-live="polite" for form results (WCAG 2.2 SC 4.1.3 Status Messages).
describe("Table", () => {
  const html = renderToStaticMarkup(
    <Table caption="Stock">
      <THead>
        <TRow>
          <TH sort="ascending">Title</TH>
          <TH numeric sort="none">
            Price
          </TH>
        </TRow>
      </THead>
      <TBody>
        <TRow>
          <TD>Output choke</TD>
          <TD numeric>€42.00</TD>
        </TRow>
      </TBody>
    </Table>,
  );

  it("marks the sorted column with aria-sort and a visible arrow", () => {
    const headers = tagsNamed(html, "th");
    expect(headers.map((th) => th.attrs["aria-sort"])).toEqual(["ascending", "none"]);
    expect(headers.every((th) => th.attrs.scope === "col")).toBe(true);
    expect(html).toMatch(/Title<span aria-hidden="true"[^>]*>↑<\/span>/);
  });

  it("right-aligns numeric cells in the mono face with tabular figures", () => {
    const cells = tagsNamed(html, "td");
    expect(cells[1]?.attrs.class).toEqual(expect.stringContaining("text-right"));
    expect(cells[1]?.attrs.class).toEqual(expect.stringContaining("font-mono"));
    expect(cells[1]?.attrs.class).toEqual(expect.stringContaining("figure"));
    expect(cells[0]?.attrs.class).not.toContain("text-right");
  });
});

describe("Alert and FormMessage", () => {
  it("interrupts only for stop, and always spells out its tone", () => {
    const stop = renderToStaticMarkup(<Alert tone="stop" title="Open-circuit voltage above the limit" />);
    const caution = renderToStaticMarkup(<Alert tone="caution">Bleeder missing</Alert>);
    expect(tagsNamed(stop, "div")[0]?.attrs.role).toBe("alert");
    expect(tagsNamed(caution, "div")[0]?.attrs.role).toBe("status");
    expect(stop).toContain(">Stop<");
    expect(caution).toContain(">Caution<");
    expect(tagsNamed(renderToStaticMarkup(<Alert role="none">x</Alert>), "div")[0]?.attrs.role).toBeUndefined();
  });

  it("keeps the live region mounted while there is no message", () => {
    const empty = renderToStaticMarkup(<FormMessage />);
    expect(tagsNamed(empty, "div")[0]?.attrs["aria-live"]).toBe("polite");
    const filled = renderToStaticMarkup(<FormMessage tone="error" message="Listing not saved." />);
    expect(filled).toMatch(/aria-live="polite"[^>]*>.*Listing not saved\./);
  });
});
