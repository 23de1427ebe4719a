import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { CheckboxField, NumberField, SelectField, TextArea, TextField } from "@/components/ui/field";
import { tagsNamed, textOfId, type Tag } from "./html";

// Wiring follows WAI-ARIA 1.2 (aria-describedby, aria-invalid) and WCAG 2.2 technique ARIA21
// ("Using aria-invalid to indicate an error field"): the error text must be reachable from
// the control through an id reference.
function control(html: string, name: string): Tag {
  const found = tagsNamed(html, name);
  expect(found).toHaveLength(1);
  return found[0] as Tag;
}

const describedIds = (tag: Tag) => (tag.attrs["aria-describedby"] ?? "").split(" ").filter(Boolean);

describe("fields", () => {
  it("TextField points aria-describedby at the error text and sets aria-invalid", () => {
    const html = renderToStaticMarkup(
      <TextField label="Title" name="title" hint="As buyers will search for it" error="Give the listing a title." />,
    );
    const input = control(html, "input");
    expect(input.attrs["aria-invalid"]).toBe("true");
    const texts = describedIds(input).map((id) => textOfId(html, id));
    expect(texts).toContain("Give the listing a title.");
    expect(texts).toContain("As buyers will search for it");
    // The label is tied to the control, too.
    expect(control(html, "label").attrs.for).toBe(input.attrs.id);
  });

  it("leaves aria-invalid off and describes only the hint when there is no error", () => {
    const html = renderToStaticMarkup(<TextField label="Title" name="title" hint="Short and plain" />);
    const input = control(html, "input");
    expect(input.attrs["aria-invalid"]).toBeUndefined();
    expect(describedIds(input).map((id) => textOfId(html, id))).toEqual(["Short and plain"]);
  });

  it("joins zod's list of messages and keeps a caller's own aria-describedby", () => {
    const html = renderToStaticMarkup(
      <TextArea label="Note" name="note" error={["Too short.", "State the wait time."]} aria-describedby="outside" />,
    );
    const textarea = control(html, "textarea");
    expect(describedIds(textarea)).toContain("outside");
    expect(describedIds(textarea).map((id) => textOfId(html, id))).toContain("Too short. State the wait time.");
  });

  it("SelectField and CheckboxField wire errors the same way", () => {
    const select = renderToStaticMarkup(
      <SelectField label="Kind" name="kind" placeholder="Choose" options={[{ value: "kit", label: "Kit" }]} error="Choose a kind." />,
    );
    const box = renderToStaticMarkup(<CheckboxField label="I have read the safety sheet" name="ack" error="Tick to go on." />);
    for (const [html, name, message] of [
      [select, "select", "Choose a kind."],
      [box, "input", "Tick to go on."],
    ] as const) {
      const tag = control(html, name);
      expect(tag.attrs["aria-invalid"]).toBe("true");
      expect(describedIds(tag).map((id) => textOfId(html, id))).toContain(message);
    }
  });

  it("NumberField shows its unit in the mono face and includes it in the description", () => {
    const html = renderToStaticMarkup(<NumberField label="Bulk capacitance" name="bulkCapacitance" unit="µF" error="Enter the capacitance." />);
    const input = control(html, "input");
    const described = describedIds(input);
    expect(described.map((id) => textOfId(html, id))).toEqual(["µF", "Enter the capacitance."]);
    const unit = tagsNamed(html, "span").find((span) => span.attrs.id === described[0]);
    expect(unit?.attrs.class).toContain("font-mono");
    expect(input.attrs.type).toBe("number");
  });

  it("gives two fields on one page distinct ids", () => {
    const html = renderToStaticMarkup(
      <form>
        <TextField label="A" name="a" error="x" />
        <TextField label="B" name="b" error="y" />
      </form>,
    );
    const ids = tagsNamed(html, "input").map((input) => input.attrs.id);
    expect(new Set(ids).size).toBe(2);
  });
});
