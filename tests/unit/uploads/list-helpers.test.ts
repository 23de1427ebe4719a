import { describe, expect, it } from "vitest";
import { moveItem, removeAt, replaceAt } from "@/components/uploads/list-moves";
import { guessDocumentKind, titleFromFileName } from "@/lib/uploads/document-kinds";

describe("moveItem (photo order: the first is the cover)", () => {
  it("moves an item up, down and to the front without touching the input", () => {
    const photos = ["a", "b", "c", "d"] as const;
    expect(moveItem(photos, 2, 1)).toEqual(["a", "c", "b", "d"]);
    expect(moveItem(photos, 0, 1)).toEqual(["b", "a", "c", "d"]);
    expect(moveItem(photos, 3, 0)).toEqual(["d", "a", "b", "c"]);
    expect(photos).toEqual(["a", "b", "c", "d"]);
  });

  it("ignores moves off either end", () => {
    expect(moveItem(["a", "b"], 0, -1)).toEqual(["a", "b"]);
    expect(moveItem(["a", "b"], 1, 2)).toEqual(["a", "b"]);
  });

  it("removes and replaces by position", () => {
    expect(removeAt(["a", "b", "c"], 1)).toEqual(["a", "c"]);
    expect(replaceAt([{ alt: "" }, { alt: "" }], 1, (p) => ({ ...p, alt: "choke" }))).toEqual([{ alt: "" }, { alt: "choke" }]);
  });
});

describe("document kinds from file names", () => {
  it("guesses the kind and a readable title", () => {
    expect(guessDocumentKind("inverter-BOM-rev3.pdf")).toBe("bom");
    expect(guessDocumentKind("Bill_of_materials.pdf")).toBe("bom");
    expect(guessDocumentKind("power_stage_schematic.pdf")).toBe("schematic");
    expect(guessDocumentKind("bring-up guide.pdf")).toBe("build-notes");
    expect(guessDocumentKind("datasheet.pdf")).toBe("other");
    // "bom" only as a word: "bombay" is not a bill of materials.
    expect(guessDocumentKind("bombay.pdf")).toBe("other");
    expect(titleFromFileName("output-choke_wiring.pdf")).toBe("output choke wiring");
    expect(titleFromFileName(".pdf")).toBe("Document");
  });
});
