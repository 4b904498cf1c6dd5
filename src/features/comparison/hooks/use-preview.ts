// Runs the preview worker for one chosen file; a new choice or leaving the page stops it.
import { useEffect, useState } from "react";
import type { PreviewMessage, PreviewRequest } from "../worker/preview-protocol";
import { startPreviewWorker } from "../worker/start-preview";

export type PreviewState =
  | { status: "idle" }
  | { status: "reading"; fraction: number }
  | (Extract<PreviewMessage, { type: "done" }> & { status: "done" })
  | { status: "failed"; message: string };

export function usePreview(request: PreviewRequest | null): PreviewState {
  // Kept with the request it belongs to, so a new choice reads as "reading" at once.
  const [held, setHeld] = useState<{ request: PreviewRequest; state: PreviewState } | null>(null);
  useEffect(() => {
    if (request === null) return;
    const setState = (state: PreviewState) => setHeld({ request, state });
    const worker = startPreviewWorker();
    worker.onmessage = (event: MessageEvent<PreviewMessage>) => {
      const message = event.data;
      if (message.type === "progress")
        setState({ status: "reading", fraction: message.bytesRead / (message.bytesTotal || 1) });
      else if (message.type === "done") {
        setState({ ...message, status: "done" });
        worker.terminate();
      } else {
        setState({ status: "failed", message: message.message });
        worker.terminate();
      }
    };
    worker.onerror = (event) => {
      setState({ status: "failed", message: event.message || "The preview could not run." });
      worker.terminate();
    };
    worker.postMessage(request);
    return () => worker.terminate();
  }, [request]);
  if (request === null) return { status: "idle" };
  return held?.request === request ? held.state : { status: "reading", fraction: 0 };
}
