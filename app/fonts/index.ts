import localFont from "next/font/local";

// Files made from @fontsource-variable/public-sans and /jetbrains-mono 5.3.0 by `npm run fonts`
// (./subset.ts: every character and weight, fewer layout features; SIL OFL 1.1, licence texts
// beside them). Shipped with the app: the site must render offline and never call a font host.
//
// Each subset is its own next/font/local call so that it can carry the unicode-range that
// fontsource publishes for it. Each call is its own font family (Turbopack ignores a shared
// `font-family` declaration when it writes the CSS variable), so tailwind.config.ts stacks them:
// extra subsets first, then the latin face with its metric-matched fallback. A browser skips a
// face whose unicode-range misses a character without downloading it, so latin-only pages
// fetch only the latin files. next/font/local options must be literals.

/**
 * Public Sans (latin, upright), exposed as `--font-sans`. Preloaded: without it the text painted in
 * the fallback shifts when the face arrives (Lighthouse measured a layout shift of 0.05–0.25 on
 * mobile).
 */
export const sans = localFont({
  src: "./public-sans-latin-wght-normal.woff2",
  weight: "100 900",
  style: "normal",
  display: "swap",
  variable: "--font-sans",
  declarations: [
    {
      prop: "unicode-range",
      value:
        "U+0000-00FF, U+0131, U+0152-0153, U+02BB-02BC, U+02C6, U+02DA, U+02DC, U+0304, U+0308, U+0329, U+2000-206F, U+20AC, U+2122, U+2191, U+2193, U+2212, U+2215, U+FEFF, U+FFFD",
    },
  ],
});

/**
 * Public Sans (latin, italic), exposed as `--font-sans-italic` and used by italic elements only
 * (globals.css). A family of its own so that it is not preloaded: few first screens have italic
 * text, and on a slow line a 26 kB preload shares the bandwidth with the page's scripts. A family
 * with only an italic face must never come first in the stack of upright text, or the browser
 * would set upright text in it.
 */
export const sansItalic = localFont({
  src: "./public-sans-latin-wght-italic.woff2",
  weight: "100 900",
  style: "italic",
  display: "swap",
  preload: false,
  // Until it arrives the browser slants the upright face, whose metrics are the same family's.
  adjustFontFallback: false,
  variable: "--font-sans-italic",
  declarations: [
    {
      prop: "unicode-range",
      value:
        "U+0000-00FF, U+0131, U+0152-0153, U+02BB-02BC, U+02C6, U+02DA, U+02DC, U+0304, U+0308, U+0329, U+2000-206F, U+20AC, U+2122, U+2191, U+2193, U+2212, U+2215, U+FEFF, U+FFFD",
    },
  ],
});

/** Public Sans latin-ext (Central European names, ł ő ř …); not preloaded, fetched on demand. */
export const sansLatinExt = localFont({
  src: [
    { path: "./public-sans-latin-ext-wght-normal.woff2", style: "normal" },
    { path: "./public-sans-latin-ext-wght-italic.woff2", style: "italic" },
  ],
  weight: "100 900",
  display: "swap",
  preload: false,
  adjustFontFallback: false,
  variable: "--font-sans-latin-ext",
  declarations: [
    {
      prop: "unicode-range",
      value:
        "U+0100-02BA, U+02BD-02C5, U+02C7-02CC, U+02CE-02D7, U+02DD-02FF, U+0304, U+0308, U+0329, U+1D00-1DBF, U+1E00-1E9F, U+1EF2-1EFF, U+2020, U+20A0-20AB, U+20AD-20C0, U+2113, U+2C60-2C7F, U+A720-A7FF",
    },
  ],
});

/**
 * JetBrains Mono (latin) for figures and units, exposed as `--font-mono`. Not preloaded: figures are
 * a small part of a first screen, and a 21 kB preload shares a slow line with the page's scripts.
 */
export const mono = localFont({
  src: "./jetbrains-mono-latin-wght-normal.woff2",
  weight: "100 900",
  style: "normal",
  display: "swap",
  preload: false,
  variable: "--font-mono",
  declarations: [
    {
      prop: "unicode-range",
      value:
        "U+0000-00FF, U+0131, U+0152-0153, U+02BB-02BC, U+02C6, U+02DA, U+02DC, U+0304, U+0308, U+0329, U+2000-206F, U+20AC, U+2122, U+2191, U+2193, U+2212, U+2215, U+FEFF, U+FFFD",
    },
  ],
});

/** JetBrains Mono latin-ext. */
export const monoLatinExt = localFont({
  src: "./jetbrains-mono-latin-ext-wght-normal.woff2",
  weight: "100 900",
  style: "normal",
  display: "swap",
  preload: false,
  adjustFontFallback: false,
  variable: "--font-mono-latin-ext",
  declarations: [
    {
      prop: "unicode-range",
      value:
        "U+0100-02BA, U+02BD-02C5, U+02C7-02CC, U+02CE-02D7, U+02DD-02FF, U+0304, U+0308, U+0329, U+1D00-1DBF, U+1E00-1E9F, U+1EF2-1EFF, U+2020, U+20A0-20AB, U+20AD-20C0, U+2113, U+2C60-2C7F, U+A720-A7FF",
    },
  ],
});

/** JetBrains Mono greek: units need Ω (ohm) and the odd Greek symbol in figures. */
export const monoGreek = localFont({
  src: "./jetbrains-mono-greek-wght-normal.woff2",
  weight: "100 900",
  style: "normal",
  display: "swap",
  preload: false,
  adjustFontFallback: false,
  variable: "--font-mono-greek",
  declarations: [
    {
      prop: "unicode-range",
      value: "U+0370-0377, U+037A-037F, U+0384-038A, U+038C, U+038E-03A1, U+03A3-03FF",
    },
  ],
});

/**
 * Class names for the root `<html>` element: `<html className={fontVariables}>`. Without the
 * subset variables the font stacks still work, with the latin faces only.
 */
export const fontVariables = [
  sans.variable,
  sansItalic.variable,
  mono.variable,
  sansLatinExt.variable,
  monoLatinExt.variable,
  monoGreek.variable,
].join(" ");
