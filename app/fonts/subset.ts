// Makes the font files in this folder from the published ones in @fontsource-variable (a
// devDependency): `npm run fonts`. Every character and the whole weight axis are kept; what goes
// is the layout features that the site never asks for. JetBrains Mono's `calt` holds its code
// ligatures (half of the latin file, 40 → 20 kB), which figures and references must not show
// anyway; Public Sans loses its fraction forms. tests/unit/ui/fonts.test.ts checks that the files
// here are what this makes, with the originals' characters. The fonts are under the SIL Open Font
// License 1.1, which allows modified versions (no Reserved Font Name is declared).
import { readFile, writeFile } from "node:fs/promises";
import path from "node:path";
import { fileURLToPath } from "node:url";
import fontverter from "fontverter";
import { Blob, Face } from "harfbuzzjs";
import subsetFont from "subset-font";

const HERE = path.dirname(fileURLToPath(import.meta.url));

// What browsers apply by default (shaping, marks, kerning, locale forms) plus the figures' tnum.
const SANS_FEATURES = ["ccmp", "locl", "liga", "calt", "kern", "mark", "pnum", "tnum"];
const MONO_FEATURES = ["ccmp", "locl", "mark"];

export type ShippedFont = { file: string; origin: string; features: readonly string[] };

/** Each shipped file, its published original and the layout features it keeps. */
export const SHIPPED_FONTS: ShippedFont[] = [
  ...["latin-wght-normal", "latin-wght-italic", "latin-ext-wght-normal", "latin-ext-wght-italic"].map((part) => ({
    file: `public-sans-${part}.woff2`,
    origin: `@fontsource-variable/public-sans/files/public-sans-${part}.woff2`,
    features: SANS_FEATURES,
  })),
  ...["latin-wght-normal", "latin-ext-wght-normal", "greek-wght-normal"].map((part) => ({
    file: `jetbrains-mono-${part}.woff2`,
    origin: `@fontsource-variable/jetbrains-mono/files/jetbrains-mono-${part}.woff2`,
    features: MONO_FEATURES,
  })),
];

/** A woff2 file as HarfBuzz reads it. */
export async function fontFace(woff2: Uint8Array): Promise<Face> {
  return new Face(new Blob(await fontverter.convert(Buffer.from(woff2), "truetype")), 0);
}

/** The code points a font file maps, in order. */
export async function fontCodePoints(woff2: Uint8Array): Promise<number[]> {
  return [...(await fontFace(woff2)).collectUnicodes()].sort((a, b) => a - b);
}

/** The woff2 bytes this folder should hold for one entry of SHIPPED_FONTS. */
export async function subsetShippedFont(entry: ShippedFont, resolve = (id: string) => fileURLToPath(import.meta.resolve(id))): Promise<Uint8Array> {
  const original = await readFile(resolve(entry.origin));
  const text = String.fromCodePoint(...(await fontCodePoints(original)));
  return subsetFont(original, text, { targetFormat: "woff2", keepFeatures: [...entry.features] });
}

async function main() {
  for (const entry of SHIPPED_FONTS) {
    const bytes = await subsetShippedFont(entry);
    await writeFile(path.join(HERE, entry.file), bytes);
    console.log(`${entry.file}: ${(bytes.length / 1000).toFixed(1)} kB`);
  }
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) await main();
