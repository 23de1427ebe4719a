// subset-font and its fontverter ship no types; app/fonts/subset.ts uses this much of them.
declare module "fontverter" {
  const fontverter: { convert(font: Buffer | Uint8Array, to: "truetype" | "woff" | "woff2" | "sfnt"): Promise<Buffer> };
  export default fontverter;
}

declare module "subset-font" {
  export default function subsetFont(
    font: Buffer | Uint8Array,
    text: string,
    options?: { targetFormat?: "woff2" | "woff" | "truetype" | "sfnt"; keepFeatures?: string[]; noLayoutClosure?: boolean },
  ): Promise<Buffer>;
}
