// One download with its own state: idle, percentage while it arrives, saved, or the reason it failed.
import { useState } from "react";
import { Button } from "../../../components/button";
import { StatusShape } from "../../../components/status-shape";
import { messageOf } from "../../../lib/api-error";
import { downloadExport, type ExportTarget } from "../api/download-export";
import type { TransferProgress } from "../api/transfer";

type State =
  | { step: "idle" }
  | { step: "loading"; progress: TransferProgress | null }
  | { step: "saved" }
  | { step: "failed"; message: string };

export const percentOf = (p: TransferProgress | null) =>
  p === null || p.total === null || p.total === 0 ? null : Math.round((p.loaded / p.total) * 100);

interface DownloadButtonProps {
  campaignId: string;
  target: ExportTarget;
  label: string;
  /** Shows a progress bar under the button (for the archive, which can be large). */
  showBar?: boolean;
}

export function DownloadButton({
  campaignId,
  target,
  label,
  showBar = false,
}: DownloadButtonProps) {
  const [state, setState] = useState<State>({ step: "idle" });
  const start = async () => {
    setState({ step: "loading", progress: null });
    try {
      await downloadExport(campaignId, target, (progress) =>
        setState({ step: "loading", progress }),
      );
      setState({ step: "saved" });
    } catch (error) {
      setState({ step: "failed", message: messageOf(error) });
    }
  };
  const percent = state.step === "loading" ? percentOf(state.progress) : null;
  return (
    <div className="flex flex-col gap-2">
      <Button
        tone={showBar ? "primary" : "secondary"}
        disabled={state.step === "loading"}
        onClick={() => void start()}
      >
        {state.step === "loading"
          ? `Downloading…${percent === null ? "" : ` ${percent} %`}`
          : label}
      </Button>
      {showBar && state.step === "loading" && (
        <progress
          className="h-4 w-full"
          max={1}
          aria-label={`${label}: progress`}
          {...(percent === null ? {} : { value: percent / 100 })}
        />
      )}
      <p role="status" className="text-sm">
        {state.step === "saved" && (
          <span className="inline-flex items-center gap-2">
            <StatusShape shape="disc" className="text-primary" /> Saved to your downloads
          </span>
        )}
        {state.step === "failed" && (
          <span className="inline-flex items-center gap-2 font-semibold text-danger-ink">
            <StatusShape shape="octagon" className="text-danger" /> {state.message}
          </span>
        )}
      </p>
    </div>
  );
}
