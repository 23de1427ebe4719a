import type { Config } from "tailwindcss";

/*
 * Fluxyard's palette, taken from the bench: paper and graphite surfaces, copper for actions,
 * verdigris for "within range" / "clear", amber for cautions and "sent back", signal red only
 * for "stop" verdicts and blocked sheets.
 *
 * `colors` replaces Tailwind's default palette on purpose, so no stray blue or purple can
 * creep in. WCAG 2.x contrast ratios of the pairs used for text (computed with the relative
 * luminance formula of WCAG 2.1 §1.4.3; AA needs 4.5:1 for body text, 3:1 for focus rings):
 *
 *   graphite-900 #1C1B19 on paper #FBFAF7          16.5:1  body text
 *   graphite-600 #57554F on paper #FBFAF7           7.1:1  secondary text, hints
 *   graphite-500 #6B6963 on paper #FBFAF7           5.3:1  faintest text allowed
 *   graphite-600 #57554F on paper-sunken #F3F1EC    6.6:1
 *   paper-sunken #F3F1EC on graphite-900 #1C1B19   15.3:1  graphite surfaces (header, footer)
 *   graphite-300 #C9C6BF on graphite-900           10.1:1  muted text on graphite
 *   white on copper-600 #9A4A22                     6.2:1  primary button
 *   copper-600 #9A4A22 on paper                     6.0:1  links
 *   copper-700 #7C3A1A on copper-100 #F8E7DC        7.1:1  "active" badge
 *   verdigris-700 #1E5F51 on verdigris-50 #E8F4EF   6.6:1  "clear" badge
 *   verdigris-700 #1E5F51 on paper                  7.2:1
 *   amber-700 #7A4E05 on amber-50 #FCF3DF           6.5:1  "caution" badge
 *   amber-700 #7A4E05 on paper                      6.9:1
 *   signal-700 #9B1C1C on signal-50 #FCEDEC         7.2:1  "stop" badge
 *   signal-700 #9B1C1C on paper                     7.8:1  inline errors
 *   white on signal-700 #9B1C1C                     8.2:1  danger button
 *   graphite-700 #413F3B on graphite-100 #E7E5DF    8.3:1  neutral badge
 *   copper-500 #B3562A on paper                     4.9:1  focus ring (non-text, needs 3:1)
 * Lighter steps (≤ 400) are for borders, fills and the hazard triangle, never for text on paper.
 */
const colors = {
  transparent: "transparent",
  current: "currentColor",
  inherit: "inherit",
  white: "#FFFFFF",
  black: "#000000",
  paper: {
    DEFAULT: "#FBFAF7",
    raised: "#FFFFFF",
    sunken: "#F3F1EC",
  },
  graphite: {
    50: "#F3F1EC",
    100: "#E7E5DF",
    200: "#D4D1CA",
    300: "#C9C6BF",
    400: "#8F8C85",
    500: "#6B6963",
    600: "#57554F",
    700: "#413F3B",
    800: "#2C2B28",
    900: "#1C1B19",
    950: "#121110",
  },
  copper: {
    50: "#FBF3EE",
    100: "#F8E7DC",
    200: "#F0CBB3",
    300: "#E5A57F",
    400: "#D7814F",
    500: "#B3562A",
    600: "#9A4A22",
    700: "#7C3A1A",
    800: "#5E2C15",
    900: "#41200F",
  },
  verdigris: {
    50: "#E8F4EF",
    100: "#D5EDE3",
    200: "#A9D9C6",
    300: "#74BFA3",
    400: "#43A182",
    500: "#2B8469",
    600: "#236F59",
    700: "#1E5F51",
    800: "#184B40",
    900: "#12382F",
  },
  amber: {
    50: "#FCF3DF",
    100: "#F9E6BC",
    200: "#F3D08A",
    300: "#EBB752",
    400: "#E0A526",
    500: "#C68A0B",
    600: "#A06E07",
    700: "#7A4E05",
    800: "#5E3C05",
    900: "#432B04",
  },
  signal: {
    50: "#FCEDEC",
    100: "#F8D8D6",
    200: "#F0B1AD",
    300: "#E4827C",
    400: "#D4554E",
    500: "#BA302A",
    600: "#A82320",
    700: "#9B1C1C",
    800: "#7A1717",
    900: "#5A1212",
  },
  // ISO 7010 safety colours (ISO 3864-4 gives them as colorimetric ranges; these sRGB values
  // are common practice for on-screen signs). Only the hazard triangle uses them.
  hazard: {
    yellow: "#F9A800",
    black: "#000000",
  },
} as const;

const config = {
  content: [
    "./app/**/*.{ts,tsx,mdx}",
    "./components/**/*.{ts,tsx}",
    "./emails/**/*.{ts,tsx}",
  ],
  theme: {
    colors,
    // The next/font variables of app/fonts: extra subsets first (their unicode-range keeps them
    // out of latin text), each falling back to the latin face if its variable is not set.
    fontFamily: {
      sans: ["var(--font-sans-latin-ext, var(--font-sans))", "var(--font-sans)", "ui-sans-serif", "system-ui", "sans-serif"],
      mono: [
        "var(--font-mono-greek, var(--font-mono))",
        "var(--font-mono-latin-ext, var(--font-mono))",
        "var(--font-mono)",
        "ui-monospace",
        "monospace",
      ],
    },
    // A 1.125-ish scale with line heights tuned for Public Sans; dense tables use `sm`.
    fontSize: {
      xs: ["0.75rem", { lineHeight: "1rem" }],
      sm: ["0.875rem", { lineHeight: "1.25rem" }],
      base: ["1rem", { lineHeight: "1.625rem" }],
      lg: ["1.125rem", { lineHeight: "1.75rem" }],
      xl: ["1.25rem", { lineHeight: "1.75rem" }],
      "2xl": ["1.5rem", { lineHeight: "2rem", letterSpacing: "-0.01em" }],
      "3xl": ["1.875rem", { lineHeight: "2.25rem", letterSpacing: "-0.015em" }],
      "4xl": ["2.25rem", { lineHeight: "2.5rem", letterSpacing: "-0.02em" }],
    },
    // Small radii: the bench is drawn with a ruler, not a pillow.
    borderRadius: {
      none: "0",
      sm: "0.125rem",
      DEFAULT: "0.25rem",
      md: "0.375rem",
      lg: "0.5rem",
      full: "9999px",
    },
    boxShadow: {
      none: "none",
      sm: "0 1px 2px 0 rgb(28 27 25 / 0.06)",
      DEFAULT: "0 1px 3px 0 rgb(28 27 25 / 0.08), 0 1px 2px -1px rgb(28 27 25 / 0.08)",
      md: "0 4px 8px -2px rgb(28 27 25 / 0.10), 0 2px 4px -2px rgb(28 27 25 / 0.06)",
      inset: "inset 0 1px 2px 0 rgb(28 27 25 / 0.08)",
    },
    extend: {
      spacing: {
        // Cell padding of dense seller/moderator tables.
        cell: "0.375rem",
        gutter: "1.5rem",
        section: "3rem",
      },
      maxWidth: {
        // Comfortable line length for sheets, logs and reports.
        reading: "68ch",
        page: "80rem",
      },
    },
  },
} satisfies Config;

export default config;
