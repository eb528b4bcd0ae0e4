import type { Config } from "tailwindcss";

/*
 * Rosinwood palette: pale planed wood for pages, dark walnut for the header and footer,
 * a cedar red-brown for actions and a rosin amber used on dark surfaces or as decoration.
 *
 * WCAG 2.x contrast ratios, computed with the relative-luminance formula (WCAG 2.2 §1.4.3,
 * §1.4.11): text needs 4.5:1 (AA), UI borders and focus rings 3:1.
 *   ink   #24190F on paper   #FBF7F0  16.11   ink on sawdust #F3EADB 14.42
 *   bark  #5E4B3C on paper            7.72    bark on sawdust          6.91
 *   cedar #8A3B12 on paper            7.24    paper on cedar (buttons) 7.24
 *   paper on cedar-dark #6E2E0D       9.55    (button hover)
 *   paper on walnut #2B1D14          15.26    rosin #E3A83E on walnut  7.71
 *   berry #A4262C on berry-tint #F8E4E1 5.94  spruce #2F5D3A on spruce-tint #E3EFE3 6.45
 *   slate #2C4F6B on slate-tint #E2EBF2 7.14  ink on rosin-tint #FBEFD2 15.05
 *   grain #8C7560 (input borders) on paper 4.07, on sawdust 3.65
 * Rosin on paper is only 1.98:1, so rosin never carries text or focus on light surfaces.
 */
const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        paper: "#FBF7F0",
        sawdust: "#F3EADB",
        ink: "#24190F",
        bark: "#5E4B3C",
        grain: "#8C7560",
        line: "#D9C8B0",
        cedar: { DEFAULT: "#8A3B12", dark: "#6E2E0D" },
        walnut: "#2B1D14",
        cream: "#F4E9D8",
        rosin: { DEFAULT: "#E3A83E", pale: "#F6DFA8", tint: "#FBEFD2" },
        spruce: { DEFAULT: "#2F5D3A", tint: "#E3EFE3" },
        berry: { DEFAULT: "#A4262C", tint: "#F8E4E1" },
        slate: { DEFAULT: "#2C4F6B", tint: "#E2EBF2" },
      },
      fontFamily: {
        serif: ['"Source Serif 4"', "Georgia", "Cambria", '"Times New Roman"', "serif"],
        sans: [
          "system-ui",
          "-apple-system",
          '"Segoe UI"',
          "Roboto",
          '"Helvetica Neue"',
          "Arial",
          '"Noto Sans"',
          "sans-serif",
        ],
      },
      // Own scale, roughly a 1.25 step from a 17px body; the two largest steps flex with the
      // viewport so a headline never overflows a 360px phone.
      fontSize: {
        caption: ["0.8125rem", { lineHeight: "1.25rem" }],
        small: ["0.9375rem", { lineHeight: "1.4rem" }],
        body: ["1.0625rem", { lineHeight: "1.7rem" }],
        lead: ["1.25rem", { lineHeight: "1.9rem" }],
        h4: ["1.3125rem", { lineHeight: "1.75rem" }],
        h3: ["1.625rem", { lineHeight: "2.1rem" }],
        h2: ["clamp(1.75rem, 1.4rem + 1.4vw, 2.25rem)", { lineHeight: "1.2" }],
        h1: ["clamp(2.125rem, 1.6rem + 2.4vw, 3.25rem)", { lineHeight: "1.12" }],
      },
      maxWidth: {
        prose: "68ch",
        shell: "72rem",
      },
      borderRadius: {
        knot: "0.625rem",
      },
    },
  },
  plugins: [],
};

export default config;
