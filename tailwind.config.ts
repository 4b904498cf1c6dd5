import type { Config } from "tailwindcss";
import plugin from "tailwindcss/plugin";

/**
 * Equipot's design tokens (DESIGN.md §8). Every colour is a role, not a hue name, and each theme
 * fills the same roles. Contrast of each text/background pair is at least 4.5:1 (7:1 in the
 * high-contrast theme); borders and status shapes at least 3:1.
 */
const roles = [
  "paper", // page background: warm paper
  "surface", // cards, inputs, menus
  "sunken", // wells, table heads
  "ink", // body text: deep blue-green
  "muted", // secondary text
  "line", // borders of inputs and cards
  "primary", // main actions
  "onPrimary", // text on primary
  "primarySoft", // selected rows, current nav item
  "attention", // the one amber accent: "needs attention"
  "attentionSoft",
  "attentionInk",
  "danger", // kept for "limit exceeded" and destructive actions
  "dangerSoft",
  "dangerInk",
  "focus", // keyboard focus ring
] as const;
type ColourRole = (typeof roles)[number];
type Palette = Record<ColourRole, string>;

export const themeNames = ["paper", "dark", "contrast"] as const;
export type ThemeName = (typeof themeNames)[number];

export const palettes: Record<ThemeName, Palette> = {
  paper: {
    paper: "#F5EFE2",
    surface: "#FFFBF2",
    sunken: "#EAE2D1",
    ink: "#0F3B3A",
    muted: "#44605D",
    line: "#857A66",
    primary: "#12524E",
    onPrimary: "#FFFFFF",
    primarySoft: "#D6E6E1",
    attention: "#A86300",
    attentionSoft: "#FBE4B8",
    attentionInk: "#5A3300",
    danger: "#B0271C",
    dangerSoft: "#F7D9D3",
    dangerInk: "#6E130D",
    focus: "#0B5C86",
  },
  dark: {
    paper: "#0E1918",
    surface: "#152321",
    sunken: "#0A1211",
    ink: "#EDE6D6",
    muted: "#B4BFB9",
    line: "#7A8C88",
    primary: "#86CFC4",
    onPrimary: "#06211F",
    primarySoft: "#1F3D3A",
    attention: "#F0AE45",
    attentionSoft: "#3B2A0D",
    attentionInk: "#F8D08E",
    danger: "#FF8C7C",
    dangerSoft: "#40150F",
    dangerInk: "#FFC1B7",
    focus: "#9BD2F0",
  },
  // For direct sunlight: pure white and black, heavier borders (see --line-width below).
  contrast: {
    paper: "#FFFFFF",
    surface: "#FFFFFF",
    sunken: "#EFEFEF",
    ink: "#000000",
    muted: "#1F1F1F",
    line: "#000000",
    primary: "#00302D",
    onPrimary: "#FFFFFF",
    primarySoft: "#CFE8E3",
    attention: "#6B3A00",
    attentionSoft: "#FFD966",
    attentionInk: "#000000",
    danger: "#8A0000",
    dangerSoft: "#FFD2CC",
    dangerInk: "#000000",
    focus: "#000000",
  },
};

const cssVar = (role: ColourRole) => `--eq-${role.replace(/[A-Z]/g, (c) => `-${c.toLowerCase()}`)}`;

function variablesOf(theme: ThemeName): Record<string, string> {
  const palette = palettes[theme];
  const entries = roles.map((role) => [cssVar(role), palette[role]] as const);
  return {
    ...Object.fromEntries(entries),
    "--eq-line-width": theme === "contrast" ? "2px" : "1px",
    "color-scheme": theme === "dark" ? "dark" : "light",
  };
}

const colours = Object.fromEntries(
  roles.map((role) => [
    role.replace(/[A-Z]/g, (c) => `-${c.toLowerCase()}`),
    `var(${cssVar(role)})`,
  ]),
);

export default {
  content: ["./index.html", "./src/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: colours,
      fontFamily: {
        sans: ['"Roboto Flex"', "system-ui", "sans-serif"],
      },
      minHeight: { touch: "3rem" },
      minWidth: { touch: "3rem" },
      // Plain `border` is 1 px, or 2 px in the high-contrast theme.
      borderWidth: { DEFAULT: "var(--eq-line-width)" },
      maxWidth: { page: "80rem" },
    },
  },
  plugins: [
    plugin(({ addBase }) => {
      addBase({
        ":root": variablesOf("paper"),
        ':root[data-theme="dark"]': variablesOf("dark"),
        ':root[data-theme="contrast"]': variablesOf("contrast"),
      });
    }),
  ],
} satisfies Config;
