import type { Connectivity } from "../lib/connectivity";
import { cx } from "../lib/cx";
import { StatusShape, type StatusShapeName } from "./status-shape";

interface ConnectionStatusProps {
  connectivity: Connectivity;
  /** The server has not yet confirmed the remembered session. */
  checking: boolean;
}

const looks: Record<
  Connectivity | "checking",
  { word: string; shape: StatusShapeName; tone: string; hint: string }
> = {
  online: {
    word: "Online",
    shape: "disc",
    tone: "text-primary",
    hint: "Connected to the Equipot server",
  },
  checking: {
    word: "Connecting",
    shape: "dots",
    tone: "text-muted",
    hint: "Checking your session with the server",
  },
  offline: {
    word: "Offline",
    shape: "ring",
    tone: "text-attention-ink",
    hint: "No network: showing what this device last saw",
  },
  unreachable: {
    word: "Server out of reach",
    shape: "ring",
    tone: "text-attention-ink",
    hint: "The network is up but the Equipot server does not answer",
  },
};

/** Shape plus word, never colour alone (DESIGN.md §8). */
export function ConnectionStatus({ connectivity, checking }: ConnectionStatusProps) {
  const look = looks[connectivity === "online" && checking ? "checking" : connectivity];
  const away = connectivity !== "online";
  return (
    <p
      role="status"
      title={look.hint}
      className={cx(
        "inline-flex min-h-touch items-center gap-2 rounded-full border-2 px-3 font-semibold",
        away ? "border-attention bg-attention-soft text-attention-ink" : "border-transparent",
      )}
    >
      <StatusShape shape={look.shape} className={look.tone} />
      <span>{look.word}</span>
      <span className="sr-only">: {look.hint}</span>
    </p>
  );
}
