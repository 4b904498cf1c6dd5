// Choose a series file, see the local preview (in a worker), then upload with a progress bar.
import { useMemo, useState } from "react";
import { Button } from "../../../components/button";
import { SelectField, TextField } from "../../../components/form-field";
import { Notice } from "../../../components/notice";
import { messageOf } from "../../../lib/api-error";
import { formatLocalBeside, formatUtc } from "../../../lib/format";
import type { SeriesRowError, SeriesValueKind } from "../../../../shared/schemas/comparison";
import { FileRefused, useUploadSeries } from "../api/upload-file";
import { usePreview, type PreviewState } from "../hooks/use-preview";
import type { PreviewRequest } from "../worker/preview-protocol";
import { formatScientific } from "../../../lib/format";
import { StabilityChart } from "./stability-chart";

const unixIso = (t: number) => new Date(t * 1000).toISOString();

function BadRows({ rows, total }: { rows: readonly SeriesRowError[]; total: number }) {
  return (
    <div className="flex flex-col gap-1">
      <p>{total.toLocaleString("en")} bad rows; the first ones by line:</p>
      <ul aria-label="Bad rows" className="list-disc pl-6 tabular-nums">
        {rows.slice(0, 20).map((r) => (
          <li key={`${r.line}-${r.field}`}>
            Line {r.line}, {r.field}: {r.message}
          </li>
        ))}
      </ul>
    </div>
  );
}

function PreviewView({ state }: { state: PreviewState }) {
  if (state.status === "idle") return null;
  if (state.status === "reading")
    return (
      <div className="flex flex-col gap-1">
        <label htmlFor="preview-progress">Reading the file on this device…</label>
        <progress id="preview-progress" className="h-3 w-full" max={1} value={state.fraction} />
      </div>
    );
  if (state.status === "failed")
    return (
      <Notice tone="danger" title="Preview failed">
        {state.message}
      </Notice>
    );
  const s = state.summary;
  return (
    <section
      aria-labelledby="preview-heading"
      data-testid="preview"
      className="flex flex-col gap-2"
    >
      <h3 id="preview-heading" className="text-lg font-semibold">
        Preview (on this device)
      </h3>
      <p className="tabular-nums">
        {s.rows.toLocaleString("en")} rows, {s.validRows.toLocaleString("en")} valid · τ0{" "}
        {s.tau0S ?? "—"} s · {s.gaps.count} gaps
      </p>
      {s.firstT !== null && s.lastT !== null && (
        <p className="text-sm tabular-nums">
          {formatUtc(unixIso(s.firstT))} to {formatUtc(unixIso(s.lastT))}{" "}
          <span className="text-muted">
            ({formatLocalBeside(unixIso(s.firstT))} to {formatLocalBeside(unixIso(s.lastT))})
          </span>
        </p>
      )}
      {s.problem !== null && (
        <Notice tone="danger" title="File not usable">
          {s.problem}
        </Notice>
      )}
      {s.badRows > 0 && (
        <Notice tone="danger" title="Bad rows">
          <BadRows rows={s.errors} total={s.badRows} />
        </Notice>
      )}
      {state.analysis !== null ? (
        <>
          <p className="text-sm">
            Quick ADEV of this file alone ({state.analysedSamples.toLocaleString("en")} samples)
            {state.analysis.fit !== null &&
              `: σ(1 s) ≈ ${formatScientific(state.analysis.fit.sigmaAt1s)}`}
          </p>
          <StabilityChart analysis={state.analysis} testId="preview-adev-chart" />
        </>
      ) : (
        state.analysisNote !== null && <p className="text-sm text-muted">{state.analysisNote}</p>
      )}
    </section>
  );
}

export function UploadPanel({ campaignId, runId }: { campaignId: string; runId: string }) {
  const [file, setFile] = useState<File | null>(null);
  const [valueKind, setValueKind] = useState<SeriesValueKind>("fractional");
  const [nominalRatio, setNominalRatio] = useState("");
  const [progress, setProgress] = useState<number | null>(null);
  const upload = useUploadSeries(campaignId, runId);
  const request = useMemo<PreviewRequest | null>(
    () =>
      file === null
        ? null
        : { file, valueKind, nominalRatio: valueKind === "ratio" ? nominalRatio : undefined },
    [file, valueKind, nominalRatio],
  );
  const preview = usePreview(request);
  const ready =
    preview.status === "done" && preview.summary.badRows === 0 && preview.summary.problem === null;
  const send = () => {
    if (file === null) return;
    setProgress(0);
    upload.mutate(
      {
        upload: {
          file,
          fileName: file.name,
          valueKind,
          nominalRatio: valueKind === "ratio" ? nominalRatio : undefined,
        },
        onProgress: setProgress,
      },
      {
        onSuccess: () => {
          setFile(null);
          setProgress(null);
        },
      },
    );
  };
  const refused = upload.error instanceof FileRefused ? upload.error : null;
  return (
    <section
      aria-labelledby="upload-heading"
      className="flex flex-col gap-3 rounded-xl border-2 border-line bg-surface p-4"
    >
      <h2 id="upload-heading" className="text-xl font-semibold">
        Add a series file
      </h2>
      <p className="text-sm text-muted">
        CSV: a time column (ISO 8601 with Z or an offset, or MJD) and a value column; an optional
        validity flag.
      </p>
      <div className="flex flex-col gap-1">
        <label htmlFor="series-file" className="font-semibold">
          Series file
        </label>
        <input
          id="series-file"
          type="file"
          accept=".csv,.txt,text/csv,text/plain"
          className="min-h-touch"
          onChange={(e) => {
            upload.reset();
            setProgress(null);
            setFile(e.target.files?.[0] ?? null);
          }}
        />
      </div>
      <div className="grid gap-3 sm:grid-cols-2">
        <SelectField
          label="Values"
          value={valueKind}
          onChange={(e) => setValueKind(e.target.value === "ratio" ? "ratio" : "fractional")}
        >
          <option value="fractional">Fractional frequency difference</option>
          <option value="ratio">Frequency ratio</option>
        </SelectField>
        {valueKind === "ratio" && (
          <TextField
            label="Nominal ratio"
            hint="Exact decimal, as the two clocks' nominal frequencies"
            value={nominalRatio}
            onChange={(e) => setNominalRatio(e.target.value)}
          />
        )}
      </div>
      <PreviewView state={preview} />
      {progress !== null && (
        <div className="flex flex-col gap-1">
          <label htmlFor="upload-progress">
            {upload.isPending
              ? `Uploading… ${Math.round(progress * 100)} %`
              : upload.isSuccess
                ? "Uploaded"
                : "Upload stopped"}
          </label>
          <progress
            id="upload-progress"
            data-testid="upload-progress"
            className="h-3 w-full"
            max={1}
            value={progress}
          />
        </div>
      )}
      {refused !== null && (
        <Notice tone="danger" title="File refused; nothing was stored" live>
          <p>{refused.message}</p>
          <BadRows rows={refused.rows} total={refused.badRows} />
        </Notice>
      )}
      {upload.error !== null && refused === null && (
        <Notice tone="danger" title="Upload failed" live>
          {messageOf(upload.error)}
        </Notice>
      )}
      <div>
        <Button
          tone="primary"
          disabled={
            file === null ||
            upload.isPending ||
            (preview.status !== "done" && preview.status !== "failed")
          }
          onClick={send}
        >
          Upload
        </Button>
        {file !== null && preview.status === "done" && !ready && (
          <span className="ml-3 text-sm text-muted">
            The server will check it too and say which lines it refuses.
          </span>
        )}
      </div>
    </section>
  );
}
