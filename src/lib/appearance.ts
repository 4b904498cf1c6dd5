// The chosen look, remembered on this device. "device" follows the system's dark and
// more-contrast settings; the others force a theme of tailwind.config.ts.
import type { ThemeName } from "../../tailwind.config";

export const appearances = ["device", "paper", "dark", "contrast"] as const;
export type Appearance = (typeof appearances)[number];

export const appearanceLabels: Record<Appearance, { label: string; hint: string }> = {
  device: { label: "Follow this device", hint: "Light or dark as the system is set" },
  paper: { label: "Paper", hint: "Warm light background" },
  dark: { label: "Dark", hint: "For dark labs and night work" },
  contrast: { label: "High contrast", hint: "Black on white, for bright sunlight" },
};

const storageKey = "equipot.appearance";
type Listener = () => void;
const listeners = new Set<Listener>();

function isAppearance(value: string | null): value is Appearance {
  return appearances.some((appearance) => appearance === value);
}

function readStored(): Appearance {
  try {
    const stored = localStorage.getItem(storageKey);
    return isAppearance(stored) ? stored : "device";
  } catch {
    return "device";
  }
}

let current: Appearance = readStored();

function resolveTheme(appearance: Appearance): ThemeName {
  if (appearance !== "device") return appearance;
  if (window.matchMedia("(prefers-contrast: more)").matches) return "contrast";
  return window.matchMedia("(prefers-color-scheme: dark)").matches ? "dark" : "paper";
}

export function applyAppearance(): void {
  const theme = resolveTheme(current);
  document.documentElement.dataset.theme = theme;
}

export function getAppearance(): Appearance {
  return current;
}

export function setAppearance(appearance: Appearance): void {
  current = appearance;
  try {
    localStorage.setItem(storageKey, appearance);
  } catch {
    // Not remembered, but still applied for this visit.
  }
  applyAppearance();
  for (const listener of listeners) listener();
}

export function subscribeAppearance(listener: Listener): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

/** Applies the stored choice and follows system changes while "device" is chosen. */
export function startAppearance(): void {
  applyAppearance();
  for (const query of ["(prefers-color-scheme: dark)", "(prefers-contrast: more)"]) {
    window.matchMedia(query).addEventListener("change", () => {
      if (current === "device") applyAppearance();
    });
  }
}
