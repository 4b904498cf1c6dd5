import { useEffect, useId, useRef, useState, useSyncExternalStore, type RefObject } from "react";
import {
  appearanceLabels,
  appearances,
  getAppearance,
  setAppearance,
  subscribeAppearance,
} from "../lib/appearance";
import { Button } from "./button";

function useAppearance() {
  return useSyncExternalStore(subscribeAppearance, getAppearance, getAppearance);
}

/** Closes a pop-up panel on Escape or on a tap outside it. */
function useDismiss(open: boolean, close: () => void, root: RefObject<HTMLElement | null>) {
  useEffect(() => {
    if (!open) return;
    const onKey = (event: KeyboardEvent) => {
      if (event.key === "Escape") close();
    };
    const onPointer = (event: MouseEvent) => {
      const inside = event.target instanceof Node && root.current?.contains(event.target);
      if (!inside) close();
    };
    document.addEventListener("keydown", onKey);
    document.addEventListener("mousedown", onPointer);
    return () => {
      document.removeEventListener("keydown", onKey);
      document.removeEventListener("mousedown", onPointer);
    };
  }, [open, close, root]);
}

function SlidersIcon() {
  const knob = { r: 2.2, fill: "var(--eq-surface)", stroke: "currentColor", strokeWidth: 1.8 };
  return (
    <svg viewBox="0 0 20 20" aria-hidden="true" className="h-5 w-5">
      <path
        d="M3 5h14M3 10h14M3 15h14"
        stroke="currentColor"
        strokeWidth="2.2"
        strokeLinecap="round"
      />
      <circle cx="7" cy="5" {...knob} />
      <circle cx="13" cy="10" {...knob} />
      <circle cx="8" cy="15" {...knob} />
    </svg>
  );
}

function AppearanceChoice() {
  const appearance = useAppearance();
  return (
    <fieldset>
      <legend className="mb-2 text-lg font-semibold">Look</legend>
      <div className="flex flex-col gap-1">
        {appearances.map((option) => (
          <label
            key={option}
            className="flex min-h-touch cursor-pointer items-center gap-3 rounded-lg px-2 hover:bg-primary-soft"
          >
            <input
              type="radio"
              name="appearance"
              value={option}
              checked={appearance === option}
              onChange={() => setAppearance(option)}
              className="h-6 w-6 accent-[var(--eq-primary)]"
            />
            <span>
              <span className="block font-semibold">{appearanceLabels[option].label}</span>
              <span className="block text-sm text-muted">{appearanceLabels[option].hint}</span>
            </span>
          </label>
        ))}
      </div>
    </fieldset>
  );
}

/** The settings button and its panel: the look of the app, remembered on this device. */
export function SettingsMenu() {
  const [open, setOpen] = useState(false);
  const panelId = useId();
  const rootRef = useRef<HTMLDivElement>(null);
  const [close] = useState(() => () => setOpen(false));
  useDismiss(open, close, rootRef);

  return (
    <div ref={rootRef} className="relative">
      <Button
        tone="quiet"
        aria-expanded={open}
        aria-controls={panelId}
        onClick={() => setOpen(!open)}
      >
        <SlidersIcon />
        Settings
      </Button>
      {open && (
        <div
          id={panelId}
          className="absolute right-0 z-20 mt-2 w-80 max-w-[calc(100vw-2rem)] rounded-lg border-2 border-ink bg-surface p-4 shadow-lg"
        >
          <AppearanceChoice />
        </div>
      )}
    </div>
  );
}
