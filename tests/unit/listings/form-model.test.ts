// The listing form's conversion from practical units to SI (SI Brochure, 9th ed., table 7:
// µ = 10⁻⁶, m = 10⁻³, k = 10³) and back, and its errors in the field's own units.
import { describe, expect, it } from "vitest";
import { defaultValues, formPath, toField, toInput, validate, valuesFromListing, type FormValues } from "@/components/listing-form/form-model";
import { setIn } from "@/components/listing-form/set-in";

function kit(): FormValues {
  let v = defaultValues("kit");
  v = { ...v, title: "Half-bridge welder kit", price: "189.50", stock: "3", shippingWeightG: "900" };
  v = setIn(v, "declaration.busCapacitanceF", "680");
  v = setIn(v, "declaration.bleederOhm", "100");
  v = setIn(v, "declaration.liveHeatsinks", true);
  return v;
}

describe("toInput", () => {
  it("converts µF, kΩ and % to farads, ohms and a fraction; the price stays text for the exact parser", () => {
    const { input } = toInput(kit());
    expect(input.declaration).toEqual({
      mainsConnected: true,
      mainsVrms: 230,
      mainsTolerance: 0.1,
      busCapacitanceF: 680e-6,
      bleederOhm: 100e3,
      liveHeatsinks: true,
      weldingSource: false,
    });
    expect(input.price).toBe("189.50");
  });

  it("converts a magnetic's mm², mm, kHz and a requirement's µH", () => {
    let v = defaultValues("magnetic");
    v = setIn(v, "figures.coreAreaM2", "125");
    v = setIn(v, "figures.gapM", "1.2");
    v = setIn(v, "figures.switchingFrequencyHz", "100");
    v = setIn(v, "figures.windings.0.areaM2", "4");
    const { input } = toInput(v);
    if (input.kind !== "magnetic") throw new Error("kind");
    expect(input.figures?.coreAreaM2).toBe(125e-6);
    expect(input.figures?.gapM).toBe(1.2e-3);
    expect(input.figures?.switchingFrequencyHz).toBe(100e3);
    expect(input.figures?.windings?.[0]?.areaM2).toBe(4e-6);

    const k = setIn(defaultValues("kit"), "requirements", [{ subtype: "choke", label: "Output choke", minInductanceH: "40", atCurrentA: "120" }]);
    const kitInput = toInput(k).input;
    if (kitInput.kind !== "kit") throw new Error("kind");
    expect(kitInput.requirements?.[0]).toEqual({ subtype: "choke", label: "Output choke", minInductanceH: 40e-6, atCurrentA: 120 });
  });

  it("sends only the notes that were written, and remembers which topic each one is", () => {
    let v = setIn(kit(), "notes.live-heatsinks.text", "Both heatsinks are at bus potential.");
    v = setIn(v, "notes.stored-charge.waitSeconds", "180");
    const { input, noteTopics } = toInput(v);
    expect(noteTopics).toEqual(["stored-charge", "live-heatsinks"]);
    expect(input.notes).toEqual([
      { topic: "stored-charge", text: "", waitSeconds: 180 },
      { topic: "live-heatsinks", text: "Both heatsinks are at bus potential." },
    ]);
    expect(formPath("notes.1.text", noteTopics)).toBe("notes.live-heatsinks.text");
  });
});

describe("validate", () => {
  it("passes a complete kit", () => {
    expect(validate(kit()).ok).toBe(true);
  });

  it("names a bound in the field's own unit (µF, not F)", () => {
    const result = validate(setIn(kit(), "declaration.busCapacitanceF", "2000000")); // 2 F, above the schema's 1 F
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.errors["declaration.busCapacitanceF"]).toEqual(["Bus capacitance must be at most 1000000 µF."]);
  });

  it("marks text that is not a number, and a comma in the price", () => {
    const result = validate({ ...setIn(kit(), "declaration.bleederOhm", "abc"), price: "1,50" });
    if (result.ok) throw new Error("should fail");
    expect(result.errors["declaration.bleederOhm"]?.[0]).toMatch(/bleeder resistance as a number/i);
    expect(result.errors.price?.[0]).toMatch(/point, not a comma/);
  });
});

describe("round trip", () => {
  it("a stored listing fills the form with the figures in the field units it was typed in", () => {
    const values = valuesFromListing(
      {
        kind: "kit",
        magneticSubtype: null,
        title: "Kit",
        descriptionMd: "",
        priceMinor: 18950,
        currency: "EUR",
        stock: 3,
        shippingWeightG: 900,
        figures: {},
        declaration: { mainsConnected: true, mainsVrms: 230, mainsTolerance: 0.1, busCapacitanceF: 680e-6, bleederOhm: 100e3, liveHeatsinks: true, weldingSource: false },
        safetyNotes: [{ topic: "stored-charge", text: "Wait.", waitSeconds: 180 }],
      },
      { photos: [], documents: [], checkpoints: [], requirements: [{ subtype: "choke", label: "Output choke", minInductanceH: 40e-6, atCurrentA: 120 }] },
    );
    expect(values.price).toBe("189.50");
    expect(values.declaration).toMatchObject({ busCapacitanceF: "680", bleederOhm: "100", mainsTolerance: "10" });
    expect(values.notes["stored-charge"]).toEqual({ text: "Wait.", waitSeconds: "180" });
    expect(values.requirements[0]?.minInductanceH).toBe("40");
    expect(toField(4.7e-5, "figures.windings.0.areaM2")).toBe("47");
  });
});
