import { readFile } from "node:fs/promises";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import { SHIPPED_FONTS, fontCodePoints, fontFace, subsetShippedFont } from "@/app/fonts/subset";

// The reference is the published font files of @fontsource-variable (the originals the shipped
// files are made from), read with HarfBuzz: no character and no weight is lost, and what is left
// out is only the layout features app/fonts/subset.mjs names.

const FONTS_DIR = path.resolve(fileURLToPath(import.meta.url), "../../../../app/fonts");
const resolveOrigin = (id: string) => fileURLToPath(import.meta.resolve(id));

describe.each(SHIPPED_FONTS)("app/fonts/$file", (entry) => {
  it("is what `npm run fonts` makes from the published file", async () => {
    const shipped = await readFile(path.join(FONTS_DIR, entry.file));
    const made = await subsetShippedFont(entry, resolveOrigin);
    expect(Buffer.from(made).equals(shipped), "run `npm run fonts` and commit the files").toBe(true);
  }, 30_000);

  it("maps every character of the original and keeps its weight axis", async () => {
    const shipped = await readFile(path.join(FONTS_DIR, entry.file));
    const original = await readFile(resolveOrigin(entry.origin));
    expect(await fontCodePoints(shipped)).toEqual(await fontCodePoints(original));
    const axes = (await fontFace(shipped)).getAxisInfos();
    const originalAxes = (await fontFace(original)).getAxisInfos();
    expect(axes).toEqual(originalAxes);
    expect(Object.keys(axes)).toContain("wght");
  }, 30_000);

  it("keeps only the layout features the site uses", async () => {
    const shipped = await fontFace(await readFile(path.join(FONTS_DIR, entry.file)));
    const tags = new Set([...shipped.getTableFeatureTags("GSUB"), ...shipped.getTableFeatureTags("GPOS")]);
    for (const tag of tags) expect(entry.features).toContain(tag);
    // JetBrains Mono's code ligatures (`calt`) would turn "->" or "!=" in a reference into one sign.
    if (entry.file.startsWith("jetbrains-mono")) expect(tags.has("calt")).toBe(false);
  }, 30_000);
});
