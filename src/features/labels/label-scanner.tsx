// Reads a crate's label three ways: the tablet's camera, a photo of the label, or typed.
// Every way ends in parseCrateCode, so a scanned code and a typed label are judged alike.
import { useCallback, useEffect, useId, useRef, useState, type FormEvent } from "react";
import { Button } from "../../components/button";
import { TextField } from "../../components/form-field";
import { Notice } from "../../components/notice";
import { parseCrateCode } from "./crate-code";
import { decodeFrame, decodeImageFile } from "./decode-image";

type Problem = { title: string; detail: string } | null;

const noCodeInPhoto: Problem = {
  title: "No code found",
  detail:
    "No QR code could be read in this photo. Hold the tablet closer and flat to the label, avoid glare, or type the label.",
};

function cameraProblem(error: unknown): Problem {
  const name = error instanceof DOMException ? error.name : "";
  if (name === "NotAllowedError" || name === "SecurityError")
    return {
      title: "Camera refused",
      detail:
        "The camera is not allowed for Equipot on this device. Allow it in the browser's site settings, or scan from a photo or type the label.",
    };
  if (name === "NotFoundError" || name === "OverconstrainedError")
    return {
      title: "No camera found",
      detail: "This device has no camera Equipot can use. Scan from a photo or type the label.",
    };
  return {
    title: "Camera not started",
    detail: "The camera could not be started. Scan from a photo or type the label.",
  };
}

export function LabelScanner({ onLabel }: { onLabel: (label: string) => void }) {
  const videoRef = useRef<HTMLVideoElement>(null);
  const streamRef = useRef<MediaStream | null>(null);
  const frameRef = useRef<number | null>(null);
  const canvasRef = useRef<HTMLCanvasElement | null>(null);
  const [scanning, setScanning] = useState(false);
  const [problem, setProblem] = useState<Problem>(null);
  const [reading, setReading] = useState(false);
  const [typed, setTyped] = useState("");
  const [typedError, setTypedError] = useState<string | undefined>(undefined);
  const fileId = useId();

  const stopCamera = useCallback(() => {
    if (frameRef.current !== null) cancelAnimationFrame(frameRef.current);
    frameRef.current = null;
    streamRef.current?.getTracks().forEach((t) => t.stop());
    streamRef.current = null;
    if (videoRef.current !== null) videoRef.current.srcObject = null;
    setScanning(false);
  }, []);

  // Never leave the camera on behind another page.
  useEffect(() => stopCamera, [stopCamera]);

  /** true when the text was a crate label (and was reported). */
  const accept = useCallback(
    (text: string): boolean => {
      const result = parseCrateCode(text);
      if (!result.ok) {
        setProblem({ title: "Not a crate label", detail: result.message });
        return false;
      }
      setProblem(null);
      onLabel(result.label);
      return true;
    },
    [onLabel],
  );

  async function startCamera() {
    setProblem(null);
    if (navigator.mediaDevices?.getUserMedia === undefined) {
      setProblem(cameraProblem(new DOMException("", "NotFoundError")));
      return;
    }
    try {
      const stream = await navigator.mediaDevices.getUserMedia({
        video: { facingMode: "environment" },
        audio: false,
      });
      streamRef.current = stream;
      const video = videoRef.current;
      if (video === null) {
        stopCamera();
        return;
      }
      video.srcObject = stream;
      await video.play();
      setScanning(true);
      const canvas = (canvasRef.current ??= document.createElement("canvas"));
      const tick = () => {
        if (streamRef.current === null) return;
        const text = decodeFrame(canvas, video, video.videoWidth, video.videoHeight);
        // A code that is not ours keeps the camera on: the next frame may show the right one.
        if (text !== null && accept(text)) {
          stopCamera();
          return;
        }
        frameRef.current = requestAnimationFrame(tick);
      };
      frameRef.current = requestAnimationFrame(tick);
    } catch (error) {
      stopCamera();
      setProblem(cameraProblem(error));
    }
  }

  async function readPhoto(file: File | undefined) {
    if (file === undefined) return;
    setProblem(null);
    setReading(true);
    try {
      const text = await decodeImageFile(file);
      if (text === null) setProblem(noCodeInPhoto);
      else accept(text);
    } catch {
      setProblem({
        title: "Photo not readable",
        detail:
          "This file could not be opened as an image. Take the photo again or type the label.",
      });
    } finally {
      setReading(false);
    }
  }

  function submitTyped(event: FormEvent) {
    event.preventDefault();
    const result = parseCrateCode(typed);
    if (!result.ok) {
      setTypedError(result.message);
      return;
    }
    setTypedError(undefined);
    setProblem(null);
    onLabel(result.label);
  }

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-center gap-3">
        {scanning ? (
          <Button onClick={stopCamera}>Stop the camera</Button>
        ) : (
          <Button tone="primary" onClick={() => void startCamera()}>
            Scan with the camera
          </Button>
        )}
        <label
          htmlFor={fileId}
          className="inline-flex min-h-touch cursor-pointer items-center justify-center gap-2 rounded-lg border-2 border-ink bg-surface px-5 py-2 font-semibold text-ink hover:bg-primary-soft focus-within:outline-3 focus-within:outline-offset-2"
        >
          Scan from a photo
          <input
            id={fileId}
            type="file"
            accept="image/*"
            capture="environment"
            className="sr-only"
            onChange={(e) => {
              void readPhoto(e.target.files?.[0]);
              e.target.value = "";
            }}
          />
        </label>
        {reading && <span role="status">Reading the photo…</span>}
      </div>
      <video
        ref={videoRef}
        muted
        playsInline
        aria-label="Camera view: hold the label's QR code in the frame"
        className={scanning ? "w-full max-w-md rounded-lg border-2 border-line" : "hidden"}
      />
      {problem !== null && (
        <Notice tone="attention" title={problem.title} live>
          {problem.detail}
        </Notice>
      )}
      <form
        onSubmit={submitTyped}
        aria-label="Label typed by hand"
        className="flex flex-wrap items-end gap-3"
        noValidate
      >
        <div className="min-w-48 flex-1">
          <TextField
            label="Type the label"
            value={typed}
            autoComplete="off"
            autoCapitalize="characters"
            error={typedError}
            onChange={(e) => setTyped(e.target.value)}
          />
        </div>
        <Button type="submit">Use this label</Button>
      </form>
    </div>
  );
}
